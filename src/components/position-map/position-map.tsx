"use client";

import { useMemo } from "react";
import type { MapPosition } from "@/lib/position-types";
import { POSITION_STATE_STYLE } from "@/components/status/position-state";
import { AirframeOutline } from "./airframe-outline";

export const WHOLE_AIRCRAFT = "__all__";

interface Props {
  positions: MapPosition[];
  zone: string;
  onZoneChange: (zone: string) => void;
  selectedCode: string | null;
  onSelect: (code: string) => void;
}

interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

const FULL: Box = { x: 0, y: 0, width: 1000, height: 600 };

/** The zone's positions framed with a margin, never smaller than a size that keeps markers tappable. */
function zoneBox(positions: MapPosition[]): Box {
  const xs = positions.map((p) => p.x);
  const ys = positions.map((p) => p.y);
  const pad = 28;
  let x0 = Math.min(...xs) - pad;
  let x1 = Math.max(...xs) + pad;
  let y0 = Math.min(...ys) - pad;
  let y1 = Math.max(...ys) + pad;
  const minWidth = 170;
  const minHeight = 130;
  if (x1 - x0 < minWidth) [x0, x1] = [(x0 + x1) / 2 - minWidth / 2, (x0 + x1) / 2 + minWidth / 2];
  if (y1 - y0 < minHeight) [y0, y1] = [(y0 + y1) / 2 - minHeight / 2, (y0 + y1) / 2 + minHeight / 2];
  return { x: x0, y: y0, width: x1 - x0, height: y1 - y0 };
}

function Marker({ position, zoomed, selected, onSelect }: { position: MapPosition; zoomed: boolean; selected: boolean; onSelect: () => void }) {
  const style = POSITION_STATE_STYLE[position.state];
  const r = zoomed ? 7 : 4.5;
  const what = position.fitted ? `${position.fitted.partNumber} serial ${position.fitted.serialNumber}` : "nothing fitted";
  return (
    <g
      role="button"
      tabIndex={0}
      aria-label={`${position.code}, ${position.label}: ${style.word}, ${what}`}
      aria-pressed={selected}
      data-position={position.code}
      className="cursor-pointer focus:outline-none [&:focus-visible>.focus-ring]:opacity-100"
      onClick={onSelect}
      onKeyDown={(event) => {
        if (event.key === "Enter" || event.key === " ") {
          event.preventDefault();
          onSelect();
        }
      }}
    >
      {/* A generous invisible hit area: markers stay easy to tap with gloves. */}
      <circle cx={position.x} cy={position.y} r={zoomed ? 14 : 8} fill="transparent" />
      <circle className="focus-ring opacity-0" cx={position.x} cy={position.y} r={r + 4} fill="none" stroke="#b45309" strokeWidth={2.5} />
      {selected ? <circle cx={position.x} cy={position.y} r={r + 3.5} fill="none" stroke="currentColor" strokeWidth={2} /> : null}
      <MarkerShape state={position.state} x={position.x} y={position.y} r={r} fill={style.fill} stroke={style.stroke} />
      {zoomed ? (
        <text x={position.x} y={position.y + r + 6.5} textAnchor="middle" fontSize={5.5} className="fill-current font-mono" style={{ pointerEvents: "none" }}>
          {position.code}
        </text>
      ) : null}
    </g>
  );
}

/** Shape as well as colour: circle fitted, hollow dashed circle empty, half-filled near, square past, diamond finding. */
function MarkerShape({ state, x, y, r, fill, stroke }: { state: MapPosition["state"]; x: number; y: number; r: number; fill: string; stroke: string }) {
  switch (state) {
    case "empty":
      return <circle cx={x} cy={y} r={r} fill={fill} stroke={stroke} strokeWidth={1.5} strokeDasharray="2 1.5" />;
    case "near_limit":
      return (
        <g>
          <circle cx={x} cy={y} r={r} fill="#fff" stroke={stroke} strokeWidth={1.5} />
          <path d={`M ${x} ${y - r} A ${r} ${r} 0 0 1 ${x} ${y + r} Z`} fill={fill} />
        </g>
      );
    case "past_limit":
      return <rect x={x - r} y={y - r} width={r * 2} height={r * 2} fill={fill} stroke={stroke} strokeWidth={1.5} />;
    case "finding":
      return <path d={`M ${x} ${y - r * 1.25} L ${x + r * 1.25} ${y} L ${x} ${y + r * 1.25} L ${x - r * 1.25} ${y} Z`} fill={fill} stroke={stroke} strokeWidth={1.5} />;
    default:
      return <circle cx={x} cy={y} r={r} fill={fill} stroke={stroke} strokeWidth={1.5} />;
  }
}

