"use client";

export default function ErrorPage({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <section className="card" role="alert">
      <h1 className="text-xl">Something went wrong</h1>
      <p className="mt-2 text-ink-soft">The page could not be shown. Nothing you saved was lost.</p>
      <button type="button" className="btn-quiet mt-4" onClick={reset}>
        Try again
      </button>
    </section>
  );
}
