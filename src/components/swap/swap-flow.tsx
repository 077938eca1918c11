"use client";

import { useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useMemo, useState } from "react";
import { SafetyNote } from "@/components/safety/safety-note";
import { LazyLabelScanner, type LabelScan, type ScanTarget } from "@/components/scanner/lazy-label-scanner";
import { ApiError, apiFetch } from "@/lib/api-client";
import { queryKeys } from "@/lib/queries";
import type { SwapCheckResponse, SwapResponse } from "@/lib/swap-types";
import { CheckList } from "./check-list";
import { SwapDetailsStep } from "./swap-details-step";
import { StepIndicator } from "./step-indicator";
import type { SwapDetails, SwapPosition, UnitReading } from "./swap-types";
import { UnitStep } from "./unit-step";

interface Props {
  registration: string;
  positions: SwapPosition[];
  initialPositionCode: string | null;
  latest: { hours: string; cycles: number };
  signer: { name: string; licenceNumber: string | null };
  recentWorkOrders: string[];
}

const sameUnit = (a: UnitReading, b: { partNumber: string; serialNumber: string }) =>
  a.partNumber.toUpperCase() === b.partNumber.toUpperCase() && a.serialNumber.toUpperCase() === b.serialNumber.toUpperCase();

function nowLocal(): string {
  const d = new Date();
  d.setSeconds(0, 0);
  return new Date(d.getTime() - d.getTimezoneOffset() * 60_000).toISOString().slice(0, 16);
}

