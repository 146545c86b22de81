// GET|POST /api/auth/*: next-auth's own endpoints (sign-in, callbacks, session, sign-out).
import NextAuth from 'next-auth';
import type { NextRequest } from 'next/server';
import { getAuthOptions } from '@/lib/auth/options';
import { toErrorResponse } from '@/lib/http/errors';
import { withCappedBody } from '@/lib/http/capped-request';

type Ctx = { params: Promise<{ nextauth: string[] }> };

// next-auth reads a POST body whole; it gets a copy read through the capped reader instead.
const AUTH_MAX_BODY_BYTES = 64 * 1024;

async function handler(req: NextRequest, ctx: Ctx) {
  const capped = await withCappedBody(req, AUTH_MAX_BODY_BYTES).catch((err: unknown) => toErrorResponse(err));
  if (capped instanceof Response) return capped;
  return NextAuth(capped as never, ctx as never, getAuthOptions());
}

export { handler as GET, handler as POST };
