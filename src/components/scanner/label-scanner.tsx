"use client";

// Reads one label at the aircraft: a part label, or at the position step a position label (`target`).
// Live camera (Code 128, Data Matrix, QR), a photo, or typed / wedge-scanned text. Each reading is
// parsed at once and shown for the user to accept or redo; only an accepted reading reaches
// `onResult`. Load it through LazyLabelScanner, not directly.
import { useCallback, useId, useRef, useState } from "react";
import { CameraViewfinder } from "./camera-viewfinder";
import { PART_LABEL_TARGET, readDecodedLabel, readTypedLabel, typingExample, type DecodedText, type LabelScan, type ScanTarget } from "./label-scan";
import { ManualLabelEntry } from "./manual-label-entry";
import { PhotoLabelInput } from "./photo-label-input";
import { ScanReading } from "./scan-reading";
import { useCameraScanner } from "./use-camera-scanner";

export interface LabelScannerProps {
  /** What to scan, shown as the heading, e.g. "Scan the OFF part's label". */
  label: string;
  /** What to read: a part label (the default), or a position label of the given aircraft. */
  target?: ScanTarget;
  /** Called once, with the reading the user accepted; the camera is already stopping. */
  onResult: (result: LabelScan) => void;
  /** Shows a Cancel button when given. */
  onCancel?: () => void;
}

export type { LabelScan, ScanTarget } from "./label-scan";

function buzz() {
  // A short buzz says "read" to someone looking at the part rather than the screen.
  if (typeof navigator !== "undefined" && typeof navigator.vibrate === "function") navigator.vibrate(80);
}

export function LabelScanner({ label, target = PART_LABEL_TARGET, onResult, onCancel }: LabelScannerProps) {
  const id = useId();
  const elementId = `${id}-camera`;
  const headingId = `${id}-heading`;
  const [pending, setPending] = useState<LabelScan | null>(null);
  const [accepted, setAccepted] = useState(false);
  const headingRef = useRef<HTMLHeadingElement>(null);

  const show = useCallback((scan: LabelScan) => {
    if (scan.source !== "typed") buzz();
    setPending(scan);
  }, []);
  const onCameraDecode = useCallback((decoded: DecodedText) => show(readDecodedLabel(decoded, "camera", target)), [show, target]);
  const onPhotoDecode = useCallback((decoded: DecodedText) => show(readDecodedLabel(decoded, "photo", target)), [show, target]);

  const camera = useCameraScanner({ elementId, active: !accepted, paused: pending !== null, onDecode: onCameraDecode });
  const cameraFailed = camera.status === "failed";

  const accept = () => {
    if (!pending?.parsed.ok) return;
    setAccepted(true); // stops the camera
    onResult(pending);
  };
  const rescan = () => {
    setPending(null);
    headingRef.current?.focus(); // the buttons that had focus are going away
  };

  return (
    <section aria-labelledby={headingId} className="panel space-y-4 p-3 text-lg sm:p-4">
      <h2 id={headingId} ref={headingRef} tabIndex={-1} className="text-2xl font-bold">
        {label}
      </h2>

      {/* No live region here: ScanReading takes focus, which announces it. */}
      <div>
        {accepted ? (
          <p role="status" className="font-semibold">
            <span aria-hidden="true">✓ </span>Label accepted.
          </p>
        ) : pending ? (
          <ScanReading scan={pending} target={target} onAccept={accept} onRescan={rescan} />
        ) : null}
      </div>

      {/* Stays rendered while a reading is shown: the frozen picture is what was read, and the
          scanner element must keep its layout width (hidden, it would measure 0). */}
      <CameraViewfinder elementId={elementId} status={camera.status} />

      <div className={pending || accepted ? "hidden" : "space-y-3"}>
        {camera.status === "scanning" ? (
          <p>Hold the camera square on to the label, close enough that the code fills most of the picture.</p>
        ) : null}
        {cameraFailed && camera.problem ? (
          <div role="alert" className="rounded-md border-2 border-red-700 p-3 dark:border-red-400">
            <p className="font-semibold">
              <span aria-hidden="true">✗ </span>
              {camera.problem.message}
            </p>
            {camera.problem.retryMayHelp ? (
              <button type="button" className="btn btn-secondary mt-3 min-h-glove w-full" onClick={camera.retry}>
                Try the camera again
              </button>
            ) : null}
          </div>
        ) : null}

        <div className="grid gap-3 sm:grid-cols-2">
          {camera.torch.supported && camera.status === "scanning" ? (
            <button
              type="button"
              className="btn btn-secondary min-h-glove w-full"
              onClick={camera.torch.toggle}
              aria-pressed={camera.torch.on}
            >
              <span aria-hidden="true">{camera.torch.on ? "●" : "○"}</span> Torch {camera.torch.on ? "on" : "off"}
            </button>
          ) : null}
          <PhotoLabelInput primary={cameraFailed} onDecoded={onPhotoDecode} />
        </div>
        {camera.torch.problem ? <p className="field-error">{camera.torch.problem}</p> : null}

        <ManualLabelEntry
          example={typingExample(target)}
          what={target.kind === "position" ? "the text printed under the position label's codes" : "the part and serial as printed"}
          onSubmit={(text) => show(readTypedLabel(text, target))}
        />
      </div>

      {onCancel ? (
        <button type="button" className="btn btn-secondary min-h-glove w-full" onClick={onCancel}>
          Cancel
        </button>
      ) : null}
    </section>
  );
}
