// Turns the elements found on a label into part number, serial and CAGE, or a refusal that says
// what was found and what is missing. Identifier namespaces do not overlap (DIs end in a letter,
// TEIs are three letters, AIs are digits, plain captions contain "/" or are "CAGE"), so one set of
// precedence lists serves every syntax; "MFR" means the same in TEI and plain labels.
import type { LabelElement, LabelParseResult, LabelRefusal, LabelSyntax } from "./types";

export type Vocabulary = "mh10" | "tei" | "gs1" | "plain";

// P/N: 1P, else 30P, else P (MH10); PNR (current) before PNO (original) for TEIs; GS1 AI 240 before the GTIN.
const PART_SOURCES = ["1P", "30P", "P", "PNR", "PNO", "240", "01", "P/N"];
const SERIAL_SOURCES = ["S", "SER", "SEQ", "UCN", "21", "S/N"];
const CAGE_SOURCES = ["17V", "MFR", "CAG", "CAGE"];
// SPL is the supplier's CAGE: used only when no manufacturer CAGE is present.
const FALLBACK_CAGE_SOURCES = ["SPL"];

const WANTED: Record<Vocabulary, { part: string; serial: string }> = {
  mh10: { part: "1P, P or 30P", serial: "S, 18S or 25S" },
  tei: { part: "PNR or PNO", serial: "SER, SEQ or UCN" },
  gs1: { part: "AI 240 or AI 01", serial: "AI 21" },
  plain: { part: "P/N", serial: "S/N" },
};

export interface InterpretContext {
  syntax: LabelSyntax;
  vocabularies: readonly Vocabulary[];
  format?: string;
  inferredSeparators?: boolean;
}

/** How an identifier is shown in messages: AIs as "AI 01", the rest as they are. */
export function displayId(id: string): string {
  return /^\d+$/.test(id) ? `AI ${id}` : id;
}

/** "a (X), b (Y) and c (Z)"; `annotate` may add words inside the parentheses. */
export function describeElements(elements: readonly LabelElement[], annotate: (e: LabelElement) => string = () => ""): string {
  const parts = elements.map((e) => `${e.name} ${e.value} (${displayId(e.id)}${annotate(e)})`);
  if (parts.length <= 1) return parts.join("");
  return `${parts.slice(0, -1).join(", ")} and ${parts[parts.length - 1]}`;
}

export function refusal(code: LabelRefusal["code"], message: string, found: readonly LabelElement[]): LabelRefusal {
  return { ok: false, code, message, found: [...found] };
}

interface Sourced {
  value: string;
  source: string;
}

/** CAGE and serial carried inside 18S (CAGE + serial) or 25S (IAC + enterprise ID + serial). */
function splitEnterpriseSerial(element: LabelElement): { cage: string | null; serial: string | null } {
  const v = element.value;
  if (element.id === "18S") return { cage: v.slice(0, 5), serial: v.slice(5) };
  if (element.id === "25S") {
    if (/^D[A-Z0-9]{5}./.test(v)) return { cage: v.slice(1, 6), serial: v.slice(6) }; // IAC D = CAGE (Table V)
    if (/^UN\d{9}./.test(v)) return { cage: null, serial: v.slice(11) }; // IAC UN = DUNS (Table V)
  }
  return { cage: null, serial: null };
}

/** Names the CAGE and serial found inside 18S/25S, so the message says what the label gave. */
function describeInner(element: LabelElement): string {
  const { cage, serial } = splitEnterpriseSerial(element);
  if (serial === null) return "";
  return cage === null ? `, holding serial number ${serial}` : `, holding CAGE ${cage} and serial number ${serial}`;
}

function collect(elements: readonly LabelElement[], ids: readonly string[]): Sourced[] {
  const found: Sourced[] = [];
  for (const id of ids) {
    for (const e of elements) if (e.id === id) found.push({ value: e.value, source: id });
  }
  return found;
}

function disagreement(what: string, candidates: readonly Sourced[]): string | null {
  const first = candidates[0];
  const other = candidates.find((c) => c.value !== first?.value);
  if (!first || !other) return null;
  return `Two different ${what}s: ${first.value} (${displayId(first.source)}) and ${other.value} (${displayId(other.source)})`;
}

function wanted(vocabularies: readonly Vocabulary[], key: "part" | "serial"): string {
  return [...new Set(vocabularies)].map((v) => WANTED[v][key]).join(", or ");
}

export function interpretElements(elements: readonly LabelElement[], context: InterpretContext): LabelParseResult {
  if (elements.length === 0) return refusal("malformed", "The label holds no data elements.", elements);

  for (const e of elements) {
    const clash = elements.find((other) => other.id === e.id && other.value !== e.value);
    if (clash) {
      return refusal("contradictory", `Two different values for ${e.name} (${displayId(e.id)}): ${e.value} and ${clash.value}.`, elements);
    }
  }

  const serials = collect(elements, SERIAL_SOURCES);
  const cages = collect(elements, CAGE_SOURCES);
  let opaqueUii: LabelElement | undefined;
  for (const e of elements.filter((x) => x.id === "18S" || x.id === "25S")) {
    const inner = splitEnterpriseSerial(e);
    if (inner.serial !== null) serials.push({ value: inner.serial, source: e.id });
    else opaqueUii = e;
    if (inner.cage !== null) cages.push({ value: inner.cage, source: e.id });
  }
  const conflict = disagreement("serial number", serials) ?? disagreement("CAGE code", cages);
  if (conflict) return refusal("contradictory", `${conflict}.`, elements);

  const partNumber = collect(elements, PART_SOURCES)[0]?.value;
  const serialNumber = serials[0]?.value;
  const cage = cages[0]?.value ?? collect(elements, FALLBACK_CAGE_SOURCES)[0]?.value ?? null;

  const missing: string[] = [];
  if (partNumber === undefined) missing.push(`no part number (${wanted(context.vocabularies, "part")})`);
  if (serialNumber === undefined) {
    const note = opaqueUii
      ? `; ${displayId(opaqueUii.id)} ${opaqueUii.value} is a UII whose serial cannot be separated from its enterprise identifier`
      : "";
    missing.push(`no serial number (${wanted(context.vocabularies, "serial")})${note}`);
  }
  if (missing.length > 0) {
    const code = partNumber === undefined ? "missing_part_number" : "missing_serial_number";
    return refusal(code, `Found ${describeElements(elements, describeInner)} but ${missing.join(" and ")}.`, elements);
  }

  return {
    ok: true,
    syntax: context.syntax,
    partNumber: partNumber as string,
    serialNumber: serialNumber as string,
    cage,
    elements: [...elements],
    ...(context.format !== undefined ? { format: context.format } : {}),
    ...(context.inferredSeparators ? { inferredSeparators: true as const } : {}),
  };
}
