"use client";

export default function ErrorPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <main className="mx-auto max-w-xl p-6">
      <h1 className="text-2xl font-bold">Something went wrong</h1>
      <p className="mt-2">
        The page could not be shown. Nothing you entered has been recorded unless you saw it confirmed. Try again; if it
        keeps happening, tell your administrator{error.digest ? <> and quote reference <span className="num">{error.digest}</span></> : null}.
      </p>
      <button type="button" onClick={reset} className="btn btn-primary mt-4">
        Try again
      </button>
    </main>
  );
}
