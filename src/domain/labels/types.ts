// Result shapes of the label parser. Plain data only, so they can cross any boundary.

export type LabelSyntax = "iso15434" | "ata-text" | "gs1" | "plain";

/** One data element as found on the label: its identifier (DI, TEI, AI or plain caption), a readable name and the raw value. */
export interface LabelElement {
  id: string;
  name: string;
  value: string;
}

export type LabelFailureCode =
  | "unrecognised"
  | "missing_part_number"
  | "missing_serial_number"
  | "contradictory"
  | "ambiguous"
  | "bad_check_digit"
  | "malformed"
  // Position labels (position-label.ts, Threadline's own syntax) and the step that wants one:
  | "missing_registration"
  | "missing_position_code"
  | "unsupported_version"
  | "not_a_position_label"
  | "not_a_part_label"
  | "other_aircraft"
  | "unknown_position";

export interface LabelReading {
  ok: true;
  syntax: LabelSyntax;
  partNumber: string;
  serialNumber: string;
  cage: string | null;
  elements: LabelElement[];
  /** ISO/IEC 15434 format indicator ("06", "DD", "12", "05"); several envelopes are joined with "+". */
  format?: string;
  /**
   * Present when the scan carried no element separators and the split into elements was
   * inferred as the only complete reading (see split-readings.ts). The UI should ask for a check.
   */
  inferredSeparators?: true;
}

export interface LabelRefusal {
  ok: false;
  code: LabelFailureCode;
  /** Plain English: what was found and what is missing or wrong. */
  message: string;
  found: LabelElement[];
}

export type LabelParseResult = LabelReading | LabelRefusal;

export interface ParseLabelOptions {
  /**
   * Set when the decoder is known to transmit every GS/FNC1 separator (e.g. our camera decoder).
   * A message without separators is then read by the standard rule (one element per field,
   * a variable-length field runs to the end) instead of being treated as possibly stripped.
   */
  separatorsReliable?: boolean;
}
