// ISO/IEC 15434 messages: "[)>" RS, then per envelope a 2-character format indicator, GS, the
// GS-separated elements, RS; EOT ends the message (trade-facts 1.1). Formats: 06 (MH10 DIs),
// 12 and DD (TEIs), 05 (GS1 AIs). The RS after "[)>" and the trailer may be missing.
import { EOT, excerpt, GS, RS } from "./control-characters";
import { readGs1Data } from "./gs1-element-string";
import { displayId, interpretElements, refusal, type Vocabulary } from "./interpret-elements";
import { DATA_IDENTIFIER_SPECS, findDataIdentifier, splitDataIdentifier } from "./mh10-data-identifiers";
import { chooseReading, commonElements, describeCandidates, enumerateSplits, type FieldSpec } from "./split-readings";
import { findTextElementIdentifier, TEXT_ELEMENT_SPECS } from "./text-element-identifiers";
import type { LabelElement, LabelParseResult, LabelRefusal, ParseLabelOptions } from "./types";

const VOCABULARY_BY_FORMAT: Record<string, Vocabulary> = { "06": "mh10", "12": "tei", DD: "tei", "05": "gs1" };

type EnvelopeResult = { ok: true; elements: LabelElement[]; inferredSeparators: boolean } | LabelRefusal;

function readDataIdentifierSegments(data: string): EnvelopeResult {
  const elements: LabelElement[] = [];
  for (const segment of data.split(GS).filter((s) => s !== "")) {
    const split = splitDataIdentifier(segment);
    if (!split) return refusal("malformed", `Element "${excerpt(segment)}" does not start with a data identifier.`, elements);
    const di = findDataIdentifier(split.id);
    if (di && !di.accepts(split.value)) {
      return refusal("malformed", `${di.name} "${excerpt(split.value)}" (${di.id}) is not ${di.format}.`, elements);
    }
    elements.push({ id: split.id, name: di?.name ?? "unsupported data identifier", value: split.value });
  }
  return { ok: true, elements, inferredSeparators: false };
}

function readTextElementSegments(data: string): EnvelopeResult {
  const elements: LabelElement[] = [];
  for (const segment of data.split(GS).filter((s) => s !== "")) {
    // TEI, a space, the value. Some reader manuals (Microscan MS-Q, §10) print no space; accepted for known TEIs.
    const match = /^([A-Z]{3})( ?)([\s\S]*)$/.exec(segment);
    const tei = match ? findTextElementIdentifier(match[1]) : undefined;
    if (!match || (!tei && match[2] !== " ")) {
      return refusal("malformed", `Element "${excerpt(segment)}" does not start with a text element identifier and a space.`, elements);
    }
    const value = match[3];
    if (tei && !tei.accepts(value)) {
      return refusal("malformed", `${tei.name} "${excerpt(value)}" (${tei.id}) is not ${tei.format}.`, elements);
    }
    elements.push({ id: match[1], name: tei?.name ?? "unsupported text element", value });
  }
  return { ok: true, elements, inferredSeparators: false };
}

function readUnseparated(data: string, format: string, specs: readonly FieldSpec[], nameOf: (id: string) => string): EnvelopeResult {
  const named = (reading: Array<{ id: string; value: string }>) => reading.map(({ id, value }) => ({ id, name: nameOf(id), value }));
  const vocabularies = [VOCABULARY_BY_FORMAT[format]];
  const choice = chooseReading(enumerateSplits(data, specs), (reading) =>
    interpretElements(named(reading), { syntax: "iso15434", vocabularies }).ok,
  );
  if (choice.kind === "none") {
    return refusal("malformed", `Format ${format} data "${excerpt(data)}" has no separators and cannot be split into known identifiers.`, []);
  }
  if (choice.kind === "ambiguous") {
    return refusal(
      "ambiguous",
      `This format ${format} message has no GS separators and can be read in more than one way: ` +
        `${describeCandidates(choice.candidates, displayId)}. Scan it with a reader that keeps the GS separators, or enter the values by hand.`,
      named(commonElements(choice.candidates)),
    );
  }
  return { ok: true, elements: named(choice.reading), inferredSeparators: choice.byCompleteness };
}

function readEnvelope(format: string, data: string, separatorsSeen: boolean): EnvelopeResult {
  switch (format) {
    case "06":
      return separatorsSeen
        ? readDataIdentifierSegments(data)
        : readUnseparated(data, format, DATA_IDENTIFIER_SPECS, (id) => findDataIdentifier(id)?.name ?? id);
    case "12":
    case "DD":
      return separatorsSeen
        ? readTextElementSegments(data)
        : readUnseparated(data, format, TEXT_ELEMENT_SPECS, (id) => findTextElementIdentifier(id)?.name ?? id);
    case "05":
      return readGs1Data(data, separatorsSeen);
    default:
      return refusal("unrecognised", `ISO/IEC 15434 format ${format} is not supported (supported: 05, 06, 12, DD).`, []);
  }
}

/** `text` starts with "[)>" and has its control-character stand-ins already replaced. */
export function readIso15434(text: string, options: ParseLabelOptions = {}): LabelParseResult {
  let body = text.slice(3);
  if (body.startsWith(RS)) body = body.slice(1);
  if (body.endsWith(EOT)) body = body.slice(0, -1);
  if (body.endsWith(RS)) body = body.slice(0, -1);
  if (body.includes(EOT)) {
    return refusal("malformed", `EOT (end of transmission) in the middle of "${excerpt(text)}".`, []);
  }
  const separatorsSeen = Boolean(options.separatorsReliable) || text.includes(GS);
  const elements: LabelElement[] = [];
  const formats: string[] = [];
  let inferredSeparators = false;
  for (const envelope of body.split(RS)) {
    const format = envelope.slice(0, 2);
    if (!/^[0-9A-Z]{2}$/.test(format)) {
      return refusal("malformed", `No format indicator (such as 06 or 12) in "${excerpt(text)}".`, elements);
    }
    const data = envelope.slice(2).startsWith(GS) ? envelope.slice(3) : envelope.slice(2);
    if (data === "") return refusal("malformed", `The format ${format} envelope holds no data.`, elements);
    const read = readEnvelope(format, data, separatorsSeen);
    if (!read.ok) return { ...read, found: [...elements, ...read.found] };
    elements.push(...read.elements);
    formats.push(format);
    inferredSeparators ||= read.inferredSeparators;
  }
  return interpretElements(elements, {
    syntax: "iso15434",
    format: formats.join("+"),
    vocabularies: formats.map((f) => VOCABULARY_BY_FORMAT[f]),
    inferredSeparators,
  });
}
