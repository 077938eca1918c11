"use client";

import { useMutation } from "@tanstack/react-query";
import { useRef, useState } from "react";
import type { LabelReading } from "@/domain/labels";
import {
  FORM_TYPE_LABELS,
  FORM_TYPES,
  MAX_CERTIFICATE_BYTES,
  RECEIPT_FIELD_ORDER,
  ReceiptFieldsSchema,
  STATUS_WORD_LABELS,
  STATUS_WORDS,
} from "@/lib/schemas/receiving";
import { Field, type ApiError } from "./field";
import { PartNumberRequestButton } from "./part-number-request-button";
import { ReceiptCheckFields } from "./receipt-check-fields";
import { ReceiptDone, type ReceiptAnswer } from "./receipt-done";
import { ScanLabelField } from "./scan-label-field";
import { uploadWithProgress } from "./upload-with-progress";

export interface CatalogEntry {
  partNumber: string;
  cage: string;
  description: string;
}

type Values = Record<string, string>;
const EMPTY: Values = { quantity: "1", formType: "", statusWork: "", certificateMatches: "" };
const FIELD_LABELS: Record<string, string> = {
  partNumber: "Part number",
  cage: "CAGE code",
  serialNumber: "Serial number",
  quantity: "Quantity",
  formType: "Form type",
  statusWork: "Status/work",
  trackingNumber: "Tracking number",
  issuerName: "Issuing organisation",
  issuerApproval: "Approval reference",
  issuedOn: "Certificate date",
  remarks: "Remarks",
  tsn: "TSN",
  csn: "CSN",
  tso: "TSO",
  cso: "CSO",
  bin: "Bin",
  certificateMatches: "Certificate match",
  discrepancyNote: "Discrepancy",
  certificate: "Certificate file",
};

const idOf = (name: string) => `receipt-${name}`;
const MB = MAX_CERTIFICATE_BYTES / 1024 / 1024;

