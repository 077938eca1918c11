"use client";

export function PrintButton() {
  return (
    <button type="button" className="btn btn-primary no-print min-h-glove w-full" onClick={() => window.print()}>
      Print
    </button>
  );
}
