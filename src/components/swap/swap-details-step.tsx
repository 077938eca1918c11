"use client";

import type { SwapDetails } from "./swap-types";

const COMMON_REASONS = ["Fault message on the maintenance computer", "Failed the operational test", "Leak", "Damage found on inspection", "Scheduled: interval reached"];

function Choice<T extends string>({ value, current, onPick, children }: { value: T; current: T | null; onPick: (v: T) => void; children: React.ReactNode }) {
  return (
    <button type="button" aria-pressed={current === value} onClick={() => onPick(value)} className="btn btn-secondary min-h-glove flex-1 aria-pressed:bg-[var(--accent)] aria-pressed:text-[var(--accent-ink)]">
      {children}
    </button>
  );
}

export function SwapDetailsStep({
  details,
  onChange,
  removing,
  installing,
  latest,
  recentWorkOrders,
  fieldErrors,
}: {
  details: SwapDetails;
  onChange: (d: SwapDetails) => void;
  removing: boolean;
  installing: boolean;
  latest: { hours: string; cycles: number };
  recentWorkOrders: string[];
  fieldErrors?: Record<string, string>;
}) {
  const set = (patch: Partial<SwapDetails>) => onChange({ ...details, ...patch });
  const err = (name: string) =>
    fieldErrors?.[name] ? (
      <p id={`${name}-error`} className="field-error">
        {fieldErrors[name]}
      </p>
    ) : null;
  return (
    <section className="space-y-4" aria-labelledby="step-heading">
      <h2 id="step-heading" className="text-xl font-bold">
        Details
      </h2>
      <fieldset className="space-y-2">
        <legend className="font-semibold">Snapshot (last recorded {latest.hours} h, {latest.cycles} cycles)</legend>
        <div className="grid grid-cols-2 gap-2">
          <label>
            <span className="field-label">Aircraft hours</span>
            <input className="field-input num" inputMode="decimal" value={details.hours} onChange={(e) => set({ hours: e.target.value })} aria-describedby={fieldErrors?.aircraftHours ? "aircraftHours-error" : undefined} />
          </label>
          <label>
            <span className="field-label">Aircraft cycles</span>
            <input className="field-input num" inputMode="numeric" value={details.cycles} onChange={(e) => set({ cycles: e.target.value })} aria-describedby={fieldErrors?.aircraftCycles ? "aircraftCycles-error" : undefined} />
          </label>
        </div>
        {err("aircraftHours")}
        {err("aircraftCycles")}
        <label className="block">
          <span className="field-label">Done at (device time)</span>
          <input className="field-input" type="datetime-local" value={details.performedAt} onChange={(e) => set({ performedAt: e.target.value })} />
        </label>
      </fieldset>
      {removing ? (
        <fieldset className="space-y-2">
          <legend className="font-semibold">Removal</legend>
          <div className="flex gap-2">
            <Choice value="unscheduled" current={details.removalType} onPick={(v) => set({ removalType: v })}>
              Unscheduled
            </Choice>
            <Choice value="scheduled" current={details.removalType} onPick={(v) => set({ removalType: v })}>
              Scheduled
            </Choice>
          </div>
          {err("removalType")}
          <div className="flex flex-wrap gap-2">
            {COMMON_REASONS.map((reason) => (
              <button key={reason} type="button" className="btn btn-secondary min-h-glove text-base" aria-pressed={details.reason === reason} onClick={() => set({ reason })}>
                {reason}
              </button>
            ))}
          </div>
          <label className="block">
            <span className="field-label">Reason</span>
            <textarea className="field-input" rows={2} value={details.reason} onChange={(e) => set({ reason: e.target.value })} aria-describedby={fieldErrors?.reason ? "reason-error" : undefined} />
          </label>
          {err("reason")}
        </fieldset>
      ) : null}
      <fieldset className="space-y-2">
        <legend className="font-semibold">Work order and task</legend>
        {recentWorkOrders.length ? (
          <div className="flex flex-wrap gap-2">
            {recentWorkOrders.map((wo) => (
              <button key={wo} type="button" className="btn btn-secondary min-h-glove num text-base" aria-pressed={details.workOrder === wo} onClick={() => set({ workOrder: wo })}>
                {wo}
              </button>
            ))}
          </div>
        ) : null}
        <label className="block">
          <span className="field-label">Work order</span>
          <input className="field-input num" value={details.workOrder} onChange={(e) => set({ workOrder: e.target.value })} aria-describedby={fieldErrors?.workOrder ? "workOrder-error" : undefined} />
        </label>
        {err("workOrder")}
        <label className="block">
          <span className="field-label">Maintenance manual task reference (leave empty to use the position&apos;s chapter)</span>
          <input className="field-input" value={details.taskReference} onChange={(e) => set({ taskReference: e.target.value })} />
        </label>
        {err("taskReference")}
      </fieldset>
      {installing ? (
        <fieldset className="space-y-2">
          <legend className="font-semibold">Operational test from the maintenance computer</legend>
          <div className="flex gap-2">
            <Choice value="passed" current={details.testResult} onPick={(v) => set({ testResult: v })}>
              ✓ Passed
            </Choice>
            <Choice value="failed" current={details.testResult} onPick={(v) => set({ testResult: v })}>
              ✕ Failed
            </Choice>
          </div>
          {err("testResult")}
        </fieldset>
      ) : null}
    </section>
  );
}
