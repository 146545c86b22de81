// GET|POST /api/auth/*: next-auth's own endpoints (sign-in, callbacks, session, sign-out).
import NextAuth from 'next-auth';
import { getAuthOptions } from '@/lib/auth/options';
import { getClientAddress } from '@/lib/http/client-address';
import { recordAttempt } from '@/lib/auth/throttle';
import { AppError, toErrorResponse } from '@/lib/http/errors';

type Ctx = { params: Promise<{ nextauth: string[] }> };

// E-mailed sign-in links asked for from one client address, per hour (each target address has its
// own smaller limit in lib/auth/options.ts).
const LINK_REQUESTS_PER_ADDRESS_PER_HOUR = 30;

async function handler(req: Request, ctx: Ctx) {
  const { nextauth } = await ctx.params;
  if (req.method === 'POST' && nextauth.join('/') === 'signin/email') {
    const throttle = await recordAttempt(`link-request:${getClientAddress(req.headers)}`, {
      limit: Number(process.env.SIGN_IN_LINK_LIMIT_PER_HOUR) || LINK_REQUESTS_PER_ADDRESS_PER_HOUR,
      windowS: 3600,
    }).catch((err) => err as Error);
    if (throttle instanceof Error) return toErrorResponse(throttle);
    if (!throttle.allowed) {
      return toErrorResponse(
        new AppError('rate_limited', 429, `Too many sign-in links asked for from this address: try again in ${Math.ceil(throttle.retryAfterS / 60)} minutes.`, {
          retryAfterS: throttle.retryAfterS,
        }),
      );
    }
  }
  return NextAuth(req as never, ctx as never, getAuthOptions());
}

export { handler as GET, handler as POST };
