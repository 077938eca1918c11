import type { LicenceFilter } from "@/lib/schemas/people";

// Word and glyph for each state, so it reads in sunlight, in grey-scale print and without colour.
const LOOK: Record<LicenceFilter, { glyph: string; className: string }> = {
  valid: { glyph: "✓", className: "border-[var(--ink-soft)]" },
  expiring: { glyph: "⚠", className: "border-amber-700 bg-amber-50 text-amber-950 dark:bg-amber-950 dark:text-amber-100 dark:border-amber-400" },
  expired: { glyph: "✕", className: "border-red-800 bg-red-50 text-red-950 dark:bg-red-950 dark:text-red-100 dark:border-red-400" },
  none: { glyph: "–", className: "border-dashed border-[var(--ink-soft)]" },
};

export function licenceWords(status: LicenceFilter, daysLeft: number | null): string {
  switch (status) {
    case "valid":
      return "Valid";
    case "expiring":
      return daysLeft === 0 ? "Expires today" : `Expires in ${daysLeft} day${daysLeft === 1 ? "" : "s"}`;
    case "expired":
      return daysLeft === null ? "Expired" : `Expired ${-daysLeft} day${daysLeft === -1 ? "" : "s"} ago`;
    case "none":
      return "No expiry on file";
  }
}

export function LicenceBadge({ status, daysLeft }: { status: LicenceFilter; daysLeft: number | null }) {
  const look = LOOK[status];
  return (
    <span className={`inline-flex items-center gap-1 rounded border-2 px-1.5 py-0.5 text-sm font-semibold ${look.className}`}>
      <span aria-hidden="true">{look.glyph}</span>
      {licenceWords(status, daysLeft)}
    </span>
  );
}
