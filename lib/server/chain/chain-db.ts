// The record chain in PostgreSQL (migration 20261204050000): the linker, the live self-check, the
// meetings' keys, signed checkpoints and the export bundle. Every function takes a plain `pg` client, so
// the app (through Sequelize's pool, chain-service.ts), scripts and the integration tests run the same code.
// No `server-only` here: tests/integration/record-chain.test.ts drives it with its own clients.
import { createPrivateKey, createPublicKey, generateKeyPairSync, sign, type KeyObject } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { parseRowJson } from '@/lib/core/chain/canonical-json';
import { GENESIS_HASH, bytesToBase64, keyFingerprint, linkHash, rowHash } from '@/lib/core/chain/hashes';
import {
  BUNDLE_VERSION,
  WITHHELD_TABLE,
  checkpointMessage,
  fileReference,
  type BundleLine,
  type ChainRecord,
  type Checkpoint,
  type CheckpointBody,
} from '@/lib/core/chain/bundle-format';
import { verifyRecords, type ChainProblem } from '@/lib/core/chain/verify-bundle';
// The process's structured log itself (lib/server/observability.ts re-exports it for server-only code).
import { logger } from '../../../scripts/observability.mjs';

export type Sql = { query(text: string, values?: unknown[]): Promise<{ rows: Record<string, unknown>[] }> };

/** Tables that may be chained and the type of their id (the queue holds table names; nothing else is read). */
const CHAINED_TABLES: Record<string, 'uuid' | 'bigint'> = {
  inspections: 'uuid',
  inspection_photos: 'uuid',
  boat_declaration_versions: 'uuid',
  seal_events: 'uuid',
  provisional_results: 'uuid',
  parity_reports: 'uuid',
  protest_evidence: 'uuid',
  technical_reports: 'uuid',
  penalties: 'uuid',
  start_decisions: 'uuid',
  custody_items: 'uuid',
  custody_releases: 'uuid',
  audit_events: 'bigint',
  class_rule_versions: 'uuid',
};

const CHAIN_KEY = /^(site|[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12})$/;

function checkChainKey(chainKey: string): string {
  if (!CHAIN_KEY.test(chainKey)) throw new Error(`not a chain: ${chainKey}`);
  return chainKey;
}

async function inTransaction<T>(client: Sql, work: () => Promise<T>): Promise<T> {
  await client.query('begin');
  try {
    // The row's JSON is to_jsonb(row) as PostgreSQL prints it: timestamps depend on the session's time
    // zone and floats on extra_float_digits, so both are fixed for every read that is hashed.
    await client.query(`set local timezone = 'UTC'`);
    await client.query('set local extra_float_digits = 1');
    const out = await work();
    await client.query('commit');
    return out;
  } catch (err) {
    await client.query('rollback').catch(() => undefined);
    throw err;
  }
}

/** The one lock per chain: linking and checkpoints of one meeting take turns; other meetings do not wait. */
function lockChain(client: Sql, chainKey: string) {
  return client.query(`select pg_advisory_xact_lock(hashtextextended('boreline-chain:' || $1, 0))`, [chainKey]);
}

/** Reads rows as to_jsonb text, keyed "table/id"; a row that is gone is absent from the map. */
async function readRows(client: Sql, refs: Array<{ table: string; rowId: string }>): Promise<Map<string, string>> {
  const byTable = new Map<string, string[]>();
  for (const { table, rowId } of refs) {
    if (!(table in CHAINED_TABLES)) throw new Error(`not a chained table: ${table}`);
    byTable.set(table, [...(byTable.get(table) ?? []), rowId]);
  }
  const out = new Map<string, string>();
  for (const [table, ids] of byTable) {
    const { rows } = await client.query(
      `select t.id::text as id, to_jsonb(t)::text as j from ${table} t where t.id = any($1::${CHAINED_TABLES[table]}[])`,
      [ids],
    );
    for (const r of rows) out.set(`${table}/${r.id}`, r.j as string);
  }
  return out;
}

/** The row as hashed: to_jsonb parsed keeping long numerics as text; a row that is gone is null. */
function rowValue(text: string | undefined): Record<string, unknown> | null {
  return text === undefined ? null : (parseRowJson(text) as Record<string, unknown>);
}

/**
 * Links what waits in the queue for one chain, in queue order, under the chain's lock: strict order, no
 * fork (chain_links' unique (chain_key, seq) and (chain_key, prev_hash) would refuse one anyway).
 * Returns how many records were linked.
 */
