'use client';

// Shown when the entries section fails to load; the message is safe, the detail stays in the logs.
export default function EntriesError({ reset }: { error: Error; reset: () => void }) {
  return (
    <div role="alert" className="card space-y-3">
      <h1 className="text-2xl">Your entries could not be loaded</h1>
      <p>Something went wrong on our side or the connection dropped. Nothing you saved is lost.</p>
      <button type="button" className="btn-primary" onClick={reset}>
        Try again
      </button>
    </div>
  );
}
