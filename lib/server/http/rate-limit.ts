import 'server-only';
import { recordAttempt } from '@/lib/server/auth/throttle';
import { AppError } from '../../core/errors';
import { getClientAddress } from './client-address';
import { serverEnv } from '@/lib/server/config/env';

// Per-client request limit for the public routes, counted in PostgreSQL (lib/server/auth/throttle.ts) so
// that it holds across any number of app servers. Fixed one-minute windows.
//
// The counter's key is `rate:<bucket>:<client address>` in auth_throttles. The integration test
// (tests/integration/calculation-api.test.ts) finds that row after one request and raises its
// count to the configured limit, so the 429 is tested against the real limit and the real store,
// with no test-only switch in this file.
//
// A database outage is not swallowed: the request answers 503 like every other route (honest
// status, and no unlimited traffic while the counter cannot be kept).

const WINDOW_S = 60;

/** Each bucket's limit per minute per client, from the environment (lib/server/config/env.ts). */
const BUCKETS = {
  'public-api': () => serverEnv().PUBLIC_API_RATE_LIMIT_PER_MINUTE,
} as const satisfies Record<string, () => number>;

export type RateLimitBucket = keyof typeof BUCKETS;

/** The bucket's limit (unset: the default; malformed: the app refuses to start). */
export function readLimitPerMinute(bucket: RateLimitBucket): number {
  return BUCKETS[bucket]();
}

/** Counts this request against the client's bucket; over the limit throws a 429 AppError. */
export async function enforceRateLimit(req: Request, bucket: RateLimitBucket = 'public-api'): Promise<void> {
  const limit = readLimitPerMinute(bucket);
  const key = `rate:${bucket}:${getClientAddress(req.headers)}`;
  const { allowed, retryAfterS } = await recordAttempt(key, { limit, windowS: WINDOW_S });
  if (!allowed) {
    // toErrorResponse turns details.retryAfterS into the Retry-After header.
    throw new AppError(
      'rate_limited',
      429,
      `Too many requests from this address: at most ${limit} a minute. Try again in ${retryAfterS} s.`,
      {
        retryAfterS,
      },
    );
  }
}
