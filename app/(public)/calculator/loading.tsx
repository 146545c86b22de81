// Shown while the calculator route loads: the page's outline, so nothing jumps when it arrives.
export default function CalculatorLoading() {
  return (
    <div className="space-y-6" aria-busy="true" aria-label="Loading the calculator">
      <div className="h-4 w-40 animate-pulse rounded bg-paper-line" />
      <div className="h-9 w-64 animate-pulse rounded bg-paper-line" />
      <div className="card h-24 animate-pulse bg-paper-deep" />
      <div className="card h-96 animate-pulse bg-paper-deep" />
      <p className="sr-only" role="status">
        Loading the calculator…
      </p>
    </div>
  );
}
