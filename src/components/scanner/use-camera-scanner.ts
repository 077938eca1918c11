"use client";

// Runs html5-qrcode's camera scan in one element: starts it, pauses it while a reading is being
// confirmed, stops it on unmount, and offers the torch where the camera has one.
import { Html5Qrcode, Html5QrcodeSupportedFormats, type Html5QrcodeResult } from "html5-qrcode";
import { useCallback, useEffect, useRef, useState } from "react";
import { describeCameraProblem, type CameraProblem } from "./camera-problems";
import type { DecodedText } from "./label-scan";

export const SCAN_FORMATS = [
  Html5QrcodeSupportedFormats.CODE_128,
  Html5QrcodeSupportedFormats.DATA_MATRIX,
  Html5QrcodeSupportedFormats.QR_CODE,
];

/**
 * Width of the scanner element in CSS pixels. html5-qrcode decodes a canvas exactly as wide as the
 * element (not as wide as the camera frame), and Code 128 needs about 2 px per narrow bar: in a
 * phone-wide element (~380 px) it did not decode at all. The element stays this wide and is shrunk
 * on screen with a CSS transform (see camera-viewfinder.tsx), which leaves clientWidth alone.
 */
export const SURFACE_WIDTH = 1280;

/**
 * The part of the frame that is decoded (and shown): the full width, and at most 3:4 of it in height.
 * A phone held upright delivers a tall frame; decoding all of it would cost time for no gain.
 */
export function decodeBand(width: number, height: number): { width: number; height: number } {
  return { width, height: Math.min(height, Math.round(width * 0.75)) };
}

export type CameraStatus = "starting" | "scanning" | "failed" | "off";

export interface CameraScanner {
  status: CameraStatus;
  problem: CameraProblem | null;
  torch: { supported: boolean; on: boolean; toggle: () => void; problem: string | null };
  retry: () => void;
}

export function toDecodedText(result: Html5QrcodeResult): DecodedText {
  return {
    text: result.decodedText,
    symbology: result.result.format?.formatName ?? null,
    decoderName: result.result.debugData?.decoderName ?? null,
  };
}

export function createDecoder(elementId: string): Html5Qrcode {
  return new Html5Qrcode(elementId, { formatsToSupport: SCAN_FORMATS, verbose: false });
}

async function stopQuietly(scanner: Html5Qrcode | null): Promise<void> {
  // Not `isScanning`: that turns true only when the video plays, and a camera opened just before
  // unmount must be released too. stop() releases the tracks first, then throws if it had not started.
  try {
    await scanner?.stop();
  } catch {
    // Never started, or already stopped: nothing is left to release.
  }
}

export function useCameraScanner(options: {
  elementId: string;
  /** False stops the camera (after a reading is accepted, or when the host hides the scanner). */
  active: boolean;
  /**
   * True while a reading waits for the user's decision: frames are neither shown live nor decoded.
   * Every decode holds the scanner at once; the host sets this true on a decode and false to scan again.
   */
  paused: boolean;
  onDecode: (decoded: DecodedText) => void;
}): CameraScanner {
  const { elementId, active, paused } = options;
  const [status, setStatus] = useState<CameraStatus>(active ? "starting" : "off");
  const [problem, setProblem] = useState<CameraProblem | null>(null);
  const [attempt, setAttempt] = useState(0);
  const [torchSupported, setTorchSupported] = useState(false);
  const [torchOn, setTorchOn] = useState(false);
  const [torchProblem, setTorchProblem] = useState<string | null>(null);
  const scannerRef = useRef<Html5Qrcode | null>(null);
  const onDecodeRef = useRef(options.onDecode);
  onDecodeRef.current = options.onDecode;
  const pausedRef = useRef(paused);
  pausedRef.current = paused;
  // A new start waits for the previous stop: two scanners in one element (React's development
  // double-mount, a quick retry) would fight over the element's children and the camera.
  const previousStop = useRef<Promise<void>>(Promise.resolve());

  useEffect(() => {
    if (!active) {
      setStatus("off");
      return;
    }
    let cancelled = false;
    let scanner: Html5Qrcode | null = null;
    setStatus("starting");
    setProblem(null);
    setTorchSupported(false);
    setTorchOn(false);

    const started = previousStop.current.then(async () => {
      if (cancelled) return;
      try {
        scanner = createDecoder(elementId);
        await scanner.start(
          { facingMode: "environment" },
          {
            fps: 10,
            qrbox: decodeBand,
            // A rear camera does not mirror, so the decoder's second, mirrored pass only costs time.
            disableFlip: true,
            // Ask for more than the default 640x480, which leaves too few pixels per bar.
            videoConstraints: { facingMode: "environment", width: { ideal: 1920 }, height: { ideal: 1080 } },
          },
          (_text, result) => {
            if (pausedRef.current) return;
            // Hold further frames until the host's `paused` comes back false (accept or rescan).
            pausedRef.current = true;
            onDecodeRef.current(toDecodedText(result));
          },
          undefined,
        );
      } catch (error) {
        if (!cancelled) {
          setProblem(describeCameraProblem(error));
          setStatus("failed");
        }
        return;
      }
      if (cancelled || !scanner) return;
      scannerRef.current = scanner;
      setStatus("scanning");
      try {
        setTorchSupported(scanner.getRunningTrackCameraCapabilities().torchFeature().isSupported());
      } catch {
        setTorchSupported(false);
      }
    });

    return () => {
      cancelled = true;
      scannerRef.current = null;
      previousStop.current = started.then(() => stopQuietly(scanner));
    };
  }, [active, attempt, elementId]);

  useEffect(() => {
    const scanner = scannerRef.current;
    if (!scanner || status !== "scanning") return;
    try {
      // pause(true) also freezes the video, so the frame that was read stays on screen.
      if (paused) scanner.pause(true);
      else scanner.resume();
    } catch {
      // Already in the wanted state.
    }
  }, [paused, status]);

  const toggleTorch = useCallback(() => {
    const scanner = scannerRef.current;
    if (!scanner) return;
    const wanted = !torchOn;
    scanner
      .getRunningTrackCameraCapabilities()
      .torchFeature()
      .apply(wanted)
      .then(() => {
        setTorchOn(wanted);
        setTorchProblem(null);
      })
      .catch(() => setTorchProblem("The torch did not switch. Light the label with a hand lamp instead."));
  }, [torchOn]);

  const retry = useCallback(() => setAttempt((value) => value + 1), []);

  return {
    status,
    problem,
    torch: { supported: torchSupported, on: torchOn, toggle: toggleTorch, problem: torchProblem },
    retry,
  };
}
