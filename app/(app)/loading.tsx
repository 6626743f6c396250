export default function Loading() {
  return (
    <div role="status" aria-live="polite" className="space-y-3">
      <span className="sr-only">Loading…</span>
      <div className="h-8 w-56 animate-pulse rounded bg-paper-sunk" />
      <div className="h-24 animate-pulse rounded-card bg-paper-sunk" />
      <div className="h-24 animate-pulse rounded-card bg-paper-sunk" />
    </div>
  );
}
