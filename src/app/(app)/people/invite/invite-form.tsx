"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { FormField } from "@/components/people/form-field";
import { ApiError, fetchJson } from "@/lib/fetch-json";
import { formatInstant } from "@/lib/format-instant";
import { ROLE_LABELS, ROLES } from "@/lib/roles";
import type { StationView, UserView } from "@/lib/schemas/people";

type Fields = "name" | "email" | "role" | "licenceNumber" | "licenceExpiresOn" | "stationCode";

export function InviteForm({ stations }: { stations: StationView[] }) {
  const queryClient = useQueryClient();
  const [formKey, setFormKey] = useState(0);
  const invite = useMutation({
    mutationFn: (body: Record<Fields, string>) => fetchJson<{ user: UserView }>("/api/users/invitations", { method: "POST", json: body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ["users"] }),
  });
  const fieldErrors: Partial<Record<Fields, string>> = invite.error instanceof ApiError ? invite.error.fields : {};
  const generalError = invite.error && Object.keys(fieldErrors).length === 0 ? invite.error.message : null;

  if (invite.isSuccess) {
    const user = invite.data.user;
    return (
      <div role="status" className="panel space-y-3 border-2 border-[var(--accent)] p-4">
        <p className="text-lg font-semibold">
          <span aria-hidden="true">✉ </span>Invitation sent to <span className="num">{user.email}</span>
        </p>
        <p>
          {user.name} is listed as invited ({ROLE_LABELS[user.role]}) until they use the link
          {user.invitation ? `, which works until ${formatInstant(user.invitation.expiresAt, "UTC")}` : ""}.
        </p>
        <div className="flex flex-wrap gap-2">
          <button
            type="button"
            className="btn btn-primary"
            onClick={() => {
              invite.reset();
              setFormKey((key) => key + 1);
            }}
          >
            Invite someone else
          </button>
          <Link href={`/people/${encodeURIComponent(user.id)}`} className="btn btn-secondary">
            Open {user.name}
          </Link>
          <Link href="/people" className="btn btn-secondary">
            Back to People
          </Link>
        </div>
      </div>
    );
  }

  return (
    <form
      key={formKey}
      className="panel space-y-4 p-4"
      noValidate
      onSubmit={(event) => {
        event.preventDefault();
        const data = new FormData(event.currentTarget);
        const body = Object.fromEntries(
          (["name", "email", "role", "licenceNumber", "licenceExpiresOn", "stationCode"] as const).map((key) => [key, String(data.get(key) ?? "")]),
        ) as Record<Fields, string>;
        invite.mutate(body);
      }}
    >
      {generalError ? (
        <p role="alert" className="rounded-md border-2 border-red-700 bg-red-50 p-3 font-semibold text-red-900">
          {generalError}
        </p>
      ) : null}
      <FormField id="name" label="Full name" error={fieldErrors.name}>
        {(props) => <input {...props} name="name" autoComplete="off" className="field-input" required />}
      </FormField>
      <FormField id="email" label="E-mail address" hint="The invitation goes here, and it is the address they sign in with." error={fieldErrors.email}>
        {(props) => <input {...props} name="email" type="email" autoComplete="off" className="field-input" required />}
      </FormField>
      <FormField id="role" label="Role" error={fieldErrors.role}>
        {(props) => (
          <select {...props} name="role" className="field-input" defaultValue="technician">
            {ROLES.map((role) => (
              <option key={role} value={role}>
                {ROLE_LABELS[role]}
              </option>
            ))}
          </select>
        )}
      </FormField>
      <div className="grid gap-4 sm:grid-cols-2">
        <FormField
          id="licenceNumber"
          label="Licence or authorisation number"
          hint="Shown with their signature. Needed for technicians and inspectors."
          error={fieldErrors.licenceNumber}
        >
          {(props) => <input {...props} name="licenceNumber" autoComplete="off" className="field-input num" />}
        </FormField>
        <FormField id="licenceExpiresOn" label="Valid until" hint="The last day it is valid." error={fieldErrors.licenceExpiresOn}>
          {(props) => <input {...props} name="licenceExpiresOn" type="date" className="field-input num" />}
        </FormField>
      </div>
      <FormField id="stationCode" label="Station" error={fieldErrors.stationCode}>
        {(props) => (
          <select {...props} name="stationCode" className="field-input" defaultValue="">
            <option value="">No station</option>
            {stations.map((station) => (
              <option key={station.code} value={station.code}>
                {station.code} · {station.name}
              </option>
            ))}
          </select>
        )}
      </FormField>
      <button type="submit" className="btn btn-primary w-full text-lg sm:w-auto" disabled={invite.isPending}>
        {invite.isPending ? "Sending…" : "Send invitation"}
      </button>
    </form>
  );
}
