// Answers for files that never change once made (a published report's PDF; its CSV revalidates): a strong ETag
// from the content's SHA-256, a year-long immutable cache lifetime, and 304 to a matching
// If-None-Match. Framework-free.
import 'server-only';

/** A year, the longest lifetime RFC 9111 section 5.2.2.1 recommends ("immutable": RFC 8246). */
export const IMMUTABLE_CACHE_CONTROL = 'public, max-age=31536000, immutable';

/** The strong entity tag for content with this SHA-256 (RFC 9110 section 8.8.3). */
export const strongEtag = (sha256Hex: string) => `"${sha256Hex}"`;

/**
 * Whether If-None-Match names this entity tag: "*" or any listed tag, compared weakly (a W/
 * prefix is ignored), as RFC 9110 section 13.1.2 asks for If-None-Match.
 */
export function ifNoneMatchHits(header: string | null, etag: string): boolean {
  if (!header) return false;
  if (header.trim() === '*') return true;
  const opaque = etag.replace(/^W\//, '');
  return header.split(',').some((t) => t.trim().replace(/^W\//, '') === opaque);
}

/** 304 with the validators when the client already holds this version; otherwise null. */
export function notModified(req: Request, etag: string, cacheControl = IMMUTABLE_CACHE_CONTROL): Response | null {
  if (!ifNoneMatchHits(req.headers.get('if-none-match'), etag)) return null;
  return new Response(null, { status: 304, headers: { etag, 'cache-control': cacheControl } });
}
