"use client";

/** The error boundary body for the catalog and layout segments: what happened, and a way to try again. */
export function SegmentError({ title, error, reset }: { title: string; error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div role="alert" className="panel max-w-xl p-4">
      <h1 className="text-xl font-bold">{title}</h1>
      <p className="mt-2">
        Nothing you entered was saved unless you saw it confirmed. Try again; if it keeps happening, tell your administrator
        {error.digest ? (
          <>
            {" "}and quote reference <span className="num">{error.digest}</span>
          </>
        ) : null}
        .
      </p>
      <button type="button" onClick={reset} className="btn btn-primary mt-4">
        Try again
      </button>
    </div>
  );
}