export async function linkChain(client: Sql, chainKey: string, limit = 500): Promise<number> {
  checkChainKey(chainKey);
  return inTransaction(client, async () => {
    await lockChain(client, chainKey);
    const queued = (
      await client.query(
        `select q.id::text as id, q.table_name as table, q.row_id as "rowId",
                exists (select 1 from chain_links l where l.chain_key = q.chain_key and l.table_name = q.table_name
                          and l.row_id = q.row_id) as linked
           from chain_queue q where q.chain_key = $1 order by q.id limit $2`,
        [chainKey, limit],
      )
    ).rows as Array<{ id: string; table: string; rowId: string; linked: boolean }>;
    if (!queued.length) return 0;
    const [head] = (
      await client.query(
        'select seq::int as seq, link_hash as "linkHash" from chain_links where chain_key = $1 order by seq desc limit 1',
        [chainKey],
      )
    ).rows as Array<{ seq: number; linkHash: string }>;
    const fresh = queued.filter((q) => !q.linked);
    const rows = await readRows(client, fresh);
    let seq = head?.seq ?? 0;
    let prev = head?.linkHash ?? GENESIS_HASH;
    const links: Array<{
      seq: number;
      table: string;
      rowId: string;
      rowHash: string;
      prevHash: string;
      linkHash: string;
    }> = [];
    for (const q of fresh) {
      // A row deleted before it was linked is chained as null: the gap stays visible.
      const own = await rowHash(q.table, rowValue(rows.get(`${q.table}/${q.rowId}`)));
      const link = await linkHash(prev, own);
      links.push({ seq: ++seq, table: q.table, rowId: q.rowId, rowHash: own, prevHash: prev, linkHash: link });
      prev = link;
    }
    if (links.length)
      await client.query(
        `insert into chain_links (chain_key, seq, table_name, row_id, row_hash, prev_hash, link_hash)
         select $1, * from unnest($2::bigint[], $3::text[], $4::text[], $5::text[], $6::text[], $7::text[])`,
        [
          chainKey,
          links.map((l) => l.seq),
          links.map((l) => l.table),
          links.map((l) => l.rowId),
          links.map((l) => l.rowHash),
          links.map((l) => l.prevHash),
          links.map((l) => l.linkHash),
        ],
      );
    await client.query('delete from chain_queue where id = any($1::bigint[])', [queued.map((q) => q.id)]);
    return links.length;
  });
}

/** Links every chain with something queued (until the queue is empty). Returns how many records. */
export async function linkAllChains(client: Sql): Promise<number> {
  let total = 0;
  for (;;) {
    const { rows } = await client.query('select distinct chain_key from chain_queue');
    if (!rows.length) return total;
    let linked = 0;
    for (const r of rows) linked += await linkChain(client, r.chain_key as string);
    total += linked;
    if (!linked) return total;
  }
}

/** The chain's records as linked, with each row read live now (null when the row is gone). */
async function chainRecords(client: Sql, chainKey: string): Promise<ChainRecord[]> {
  return inTransaction(client, async () => {
    const { rows: links } = await client.query(
      `select seq::int as seq, table_name as table, row_id as "rowId", prev_hash as "prevHash", row_hash as "rowHash",
              link_hash as "linkHash", linked_at as "linkedAt"
         from chain_links where chain_key = $1 order by seq`,
      [chainKey],
    );
    const rows = await readRows(client, links as Array<{ table: string; rowId: string }>);
    return links.map((l) => ({
      type: 'record' as const,
      seq: l.seq as number,
      table: l.table as string,
      rowId: l.rowId as string,
      prevHash: l.prevHash as string,
      rowHash: l.rowHash as string,
      linkHash: l.linkHash as string,
      linkedAt: (l.linkedAt as Date).toISOString(),
      row: rowValue(rows.get(`${l.table}/${l.rowId}`)) as Record<string, unknown>,
    }));
  });
}

export type ChainCheck = { chain: string; records: number; problem: ChainProblem | null };

/**
 * The self-check: links what is queued, then re-reads every chained row of the chain as it is now and
 * recomputes every row hash and link. A row changed or deleted behind the triggers' back (a superuser's
 * `alter table … disable trigger`) is named here.
 */
export async function checkChain(client: Sql, chainKey: string): Promise<ChainCheck> {
  checkChainKey(chainKey);
  await linkChain(client, chainKey, 100_000);
  const records = await chainRecords(client, chainKey);
  const result = await verifyRecords(
    records.map((r) => ({ line: r.seq, r })),
    null,
  );
  return { chain: chainKey, records: records.length, problem: result.ok ? null : result.problem };
}

