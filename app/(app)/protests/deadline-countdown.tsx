'use client';

import { useEffect, useState } from 'react';

/** The protest deadline in the meeting's time zone, with the time left counting down live. */
export function DeadlineCountdown({ deadline, label }: { deadline: string; label: string }) {
  const [now, setNow] = useState<number | null>(null);
  useEffect(() => {
    // The clock is read after mount (the server's time would not match the phone's at hydration).
    const tick = () => setNow(Date.now());
    const first = setTimeout(tick, 0);
    const t = setInterval(tick, 1000);
    return () => {
      clearTimeout(first);
      clearInterval(t);
    };
  }, []);
  const left = now === null ? null : Math.floor((new Date(deadline).getTime() - now) / 1000);
  const isClosed = left !== null && left < 0;
  const mmss =
    left === null || left < 0 ? '' : `${Math.floor(left / 60)} min ${String(left % 60).padStart(2, '0')} s left`;
  return (
    <p
      role="status"
      data-testid="deadline"
      data-closed={isClosed ? 'true' : 'false'}
      className={`rounded-lg p-3 font-bold ${isClosed ? 'bg-fail-100 text-fail-800' : 'bg-doubt-100 text-doubt-800'}`}
    >
      {isClosed ? `The protest window closed at ${label}.` : `Protest by ${label}`}
      {mmss && (
        <span className="ml-2 font-normal" data-testid="time-left">
          ({mmss})
        </span>
      )}
    </p>
  );
}
