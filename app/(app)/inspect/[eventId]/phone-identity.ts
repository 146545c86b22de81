// Who and what on the phone: a record's key and the phone's own short name, both made in the browser.

/** A record key made on the phone (crypto.randomUUID needs a secure context; fall back to random bytes). */
export function newKey(): string {
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID();
  const b = crypto.getRandomValues(new Uint8Array(16));
  b[6] = (b[6] & 0x0f) | 0x40;
  b[8] = (b[8] & 0x3f) | 0x80;
  const h = Array.from(b, (x) => x.toString(16).padStart(2, '0')).join('');
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}

/**
 * A short, stable name for this phone, so the record says which device captured it. Read when a record is
 * made (never while the page hydrates: the server has no such name, and a value differing from the server's
 * would make React render the whole dock a second time, at once, as the page starts).
 */
export function deviceName(): string {
  const saved = localStorage.getItem('boreline-device');
  if (saved) return saved;
  const ua = navigator.userAgent;
  const name = `${/iPhone|iPad/.test(ua) ? 'iPhone' : /Android/.test(ua) ? 'Android phone' : 'Browser'} ${newKey().slice(0, 4)}`;
  localStorage.setItem('boreline-device', name);
  return name;
}