/** Every chain's self-check. */
export async function checkAllChains(client: Sql): Promise<ChainCheck[]> {
  await linkAllChains(client);
  const { rows } = await client.query('select distinct chain_key from chain_links order by 1');
  const out: ChainCheck[] = [];
  for (const r of rows) out.push(await checkChain(client, r.chain_key as string));
  return out;
}

// Keys --------------------------------------------------------------------------------------------

export type ChainKey = { privateKey: KeyObject; spki: Buffer; fingerprint: string };

function keyFile(keyDir: string, chainKey: string) {
  return path.join(keyDir, `${checkChainKey(chainKey)}.ed25519.pem`);
}

/**
 * The Ed25519 private key in a key file, or null when the file holds no such key (damaged, another kind of key).
 * A file that cannot be read (permissions, too many open files, a disk error) throws: that says nothing about
 * the key, and must never get a good key file moved aside.
 */
function readPrivateKey(file: string): KeyObject | null {
  const text = fs.readFileSync(file, 'utf8');
  try {
    const key = createPrivateKey(text);
    return key.asymmetricKeyType === 'ed25519' ? key : null;
  } catch {
    return null;
  }
}

/**
 * The chain's Ed25519 key: made on first use (the private key as PKCS#8 PEM in keyDir, mode 0600, never
 * in the database; the public key and its fingerprint in chain_keys). Call under the chain's lock.
 * A key file is never written over: when the database has no public key for the chain but the folder has
 * its key file (the database was restored, or reset, and the key folder kept), that key is the chain's
 * again, so checkpoints it signed before still verify with it; a file that holds no usable key is kept
 * beside under another name and a new key is made.
 */
async function chainKeyPair(client: Sql, chainKey: string, keyDir: string): Promise<ChainKey> {
  const file = keyFile(keyDir, chainKey);
  const [stored] = (
    await client.query('select public_key_spki as spki, fingerprint from chain_keys where chain_key = $1', [chainKey])
  ).rows as Array<{ spki: Buffer; fingerprint: string }>;
  if (stored) {
    if (!fs.existsSync(file))
      throw new Error(`the private key of chain ${chainKey} is missing from the key folder (${keyDir})`);
    const privateKey = createPrivateKey(fs.readFileSync(file, 'utf8'));
    const spki = createPublicKey(privateKey).export({ format: 'der', type: 'spki' });
    if (!spki.equals(stored.spki)) throw new Error(`the key file of chain ${chainKey} is not the chain's key`);
    return { privateKey, spki, fingerprint: stored.fingerprint };
  }
  let privateKey = fs.existsSync(file) ? readPrivateKey(file) : null;
  if (!privateKey) {
    if (fs.existsSync(file)) {
      const aside = `${file}.unusable-${new Date().toISOString().replace(/[:.]/g, '-')}`;
      fs.renameSync(file, aside);
      logger().warn(
        { chainKey, file: aside },
        'record chain: a key file held no usable Ed25519 key; kept aside, new key made',
      );
    }
    privateKey = generateKeyPairSync('ed25519').privateKey;
    fs.mkdirSync(keyDir, { recursive: true, mode: 0o700 });
    // 'wx': fails rather than replace a file that appeared meanwhile.
    fs.writeFileSync(file, privateKey.export({ format: 'pem', type: 'pkcs8' }), { mode: 0o600, flag: 'wx' });
  }
  const spki = createPublicKey(privateKey).export({ format: 'der', type: 'spki' });
  const fingerprint = await keyFingerprint(new Uint8Array(spki));
  await client.query('insert into chain_keys (chain_key, public_key_spki, fingerprint) values ($1, $2, $3)', [
    chainKey,
    spki,
    fingerprint,
  ]);
  return { privateKey, spki, fingerprint };
}

