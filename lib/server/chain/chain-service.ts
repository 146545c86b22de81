import 'server-only';
import path from 'node:path';
import type pg from 'pg';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { serverEnv } from '@/lib/server/config/env';
import { logger, metrics } from '@/lib/server/observability';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { parseId } from '@/lib/server/http/ids';
import { getObjectBytes } from '@/lib/server/storage/objects';
import { AppError } from '@/lib/core/errors';
import type { Checkpoint } from '@/lib/core/chain/bundle-format';
import type { ChainProblem } from '@/lib/core/chain/verify-bundle';
import {
  bundleFileLines,
  planBundle,
  checkpointCovering,
  checkAllChains,
  latestCheckpoint,
  linkAllChains,
  signCheckpoint,
  type Sql,
} from './chain-db';

// The app's side of the record chain (chain-db.ts does the work on a plain pg connection, taken here from
// Sequelize's pool). Nothing here runs on the record path: the linker runs in each server's worker
// (chain-worker.ts), before every checkpoint and before every export or self-check.

type Pool = {
  getConnection(o?: { type?: string; useMaster?: boolean }): Promise<pg.Client>;
  releaseConnection(c: pg.Client): Promise<void>;
};

export async function withChainClient<T>(work: (client: Sql) => Promise<T>): Promise<T> {
  const pool = getDb().sequelize.connectionManager as unknown as Pool;
  const client = await pool.getConnection({ type: 'write', useMaster: true });
  try {
    return await work(client as unknown as Sql);
  } finally {
    await pool.releaseConnection(client);
  }
}

export function keyDir(): string {
  return path.resolve(serverEnv().BORELINE_KEY_DIR);
}

export function linkChainsNow(): Promise<number> {
  return withChainClient((c) => linkAllChains(c));
}

/**
 * Signs a checkpoint of the meeting's chain after a publication (rules, results, parity report, a
 * decision). Called after the publication's commit and never awaited by it: a failure is logged, and the
 * next publication or the end of the meeting day signs again.
 */
export function checkpointAfter(eventId: string, reason: string): void {
  void withChainClient((c) => signCheckpoint(c, eventId, reason, keyDir())).catch((err) =>
    logger().error({ err, eventId, reason }, 'record chain: checkpoint failed'),
  );
}

/**
 * The same, awaited by a publication so its page and PDF print a checkpoint that covers it. Never fails
 * the publication: a failure is logged, and the next checkpoint covers the record.
 */
export async function checkpointQuietly(eventId: string, reason: string): Promise<void> {
  await withChainClient((c) => signCheckpoint(c, eventId, reason, keyDir())).catch((err) =>
    logger().error({ err, eventId, reason }, 'record chain: checkpoint failed'),
  );
}

export function signCheckpointNow(eventId: string, reason: string): Promise<Checkpoint> {
  return withChainClient((c) => signCheckpoint(c, eventId, reason, keyDir()));
}

/** The newest checkpoint of a meeting (public: it is printed on published pages). */
export async function meetingCheckpoint(eventId: string): Promise<Checkpoint | null> {
  return withChainClient((c) => latestCheckpoint(c, eventId));
}

/** The checkpoint that covers one published parity report, printed on its page and PDF (public). */
export async function reportCheckpoint(eventId: string, reportId: string): Promise<Checkpoint | null> {
  return withChainClient((c) => checkpointCovering(c, eventId, 'parity_reports', reportId));
}

/** The checkpoint that covers one version of a class's provisional results, printed on the results page. */
export async function resultsCheckpoint(eventId: string, resultsId: string): Promise<Checkpoint | null> {
  return withChainClient((c) => checkpointCovering(c, eventId, 'provisional_results', resultsId));
}

export type SelfCheck = {
  checkedAt: string;
  chains: number;
  records: number;
  broken: Array<{ chain: string; problem: ChainProblem }>;
};

