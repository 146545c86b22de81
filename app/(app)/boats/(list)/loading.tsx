// Skeleton while the boats list loads (in its own route group: a boat's pages decide their own status).
export default function BoatsLoading() {
  return (
    <div className="space-y-4" aria-busy="true" aria-live="polite">
      <p className="sr-only">Loading your boats…</p>
      <div className="h-9 w-48 animate-pulse rounded-lg bg-paper-deep" />
      <div className="grid gap-3 sm:grid-cols-2">
        {[0, 1].map((i) => (
          <div key={i} className="card h-40 animate-pulse bg-paper-deep" />
        ))}
      </div>
    </div>
  );
}
