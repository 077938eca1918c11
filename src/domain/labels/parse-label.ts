// The one entry point for scanned label text: decides the syntax and hands over to its reader.
import { ATA_TEXT_VOCABULARY, looksLikeAtaText } from "./ata-text-label";
import { excerpt, GS, normaliseControlCharacters, splitSymbologyId } from "./control-characters";
import { applicationIdentifierAt } from "./gs1-application-identifiers";
import { parseGs1ElementString } from "./gs1-element-string";
import { interpretElements, refusal } from "./interpret-elements";
import { readIso15434 } from "./iso15434-message";
import { readLabelledLabel } from "./labelled-label-reading";
import { PLAIN_VOCABULARY } from "./plain-label";
import { positionLabelWherePartWanted } from "./position-label";
import type { LabelParseResult, ParseLabelOptions } from "./types";

const MAX_INPUT_LENGTH = 4000;

const SYNTAXES_TRIED =
  'an ISO/IEC 15434 message (starting "[)>"), a GS1 element string (AIs such as 01 and 21, or "(01)..."), ' +
  'ATA Spec 2000 text elements ("MFR .../PNR .../SER ...") and a plain "P/N ... S/N ..." label';

/** "sure": only GS1 looks like this; "maybe": a digit string that merely starts like an AI (or is a bare number). */
function gs1Claim(text: string, announcedGs1: boolean): "sure" | "maybe" | "no" {
  if (announcedGs1 || text.startsWith(GS) || /^\(\d{2,4}\)/.test(text)) return "sure";
  if (/\s/.test(text) || applicationIdentifierAt(text, 0) === undefined) return "no";
  return text.includes(GS) || /^(?:0[12]\d{14}|00\d{18}|8004)/.test(text) ? "sure" : "maybe";
}

/**
 * Reads the raw text a scanner returned from a part label (camera decoder or keyboard wedge) and finds part number,
 * serial number, CAGE code and the other elements, or says in plain English why it cannot.
 */
export function parseLabel(raw: string, options: ParseLabelOptions = {}): LabelParseResult {
  if (raw.length > MAX_INPUT_LENGTH) {
    return refusal("malformed", `The scan is ${raw.length} characters long; labels are at most ${MAX_INPUT_LENGTH}.`, []);
  }
  const normalised = normaliseControlCharacters(raw).trim();
  if (normalised === "") return refusal("unrecognised", `The scan is empty. Tried ${SYNTAXES_TRIED}.`, []);
  const { isGs1, rest: text } = splitSymbologyId(normalised);

  // One of our own position labels where a part label is wanted: say so instead of "unrecognised".
  const positionLabel = positionLabelWherePartWanted(text);
  if (positionLabel) return positionLabel;

  if (text.startsWith("[)>")) return readIso15434(text, options);

  const claim = gs1Claim(text, isGs1);
  let gs1Problem = "";
  if (claim !== "no") {
    const gs1 = parseGs1ElementString(normalised, options);
    if (gs1.ok) {
      return interpretElements(gs1.elements, { syntax: "gs1", vocabularies: ["gs1"], inferredSeparators: gs1.inferredSeparators });
    }
    if (claim === "sure" || gs1.code !== "malformed") return gs1;
    gs1Problem = ` As GS1 data: ${gs1.message}`;
  }

  const ata = readLabelledLabel(text, ATA_TEXT_VOCABULARY, { syntax: "ata-text", vocabularies: ["tei"] });
  if (ata.kind === "read") return ata.result;
  const plain = readLabelledLabel(text, PLAIN_VOCABULARY, { syntax: "plain", vocabularies: ["plain"] });
  if (plain.kind === "read") return plain.result;

  if (looksLikeAtaText(text)) {
    return refusal(
      "malformed",
      `"${excerpt(text)}" starts as ATA text elements, but "${excerpt(text.slice(ata.stuckAt))}" is not a known text element and value.`,
      [],
    );
  }
  return refusal("unrecognised", `"${excerpt(text)}" is not a label we can read. Tried ${SYNTAXES_TRIED}.${gs1Problem}`, []);
}