export function ReceiptForm({ catalog }: { catalog: CatalogEntry[] }) {
  const [values, setValues] = useState<Values>(EMPTY);
  const [file, setFile] = useState<File | null>(null);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [banner, setBanner] = useState<ApiError | null>(null);
  const [progress, setProgress] = useState(0);
  const [done, setDone] = useState<ReceiptAnswer | null>(null);
  const fileInput = useRef<HTMLInputElement>(null);
  const summary = useRef<HTMLDivElement>(null);
  const formTypeSelect = useRef<HTMLSelectElement>(null);

  const matches = catalog.filter((entry) => entry.partNumber.toUpperCase() === values.partNumber?.trim().toUpperCase());
  const chosen = matches.find((entry) => entry.cage === values.cage?.trim().toUpperCase()) ?? (matches.length === 1 ? matches[0] : undefined);

  const set = (name: string, value: string) => setValues((current) => ({ ...current, [name]: value }));
  function setPartNumber(value: string) {
    const found = catalog.filter((entry) => entry.partNumber.toUpperCase() === value.trim().toUpperCase());
    setValues((current) => ({ ...current, partNumber: value, cage: found.length === 1 ? found[0].cage : current.cage }));
  }
  function setStatusWork(value: string) {
    // A new part has no time in service; the clerk need not type the zeros.
    setValues((current) => ({ ...current, statusWork: value, ...(value === "new" ? { tsn: current.tsn || "0:00", csn: current.csn || "0" } : {}) }));
  }
  function onScan(reading: LabelReading) {
    const found = catalog.filter((entry) => entry.partNumber.toUpperCase() === reading.partNumber.toUpperCase());
    setValues((current) => ({
      ...current,
      partNumber: found[0]?.partNumber ?? reading.partNumber,
      serialNumber: reading.serialNumber,
      cage: reading.cage ?? (found.length === 1 ? found[0].cage : current.cage ?? ""),
    }));
    formTypeSelect.current?.focus();
  }

  const upload = useMutation<ReceiptAnswer, ApiError, FormData>({
    mutationFn: (body) => uploadWithProgress<ReceiptAnswer>("/api/receipts", body, setProgress),
    onSuccess: (answer) => {
      setDone(answer);
      setErrors({});
      setBanner(null);
    },
    onError: (error) => {
      setErrors(error.fields);
      setBanner(error);
      setProgress(0);
      requestAnimationFrame(() => summary.current?.focus());
    },
  });

  function submit(event: React.FormEvent) {
    event.preventDefault();
    const trimmed = Object.fromEntries(Object.entries(values).map(([k, v]) => [k, v.trim()]));
    const parsed = ReceiptFieldsSchema.safeParse(trimmed);
    const found: Record<string, string> = {};
    if (!parsed.success) for (const issue of parsed.error.issues) found[String(issue.path[0] ?? "body")] ??= issue.message;
    if (!file) found.certificate = "Attach the release certificate (PDF, JPEG or PNG).";
    else if (file.size > MAX_CERTIFICATE_BYTES) found.certificate = `The file is larger than ${MB} MB: scan it at a lower resolution.`;
    setErrors(found);
    setBanner(null);
    if (Object.keys(found).length > 0) {
      requestAnimationFrame(() => summary.current?.focus());
      return;
    }
    const body = new FormData();
    for (const [name, value] of Object.entries(trimmed)) if (value !== "") body.append(name, value);
    body.append("certificate", file!);
    setProgress(0);
    upload.mutate(body);
  }

  function reset() {
    setValues(EMPTY);
    setFile(null);
    setErrors({});
    setBanner(null);
    setDone(null);
    setProgress(0);
    upload.reset();
    if (fileInput.current) fileInput.current.value = "";
  }

  if (done) return <ReceiptDone answer={done} onAnother={reset} />;

  const errorList = RECEIPT_FIELD_ORDER.filter((name) => errors[name]).map((name) => [name, errors[name]] as const);
  const text = (name: string, label: string, extra: React.InputHTMLAttributes<HTMLInputElement> = {}, hint?: React.ReactNode) => (
    <Field id={idOf(name)} label={label} error={errors[name]} hint={hint}>
      {(aria) => <input {...aria} name={name} className="field-input" value={values[name] ?? ""} onChange={(e) => set(name, e.target.value)} {...extra} />}
    </Field>
  );

  return (
    <form onSubmit={submit} noValidate className="space-y-5" aria-describedby="receipt-intro">
      <p id="receipt-intro" className="max-w-prose">
        Book a serialised unit in with its release certificate. Check the certificate against the unit&apos;s data plate before you confirm.
      </p>

      <div ref={summary} tabIndex={-1} className="outline-none">
        {banner || errorList.length > 0 ? (
          <div role="alert" className="rounded-md border-2 border-red-700 bg-red-50 p-3 text-red-950 dark:bg-red-950 dark:text-red-50">
            <p className="font-semibold">{banner ? banner.message : "Some fields need attention before the unit can be received:"}</p>
            {errorList.length > 0 ? (
              <ul className="mt-2 list-disc pl-5">
                {errorList.map(([name, message]) => (
                  <li key={name}>
                    <a className="underline" href={`#${idOf(name)}`}>
                      {FIELD_LABELS[name] ?? name}
                    </a>
                    : {message}
                  </li>
                ))}
              </ul>
            ) : null}
            {banner?.code === "unknown_part_number" ? <PartNumberRequestButton partNumber={values.partNumber.trim()} cage={values.cage?.trim()} /> : null}
          </div>
        ) : null}
      </div>

      <ScanLabelField id={idOf("scan")} onRead={onScan} />

      <fieldset className="panel grid gap-4 p-4 sm:grid-cols-2 lg:grid-cols-4">
        <legend className="px-1 text-lg font-semibold">The unit</legend>
        {text(
          "partNumber",
          "Part number (block 8)",
          { list: "receipt-catalog", autoComplete: "off", spellCheck: false, className: "field-input num", onChange: (e) => setPartNumber(e.target.value) },
          values.partNumber?.trim() ? (chosen ? chosen.description : matches.length > 1 ? "Made under several CAGE codes: give the CAGE." : "Not in the catalog.") : "Choose from the catalog, or scan the label.",
        )}
        <datalist id="receipt-catalog">
          {catalog.map((entry) => (
            <option key={`${entry.partNumber}-${entry.cage}`} value={entry.partNumber}>
              {entry.description} · {entry.cage}
            </option>
          ))}
        </datalist>
        {text("cage", "CAGE code", { maxLength: 5, autoComplete: "off", className: "field-input num uppercase" }, "Filled from the part number.")}
        {text("serialNumber", "Serial number (block 10)", { autoComplete: "off", spellCheck: false, className: "field-input num" })}
        {text("quantity", "Quantity (block 9)", { readOnly: true, inputMode: "numeric", className: "field-input num" }, "Serialised units come one at a time.")}
      </fieldset>

      <fieldset className="panel grid gap-4 p-4 sm:grid-cols-2 lg:grid-cols-4">
        <legend className="px-1 text-lg font-semibold">The release certificate</legend>
        <Field id={idOf("formType")} label="Form type" error={errors.formType}>
          {(aria) => (
            <select {...aria} ref={formTypeSelect} name="formType" className="field-input" value={values.formType} onChange={(e) => set("formType", e.target.value)}>
              <option value="">Choose…</option>
              {FORM_TYPES.map((type) => (
                <option key={type} value={type}>
                  {FORM_TYPE_LABELS[type]}
                </option>
              ))}
            </select>
          )}
        </Field>
        <Field id={idOf("statusWork")} label="Condition: status/work (block 11)" error={errors.statusWork}>
          {(aria) => (
            <select {...aria} name="statusWork" className="field-input" value={values.statusWork} onChange={(e) => setStatusWork(e.target.value)}>
              <option value="">Choose…</option>
              {STATUS_WORDS.map((word) => (
                <option key={word} value={word}>
                  {STATUS_WORD_LABELS[word]}
                </option>
              ))}
            </select>
          )}
        </Field>
        {text("trackingNumber", "Tracking number (block 3)", { autoComplete: "off", spellCheck: false, className: "field-input num" })}
        {text("issuedOn", "Certificate date", { type: "date" })}
        {text("issuerName", "Issuing organisation (block 4)")}
        {text("issuerApproval", "Approval reference", { autoComplete: "off", className: "field-input num" }, "The organisation's approval number, as signed in block 13 or 14.")}
        <Field id={idOf("remarks")} label="Remarks (block 12)" error={errors.remarks} className="sm:col-span-2">
          {(aria) => <textarea {...aria} name="remarks" rows={2} className="field-input" value={values.remarks ?? ""} onChange={(e) => set("remarks", e.target.value)} />}
        </Field>
      </fieldset>

      <fieldset className="panel grid gap-4 p-4 sm:grid-cols-2 lg:grid-cols-5">
        <legend className="px-1 text-lg font-semibold">Times on the paperwork, and where it goes</legend>
        {text("tsn", "TSN (hours)", { inputMode: "decimal", placeholder: "H:MM", className: "field-input num" }, 'H:MM or decimal hours, e.g. "4210:30" or "4210.5".')}
        {text("csn", "CSN (cycles)", { inputMode: "numeric", className: "field-input num" })}
        {text("tso", "TSO (hours, if stated)", { inputMode: "decimal", placeholder: "H:MM", className: "field-input num" }, "Left empty on an overhaul certificate, TSO starts at 0:00.")}
        {text("cso", "CSO (cycles, if stated)", { inputMode: "numeric", className: "field-input num" })}
        {text("bin", "Bin", { autoComplete: "off", className: "field-input num uppercase" })}
      </fieldset>

      <ReceiptCheckFields
        match={values.certificateMatches}
        note={values.discrepancyNote ?? ""}
        onMatch={(value) => set("certificateMatches", value)}
        onNote={(value) => set("discrepancyNote", value)}
        onFile={setFile}
        fileInput={fileInput}
        errors={errors}
        idOf={idOf}
      />

      <div className="sticky bottom-0 z-10 -mx-3 space-y-2 border-t border-[var(--rule)] bg-[var(--page)] px-3 py-3 sm:-mx-5 sm:px-5">
        {upload.isPending ? (
          <div>
            <label htmlFor="receipt-progress" className="field-label">
              Uploading the certificate: <span className="num">{Math.round(progress * 100)}%</span>
            </label>
            <progress id="receipt-progress" max={1} value={progress} className="h-4 w-full" />
          </div>
        ) : null}
        <button type="submit" className="btn btn-primary w-full text-lg sm:w-auto" disabled={upload.isPending}>
          {upload.isPending ? "Receiving…" : "Receive the unit"}
        </button>
      </div>
    </form>
  );
}
