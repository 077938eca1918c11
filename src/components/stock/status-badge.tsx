import type { PartStatus } from "@/domain/ledger-types";

// Status never by colour alone: each state has its word and its own shape, so it reads in sunlight,
// in grey-scale print and for colour-blind users.
const STATUS_LOOK: Record<PartStatus, { word: string; className: string; glyph: React.ReactNode }> = {
  serviceable: {
    word: "Serviceable",
    className: "border-green-800 bg-green-50 text-green-900 dark:border-green-300 dark:bg-green-950 dark:text-green-100",
    glyph: <path d="M3 8.5l3.2 3.2L13 4.8" fill="none" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" strokeLinejoin="round" />,
  },
  installed: {
    word: "Installed",
    className: "border-thread-700 bg-thread-50 text-thread-900 dark:border-thread-300 dark:bg-thread-900 dark:text-thread-50",
    glyph: <path d="M2 8h12M8 2v12" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" />,
  },
  unserviceable: {
    word: "Unserviceable",
    className: "border-orange-800 bg-orange-50 text-orange-950 dark:border-orange-300 dark:bg-orange-950 dark:text-orange-100",
    glyph: (
      <>
        <path d="M8 1.8L14.6 13.6H1.4z" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinejoin="round" />
        <path d="M8 6v3.6M8 11.4v.2" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
      </>
    ),
  },
  in_repair: {
    word: "In repair",
    className: "border-blue-800 bg-blue-50 text-blue-950 dark:border-blue-300 dark:bg-blue-950 dark:text-blue-100",
    glyph: (
      <>
        <circle cx="8" cy="8" r="5.6" fill="none" stroke="currentColor" strokeWidth="1.8" />
        <path d="M8 4.6V8l2.4 1.6" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
      </>
    ),
  },
  quarantined: {
    word: "Quarantined",
    className: "border-red-800 bg-red-50 text-red-950 dark:border-red-300 dark:bg-red-950 dark:text-red-100",
    glyph: (
      <>
        <rect x="2" y="2" width="12" height="12" rx="1" fill="none" stroke="currentColor" strokeWidth="1.8" />
        <path d="M2.5 9.5l7-7M6.5 13.5l7-7" stroke="currentColor" strokeWidth="1.6" />
      </>
    ),
  },
  scrapped: {
    word: "Scrapped",
    className: "border-neutral-700 bg-neutral-100 text-neutral-900 dark:border-neutral-300 dark:bg-neutral-800 dark:text-neutral-100",
    glyph: <path d="M3.5 3.5l9 9M12.5 3.5l-9 9" stroke="currentColor" strokeWidth="2.2" strokeLinecap="round" />,
  },
};

export function statusWord(status: PartStatus): string {
  return STATUS_LOOK[status].word;
}

export function StatusBadge({ status }: { status: PartStatus }) {
  const look = STATUS_LOOK[status];
  return (
    <span className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded border-2 px-2 py-0.5 text-sm font-semibold ${look.className}`}>
      <svg viewBox="0 0 16 16" width="16" height="16" aria-hidden="true" focusable="false">
        {look.glyph}
      </svg>
      {look.word}
    </span>
  );
}
