// GET|POST /api/auth/*: next-auth's own endpoints (sign-in, callbacks, session, sign-out).
import NextAuth from 'next-auth';
import type { NextRequest } from 'next/server';
import { getAuthOptions } from '@/lib/server/auth/options';
import { getClientAddress } from '@/lib/server/http/client-address';
import { recordAttempt } from '@/lib/server/auth/throttle';
import { AppError, toErrorResponse } from '@/lib/core/errors';
import { withCappedBody } from '@/lib/server/http/read-body';
import { serverEnv } from '@/lib/server/config/env';

type Ctx = { params: Promise<{ nextauth: string[] }> };

// next-auth reads a POST body whole; it gets a copy read through the capped reader instead.
const AUTH_MAX_BODY_BYTES = 64 * 1024;
// E-mailed sign-in links asked for from one client address, per hour: SIGN_IN_LINK_LIMIT_PER_HOUR,
// 30 by default (each target address has its own smaller limit in lib/server/auth/options.ts).

async function throttleLinkRequests(req: NextRequest) {
  const throttle = await recordAttempt(`link-request:${getClientAddress(req.headers)}`, {
    limit: serverEnv().SIGN_IN_LINK_LIMIT_PER_HOUR,
    windowS: 3600,
  });
  if (!throttle.allowed) {
    throw new AppError(
      'rate_limited',
      429,
      `Too many sign-in links asked for from this address: try again in ${Math.ceil(throttle.retryAfterS / 60)} minutes.`,
      {
        retryAfterS: throttle.retryAfterS,
      },
    );
  }
}

async function handler(req: NextRequest, ctx: Ctx) {
  try {
    const { nextauth } = await ctx.params;
    if (req.method === 'POST' && nextauth.join('/') === 'signin/email') await throttleLinkRequests(req);
    const capped = await withCappedBody(req, AUTH_MAX_BODY_BYTES);
    return await NextAuth(capped as never, ctx as never, getAuthOptions());
  } catch (err) {
    return toErrorResponse(err);
  }
}

export { handler as GET, handler as POST };
