import 'server-only';
import type pg from 'pg';
import { getDb } from '.';

// A hot single statement as a named prepared statement on one of Sequelize's pooled connections: PostgreSQL
// parses and plans it once per connection (after five runs a generic plan, PostgreSQL documentation, PREPARE,
// "plan_cache_mode"), where a statement sent as text through Sequelize is parsed and planned on every request.
// Planning was the larger part of PostgreSQL's work for a dock record (measured with pg_stat_statements: the
// record's entry lookup planned in 0.77 ms and ran in 0.2 ms). Named parameters (:name) as Sequelize's
// replacements, bound as $n values (never spliced into the text).

type Compiled = { text: string; names: string[] };
const compiledByName = new Map<string, { sql: string; compiled: Compiled }>();

/** ":entryId" → "$1", the same name the same number; "::jsonb" casts are left alone. */
export function compileNamed(sql: string): Compiled {
  const names: string[] = [];
  const text = sql.replace(/(?<![:\w]):([A-Za-z_]\w*)/g, (_m, name: string) => {
    let i = names.indexOf(name);
    if (i < 0) i = names.push(name) - 1;
    return `$${i + 1}`;
  });
  return { text, names };
}

type Pool = {
  getConnection(o?: { type?: string; useMaster?: boolean }): Promise<pg.Client>;
  releaseConnection(c: pg.Client): Promise<void>;
};

/**
 * Runs `sql` (one statement) prepared under `name` (one text per name, for the life of the process) on the
 * primary, outside any transaction. Errors carry the driver's error as `parent`, as Sequelize's do, so a
 * database that is down still answers 503 (isDatabaseDown) and a crossed write 409.
 */
export async function preparedQuery<T>(name: string, sql: string, values: Record<string, unknown>): Promise<T[]> {
  const pool = getDb().sequelize.connectionManager as unknown as Pool;
  const client = await pool.getConnection({ type: 'write', useMaster: true });
  try {
    return (await client.query<T & pg.QueryResultRow>(bound(name, sql, values))).rows;
  } catch (err) {
    throw asDriverError(err);
  } finally {
    await pool.releaseConnection(client);
  }
}

function bound(name: string, sql: string, values: Record<string, unknown>): pg.QueryConfig {
  let known = compiledByName.get(name);
  if (!known) compiledByName.set(name, (known = { sql, compiled: compileNamed(sql) }));
  else if (known.sql !== sql) throw new Error(`prepared statement ${name} was given another text`);
  const { text, names } = known.compiled;
  return {
    name,
    text,
    values: names.map((n) => {
      if (!(n in values)) throw new Error(`prepared statement ${name}: no value for :${n}`);
      return values[n] ?? null;
    }),
  };
}

/** The driver's error as Sequelize would carry it (`parent`), for isDatabaseDown and isCrossedWrite. */
function asDriverError(err: unknown): Error {
  const e = err as Error & { code?: string };
  return Object.assign(new Error(e.message), { name: 'PreparedQueryError', parent: e, original: e, code: e.code });
}

export type PipelinedStep = { name: string; sql: string; values: Record<string, unknown> };

type PipelinedClient = pg.Client & { pipeline: boolean; connection: { stream: { cork(): void; uncork(): void } } };

/**
 * Prepared statements in one transaction, written to PostgreSQL at once: BEGIN, each statement and COMMIT go
 * out in one write and are answered together (one round trip, where awaiting each costs one per statement:
 * measured on the dock's record, six round trips became three). The driver's pipeline mode (pg's `pipeline`
 * client option) is switched on for this call alone on a pooled connection nobody else holds meanwhile.
 *
 * Each statement still takes its own snapshot (READ COMMITTED) and sees what the earlier ones did and
 * everything committed before a lock it waited for was granted. Once one fails, PostgreSQL refuses the rest
 * of the block and the COMMIT rolls it back (PostgreSQL documentation, COMMIT and "Pipelining" in the
 * frontend/backend protocol). A later statement cannot read an earlier one's answer in the application, so
 * it guards itself in SQL (for example: act only if the row the earlier statement inserted exists).
 * Returns each statement's rows; throws the first failure, carried as the driver's error (asDriverError).
 */
export async function preparedPipeline(steps: PipelinedStep[]): Promise<unknown[][]> {
  // Every statement is bound before anything is sent: a missing value must not leave a BEGIN on the wire
  // with no COMMIT behind it, on a connection that goes back to the pool.
  const queries = steps.map((s) => bound(s.name, s.sql, s.values));
  const pool = getDb().sequelize.connectionManager as unknown as Pool;
  const client = (await pool.getConnection({ type: 'write', useMaster: true })) as PipelinedClient;
  const stream = client.connection.stream;
  client.pipeline = true;
  try {
    stream.cork();
    let sent: Promise<pg.QueryResult>[];
    try {
      sent = [client.query('begin'), ...queries.map((q) => client.query(q)), client.query('commit')];
    } finally {
      stream.uncork();
    }
    // Every answer is awaited before the connection goes back to the pool, failed or not.
    const answers = await Promise.allSettled(sent);
    const failed = answers.find((a): a is PromiseRejectedResult => a.status === 'rejected');
    if (failed) throw asDriverError(failed.reason);
    return answers.slice(1, -1).map((a) => (a as PromiseFulfilledResult<pg.QueryResult>).value.rows);
  } finally {
    client.pipeline = false;
    await pool.releaseConnection(client);
  }
}
