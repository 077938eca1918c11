// Position labels: THREADLINE'S OWN SYNTAX. No standard defines a label for an aircraft position
// (ISO/IEC 15434, ATA Spec 2000 and GS1 all describe items, not places), so this one is ours and
// only Threadline reads it.
//
//   TLPOS1 <registration> <position code>        e.g.  TLPOS1 Q-FRBC B2-EBA1
//
// - "TLPOS" names the syntax (Threadline position), "1" is its version. A reader refuses versions it
//   does not know instead of guessing.
// - The registration, not the aircraft type: a label fixed at a position must prove which airframe
//   it is on, so that a label of another aircraft is refused; the registration also determines the
//   type and so the layout the position code belongs to. A re-registered aircraft needs new labels.
// - Fields are separated by one space (ASCII 32). Registrations and position codes hold letters,
//   digits and '-' only (src/lib/schemas: registrationParam, the layouts' position code), so a space
//   can never be part of a value; it is printable ASCII that every Code 128 and Data Matrix decoder
//   returns unchanged (no GS/FNC1, which Code 128 decoders drop, and nothing a keyboard cannot
//   type); and the human-readable line under the symbols is the exact text a technician would type.
// - Upper case on the label. The reader also accepts lower case, runs of spaces, tabs or a line
//   break between fields (typed entry, a wedge scanner that sends Enter), and an AIM symbology
//   identifier before the text.
import { excerpt, normaliseControlCharacters, splitSymbologyId } from "./control-characters";
import { LabelEncodingError } from "./encoding-error";
import { refusal } from "./interpret-elements";
import type { LabelElement, LabelRefusal } from "./types";

export const POSITION_LABEL_PREFIX = "TLPOS";
export const POSITION_LABEL_VERSION = 1;
/** "TLPOS1", the first field of every label of this version. */
export const POSITION_LABEL_TAG = `${POSITION_LABEL_PREFIX}${POSITION_LABEL_VERSION}`;
const TAG = POSITION_LABEL_TAG;

export const REGISTRATION_MAX = 16;
export const POSITION_CODE_MAX = 32;
// The same character sets as registrationParam and the layouts' position code field.
const REGISTRATION = /^[A-Z0-9-]+$/;
const POSITION_CODE = /^[A-Z0-9][A-Z0-9-]*$/;

export interface PositionLabelFields {
  registration: string;
  positionCode: string;
}

export interface PositionLabelReading {
  ok: true;
  syntax: "threadline-position";
  version: typeof POSITION_LABEL_VERSION;
  registration: string;
  positionCode: string;
  /** REG and POS, the two fields of the syntax, for display beside a part label's elements. */
  elements: LabelElement[];
}

export type PositionLabelParseResult = PositionLabelReading | LabelRefusal;

/** The aircraft a position label must belong to at the position-choice step of a swap. */
export interface PositionLabelContext {
  registration: string;
  positionCodes: readonly string[];
}

const element = (id: "REG" | "POS", value: string): LabelElement => ({
  id,
  name: id === "REG" ? "registration" : "position code",
  value,
});

/** The form in words, for messages. */
export const POSITION_LABEL_FORM = `"${TAG} <registration> <position code>"`;
const FORM = POSITION_LABEL_FORM;

/** The exact text of a position label; both symbols and the human-readable line carry it. */
export function encodePositionLabel(fields: PositionLabelFields): string {
  const { registration, positionCode } = fields;
  if (registration.length > REGISTRATION_MAX || !REGISTRATION.test(registration)) {
    throw new LabelEncodingError(
      `Registration "${registration}" must be 1 to ${REGISTRATION_MAX} upper-case letters, digits and '-', like Q-FRBC.`,
    );
  }
  if (positionCode.length > POSITION_CODE_MAX || !POSITION_CODE.test(positionCode)) {
    throw new LabelEncodingError(
      `Position code "${positionCode}" must be 1 to ${POSITION_CODE_MAX} upper-case letters, digits and '-', starting with a letter or digit, like B2-EBA1.`,
    );
  }
  return `${TAG} ${registration} ${positionCode}`;
}

// "TLPOS", an optional version number, then a field separator or the end.
const CLAIM = /^TLPOS(\d*)(?=\s|$)/i;

function prepare(raw: string): string {
  return splitSymbologyId(normaliseControlCharacters(raw).trim()).rest.trim();
}

/** Whether the text starts like a position label ("TLPOS…"), whatever is wrong with the rest. */
export function claimsPositionLabel(raw: string): boolean {
  return CLAIM.test(prepare(raw));
}