/** Zone names as the layout gives them; long all-capital words read better in title case. */
export function zoneName(zone: string): string {
  if (/^[A-Z]{2,4}(-[A-Z0-9]+)?$/.test(zone)) return zone;
  return zone.charAt(0) + zone.slice(1).toLowerCase();
}

export function PositionMap({ positions, zone, onZoneChange, selectedCode, onSelect }: Props) {
  const zones = useMemo(() => [...new Set(positions.map((p) => p.zone ?? "OTHER"))], [positions]);
  const zoomed = zone !== WHOLE_AIRCRAFT;
  const shown = zoomed ? positions.filter((p) => (p.zone ?? "OTHER") === zone) : positions;
  const box = zoomed && shown.length ? zoneBox(shown) : FULL;
  const counts = useMemo(() => {
    const byZone = new Map<string, number>();
    for (const p of positions) if (p.state !== "fitted") byZone.set(p.zone ?? "OTHER", (byZone.get(p.zone ?? "OTHER") ?? 0) + 1);
    return byZone;
  }, [positions]);
  const hasEngines = positions.some((p) => (p.zone ?? "").startsWith("ENGINE"));

  return (
    <div className="space-y-2">
      <div role="group" aria-label="Map zone" className="flex flex-wrap gap-2">
        {[WHOLE_AIRCRAFT, ...zones].map((z) => (
          <button
            key={z}
            type="button"
            aria-pressed={zone === z}
            onClick={() => onZoneChange(z)}
            className="btn btn-secondary min-h-touch px-3 py-1 text-sm aria-pressed:bg-[var(--accent)] aria-pressed:text-[var(--accent-ink)]"
          >
            {z === WHOLE_AIRCRAFT ? "Whole aircraft" : zoneName(z)}
            {z !== WHOLE_AIRCRAFT && counts.get(z) ? <span className="num ml-1">({counts.get(z)} flagged)</span> : null}
          </button>
        ))}
      </div>
      <svg
        viewBox={`${box.x} ${box.y} ${box.width} ${box.height}`}
        className="panel block h-auto w-full touch-manipulation text-[var(--ink)]"
        role="group"
        aria-label={zoomed ? `Position map, zone ${zone}` : "Position map, whole aircraft"}
      >
        <AirframeOutline engines={hasEngines ? "wing" : "none"} />
        {!zoomed
          ? zones.map((z) => {
              const members = positions.filter((p) => (p.zone ?? "OTHER") === z);
              const b = zoneBox(members);
              return (
                <rect
                  key={z}
                  x={b.x}
                  y={b.y}
                  width={b.width}
                  height={b.height}
                  rx={8}
                  fill="transparent"
                  stroke="currentColor"
                  strokeOpacity={0.25}
                  strokeDasharray="6 4"
                  onClick={() => onZoneChange(z)}
                  className="cursor-zoom-in"
                />
              );
            })
          : null}
        {shown.map((position) => (
          <Marker key={position.code} position={position} zoomed={zoomed} selected={position.code === selectedCode} onSelect={() => onSelect(position.code)} />
        ))}
      </svg>
      {zoomed ? (
        // The same positions as large buttons: easier than the drawing with gloves on a phone.
        <ul className="grid grid-cols-2 gap-2 sm:grid-cols-3 xl:grid-cols-4" aria-label={`Positions in ${zoneName(zone)}`}>
          {shown.map((position) => {
            const style = POSITION_STATE_STYLE[position.state];
            return (
              <li key={position.code}>
                <button
                  type="button"
                  onClick={() => onSelect(position.code)}
                  aria-pressed={position.code === selectedCode}
                  className="panel flex min-h-glove w-full items-center gap-2 px-2 py-1 text-left aria-pressed:border-[var(--accent)] aria-pressed:ring-2 aria-pressed:ring-[var(--accent)]"
                >
                  <span aria-hidden="true" className="text-lg" style={{ color: style.fill === "#ffffff" ? style.stroke : style.fill }}>
                    {style.glyph}
                  </span>
                  <span>
                    <span className="num block font-semibold">{position.code}</span>
                    <span className="block text-xs">{style.word}</span>
                  </span>
                </button>
              </li>
            );
          })}
        </ul>
      ) : null}
      <ul className="flex flex-wrap gap-x-4 gap-y-1 text-sm" aria-label="Map key">
        {Object.entries(POSITION_STATE_STYLE).map(([state, style]) => (
          <li key={state} className="flex items-center gap-1">
            <span aria-hidden="true" style={{ color: style.fill === "#ffffff" ? style.stroke : style.fill }} className="text-lg">
              {style.glyph}
            </span>
            {style.word}
          </li>
        ))}
      </ul>
    </div>
  );
}
