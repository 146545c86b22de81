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

export async function closeDb() {
  await pool?.end();
  pool = undefined;
}
