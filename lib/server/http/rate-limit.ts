import 'server-only';
import { recordAttempt } from '@/lib/server/auth/throttle';
import { AppError } from '../../core/errors';
import { getClientAddress } from './client-address';

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

/** Each bucket reads its own limit from the environment, per minute per client. */
const BUCKETS = {
  'public-api': { env: 'PUBLIC_API_RATE_LIMIT_PER_MINUTE', defaultPerMinute: 600 },
} as const satisfies Record<string, { env: string; defaultPerMinute: number }>;

export type RateLimitBucket = keyof typeof BUCKETS;

const warnedAbout = new Set<string>();

/** The bucket's limit; a missing or malformed value falls back to the default (warned once). */
export function readLimitPerMinute(bucket: RateLimitBucket): number {
  const { env, defaultPerMinute } = BUCKETS[bucket];
  const raw = process.env[env]?.trim();
  if (!raw) return defaultPerMinute;
  const limit = Number(raw);
  if (Number.isInteger(limit) && limit > 0) return limit;
  if (!warnedAbout.has(env)) {
    warnedAbout.add(env);
    console.warn(`[boreline] ${env}=${raw} is not a positive integer; using ${defaultPerMinute}`);
  }
  return defaultPerMinute;
}

/** Counts this request against the client's bucket; over the limit throws a 429 AppError. */
export async function enforceRateLimit(req: Request, bucket: RateLimitBucket = 'public-api'): Promise<void> {
  const limit = readLimitPerMinute(bucket);
  const key = `rate:${bucket}:${getClientAddress(req.headers)}`;
  const { allowed, retryAfterS } = await recordAttempt(key, { limit, windowS: WINDOW_S });
  if (!allowed) {
    // toErrorResponse turns details.retryAfterS into the Retry-After header.
    throw new AppError('rate_limited', 429, `Too many requests from this address: at most ${limit} a minute. Try again in ${retryAfterS} s.`, {
      retryAfterS,
    });
  }
}
