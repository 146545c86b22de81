// A fixed-window request counter held in one process's memory: the rate limit's stand-in while the
// database (which normally keeps the count for every app server) cannot answer. Bounded: at most
// `maxKeys` clients are held; expired windows give way first, then the oldest client.

export type FixedWindowCounter = (
  key: string,
  limit: number,
  now?: number,
) => { allowed: boolean; retryAfterS: number };

export function createFixedWindowCounter({
  windowS,
  maxKeys,
}: {
  windowS: number;
  maxKeys: number;
}): FixedWindowCounter {
  const windows = new Map<string, { windowEnds: number; attempts: number }>();
  return (key, limit, now = Date.now()) => {
    let w = windows.get(key);
    if (!w || w.windowEnds <= now) {
      if (!w && windows.size >= maxKeys) {
        for (const [k, v] of windows) if (v.windowEnds <= now) windows.delete(k);
        // Still full of live windows: the oldest client gives way (a Map keeps insertion order).
        if (windows.size >= maxKeys) windows.delete(windows.keys().next().value!);
      }
      w = { windowEnds: now + windowS * 1000, attempts: 0 };
      windows.set(key, w);
    }
    w.attempts += 1;
    return { allowed: w.attempts <= limit, retryAfterS: Math.max(1, Math.ceil((w.windowEnds - now) / 1000)) };
  };
}
