// Where the app may send a person after signing in: only a path on its own origin. Framework-free.
//
// The value is resolved against the app's own origin by the WHATWG URL parser, the same parser the
// browser will use (WHATWG URL Standard: tabs and newlines are stripped, a backslash counts as a
// slash in http(s) URLs), so "/\evil.example", "/<TAB>/evil.example" and "//evil.example" all resolve
// to another host and are refused. What is kept is re-serialised from the parsed URL (path, query,
// fragment), never the raw string; a path that would itself start with "//" is refused too.

export function safeRedirectPath(raw: unknown, appOrigin: string, fallback = '/home'): string {
  if (typeof raw !== 'string' || raw.length === 0 || raw.length > 2000) return fallback;
  let origin: string;
  let url: URL;
  try {
    origin = new URL(appOrigin).origin;
    url = new URL(raw, origin);
  } catch {
    return fallback;
  }
  if (url.origin !== origin) return fallback;
  const path = `${url.pathname}${url.search}${url.hash}`;
  if (!path.startsWith('/') || path.startsWith('//') || path.startsWith('/\\')) return fallback;
  return path;
}