/** Re-verifies every chain against the live rows, stores the result, and sets the metrics' alert. */
export async function runSelfCheck(actor: Actor | null): Promise<SelfCheck> {
  if (actor) assertCan(actor, 'chain.check');
  const checks = await withChainClient((c) => checkAllChains(c));
  const broken = checks.flatMap((c) => (c.problem ? [{ chain: c.chain, problem: c.problem }] : []));
  const records = checks.reduce((n, c) => n + c.records, 0);
  const [row] = await getDb().sequelize.query<{ checkedAt: Date }>(
    `insert into chain_self_checks (checked_by_id, chains, records, broken) values (:by, :chains, :records, :broken)
     returning checked_at as "checkedAt"`,
    {
      replacements: { by: actor?.id ?? null, chains: checks.length, records, broken: JSON.stringify(broken) },
      type: QueryTypes.SELECT,
    },
  );
  metrics().chainBroken.set(broken.length);
  metrics().chainLastCheck.set(Date.now() / 1000);
  if (broken.length) logger().error({ broken }, 'record chain: the self-check found a break');
  return { checkedAt: row!.checkedAt.toISOString(), chains: checks.length, records, broken };
}

/** The newest self-check, for the admin page. */
export async function lastSelfCheck(actor: Actor): Promise<SelfCheck | null> {
  assertCan(actor, 'chain.check');
  const [row] = await getDb().sequelize.query<{
    checkedAt: Date;
    chains: number;
    records: string;
    broken: SelfCheck['broken'];
  }>(`select checked_at as "checkedAt", chains, records, broken from chain_self_checks order by id desc limit 1`, {
    type: QueryTypes.SELECT,
  });
  return row
    ? { checkedAt: row.checkedAt.toISOString(), chains: row.chains, records: Number(row.records), broken: row.broken }
    : null;
}

/**
 * A meeting's export bundle (or one protest's case file), for the meeting's officials who may export it.
 * The chain's key must exist: a checkpoint is signed first, so the bundle always ends with a signed head.
 */
export async function exportMeetingBundle(
  actor: Actor,
  eventIdRaw: string,
  protestIdRaw?: string,
): Promise<ReadableStream<Uint8Array>> {
  const eventId = parseId(eventIdRaw, 'meeting');
  assertCan(actor, 'chain.export', { eventId });
  const protestId = protestIdRaw ? parseId(protestIdRaw, 'protest') : undefined;
  if (protestId) {
    const [p] = await getDb().sequelize.query('select 1 from protests where id = :protestId and event_id = :eventId', {
      replacements: { protestId, eventId },
      type: QueryTypes.SELECT,
    });
    if (!p) throw new AppError('not_found', 404, 'No such protest at this meeting.');
  }
  const plan = await withChainClient(async (c) => {
    await signCheckpoint(c, eventId, protestId ? 'case file export' : 'export', keyDir());
    return planBundle(c, eventId, protestId ? { protestId } : {});
  });
  // The records go out at once; the files follow one at a time as the client reads (the database connection is
  // already back in the pool), so a meeting's photos are never all in memory.
  const encoder = new TextEncoder();
  const stored = (key: string) =>
    getObjectBytes(key).catch((err: unknown) => {
      if (err instanceof AppError && err.status === 404) return null; // not stored: left out, and the verifier says so
      throw err;
    });
  const files = bundleFileLines(plan.files, stored);
  return new ReadableStream<Uint8Array>({
    start(controller) {
      controller.enqueue(encoder.encode(plan.head));
    },
    async pull(controller) {
      try {
        const next = await files.next();
        if (next.done) controller.close();
        else controller.enqueue(encoder.encode(next.value));
      } catch (err) {
        // Storage failed mid-bundle: the download is cut short (an incomplete last line, which the verifier refuses),
        // never finished without the file.
        logger().error({ err, eventId, protestId }, 'record chain: a bundle file could not be read from storage');
        controller.error(err);
      }
    },
    async cancel() {
      await files.return(undefined);
    },
  });
}
