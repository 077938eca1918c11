// Why the camera did not start, in plain language with the next step.
// html5-qrcode rejects start() with a string such as "Error getting userMedia, error = NotAllowedError: ..."
// rather than the DOMException itself, so the DOMException name is found in the text.

export type CameraProblemKind = "denied" | "no-camera" | "busy" | "unsupported" | "other";

export interface CameraProblem {
  kind: CameraProblemKind;
  message: string;
  /** Whether pressing "Try the camera again" can help without changing anything else. */
  retryMayHelp: boolean;
}

const NAMES: [RegExp, CameraProblemKind][] = [
  [/NotAllowedError|PermissionDeniedError|SecurityError|Permission denied/i, "denied"],
  [/NotFoundError|DevicesNotFoundError|OverconstrainedError|Requested device not found/i, "no-camera"],
  [/NotReadableError|TrackStartError|AbortError|Could not start video source/i, "busy"],
  [/not supported|secure context|mediaDevices/i, "unsupported"],
];

export function describeCameraProblem(error: unknown): CameraProblem {
  const text = error instanceof Error ? `${error.name}: ${error.message}` : String(error);
  const kind = NAMES.find(([pattern]) => pattern.test(text))?.[1] ?? "other";
  switch (kind) {
    case "denied":
      return {
        kind,
        retryMayHelp: true,
        message:
          "Threadline is not allowed to use the camera. Allow the camera for this site in the browser's settings and press “Try the camera again”, or take a photo of the label instead.",
      };
    case "no-camera":
      return {
        kind,
        retryMayHelp: false,
        message: "No camera was found on this device. Take a photo of the label, or type what the label says.",
      };
    case "busy":
      return {
        kind,
        retryMayHelp: true,
        message:
          "The camera is in use by another app or browser tab. Close it there and press “Try the camera again”, or take a photo of the label instead.",
      };
    case "unsupported":
      return {
        kind,
        retryMayHelp: false,
        message:
          "This browser does not let the page use the camera (the page must be opened over https). Take a photo of the label, or type what the label says.",
      };
    default:
      return {
        kind,
        retryMayHelp: true,
        message: `The camera did not start (${text.slice(0, 120)}). Press “Try the camera again”, take a photo of the label, or type what it says.`,
      };
  }
}
