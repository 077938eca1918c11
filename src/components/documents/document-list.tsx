"use client";

import { useState } from "react";
import { formatInstant } from "@/lib/format";
import { FORM_TYPE_LABELS } from "@/lib/schemas/receiving";

/** A document as getPartDetail lists it. */
export interface PartDocument {
  id: number;
  kind: string;
  formType: string | null;
  trackingNumber: string | null;
  sha256: string;
  sizeBytes: number;
  contentType: string;
  uploadedAt: string;
}

const KIND_LABELS: Record<string, string> = {
  release_certificate: "Release certificate",
  unserviceable_tag: "Unserviceable tag",
  shop_report: "Shop report",
  photo: "Photo",
};
const TYPE_LABELS: Record<string, string> = { "application/pdf": "PDF", "image/jpeg": "JPEG", "image/png": "PNG" };

function size(bytes: number): string {
  return bytes < 1024 * 1024 ? `${Math.max(1, Math.round(bytes / 1024))} KB` : `${(bytes / 1024 / 1024).toFixed(1)} MB`;
}

/**
 * A unit's documents with a download for each. The download goes through GET /api/documents/{id},
 * which refuses a file whose bytes no longer match the SHA-256 recorded at upload; that refusal is
 * shown here rather than a broken file.
 */
export function DocumentList({ documents, timeZone = "UTC" }: { documents: PartDocument[]; timeZone?: string }) {
  const [problems, setProblems] = useState<Record<number, string>>({});
  const [busy, setBusy] = useState<number | null>(null);

  async function download(doc: PartDocument) {
    setBusy(doc.id);
    setProblems((current) => ({ ...current, [doc.id]: "" }));
    try {
      const response = await fetch(`/api/documents/${doc.id}`);
      if (!response.ok) {
        const body = await response.json().catch(() => null);
        throw new Error(body?.error?.message ?? `The server answered ${response.status}.`);
      }
      const url = URL.createObjectURL(await response.blob());
      const name = /filename="([^"]+)"/.exec(response.headers.get("content-disposition") ?? "")?.[1] ?? `document-${doc.id}`;
      const link = Object.assign(document.createElement("a"), { href: url, download: name });
      link.click();
      setTimeout(() => URL.revokeObjectURL(url), 60_000);
    } catch (error) {
      setProblems((current) => ({ ...current, [doc.id]: error instanceof Error ? error.message : String(error) }));
    } finally {
      setBusy(null);
    }
  }

  if (documents.length === 0) {
    return <p>No documents on file. A serviceable unit needs its release certificate: receive it through Receiving.</p>;
  }
  return (
    <ul className="space-y-3" aria-label="Documents">
      {documents.map((doc) => (
        <li key={doc.id} className="panel p-3">
          <div className="flex flex-wrap items-start justify-between gap-3">
            <div className="min-w-0">
              <p className="font-semibold">
                {doc.formType ? ((FORM_TYPE_LABELS as Record<string, string>)[doc.formType] ?? doc.formType) : (KIND_LABELS[doc.kind] ?? doc.kind)}
                {doc.trackingNumber ? (
                  <>
                    {" "}
                    · tracking no. <span className="num">{doc.trackingNumber}</span>
                  </>
                ) : null}
              </p>
              <p className="text-sm">
                {TYPE_LABELS[doc.contentType] ?? doc.contentType}, <span className="num">{size(doc.sizeBytes)}</span>, uploaded {formatInstant(doc.uploadedAt, timeZone)}
              </p>
              <p className="text-sm">
                SHA-256 <span className="num select-all break-all">{doc.sha256}</span>
              </p>
            </div>
            <button type="button" className="btn btn-secondary" disabled={busy === doc.id} onClick={() => download(doc)}>
              {busy === doc.id ? "Checking…" : "Download"}
            </button>
          </div>
          {problems[doc.id] ? (
            <p role="alert" className="field-error">
              {problems[doc.id]}
            </p>
          ) : null}
        </li>
      ))}
    </ul>
  );
}
