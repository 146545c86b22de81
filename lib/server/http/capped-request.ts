import 'server-only';
import { NextRequest } from 'next/server';
import { readCappedBytes } from './read-body';

/**
 * The same request with its body already read through the capped reader, for code we do not own
 * that reads a body whole (next-auth's POST endpoints call req.text() / req.json()). Throws the
 * reader's 413 past maxBytes.
 */
export async function withCappedBody(req: NextRequest, maxBytes: number): Promise<NextRequest> {
  if (req.method !== 'POST' || !req.body) return req;
  return new NextRequest(req.url, { method: req.method, headers: req.headers, body: (await readCappedBytes(req, maxBytes)) as BodyInit });
}
