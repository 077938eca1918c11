import { MAP_HEIGHT, MAP_WIDTH } from "@/lib/schemas/layouts";

export interface MapPoint {
  code: string;
  x: number;
  y: number;
}

const inRange = (p: { x: number; y: number }) => Number.isFinite(p.x) && Number.isFinite(p.y) && p.x >= 0 && p.x <= MAP_WIDTH && p.y >= 0 && p.y <= MAP_HEIGHT;

/**
 * A plain 1000 x 600 frame with the type's positions as dots: enough to see where a position sits.
 * The full position map is a separate component; this one only previews coordinates.
 */
export function PositionPreview({
  title,
  points,
  current,
  parent,
  highlighted,
}: {
  title: string;
  points: MapPoint[];
  current?: MapPoint;
  parent?: MapPoint;
  highlighted?: Set<string>;
}) {
  const showCurrent = current && inRange(current);
  return (
    <figure className="space-y-1">
      <svg viewBox={`-40 -30 ${MAP_WIDTH + 80} ${MAP_HEIGHT + 60}`} role="img" aria-label={title} className="h-auto w-full rounded-md border border-[var(--rule)] bg-[var(--panel)]">
        <rect x={0} y={0} width={MAP_WIDTH} height={MAP_HEIGHT} fill="none" stroke="var(--ink-soft)" strokeWidth={2} />
        {/* An outline of fuselage, wings and tail, only for orientation. */}
        <path d="M 20 300 Q 40 270 110 268 L 900 278 L 985 296 L 985 304 L 900 322 L 110 332 Q 40 330 20 300 Z" fill="none" stroke="var(--rule)" strokeWidth={3} />
        <path d="M 470 272 L 640 20 L 700 20 L 640 272 Z M 470 328 L 640 580 L 700 580 L 640 328 Z" fill="none" stroke="var(--rule)" strokeWidth={3} />
        <path d="M 890 280 L 950 190 L 985 190 L 960 280 Z M 890 320 L 950 410 L 985 410 L 960 320 Z" fill="none" stroke="var(--rule)" strokeWidth={3} />
        <line x1={0} y1={MAP_HEIGHT / 2} x2={MAP_WIDTH} y2={MAP_HEIGHT / 2} stroke="var(--rule)" strokeDasharray="8 8" />
        <text x={4} y={-8} fontSize={20} fill="var(--ink)">Nose (x 0)</text>
        <text x={MAP_WIDTH - 4} y={-8} fontSize={20} fill="var(--ink)" textAnchor="end">Tail (x 1000)</text>
        <text x={MAP_WIDTH / 2} y={-8} fontSize={20} fill="var(--ink)" textAnchor="middle">Left (y 0)</text>
        <text x={MAP_WIDTH / 2} y={MAP_HEIGHT + 24} fontSize={20} fill="var(--ink)" textAnchor="middle">Right (y 600)</text>
        {points.map((p) => (
          <circle
            key={p.code}
            cx={p.x}
            cy={p.y}
            r={highlighted?.has(p.code) ? 7 : 4}
            fill={highlighted?.has(p.code) ? "var(--accent)" : "var(--ink-soft)"}
            opacity={highlighted && !highlighted.has(p.code) ? 0.35 : 0.8}
          />
        ))}
        {showCurrent && parent && inRange(parent) ? (
          <>
            <line x1={parent.x} y1={parent.y} x2={current.x} y2={current.y} stroke="var(--accent)" strokeWidth={3} strokeDasharray="6 4" />
            <rect x={parent.x - 8} y={parent.y - 8} width={16} height={16} fill="none" stroke="var(--accent)" strokeWidth={3} />
          </>
        ) : null}
        {showCurrent ? (
          <g>
            <circle cx={current.x} cy={current.y} r={22} fill="none" stroke="var(--focus)" strokeWidth={4} />
            <circle cx={current.x} cy={current.y} r={10} fill="var(--accent)" stroke="var(--panel)" strokeWidth={3} />
            <text
              x={current.x + (current.x > MAP_WIDTH - 160 ? -28 : 28)}
              y={current.y + 7}
              fontSize={24}
              fontWeight={700}
              fill="var(--ink)"
              textAnchor={current.x > MAP_WIDTH - 160 ? "end" : "start"}
              className="num"
            >
              {current.code || "new position"}
            </text>
          </g>
        ) : null}
      </svg>
      {current && !showCurrent ? (
        <figcaption className="field-error">The coordinates are outside the map (x 0 to 1000, y 0 to 600), so the position is not drawn.</figcaption>
      ) : null}
    </figure>
  );
}