export function SwapFlow({ registration, positions, initialPositionCode, latest, signer, recentWorkOrders }: Props) {
  const queryClient = useQueryClient();
  const [step, setStep] = useState(0);
  const [positionCode, setPositionCode] = useState<string | null>(initialPositionCode);
  const [safe, setSafe] = useState(false);
  const [filter, setFilter] = useState("");
  const [scanningPosition, setScanningPosition] = useState(false);
  const [chosenByLabel, setChosenByLabel] = useState(false);
  const [off, setOff] = useState<UnitReading | null>(null);
  const [on, setOn] = useState<UnitReading | null>(null);
  const [installNothing, setInstallNothing] = useState(false);
  const [checks, setChecks] = useState<SwapCheckResponse | null>(null);
  const [details, setDetails] = useState<SwapDetails>(() => ({
    hours: latest.hours,
    cycles: String(latest.cycles),
    performedAt: nowLocal(),
    removalType: null,
    reason: "",
    workOrder: recentWorkOrders[0] ?? "",
    taskReference: "",
    testResult: null,
  }));
  const [idempotencyKey] = useState(() => crypto.randomUUID());
  const [submitting, setSubmitting] = useState(false);
  const [error, setError] = useState<{ message: string; fields?: Record<string, string> } | null>(null);
  const [result, setResult] = useState<SwapResponse | null>(null);
  const [discrepancySent, setDiscrepancySent] = useState(false);

  const position = positions.find((p) => p.code === positionCode) ?? null;
  const positionTarget = useMemo<ScanTarget>(
    () => ({ kind: "position", registration, positions: positions.map((p) => ({ code: p.code, label: p.label })) }),
    [registration, positions],
  );

  function choosePosition(code: string | null, byLabel = false) {
    setPositionCode(code);
    setChosenByLabel(byLabel);
    setSafe(false); // "made safe" is confirmed for one position's task
  }

  function acceptPositionLabel(scan: LabelScan) {
    setScanningPosition(false);
    // The scanner offers "Use this position" only for a position label of this aircraft and layout.
    if (scan.parsed.ok && scan.parsed.syntax === "threadline-position") choosePosition(scan.parsed.positionCode, true);
  }
  const offMismatch = position?.fitted && off && !sameUnit(off, position.fitted);
  const removing = Boolean(position?.fitted);

  const body = useMemo(() => {
    if (!position) return null;
    const hoursText = details.hours.trim();
    return {
      registration,
      positionCode: position.code,
      aircraftHours: /^\d+(\.\d+)?$/.test(hoursText) ? Number(hoursText) : hoursText,
      aircraftCycles: Number(details.cycles),
      performedAt: details.performedAt ? new Date(details.performedAt).toISOString() : "",
      removed: removing && off ? { partNumber: off.partNumber, serialNumber: off.serialNumber, cage: off.cage } : null,
      installed: !installNothing && on ? { partNumber: on.partNumber, serialNumber: on.serialNumber, cage: on.cage } : null,
      removalType: removing ? details.removalType : null,
      reason: removing ? details.reason : null,
      workOrder: details.workOrder,
      taskReference: details.taskReference || (position ? `AMM ${position.ataChapter} task for ${position.code}` : ""),
      testResult: !installNothing && on ? (details.testResult === "passed" ? "Operational test from the maintenance computer: passed" : details.testResult === "failed" ? "Operational test: failed" : null) : null,
    };
  }, [position, details, registration, removing, off, on, installNothing]);

  async function runChecks(reading: UnitReading) {
    setOn(reading);
    setChecks(null);
    if (!position) return;
    try {
      const response = await apiFetch<SwapCheckResponse>("/api/swaps/check", {
        method: "POST",
        body: JSON.stringify({
          registration,
          positionCode: position.code,
          aircraftHours: latest.hours,
          aircraftCycles: latest.cycles,
          removed: removing && off ? off : null,
          installed: reading,
        }),
      });
      setChecks(response);
    } catch (e) {
      setChecks({ ok: false, fitted: null, checks: [{ name: "check", level: "fail", message: e instanceof Error ? e.message : "The checks could not be run." }] });
    }
  }

  async function reportDiscrepancy() {
    if (!position) return;
    await apiFetch("/api/discrepancies", {
      method: "POST",
      body: JSON.stringify({ registration, positionCode: position.code, found: off, onRecord: position.fitted }),
    });
    setDiscrepancySent(true);
  }

  async function sign() {
    if (!body) return;
    setSubmitting(true);
    setError(null);
    try {
      const response = await apiFetch<SwapResponse>("/api/swaps", { method: "POST", body: JSON.stringify(body), headers: { "Idempotency-Key": idempotencyKey } });
      setResult(response);
      void queryClient.invalidateQueries({ queryKey: queryKeys.aircraft(registration) });
    } catch (e) {
      setError(e instanceof ApiError ? { message: e.message, fields: e.fields } : { message: "The swap could not be sent. Nothing was recorded; check the connection and sign again (it will not be recorded twice)." });
    } finally {
      setSubmitting(false);
    }
  }

  if (result) {
    return (
      <section className="space-y-4" aria-labelledby="done-heading">
        <h2 id="done-heading" className="text-2xl font-bold">
          <span aria-hidden="true">✓</span> Swap recorded
        </h2>
        {result.swap.status === "awaiting_inspection" ? (
          <p className="rounded-md border-2 border-amber-700 bg-amber-50 p-3 font-semibold text-amber-950">
            ◐ This position requires an independent inspection: the swap is complete once an inspector countersigns it.
          </p>
        ) : null}
        <ul className="panel space-y-1 p-3">
          {result.entries.map((entry) => (
            <li key={entry.seq} className="num">
              seq {entry.seq} · {entry.kind} · {entry.hash.slice(0, 16)}…
            </li>
          ))}
        </ul>
        <div className="flex flex-col gap-2 sm:flex-row">
          {result.swap.removed ? (
            <Link href={`/swaps/${result.swap.id}/tag`} className="btn btn-primary min-h-glove">
              Print the unserviceable tag
            </Link>
          ) : null}
          <Link href={`/aircraft/${registration}?position=${encodeURIComponent(result.swap.positionCode)}`} className="btn btn-secondary min-h-glove">
            Back to {registration}
          </Link>
        </div>
      </section>
    );
  }

  const canNext = [
    Boolean(position && safe),
    !removing || (Boolean(off) && !offMismatch),
    installNothing ? removing : Boolean(on && checks?.ok),
    true,
    false,
  ][step];

  return (
    <div className="space-y-4 pb-28 text-lg">
      <StepIndicator current={step} />
      {position ? (
        <p className="sticky top-0 z-10 rounded-md bg-thread-800 px-3 py-2 font-semibold text-white" data-testid="swap-where">
          <span className="num">{registration}</span> · <span className="num">{position.code}</span> — {position.label}
        </p>
      ) : null}

      {step === 0 ? (
        <section className="space-y-3" aria-labelledby="step-heading">
          <h2 id="step-heading" className="text-xl font-bold">
            Position
          </h2>
          {!position && scanningPosition ? (
            <LazyLabelScanner label="Scan the position label" target={positionTarget} onResult={acceptPositionLabel} onCancel={() => setScanningPosition(false)} />
          ) : !position ? (
            <>
              <button type="button" className="btn btn-primary min-h-glove w-full text-lg" onClick={() => setScanningPosition(true)}>
                <span aria-hidden="true">▥ </span>Scan the position label
              </button>
              <p className="text-base">Or find the position and tap it:</p>
              <label className="block">
                <span className="field-label">Find the position</span>
                <input className="field-input" value={filter} onChange={(e) => setFilter(e.target.value)} placeholder="B1-EBA2, brake, 32-42…" />
              </label>
              <ul className="grid gap-2 sm:grid-cols-2">
                {positions
                  .filter((p) => `${p.code} ${p.label} ${p.ataChapter}`.toLowerCase().includes(filter.toLowerCase()))
                  .slice(0, 40)
                  .map((p) => (
                    <li key={p.code}>
                      <button type="button" className="panel min-h-glove w-full px-3 py-2 text-left" onClick={() => choosePosition(p.code)}>
                        <span className="num font-bold">{p.code}</span> {p.label}
                      </button>
                    </li>
                  ))}
              </ul>
            </>
          ) : (
            <>
              {chosenByLabel ? (
                <p className="font-semibold" data-testid="position-chosen-by-label">
                  <span aria-hidden="true">✓ </span>Chosen by scanning the position label of <span className="num">{registration}</span>{" "}
                  <span className="num">{position.code}</span>.
                </p>
              ) : null}
              <p>
                On record: {position.fitted ? <span className="num font-bold">{position.fitted.partNumber} · {position.fitted.serialNumber}</span> : "nothing fitted"}
                {position.independentInspection ? <span className="block font-semibold">⧉ An independent inspection is required at this position.</span> : null}
              </p>
              <SafetyNote cautions={position.cautions} />
              <label className="panel flex min-h-glove cursor-pointer items-center gap-3 p-3 font-semibold">
                <input type="checkbox" className="h-7 w-7" checked={safe} onChange={(e) => setSafe(e.target.checked)} />
                The aircraft is made safe for this task as the maintenance manual requires.
              </label>
              {!initialPositionCode ? (
                <button type="button" className="btn btn-secondary min-h-glove" onClick={() => choosePosition(null)}>
                  Choose another position
                </button>
              ) : null}
            </>
          )}
        </section>
      ) : null}

      {step === 1 && position ? (
        <section className="space-y-3" aria-labelledby="step-heading">
          <h2 id="step-heading" className="text-xl font-bold">
            Off part
          </h2>
          {position.fitted ? (
            <>
              <p>
                Threadline has <span className="num font-bold">{position.fitted.partNumber} · {position.fitted.serialNumber}</span> fitted here. Scan the label of the unit you take off.
              </p>
              <UnitStep title="Scan the off part's label" reading={off} onReading={setOff} />
              {offMismatch ? (
                <div role="alert" className="rounded-md border-2 border-red-800 bg-red-50 p-3 text-red-950">
                  <p className="font-bold">✕ This is not the unit on record.</p>
                  <p>
                    You read <span className="num">{off!.partNumber} · {off!.serialNumber}</span>; Threadline has <span className="num">{position.fitted.partNumber} · {position.fitted.serialNumber}</span> at {position.code}. Check you are at the right position. If the unit on the aircraft really differs from the record, report the discrepancy: the swap cannot be recorded over it.
                  </p>
                  <button type="button" className="btn btn-primary mt-2 min-h-glove" onClick={reportDiscrepancy} disabled={discrepancySent}>
                    {discrepancySent ? "Discrepancy reported to the inspectors" : "Report the discrepancy"}
                  </button>
                </div>
              ) : null}
            </>
          ) : (
            <p>Nothing is fitted at {position.code} on record: this is an installation only.</p>
          )}
        </section>
      ) : null}

      {step === 2 && position ? (
        <section className="space-y-3" aria-labelledby="step-heading">
          <h2 id="step-heading" className="text-xl font-bold">
            On part
          </h2>
          {!installNothing ? (
            <>
              <UnitStep title="Scan the on part's label" reading={on} onReading={runChecks} />
              {on && !checks ? <p role="status">Checking the unit…</p> : null}
              {checks ? <CheckList checks={checks.checks} /> : null}
            </>
          ) : (
            <p>The position will be left empty.</p>
          )}
          {removing ? (
            <label className="panel flex min-h-glove cursor-pointer items-center gap-3 p-3">
              <input type="checkbox" className="h-7 w-7" checked={installNothing} onChange={(e) => setInstallNothing(e.target.checked)} />
              Install nothing now (removal only)
            </label>
          ) : null}
        </section>
      ) : null}

      {step === 3 && position ? (
        <SwapDetailsStep details={details} onChange={setDetails} removing={removing} installing={!installNothing && Boolean(on)} latest={latest} recentWorkOrders={recentWorkOrders} fieldErrors={error?.fields} />
      ) : null}

      {step === 4 && position && body ? (
        <section className="space-y-3" aria-labelledby="step-heading">
          <h2 id="step-heading" className="text-xl font-bold">
            Review and sign
          </h2>
          <dl className="panel grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 p-3 text-base" data-testid="swap-review">
            <dt className="font-semibold">Aircraft · position</dt>
            <dd className="num">{registration} · {position.code}</dd>
            <dt className="font-semibold">Off</dt>
            <dd className="num">{body.removed ? `${body.removed.partNumber} · ${body.removed.serialNumber}` : "—"}</dd>
            <dt className="font-semibold">On</dt>
            <dd className="num">{body.installed ? `${body.installed.partNumber} · ${body.installed.serialNumber}` : "— (left empty)"}</dd>
            <dt className="font-semibold">Snapshot</dt>
            <dd className="num">{details.hours} h · {details.cycles} cycles</dd>
            <dt className="font-semibold">When</dt>
            <dd>{new Date(details.performedAt).toString().slice(0, 21)} (device time)</dd>
            {body.removed ? (
              <>
                <dt className="font-semibold">Removal</dt>
                <dd>
                  {details.removalType} — {details.reason}
                </dd>
              </>
            ) : null}
            <dt className="font-semibold">Work order</dt>
            <dd className="num">{body.workOrder}</dd>
            <dt className="font-semibold">Task</dt>
            <dd>{body.taskReference}</dd>
            {body.installed ? (
              <>
                <dt className="font-semibold">Operational test</dt>
                <dd>{body.testResult}</dd>
              </>
            ) : null}
            <dt className="font-semibold">Signed by</dt>
            <dd>
              {signer.name} {signer.licenceNumber ? <span className="num">({signer.licenceNumber})</span> : null}
            </dd>
          </dl>
          {position.independentInspection ? <p className="font-semibold">⧉ An inspector must countersign before the swap is complete.</p> : null}
          {details.testResult === "failed" && body.installed ? (
            <p role="alert" className="field-error">An installation is signed only with a passed operational test. Troubleshoot and retest, or record the removal only.</p>
          ) : null}
          {error ? (
            <p role="alert" className="rounded-md border-2 border-red-800 bg-red-50 p-3 font-semibold text-red-950">
              {error.message}
            </p>
          ) : null}
          <button type="button" className="btn btn-primary min-h-glove w-full text-xl" onClick={sign} disabled={submitting || (details.testResult === "failed" && Boolean(body.installed))}>
            {submitting ? "Recording…" : "Sign and record the swap"}
          </button>
        </section>
      ) : null}

      <div className="fixed inset-x-0 bottom-0 z-20 flex gap-2 border-t border-[var(--rule)] bg-[var(--panel)] p-3">
        <button type="button" className="btn btn-secondary min-h-glove flex-1" onClick={() => setStep((s) => Math.max(0, s - 1))} disabled={step === 0}>
          Back
        </button>
        {step < 4 ? (
          <button type="button" className="btn btn-primary min-h-glove flex-1" onClick={() => setStep((s) => s + 1)} disabled={!canNext}>
            Next
          </button>
        ) : null}
      </div>
    </div>
  );
}
