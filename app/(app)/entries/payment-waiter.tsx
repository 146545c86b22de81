'use client';

import { useEffect, useState } from 'react';
import { useRouter } from 'next/navigation';

// The provider confirms a payment by webhook, usually within seconds of the redirect back here:
// re-read the page every 2 s for a minute, and let the person refresh by hand after that.
const EVERY_MS = 2000;
const FOR_MS = 60_000;

export function PaymentWaiter() {
  const router = useRouter();
  const [isPolling, setPolling] = useState(true);
  useEffect(() => {
    const started = Date.now();
    const timer = setInterval(() => {
      if (Date.now() - started > FOR_MS) {
        setPolling(false);
        clearInterval(timer);
        return;
      }
      router.refresh();
    }, EVERY_MS);
    return () => clearInterval(timer);
  }, [router]);
  return (
    <div className="flex flex-wrap items-center gap-3">
      <button type="button" className="btn-secondary" onClick={() => router.refresh()}>
        Refresh
      </button>
      <span className="text-sm text-ink-mute">
        {isPolling
          ? 'Checking again every few seconds…'
          : 'Still nothing: refresh in a minute, or check your e-mail for the receipt.'}
      </span>
    </div>
  );
}
