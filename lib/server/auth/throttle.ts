import 'server-only';
import { getDb } from '@/lib/server/db';
import { serverEnv } from '@/lib/server/config/env';

// Attempt counters in PostgreSQL (table auth_throttles), so a limit holds across every app server.
// Fixed windows; each row expires with its window and is purged (at most once a minute per process,
// THROTTLE_PURGE_INTERVAL_S).

type Limit = { key: string; limit: number; windowS: number };

let lastPurgeMs = 0;
const purgeIntervalMs = () => serverEnv().THROTTLE_PURGE_INTERVAL_S * 1000;
function purgeExpiredSometimes() {
  const now = Date.now();
  if (now - lastPurgeMs < purgeIntervalMs()) return;
  lastPurgeMs = now;
  void getDb()
    .sequelize.query(
      `delete from auth_throttles where ctid in (select ctid from auth_throttles where expires_at < now() limit 10000)`,
    )
    .catch(() => undefined);
}

const UPSERT = `insert into auth_throttles (key, window_started_at, attempts, expires_at)
     values (:key, now(), 1, now() + make_interval(secs => :windowS))
     on conflict (key) do update set
       attempts = case when auth_throttles.expires_at <= now() then 1 else auth_throttles.attempts + 1 end,
       window_started_at = case when auth_throttles.expires_at <= now() then now() else auth_throttles.window_started_at end,
       expires_at = case when auth_throttles.expires_at <= now() then now() + make_interval(secs => :windowS) else auth_throttles.expires_at end
     returning attempts, greatest(1, ceil(extract(epoch from (expires_at - now()))))::int as "retryAfterS"`;

/** Counts one attempt against the key and says whether it is still within the limit. */
export async function recordAttempt(key: string, opts: { limit: number; windowS: number }) {
  purgeExpiredSometimes();
  const [rows] = await getDb().sequelize.query(UPSERT, { replacements: { key, windowS: opts.windowS } });
  const row = (rows as { attempts: number; retryAfterS: number }[])[0];
  return { allowed: row.attempts <= opts.limit, attempts: row.attempts, retryAfterS: row.retryAfterS };
}

/** Counts one attempt against each key (a failed sign-in counts for the pair, the address and the account). */
export async function recordAttempts(limits: Limit[]) {
  purgeExpiredSometimes();
  await Promise.all(
    limits.map((l) => getDb().sequelize.query(UPSERT, { replacements: { key: l.key, windowS: l.windowS } })),
  );
}

/** True when any key has already reached its limit in its current window (nothing is counted). */
export async function isOverAnyLimit(limits: Limit[]): Promise<boolean> {
  if (limits.length === 0) return false;
  const [rows] = await getDb().sequelize.query(
    `select key, attempts from auth_throttles where key in (:keys) and expires_at > now()`,
    {
      replacements: { keys: limits.map((l) => l.key) },
    },
  );
  const seen = new Map((rows as { key: string; attempts: number }[]).map((r) => [r.key, r.attempts]));
  return limits.some((l) => (seen.get(l.key) ?? 0) >= l.limit);
}

export async function clearAttempts(key: string) {
  await getDb().sequelize.query('delete from auth_throttles where key = :key', { replacements: { key } });
}
