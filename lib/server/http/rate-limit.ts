import 'server-only';
import { recordAttempt } from '@/lib/server/auth/throttle';
import { AppError, isDatabaseDown } from '../../core/errors';
import { logger } from '@/lib/server/observability';
import { getClientAddress } from './client-address';
import { createFixedWindowCounter } from '../../core/api/fixed-window-counter';
import { serverEnv } from '@/lib/server/config/env';

// Per-client request limit for the public routes, counted in PostgreSQL (lib/server/auth/throttle.ts) so
// that it holds across any number of app servers. Fixed one-minute windows.
//
// The counter's key is `rate:<bucket>:<client address>` in auth_throttles. The integration test
// (tests/integration/calculation-api.test.ts) finds that row after one request and raises its
// count to the configured limit, so the 429 is tested against the real limit and the real store,
// with no test-only switch in this file.
//
// While the database is down (a connection failure, not a bad query), the public routes are pure
// calculations that need no database, so they go on answering: the count falls back to this app
// server's own memory, with the same limit per client and window (per server, not across servers,
// for as long as the outage lasts), and a warning in the log. Never unlimited.

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

/** This server's own count while the database cannot keep it (same windows, bounded memory). */
const recordAttemptInMemory = createFixedWindowCounter({ windowS: WINDOW_S, maxKeys: 10_000 });
let isWarned = false;

async function countAttempt(key: string, limit: number) {
  try {
    const counted = await recordAttempt(key, { limit, windowS: WINDOW_S });
    isWarned = false;
    return counted;
  } catch (err) {
    if (!isDatabaseDown(err)) throw err;
    if (!isWarned) {
      logger().warn(
        { err: String(err) },
        'rate limit: the database cannot count; counting in this server until it is back',
      );
      isWarned = true;
    }
    return recordAttemptInMemory(key, limit);
  }
}

/** Counts this request against the client's bucket; over the limit throws a 429 AppError. */
export async function enforceRateLimit(req: Request, bucket: RateLimitBucket = 'public-api'): Promise<void> {
  const limit = readLimitPerMinute(bucket);
  const key = `rate:${bucket}:${getClientAddress(req.headers)}`;
  const { allowed, retryAfterS } = await countAttempt(key, limit);
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
