export default function Loading() {
  return (
    <div role="status" aria-live="polite" className="animate-pulse space-y-4">
      <div className="h-8 w-1/3 rounded bg-paper-sunk" />
      <div className="h-24 rounded-card bg-paper-sunk" />
      <span className="sr-only">Loading…</span>
    </div>
  );
}
