export const SWAP_STEPS = ["Position", "Off part", "On part", "Details", "Review and sign"] as const;

export function StepIndicator({ current }: { current: number }) {
  return (
    <ol className="flex flex-wrap gap-1 text-sm" aria-label="Swap steps">
      {SWAP_STEPS.map((step, index) => (
        <li
          key={step}
          aria-current={index === current ? "step" : undefined}
          className={`rounded-full border-2 px-3 py-1 font-semibold ${
            index === current ? "border-[var(--accent)] bg-[var(--accent)] text-[var(--accent-ink)]" : index < current ? "border-[var(--accent)]" : "border-[var(--rule)] text-[var(--ink-soft)]"
          }`}
        >
          <span aria-hidden="true">{index < current ? "✓ " : `${index + 1}. `}</span>
          {step}
        </li>
      ))}
    </ol>
  );
}
