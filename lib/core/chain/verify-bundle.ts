// Verifies an export bundle (bundle-format.ts) offline: recomputes every row hash and link, every
// referenced file's SHA-256, every checkpoint's Ed25519 signature, and answers with the first place
// where anything differs, naming the record (seq, table, row id). Used by `npm run verify` and /verify.
import { base64ToBytes, GENESIS_HASH, keyFingerprint, linkHash, rowHash, sha256Hex, verifyEd25519 } from './hashes';
import {
  BUNDLE_VERSION,
  checkpointMessage,
  fileReference,
  WITHHELD_TABLE,
  type BundleFile,
  type BundleHeader,
  type BundleKey,
  type ChainRecord,
  type Checkpoint,
} from './bundle-format';

export type ChainProblem = {
  /** What differs. */
  kind:
    | 'format'
    | 'sequence'
    | 'previous-link'
    | 'row-hash'
    | 'link-hash'
    | 'file-missing'
    | 'file-hash'
    | 'key'
    | 'checkpoint-head'
    | 'signature'
    | 'unsigned';
  /** 1-based line of the bundle. */
  line: number;
  /** The record named (for a checkpoint: the record at its head). */
  record?: { seq: number; table: string; rowId: string };
  message: string;
};

export type VerifyResult =
  | {
      ok: true;
      chain: string;
      records: number;
      withheld: number;
      files: number;
      checkpoints: Array<{ count: number; head: string; reason: string; signedAt: string }>;
      fingerprint: string;
    }
  | { ok: false; problem: ChainProblem };

const HEX64 = /^[0-9a-f]{64}$/;

function describe(r: ChainRecord): string {
  return r.table === WITHHELD_TABLE && r.row === undefined
    ? `record ${r.seq} (withheld)`
    : `record ${r.seq} (${r.table} ${r.rowId})`;
}

/**
 * Verifies the text of a bundle. Never throws for bad input: a malformed bundle is a `format` problem.
 * A bundle carries its own public key, so on its own it proves only that it is consistent with that key: someone
 * who rewrites the records can sign them again with a key of their own. `expectedFingerprint` (the key
 * fingerprint printed on the meeting's published pages and PDFs) closes that: a bundle whose key is another is
 * refused as a `key` problem. Every record must stand under a signed checkpoint (`unsigned` otherwise): hashes
 * and links anyone can recompute, so records no signature covers prove nothing.
 */
export async function verifyBundle(
  text: string,
  opts: { expectedFingerprint?: string | null } = {},
): Promise<VerifyResult> {
  const lines = text.split('\n').filter((l, k, all) => l.trim() !== '' || k < all.length - 1);
  let header: BundleHeader | undefined;
  let key: BundleKey | undefined;
  const records: Array<{ line: number; r: ChainRecord }> = [];
  const checkpoints: Array<{ line: number; c: Checkpoint }> = [];
  const files = new Map<string, { line: number; f: BundleFile }>();
  for (let k = 0; k < lines.length; k++) {
    const line = k + 1;
    let obj: { type?: unknown } & Record<string, unknown>;
    try {
      obj = JSON.parse(lines[k]);
    } catch {
      return fail('format', line, `line ${line} is not JSON`);
    }
    if (!obj || typeof obj !== 'object') return fail('format', line, `line ${line} is not a JSON object`);
    if (obj.type === 'bundle') header = obj as unknown as BundleHeader;
    else if (obj.type === 'key') key = obj as unknown as BundleKey;
    else if (obj.type === 'record') {
      const r = obj as unknown as ChainRecord;
      if (
        !Number.isInteger(r.seq) ||
        typeof r.table !== 'string' ||
        typeof r.rowId !== 'string' ||
        ![r.prevHash, r.rowHash, r.linkHash].every((h) => typeof h === 'string' && HEX64.test(h)) ||
        (r.row !== undefined && typeof r.row !== 'object')
      )
        return fail('format', line, `line ${line}: a record needs seq, table, rowId and three SHA-256 hashes`);
      records.push({ line, r });
    } else if (obj.type === 'checkpoint') checkpoints.push({ line, c: obj as unknown as Checkpoint });
    else if (obj.type === 'file') {
      const f = obj as unknown as BundleFile;
      if (typeof f.objectKey !== 'string' || typeof f.base64 !== 'string')
        return fail('format', line, `line ${line}: a file needs objectKey and base64`);
      files.set(f.objectKey, { line, f });
    } else return fail('format', line, `line ${line} has an unknown type`);
  }
  if (!header || header.version !== BUNDLE_VERSION)
    return fail('format', 1, `not a Boreline chain bundle of version ${BUNDLE_VERSION}`);
  if (!key || typeof key.publicKey !== 'string') return fail('format', 1, 'the bundle carries no public key');

  let spki: Uint8Array<ArrayBuffer>;
  try {
    spki = base64ToBytes(key.publicKey);
  } catch {
    return fail('key', 1, 'the public key is not base64');
  }
  const fingerprint = await keyFingerprint(spki);
  if (fingerprint !== key.fingerprint) return fail('key', 1, 'the public key does not match its fingerprint');
  // A fingerprint given but empty once its separators are gone (" ", ":::") must not pass as "checked".
  const given = opts.expectedFingerprint?.trim() ?? '';
  const expected = given.toLowerCase().replace(/[\s:]/g, '');
  if (given && !HEX64.test(expected))
    return fail('key', 1, `the published fingerprint given (${given}) is not 64 hexadecimal digits (a SHA-256)`);
  if (given && expected !== fingerprint)
    return fail(
      'key',
      1,
      `the bundle is signed with another key (fingerprint ${fingerprint}) than the published one (${expected})`,
    );

  const chain = await verifyRecords(records, (objectKey) => files.get(objectKey));
  if (!chain.ok) return chain;

  for (const { line, c } of checkpoints) {
    const head = Number.isInteger(c.count) && c.count > 0 ? records[c.count - 1]?.r : undefined;
    const named = head ? { seq: head.seq, table: head.table, rowId: head.rowId } : undefined;
    // A checkpoint of an empty chain (count 0) signs the genesis hash: a meeting with nothing chained yet.
    const matches = c.count === 0 ? c.head === GENESIS_HASH : !!head && head.linkHash === c.head;
    if (c.chain !== header.chain || !matches)
      return fail(
        'checkpoint-head',
        line,
        `the checkpoint of ${c.signedAt} (${c.count} records) does not match the chain${head ? ` at ${describe(head)}` : ''}`,
        named,
      );
    let ok = false;
    try {
      ok =
        c.keyFingerprint === fingerprint &&
        (await verifyEd25519(spki, checkpointMessage(c), base64ToBytes(c.signature)));
    } catch {
      ok = false;
    }
    if (!ok)
      return fail(
        'signature',
        line,
        `the signature of the checkpoint of ${c.signedAt} at ${head ? describe(head) : 'the start of the chain'} is not the meeting key's`,
        named,
      );
  }

  // Only a signature binds the records to the meeting's key: hashes and links anyone can recompute. So every
  // record must stand under a signed checkpoint (an export signs one at its head first). Without this, a
  // bundle stripped of its checkpoints, or with invented records added after the last one, would verify
  // even against the published fingerprint.
  const signed = checkpoints.reduce((n, { c }) => Math.max(n, c.count), -1);
  if (signed < 0)
    return fail(
      'unsigned',
      1,
      'the bundle carries no signed checkpoint, so nothing in it is signed by the meeting key',
    );
  if (signed < records.length) {
    const { line, r } = records[signed];
    return fail(
      'unsigned',
      line,
      `${describe(r)} and every record after it (${records.length - signed} in all) are not covered by any signed checkpoint`,
      { seq: r.seq, table: r.table, rowId: r.rowId },
    );
  }

  return {
    ok: true,
    chain: header.chain,
    records: records.length,
    withheld: chain.withheld,
    files: chain.files,
    checkpoints: checkpoints.map(({ c }) => ({ count: c.count, head: c.head, reason: c.reason, signedAt: c.signedAt })),
    fingerprint,
  };
}

