// Threadline's own plan-view drawing of an airframe in map units (x 0..1000 nose to tail,
// y 0..600 across the span): simple geometric shapes, drawn from the layout's coordinate frame.
export function AirframeOutline({ engines }: { engines: "wing" | "none" }) {
  return (
    <g aria-hidden="true" className="text-stone-400 dark:text-stone-600">
      <path d="M 40 300 C 40 268, 80 258, 140 258 L 900 268 C 960 272, 985 285, 990 300 C 985 315, 960 328, 900 332 L 140 342 C 80 342, 40 332, 40 300 Z" fill="currentColor" fillOpacity="0.18" stroke="currentColor" strokeWidth="2" />
      <path d="M 420 262 L 640 20 L 690 20 L 620 262 Z" fill="currentColor" fillOpacity="0.12" stroke="currentColor" strokeWidth="2" />
      <path d="M 420 338 L 640 580 L 690 580 L 620 338 Z" fill="currentColor" fillOpacity="0.12" stroke="currentColor" strokeWidth="2" />
      <path d="M 880 270 L 950 180 L 985 180 L 960 270 Z" fill="currentColor" fillOpacity="0.12" stroke="currentColor" strokeWidth="2" />
      <path d="M 880 330 L 950 420 L 985 420 L 960 330 Z" fill="currentColor" fillOpacity="0.12" stroke="currentColor" strokeWidth="2" />
      {engines === "wing" ? (
        <>
          <rect x="405" y="78" width="110" height="44" rx="20" fill="currentColor" fillOpacity="0.2" stroke="currentColor" strokeWidth="2" />
          <rect x="405" y="478" width="110" height="44" rx="20" fill="currentColor" fillOpacity="0.2" stroke="currentColor" strokeWidth="2" />
        </>
      ) : null}
    </g>
  );
}
