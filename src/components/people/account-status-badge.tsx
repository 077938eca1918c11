import type { AccountStatus } from "@/lib/schemas/people";

const LOOK: Record<AccountStatus, { glyph: string; word: string; className: string }> = {
  active: { glyph: "●", word: "Active", className: "border-[var(--accent)]" },
  invited: { glyph: "✉", word: "Invited", className: "border-dashed border-[var(--accent)]" },
  deactivated: { glyph: "⊘", word: "Deactivated", className: "border-[var(--ink-soft)] bg-[var(--page)]" },
};

export function AccountStatusBadge({ status }: { status: AccountStatus }) {
  const look = LOOK[status];
  return (
    <span className={`inline-flex items-center gap-1 rounded border-2 px-1.5 py-0.5 text-sm font-semibold ${look.className}`}>
      <span aria-hidden="true">{look.glyph}</span>
      {look.word}
    </span>
  );
}
