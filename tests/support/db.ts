import pg from 'pg';

let pool: pg.Pool | undefined;

/** Direct SQL against the test database, to check what the app stored. */
export async function query<T = Record<string, unknown>>(sql: string, params: unknown[] = []): Promise<T[]> {
  pool ??= new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 2, allowExitOnIdle: true });
  const res = await pool.query(sql, params);
  return res.rows as T[];
}

/**
 * The same, as a named prepared statement: PostgreSQL plans it once per connection, not on every call (for a
 * statement run hundreds of times; the name must stand for one SQL text).
 */
export async function queryPrepared<T = Record<string, unknown>>(name: string, sql: string): Promise<T[]> {
  pool ??= new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 2, allowExitOnIdle: true });
  const res = await pool.query({ name, text: sql });
  return res.rows as T[];
}

/**
 * Waits until the app's background work left by earlier tests is done: the record chain's queue is empty (its
 * linker deletes each queued row as it links it, and may wait behind a busy server) and no mail waits to be sent.
 * A test that compares whole-table row counts calls it first, so only its own requests can move them.
 */
export async function waitForBackgroundWork(timeoutMs = 60_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const [r] = await query<{ unlinked: number; mails: number }>(
      `select (select count(*)::int from chain_queue) as unlinked,
              (select count(*)::int from mail_outbox where sent_at is null and failed_at is null) as mails`,
    );
    if (r.unlinked === 0 && r.mails === 0) return;
    if (Date.now() > deadline)
      throw new Error(
        `background work still waiting after ${timeoutMs} ms: ${r.unlinked} rows to chain, ${r.mails} mails`,
      );
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

export async function closeDb() {
  await pool?.end();
  pool = undefined;
}
