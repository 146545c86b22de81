'use client';

import { useState } from 'react';

/** Opens (or reopens: the same session) the payment page for the protest fee. */
export function PayFeeButton({ protestId, label }: { protestId: string; label: string }) {
  const [isBusy, setBusy] = useState(false);
  const [error, setError] = useState<string>();
  async function pay() {
    setBusy(true);
    setError(undefined);
    const res = await fetch(`/api/protests/${protestId}/checkout`, { method: 'POST' });
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