/**
 * The chain itself: strict order from seq 1, each link on the one before it, each row's hash, each
 * referenced file's SHA-256. `line` names where a record came from (a bundle line; the live check uses seq).
 */
export async function verifyRecords(
  records: Array<{ line: number; r: ChainRecord }>,
  /** Where a referenced file is; null skips the file check (the live self-check reads no files). */
  fileOf: ((objectKey: string) => { line: number; f: Pick<BundleFile, 'base64'> } | undefined) | null,
): Promise<{ ok: true; withheld: number; files: number } | { ok: false; problem: ChainProblem }> {
  let prev = GENESIS_HASH;
  let withheld = 0;
  let fileCount = 0;
  for (let k = 0; k < records.length; k++) {
    const { line, r } = records[k];
    const named = { seq: r.seq, table: r.table, rowId: r.rowId };
    if (r.seq !== k + 1)
      return fail(
        'sequence',
        line,
        `${describe(r)} stands where record ${k + 1} should be: a record is missing or out of order here`,
        named,
      );
    if (r.prevHash !== prev)
      return fail('previous-link', line, `${describe(r)} does not link to the record before it`, named);
    if (r.row === undefined) withheld++;
    else if ((await rowHash(r.table, r.row)) !== r.rowHash)
      return fail('row-hash', line, `${describe(r)} differs from what was chained (its row hash)`, named);
    if ((await linkHash(r.prevHash, r.rowHash)) !== r.linkHash)
      return fail('link-hash', line, `${describe(r)} has a link hash that is not its own`, named);
    const ref = fileReference(r.row);
    if (ref && fileOf) {
      const file = fileOf(ref.objectKey);
      if (!file) return fail('file-missing', line, `${describe(r)} names a file the bundle lacks`, named);
      let bytes: Uint8Array<ArrayBuffer>;
      try {
        bytes = base64ToBytes(file.f.base64);
      } catch {
        return fail('file-hash', file.line, `the file of ${describe(r)} is not base64`, named);
      }
      if ((await sha256Hex(bytes)) !== ref.sha256)
        return fail('file-hash', file.line, `the file of ${describe(r)} is not the one recorded (SHA-256)`, named);
      fileCount++;
    }
    prev = r.linkHash;
  }

  return { ok: true, withheld, files: fileCount };
}

function fail(
  kind: ChainProblem['kind'],
  line: number,
  message: string,
  record?: ChainProblem['record'],
): { ok: false; problem: ChainProblem } {
  return { ok: false, problem: { kind, line, message, ...(record ? { record } : {}) } };
}