/** Links what is queued, then signs the chain's head with the meeting's key and stores the checkpoint. */
export async function signCheckpoint(
  client: Sql,
  chainKey: string,
  reason: string,
  keyDir: string,
): Promise<Checkpoint> {
  await linkChain(client, chainKey, 100_000);
  return inTransaction(client, async () => {
    await lockChain(client, chainKey);
    const key = await chainKeyPair(client, chainKey, keyDir);
    const [head] = (
      await client.query(
        'select seq::int as seq, link_hash as "linkHash" from chain_links where chain_key = $1 order by seq desc limit 1',
        [chainKey],
      )
    ).rows as Array<{ seq: number; linkHash: string }>;
    const body: CheckpointBody = {
      chain: chainKey,
      count: head?.seq ?? 0,
      head: head?.linkHash ?? GENESIS_HASH,
      reason: reason.slice(0, 200),
      signedAt: new Date().toISOString(),
      keyFingerprint: key.fingerprint,
    };
    const signature = sign(null, checkpointMessage(body), key.privateKey).toString('base64');
    await client.query(
      `insert into chain_checkpoints (chain_key, count, head, reason, signed_at, key_fingerprint, signature)
       values ($1, $2, $3, $4, $5, $6, $7)`,
      [chainKey, body.count, body.head, body.reason, body.signedAt, body.keyFingerprint, signature],
    );
    return { type: 'checkpoint', ...body, signature };
  });
}

/** The newest checkpoint of a chain, for printing on published pages. */
export async function latestCheckpoint(client: Sql, chainKey: string): Promise<Checkpoint | null> {
  const [c] = (
    await client.query(
      `select chain_key as chain, count::int as count, head, reason, signed_at as "signedAt",
              key_fingerprint as "keyFingerprint", signature
         from chain_checkpoints where chain_key = $1 order by id desc limit 1`,
      [checkChainKey(chainKey)],
    )
  ).rows;
  return c
    ? ({ type: 'checkpoint', ...c, head: c.head as string, signedAt: (c.signedAt as Date).toISOString() } as Checkpoint)
    : null;
}

// The export bundle ------------------------------------------------------------------------------

/** Whether a record belongs to one protest's case file. */
function inCaseFile(r: ChainRecord, protestId: string, items: Set<string>, inspections: Set<string>): boolean {
  const row = r.row ?? {};
  return (
    row.protest_id === protestId ||
    row.subject_id === protestId ||
    (r.table === 'custody_releases' && items.has(row.item_id as string)) ||
    (r.table === 'inspections' && inspections.has(r.rowId))
  );
}

/** A bundle read from the database: its lines up to the checkpoints (header, key, records, checkpoints), and the files its records name, read afterwards. */
export type BundlePlan = { head: string; files: { objectKey: string; sha256: string; contentType: string }[] };

/**
 * The export bundle of a meeting's chain (bundle-format.ts), or one protest's case file: every link of
 * the meeting up to its newest signed checkpoint, with rows only for the protest's records (the others'
 * links still chain). The verifier refuses records no checkpoint covers, so a record linked after that
 * checkpoint (the meeting goes on while the bundle is built) waits for the next export, and a checkpoint
 * signed after the records were read is left out. The files the rows name come after (bundleFileLines,
 * from object storage in the app).
 */
export async function planBundle(
  client: Sql,
  chainKey: string,
  opts: { protestId?: string } = {},
): Promise<BundlePlan> {
  await linkChain(client, chainKey, 100_000);
  let records = await chainRecords(client, chainKey);
  const { rows: checkpoints } = await client.query(
    `select chain_key as chain, count::int as count, head, reason, signed_at as "signedAt",
            key_fingerprint as "keyFingerprint", signature
       from chain_checkpoints where chain_key = $1 and count <= $2 order by id`,
    [chainKey, records.length],
  );
  records = records.slice(0, Math.max(0, ...checkpoints.map((c) => c.count as number)));
  if (opts.protestId) {
    const protestId = opts.protestId;
    const items = new Set(
      records.filter((r) => r.table === 'custody_items' && r.row?.protest_id === protestId).map((r) => r.rowId),
    );
    const inspections = new Set(
      records
        .filter((r) => r.table === 'protest_evidence' && r.row?.protest_id === protestId && r.row?.inspection_id)
        .map((r) => r.row!.inspection_id as string),
    );
    // Another matter's record keeps only what the chain needs (its place and three hashes): not its row, and not
    // its table, id or time, which would show the meeting's other protests and when they were made.
    records = records.map((r) =>
      inCaseFile(r, protestId, items, inspections)
        ? r
        : {
            type: 'record',
            seq: r.seq,
            table: WITHHELD_TABLE,
            rowId: '',
            prevHash: r.prevHash,
            rowHash: r.rowHash,
            linkHash: r.linkHash,
          },
    );
  }
  const [key] = (
    await client.query('select public_key_spki as spki, fingerprint from chain_keys where chain_key = $1', [chainKey])
  ).rows as Array<{ spki: Buffer; fingerprint: string }>;
  if (!key) throw new Error(`chain ${chainKey} has no key yet: sign a checkpoint first`);
  const lines: BundleLine[] = [
    {
      type: 'bundle',
      version: BUNDLE_VERSION,
      chain: chainKey,
      scope: opts.protestId ? 'protest' : 'meeting',
      createdAt: new Date().toISOString(),
    },
    { type: 'key', publicKey: bytesToBase64(new Uint8Array(key.spki)), fingerprint: key.fingerprint },
    ...records,
    ...checkpoints.map(
      (c) => ({ type: 'checkpoint', ...c, signedAt: (c.signedAt as Date).toISOString() }) as unknown as Checkpoint,
    ),
  ];
  const files: BundlePlan['files'] = [];
  const seen = new Set<string>();
  for (const r of records) {
    const ref = fileReference(r.row);
    if (!ref || seen.has(ref.objectKey)) continue;
    seen.add(ref.objectKey);
    files.push({ ...ref, contentType: String(r.row?.content_type ?? 'application/octet-stream') });
  }
  return { head: lines.map((l) => JSON.stringify(l) + '\n').join(''), files };
}

