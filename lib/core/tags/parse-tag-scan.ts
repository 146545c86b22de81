// What a scanner (or a person typing from the sticker) read, as a tag token. Framework-free: the
// dock screen parses before asking the server (and before looking in its offline copy).

/** The token from a tag URL (…/t/TOKEN) or a bare token; null when the text cannot be a token. */
export function parseTagScan(text: string): string | null {
  const t = text.trim();
  const fromUrl = /\/t\/([A-Za-z0-9_-]+)\/?(?:[?#].*)?$/.exec(t);
  const token = fromUrl ? fromUrl[1] : t;
  return /^[A-Za-z0-9_-]{8,64}$/.test(token) ? token : null;
}
