"use client";

import { useMutation } from "@tanstack/react-query";
import { toApiError, type ApiError } from "./field";

/** Shown when the P/N is not in the catalog: queues a mail to the administrators asking them to add it. */
export function PartNumberRequestButton({ partNumber, cage }: { partNumber: string; cage?: string }) {
  const request = useMutation<{ queued: number }, ApiError>({
    mutationFn: async () => {
      const response = await fetch("/api/receipts/part-number-requests", {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ partNumber, cage: cage || undefined }),
      });
      const body = await response.json().catch(() => null);
      if (!response.ok) throw toApiError(response.status, body);
      return body;
    },
  });
  if (request.isSuccess) {
    return (
      <p className="mt-2 font-semibold">
        Sent: {request.data.queued} administrator{request.data.queued === 1 ? "" : "s"} will be asked to add {partNumber} to the catalog. Receive the unit once it is there.
      </p>
    );
  }
  return (
    <div className="mt-2">
      <button type="button" className="btn btn-secondary border-red-900 text-red-950 dark:text-red-50" disabled={request.isPending} onClick={() => request.mutate()}>
        Ask an administrator to add {partNumber}
      </button>
      {request.isError ? <p className="field-error">{request.error.message}</p> : null}
    </div>
  );
}
