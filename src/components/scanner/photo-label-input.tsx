"use client";

// The photo fallback: the phone's camera app (or a picture already taken) instead of the live view.
// Offered always, and put first when the live camera cannot start.
import { useEffect, useId, useRef, useState, type ChangeEvent } from "react";
import type { Html5Qrcode } from "html5-qrcode";
import type { DecodedText } from "./label-scan";
import { createDecoder, toDecodedText } from "./use-camera-scanner";

export function PhotoLabelInput({ primary, onDecoded }: { primary: boolean; onDecoded: (decoded: DecodedText) => void }) {
  const id = useId();
  const elementId = `${id}-photo-decoder`;
  const errorId = `${id}-photo-error`;
  const inputRef = useRef<HTMLInputElement>(null);
  // A decoder of its own: html5-qrcode refuses to read a file while its camera scan is running.
  const decoderRef = useRef<Html5Qrcode | null>(null);
  const [reading, setReading] = useState(false);
  const [error, setError] = useState<string | null>(null);

  useEffect(
    () => () => {
      try {
        decoderRef.current?.clear();
      } catch {
        // The element is already gone with the component.
      }
    },
    [],
  );

  const readPhoto = async (event: ChangeEvent<HTMLInputElement>) => {
    const file = event.target.files?.[0];
    event.target.value = ""; // so the same photo can be chosen again after a refusal
    if (!file) return;
    if (!file.type.startsWith("image/")) {
      setError(`“${file.name}” is not a picture. Choose a photo of the label (JPEG or PNG).`);
      return;
    }
    setReading(true);
    setError(null);
    try {
      decoderRef.current ??= createDecoder(elementId);
      onDecoded(toDecodedText(await decoderRef.current.scanFileV2(file, false)));
    } catch {
      setError(
        "No barcode was found in that photo. Take it again square on to the label, with the whole code in the picture, in focus and without glare — or type what the label says.",
      );
    } finally {
      setReading(false);
    }
  };

  return (
    <div className="space-y-2">
      <button
        type="button"
        className={`btn min-h-glove w-full text-lg ${primary ? "btn-primary" : "btn-secondary"}`}
        onClick={() => inputRef.current?.click()}
        disabled={reading}
        aria-describedby={error ? errorId : undefined}
      >
        <span aria-hidden="true">▣</span> {reading ? "Reading the photo…" : "Take a photo of the label"}
      </button>
      <input
        ref={inputRef}
        type="file"
        accept="image/*"
        capture="environment"
        className="hidden"
        tabIndex={-1}
        aria-hidden="true"
        data-testid="label-photo-input"
        onChange={readPhoto}
      />
      <div id={elementId} hidden />
      {error ? (
        <p id={errorId} role="alert" className="field-error">
          {error}
        </p>
      ) : null}
    </div>
  );
}