/** Reads prepared text that claims to be a position label; null when it does not claim to be one. */
function readClaimed(text: string): PositionLabelParseResult | null {
  const claim = CLAIM.exec(text);
  if (!claim) return null;
  const shown = excerpt(text);
  if (claim[1] === "") {
    return refusal("unsupported_version", `"${shown}" starts ${POSITION_LABEL_PREFIX} but has no version number; this Threadline reads ${FORM}.`, []);
  }
  if (Number(claim[1]) !== POSITION_LABEL_VERSION) {
    return refusal(
      "unsupported_version",
      `"${shown}" is a position label of version ${claim[1]} (${POSITION_LABEL_PREFIX}${claim[1]}); this Threadline reads version ${POSITION_LABEL_VERSION} only, ${FORM}.`,
      [],
    );
  }
  const fields = text.slice(claim[0].length).trim().split(/\s+/).filter(Boolean).map((f) => f.toUpperCase());
  const [registration, positionCode, ...extra] = fields;
  const found: LabelElement[] = [];
  if (registration !== undefined) found.push(element("REG", registration));
  if (positionCode !== undefined) found.push(element("POS", positionCode));

  if (registration === undefined) {
    return refusal("missing_registration", `"${shown}" is a position label with no registration and no position code; it should read ${FORM}.`, []);
  }
  if (positionCode === undefined) {
    return refusal("missing_position_code", `Position label "${shown}" names registration ${registration} but no position code; it should read ${FORM}.`, found);
  }
  if (extra.length > 0) {
    return refusal(
      "malformed",
      `Position label "${shown}" has ${fields.length} fields after ${TAG}; it should have two, the registration and the position code (found the extra "${excerpt(extra.join(" "), 30)}").`,
      found,
    );
  }
  if (registration.length > REGISTRATION_MAX || !REGISTRATION.test(registration)) {
    return refusal(
      "malformed",
      `Position label "${shown}": registration "${registration}" is not a registration (1 to ${REGISTRATION_MAX} letters, digits and '-').`,
      found,
    );
  }
  if (positionCode.length > POSITION_CODE_MAX || !POSITION_CODE.test(positionCode)) {
    return refusal(
      "malformed",
      `Position label "${shown}": position code "${positionCode}" is not a position code (1 to ${POSITION_CODE_MAX} letters, digits and '-').`,
      found,
    );
  }
  return { ok: true, syntax: "threadline-position", version: POSITION_LABEL_VERSION, registration, positionCode, elements: found };
}

/**
 * Reads the text of a position label, or says in plain English what was found and what is missing.
 * Text that does not start with TLPOS is refused as "not_a_position_label".
 */
export function parsePositionLabel(raw: string): PositionLabelParseResult {
  const text = prepare(raw);
  if (text === "") return refusal("not_a_position_label", `The scan is empty. A position label reads ${FORM}.`, []);
  return readClaimed(text) ?? refusal("not_a_position_label", `"${excerpt(text)}" is not a position label: those read ${FORM}.`, []);
}

/** The refusal parseLabel gives for a position label scanned where a part label is wanted. */
export function positionLabelWherePartWanted(raw: string): LabelRefusal | null {
  const result = readClaimed(prepare(raw));
  if (result === null) return null;
  const what = result.ok
    ? `This is a position label (aircraft ${result.registration}, position ${result.positionCode}), not a part label.`
    : `"${excerpt(prepare(raw))}" starts like a position label (${POSITION_LABEL_PREFIX}), not a part label.`;
  return refusal(
    "not_a_part_label",
    `${what} Scan the label on the unit itself: it carries the part number and serial number.`,
    result.ok ? result.elements : result.found,
  );
}

/**
 * Checks a position-label reading against the aircraft of the swap: the registration must be this
 * aircraft's and the position code one of its layout's.
 */
export function checkPositionLabel(reading: PositionLabelReading, context: PositionLabelContext): PositionLabelParseResult {
  const registration = context.registration.toUpperCase();
  if (reading.registration !== registration) {
    return refusal(
      "other_aircraft",
      `This position label is for aircraft ${reading.registration} (position ${reading.positionCode}); this swap is on ${registration}. Check you are at ${registration}, or start the swap from ${reading.registration}'s page.`,
      reading.elements,
    );
  }
  const codes = new Set(context.positionCodes.map((code) => code.toUpperCase()));
  if (!codes.has(reading.positionCode)) {
    return refusal(
      "unknown_position",
      `${registration} has no position ${reading.positionCode} in its layout. The label may be out of date: choose the position from the list, and tell whoever keeps the layouts.`,
      reading.elements,
    );
  }
  return reading;
}
