import type { RefObject } from "react";
import { MAX_CERTIFICATE_BYTES } from "@/lib/schemas/receiving";
import { Field } from "./field";

const MB = MAX_CERTIFICATE_BYTES / 1024 / 1024;

/** The clerk's confirmation that certificate and data plate agree, and the certificate file itself. */
export function ReceiptCheckFields(props: {
  match: string;
  note: string;
  onMatch: (value: string) => void;
  onNote: (value: string) => void;
  onFile: (file: File | null) => void;
  fileInput: RefObject<HTMLInputElement | null>;
  errors: Record<string, string>;
  idOf: (name: string) => string;
}) {
  const { match, note, onMatch, onNote, onFile, fileInput, errors, idOf } = props;
  return (
    <fieldset className="panel space-y-4 p-4">
      <legend className="px-1 text-lg font-semibold">Check and attach</legend>
      <div role="radiogroup" aria-labelledby="receipt-match-label" aria-describedby={errors.certificateMatches ? `${idOf("certificateMatches")}-error` : undefined}>
        <p id="receipt-match-label" className="field-label">
          Do the P/N and S/N on the certificate match the unit&apos;s data plate?
        </p>
        <div id={idOf("certificateMatches")} className="flex flex-wrap gap-3">
          {[
            ["true", "Yes, they match"],
            ["false", "No: record a receiving discrepancy"],
          ].map(([value, label]) => (
            <label key={value} className="flex min-h-touch cursor-pointer items-center gap-2 rounded-md border-2 border-[var(--ink-soft)] px-3">
              <input type="radio" name="certificateMatches" value={value} checked={match === value} onChange={() => onMatch(value)} className="h-5 w-5" />
              {label}
            </label>
          ))}
        </div>
        {errors.certificateMatches ? (
          <p id={`${idOf("certificateMatches")}-error`} className="field-error">
            {errors.certificateMatches}
          </p>
        ) : null}
      </div>
      {match === "false" ? (
        <>
          <p className="rounded-md border-2 border-red-800 bg-red-50 p-3 font-semibold text-red-950 dark:bg-red-950 dark:text-red-50">
            The unit will be booked in as quarantined and quality will be told. Do not issue or fit it until quality releases it.
          </p>
          <Field id={idOf("discrepancyNote")} label="What differs?" error={errors.discrepancyNote}>
            {(aria) => <textarea {...aria} name="discrepancyNote" rows={2} className="field-input" value={note} onChange={(e) => onNote(e.target.value)} />}
          </Field>
        </>
      ) : null}
      <Field id={idOf("certificate")} label="Certificate file" error={errors.certificate} hint={`PDF, JPEG or PNG, up to ${MB} MB.`}>
        {(aria) => (
          <input
            {...aria}
            ref={fileInput}
            type="file"
            name="certificate"
            accept="application/pdf,image/jpeg,image/png,.pdf,.jpg,.jpeg,.png"
            className="field-input py-2"
            onChange={(e) => onFile(e.target.files?.[0] ?? null)}
          />
        )}
      </Field>
    </fieldset>
  );
}
