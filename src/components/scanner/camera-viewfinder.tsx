"use client";

// The live camera picture. The scanner element stays SURFACE_WIDTH CSS pixels wide, so html5-qrcode
// decodes a canvas with enough pixels per bar, and is shrunk to the container's width on screen with
// `transform: scale(...)`: a transform changes neither layout nor clientWidth, which is what the
// decoder measures. Only the decoded band (decodeBand) is shown, so what the user aims with is what is read.
import { useEffect, useRef, useState } from "react";
import { decodeBand, SURFACE_WIDTH, type CameraStatus } from "./use-camera-scanner";

// Until the video reports its size, assume a 16:9 frame.
const ASSUMED_HEIGHT = Math.round((SURFACE_WIDTH * 9) / 16);

export function CameraViewfinder({ elementId, status }: { elementId: string; status: CameraStatus }) {
  const frameRef = useRef<HTMLDivElement>(null);
  const surfaceRef = useRef<HTMLDivElement>(null);
  const [frameWidth, setFrameWidth] = useState(0);
  const [surfaceHeight, setSurfaceHeight] = useState(0);

  useEffect(() => {
    const frame = frameRef.current;
    const surface = surfaceRef.current;
    if (!frame || !surface) return;
    // Sizes from layout, which the transform does not touch: the frame's width on screen and the
    // untransformed height of the video html5-qrcode puts into the surface.
    const measure = () => {
      setFrameWidth(frame.clientWidth);
      setSurfaceHeight(surface.offsetHeight);
    };
    const observer = new ResizeObserver(measure);
    observer.observe(frame);
    observer.observe(surface);
    measure();
    return () => observer.disconnect();
  }, []);

  const scale = frameWidth > 0 ? Math.min(1, frameWidth / SURFACE_WIDTH) : 0;
  const fullHeight = surfaceHeight > 0 ? surfaceHeight : ASSUMED_HEIGHT;
  const bandHeight = decodeBand(SURFACE_WIDTH, fullHeight).height;
  const cropTop = (fullHeight - bandHeight) / 2;
  // Collapsed rather than removed when there is no picture: the surface must keep its layout width
  // for the next start, and display:none would make its clientWidth 0.
  const shown = status === "starting" || status === "scanning";

  return (
    <div
      ref={frameRef}
      className="relative w-full overflow-hidden rounded-md bg-black"
      style={{ height: shown ? Math.round(bandHeight * scale) : 0 }}
      aria-hidden="true"
    >
      <div
        className="absolute left-0 top-0"
        style={{ transform: `translateY(${-cropTop * scale}px) scale(${scale})`, transformOrigin: "0 0" }}
      >
        {/* html5-qrcode owns this element's children. Its "Scanner paused" banner would be unreadably
            small after scaling; the frozen picture and the confirmation say the same. */}
        <div id={elementId} ref={surfaceRef} data-testid="camera-surface" style={{ width: SURFACE_WIDTH }} className="[&>div:not([id])]:hidden!" />
      </div>
      {status === "starting" ? (
        <p className="absolute inset-0 flex items-center justify-center p-4 text-center text-lg font-semibold text-white">
          Starting the camera… If the browser asks, allow it.
        </p>
      ) : null}
    </div>
  );
}
