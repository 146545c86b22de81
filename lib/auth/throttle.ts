import 'server-only';
import { getDb } from '@/lib/db';

// Fixed-window attempt counter in PostgreSQL, so the limit holds across several app servers.
export async function recordAttempt(key: string, opts: { limit: number; windowS: number }) {
  const { sequelize } = getDb();
  const [rows] = await sequelize.query(
    `insert into auth_throttles (key, window_started_at, attempts) values (:key, now(), 1)
     on conflict (key) do update set
       attempts = case when auth_throttles.window_started_at < now() - make_interval(secs => :windowS) then 1 else auth_throttles.attempts + 1 end,
       window_started_at = case when auth_throttles.window_started_at < now() - make_interval(secs => :windowS) then now() else auth_throttles.window_started_at end
     returning attempts, extract(epoch from (window_started_at + make_interval(secs => :windowS) - now()))::int as retry_after_s`,
    { replacements: { key, windowS: opts.windowS } },
  );
  const row = (rows as { attempts: number; retry_after_s: number }[])[0];
  return { allowed: row.attempts <= opts.limit, attempts: row.attempts, retryAfterS: Math.max(1, row.retry_after_s) };
}

export async function clearAttempts(key: string) {
  await getDb().sequelize.query('delete from auth_throttles where key = :key', { replacements: { key } });
}
