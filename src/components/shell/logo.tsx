/** Threadline's mark: one continuous line threading over and under a row of dots. */
export function LogoMark({ className = "h-7 w-auto" }: { className?: string }) {
  return (
    <svg viewBox="0 0 64 24" className={className} role="img" aria-label="Threadline">
      <path
        d="M2 12 C 8 2, 14 2, 16 12 S 24 22, 32 12 S 40 2, 48 12 S 56 22, 62 12"
        fill="none"
        stroke="currentColor"
        strokeWidth="2.5"
        strokeLinecap="round"
      />
      {[8, 24, 40, 56].map((cx) => (
        <circle key={cx} cx={cx} cy="12" r="3.2" fill="currentColor" />
      ))}
    </svg>
  );
}
