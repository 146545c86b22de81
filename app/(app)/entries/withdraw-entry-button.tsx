'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';

/** Withdraw an unpaid entry, after a one-step confirmation (its race number is not given back). */
export function WithdrawEntryButton({ entryId }: { entryId: string }) {
  const router = useRouter();
  const [isAsking, setAsking] = useState(false);
  const [isBusy, setBusy] = useState(false);
  const [error, setError] = useState<string>();

  async function withdraw() {
    setBusy(true);
    const res = await fetch(`/api/entries/${entryId}/withdraw`, { method: 'POST' });
    const json = await res.json().catch(() => null);
    setBusy(false);
    if (!res.ok) return setError(json?.error?.message ?? 'The entry could not be withdrawn. Try again.');
    setAsking(false);
    router.refresh();
  }

  if (!isAsking) return <button type="button" className="btn-secondary" onClick={() => setAsking(true)}>Withdraw</button>;
  return (
    <div role="alertdialog" aria-label="Withdraw this entry?" className="w-full space-y-2 rounded-lg bg-paper-deep p-3">
      <p>Withdraw this entry? You can enter again while entries are open, with a new race number.</p>
      <div className="flex flex-wrap gap-2">
        <button type="button" className="btn-danger" onClick={withdraw} disabled={isBusy}>{isBusy ? 'Withdrawing…' : 'Yes, withdraw'}</button>
        <button type="button" className="btn-secondary" onClick={() => setAsking(false)} disabled={isBusy}>Keep the entry</button>
      </div>
      <p aria-live="polite" className="field-error">{error}</p>
    </div>
  );
}
