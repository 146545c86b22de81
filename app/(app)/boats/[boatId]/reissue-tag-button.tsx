'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';

/** Reissue the QR tag, after a confirmation that says what happens to the old sticker. */
export function ReissueTagButton({ boatId }: { boatId: string }) {
  const router = useRouter();
  const [isAsking, setAsking] = useState(false);
  const [isBusy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ ok: boolean; text: string }>();

  async function reissue() {
    setBusy(true);
    const res = await fetch(`/api/boats/${boatId}/tag`, { method: 'POST' });
    const json = await res.json().catch(() => null);
    setBusy(false);
    setAsking(false);
    if (!res.ok) return setMessage({ ok: false, text: json?.error?.message ?? 'The tag could not be reissued. Try again.' });
    setMessage({ ok: true, text: 'New tag issued. Download it, print it and replace the old sticker.' });
    router.refresh();
  }

  return (
    <div className="space-y-2">
      {!isAsking ? (
        <button type="button" className="btn-secondary" onClick={() => { setMessage(undefined); setAsking(true); }}>Reissue tag</button>
      ) : (
        <div role="alertdialog" aria-labelledby="reissue-title" aria-describedby="reissue-text" className="rounded-lg border-2 border-flare-500 bg-flare-100 p-4 space-y-3">
          <p id="reissue-title" className="font-bold">Reissue this boat&apos;s tag?</p>
          <p id="reissue-text">
            The old sticker stops working at once: anyone who scans it is told it was replaced. Do this only if the tag is
            lost or damaged, and fix the new one before inspection.
          </p>
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn-danger" onClick={reissue} disabled={isBusy}>{isBusy ? 'Reissuing…' : 'Yes, reissue the tag'}</button>
            <button type="button" className="btn-secondary" onClick={() => setAsking(false)} disabled={isBusy}>Keep the current tag</button>
          </div>
        </div>
      )}
      <p aria-live="polite" className={message?.ok ? 'font-bold text-pass-600' : 'field-error'}>{message?.text}</p>
    </div>
  );
}
