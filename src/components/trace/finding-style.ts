import type { FindingKind } from "@/domain/continuity";

// Each finding kind has a word and a glyph of its own, so it reads in grey-scale print and
// without colour; the colour is only a third cue.
export const FINDING_STYLE: Record<FindingKind, { word: string; glyph: string }> = {
  gap: { word: "Gap", glyph: "◌" },
  overlap: { word: "Overlap", glyph: "◎" },
  time_regression: { word: "Time regression", glyph: "↺" },
  no_certificate: { word: "No certificate", glyph: "▯" },
  not_serviceable_at_install: { word: "Not serviceable at installation", glyph: "✕" },
  not_eligible: { word: "Not eligible", glyph: "⊘" },
  life_exceeded: { word: "Life exceeded", glyph: "■" },
};
