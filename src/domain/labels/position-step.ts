// The position-choice step of a swap reads a position label (Threadline's own syntax, see
// position-label.ts) of this aircraft; anything else scanned there is refused with what it is.
import { excerpt, normaliseControlCharacters } from "./control-characters";
import { describeElements, refusal } from "./interpret-elements";
import { parseLabel } from "./parse-label";
import {
  checkPositionLabel,
  claimsPositionLabel,
  parsePositionLabel,
  POSITION_LABEL_FORM,
  POSITION_LABEL_TAG,
  type PositionLabelContext,
  type PositionLabelParseResult,
} from "./position-label";
import type { ParseLabelOptions } from "./types";

const NEXT_STEP = "Scan the label fixed at the position, or choose the position from the list.";

/**
 * Reads a scan at the position-choice step: a position label of this aircraft and one of its
 * positions, or a refusal that says what was scanned instead (a part label, a label of another
 * aircraft, an unknown position, text that is no label) and what to do.
 */
export function readPositionStepLabel(
  raw: string,
  context: PositionLabelContext,
  options: ParseLabelOptions = {},
): PositionLabelParseResult {
  if (claimsPositionLabel(raw)) {
    const reading = parsePositionLabel(raw);
    return reading.ok ? checkPositionLabel(reading, context) : reading;
  }
  const example = context.positionCodes[0];
  const form = `Position labels read ${POSITION_LABEL_FORM}${example ? `, like "${POSITION_LABEL_TAG} ${context.registration.toUpperCase()} ${example}"` : ""}.`;
  const text = normaliseControlCharacters(raw).trim();
  if (text === "") return refusal("not_a_position_label", `The scan is empty. ${form}`, []);

  const part = parseLabel(raw, options);
  if (part.ok) {
    return refusal(
      "not_a_position_label",
      `This is a part label (P/N ${part.partNumber}, S/N ${part.serialNumber}), not a position label. ${NEXT_STEP}`,
      part.elements,
    );
  }
  if (part.code === "unrecognised") {
    return refusal("not_a_position_label", `"${excerpt(text)}" is not a position label. ${form} ${NEXT_STEP}`, []);
  }
  // It reads as a part label, if an incomplete one.
  const found = part.found.length > 0 ? ` (it carries ${describeElements(part.found)})` : "";
  return refusal("not_a_position_label", `This looks like a part label${found}, not a position label. ${NEXT_STEP}`, part.found);
}
