// GET|POST /api/auth/*: next-auth's own endpoints (sign-in, callbacks, session, sign-out).
import NextAuth from 'next-auth';
import { NextRequest } from 'next/server';
import { getAuthOptions } from '@/lib/auth/options';
import { toErrorResponse } from '@/lib/http/errors';
import { readCappedBytes } from '@/lib/http/read-body';

type Ctx = { params: Promise<{ nextauth: string[] }> };

// next-auth reads a POST body whole (req.text() / req.json()); it is handed a copy read through the
// one capped reader instead, so a chunked body with no length cannot grow past this.
const AUTH_MAX_BODY_BYTES = 64 * 1024;

async function handler(req: NextRequest, ctx: Ctx) {
  let request = req;
  if (req.method === 'POST' && req.body) {
    try {
      request = new NextRequest(req.url, { method: 'POST', headers: req.headers, body: await readCappedBytes(req, AUTH_MAX_BODY_BYTES) as BodyInit });
    } catch (err) {
      return toErrorResponse(err);
    }
  }
  return NextAuth(request as never, ctx as never, getAuthOptions());
}

export { handler as GET, handler as POST };
