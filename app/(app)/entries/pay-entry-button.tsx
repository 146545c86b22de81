'use client';

import { useState } from 'react';

/** Opens the payment page for an unpaid entry (the provider's hosted page) and sends the browser there. */
export function PayEntryButton({ entryId, label = 'Pay entry fee' }: { entryId: string; label?: string }) {
  const [isBusy, setBusy] = useState(false);
  const [error, setError] = useState<string>();

  async function pay() {
    setBusy(true);
    setError(undefined);
    const res = await fetch(`/api/entries/${entryId}/checkout`, { method: 'POST' });
    const json = await res.json().catch(() => null);
    if (!res.ok || !json?.data?.url) {
      setBusy(false);
      return setError(json?.error?.message ?? 'The payment page could not be opened. Try again.');
    }
    window.location.assign(json.data.url);
  }

  return (
    <div className="space-y-1">
      <button type="button" className="btn-primary" onClick={pay} disabled={isBusy}>{isBusy ? 'Opening the payment page…' : label}</button>
      <p aria-live="polite" className="field-error">{error}</p>
    </div>
  );
}
