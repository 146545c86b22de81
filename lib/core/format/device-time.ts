// Times on the phone's own clock, without date-fns: this module is part of the dock's first load.

const deviceFormats = new Map<string, Intl.DateTimeFormat>();

/**
 * A moment on the phone's own clock and in its own language, for screens that only say "when, here and now"
 * (the boat card's history, the phone's outbox). One formatter per set of options, made once: each
 * toLocaleString(…, options) call builds a new Intl.DateTimeFormat, which on a phone cost more than
 * drawing the rest of the boat card.
 */
export function formatOnDevice(instant: Date | string | number, options: Intl.DateTimeFormatOptions): string {
  const key = JSON.stringify(options);
  let f = deviceFormats.get(key);
  if (!f) deviceFormats.set(key, (f = new Intl.DateTimeFormat(undefined, options)));
  return f.format(new Date(instant));
}
