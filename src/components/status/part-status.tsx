import type { PartStatus } from "@/domain/ledger-types";

// Every state has a word and a glyph as well as a colour, so it reads in sunlight, in grey-scale print
// and for colour-blind users. The glyphs and colours are Threadline's own.
export const PART_STATUS_STYLE: Record<PartStatus, { word: string; glyph: string; className: string }> = {
  serviceable: { word: "Serviceable", glyph: "✓", className: "border-emerald-800 text-emerald-900 bg-emerald-50 dark:bg-emerald-950 dark:text-emerald-100 dark:border-emerald-300" },
  installed: { word: "Installed", glyph: "◆", className: "border-thread-700 text-thread-800 bg-thread-50 dark:bg-thread-900 dark:text-thread-100 dark:border-thread-300" },
  unserviceable: { word: "Unserviceable", glyph: "✕", className: "border-red-800 text-red-900 bg-red-50 dark:bg-red-950 dark:text-red-100 dark:border-red-300" },
  in_repair: { word: "In repair", glyph: "↻", className: "border-amber-800 text-amber-950 bg-amber-50 dark:bg-amber-950 dark:text-amber-100 dark:border-amber-300" },
  quarantined: { word: "Quarantined", glyph: "⊘", className: "border-fuchsia-900 text-fuchsia-950 bg-fuchsia-50 dark:bg-fuchsia-950 dark:text-fuchsia-100 dark:border-fuchsia-300" },
  scrapped: { word: "Scrapped", glyph: "▬", className: "border-stone-700 text-stone-900 bg-stone-100 dark:bg-stone-900 dark:text-stone-100 dark:border-stone-300" },
};

export function PartStatusBadge({ status }: { status: PartStatus }) {
  const style = PART_STATUS_STYLE[status];
  return (
    <span className={`inline-flex items-center gap-1 rounded border-2 px-2 py-0.5 text-sm font-semibold ${style.className}`}>
      <span aria-hidden="true">{style.glyph}</span>
      {style.word}
    </span>
  );
}