/**
 * The bundle's file lines, one file read (and held) at a time, so a meeting's photos never sit in memory together.
 * `readFile` answers null for a file storage does not have: it is left out, and the verifier then names the record
 * whose file is missing. Any other failure of storage (down, refusing) is thrown: a bundle must not pass a file
 * storage failed to send for a missing one, which in a protest's case file would read like tampering.
 */
export async function* bundleFileLines(
  files: BundlePlan['files'],
  readFile: (objectKey: string) => Promise<Buffer | null>,
): AsyncGenerator<string> {
  for (const f of files) {
    const bytes = await readFile(f.objectKey);
    if (!bytes) continue;
    const line: BundleLine = { type: 'file', ...f, base64: bytes.toString('base64') };
    yield JSON.stringify(line) + '\n';
  }
}

/** The whole bundle as one text (tests, and small chains): planBundle, then every file line. */
export async function buildBundle(
  client: Sql,
  chainKey: string,
  opts: { readFile: (objectKey: string) => Promise<Buffer | null>; protestId?: string },
): Promise<string> {
  const plan = await planBundle(client, chainKey, opts);
  let text = plan.head;
  for await (const line of bundleFileLines(plan.files, opts.readFile)) text += line;
  return text;
}

/** The first checkpoint that covers a chained row (the one signed at its publication), or null. */
export async function checkpointCovering(
  client: Sql,
  chainKey: string,
  table: string,
  rowId: string,
): Promise<Checkpoint | null> {
  const [c] = (
    await client.query(
      `select c.chain_key as chain, c.count::int as count, c.head, c.reason, c.signed_at as "signedAt",
              c.key_fingerprint as "keyFingerprint", c.signature
         from chain_links l
         join chain_checkpoints c on c.chain_key = l.chain_key and c.count >= l.seq
        where l.chain_key = $1 and l.table_name = $2 and l.row_id = $3
        order by c.id limit 1`,
      [checkChainKey(chainKey), table, rowId],
    )
  ).rows;
  return c
    ? ({ type: 'checkpoint', ...c, head: c.head as string, signedAt: (c.signedAt as Date).toISOString() } as Checkpoint)
    : null;
}

/**
 * End-of-day checkpoints: each meeting whose newest link was made on an earlier day than `now` (both in the
 * meeting's time zone) and that no checkpoint covers yet gets one. Returns the meetings signed.
 */
export async function signEndOfDayCheckpoints(client: Sql, keyDir: string, now = new Date()): Promise<string[]> {
  const { rows } = await client.query(
    `select e.id::text as "eventId", to_char((h.linked_at at time zone e.time_zone)::date, 'YYYY-MM-DD') as day
       from events e
       join lateral (select l.seq, l.linked_at from chain_links l where l.chain_key = e.id::text
                      order by l.seq desc limit 1) h on true
      where (h.linked_at at time zone e.time_zone)::date < ($1::timestamptz at time zone e.time_zone)::date
        and not exists (select 1 from chain_checkpoints c where c.chain_key = e.id::text and c.count >= h.seq)`,
    [now.toISOString()],
  );
  for (const r of rows) await signCheckpoint(client, r.eventId as string, `end of meeting day ${r.day}`, keyDir);
  return rows.map((r) => r.eventId as string);
}
