// The export bundle: one UTF-8 text file of JSON lines (".boreline-chain.jsonl"), each line one object
// with a `type`. Written by lib/server/chain/export-bundle.ts, read by verify-bundle.ts (CLI and the
// /verify page). Format version 1:
//   {"type":"bundle","version":1,"chain":"<meeting id or 'site'>","scope":"meeting"|"protest","createdAt":"…"}
//   {"type":"key","publicKey":"<SPKI DER, base64>","fingerprint":"<SHA-256 of the DER, hex>"}
//   {"type":"record","seq":1,"table":"…","rowId":"…","prevHash":"…","rowHash":"…","linkHash":"…","linkedAt":"…","row":{…}}
//       (a protest's case file gives the meeting's other records as {"type","seq","table":"withheld","rowId":"",
//        "prevHash","rowHash","linkHash"}: no row, table, id or time; their links still chain)
//   {"type":"checkpoint","chain":"…","count":N,"head":"<link_hash of seq N>","reason":"…","signedAt":"…",
//    "keyFingerprint":"…","signature":"<Ed25519 over JCS of the other fields but signature, base64>"}
//   {"type":"file","objectKey":"…","sha256":"…","contentType":"…","base64":"…"}
import { canonicalJson } from './canonical-json';

export const BUNDLE_VERSION = 1;

export type BundleHeader = {
  type: 'bundle';
  version: number;
  chain: string;
  scope: 'meeting' | 'protest';
  createdAt: string;
};
export type BundleKey = { type: 'key'; publicKey: string; fingerprint: string };
export type ChainRecord = {
  type: 'record';
  seq: number;
  table: string;
  rowId: string;
  prevHash: string;
  rowHash: string;
  linkHash: string;
  /** When it was linked; absent for a record withheld from a case file. */
  linkedAt?: string;
  /** The row as hashed; null when it was gone before it was linked; absent when withheld from a case file. */
  row?: Record<string, unknown> | null;
};
/** The table a case file names for another matter's record: only its place in the chain and its hashes are given. */
export const WITHHELD_TABLE = 'withheld';
export type CheckpointBody = {
  chain: string;
  count: number;
  head: string;
  reason: string;
  signedAt: string;
  keyFingerprint: string;
};
export type Checkpoint = CheckpointBody & { type: 'checkpoint'; signature: string };
export type BundleFile = { type: 'file'; objectKey: string; sha256: string; contentType: string; base64: string };
export type BundleLine = BundleHeader | BundleKey | ChainRecord | Checkpoint | BundleFile;

/** The exact bytes an Ed25519 checkpoint signature covers: JCS of the body (RFC 8785), UTF-8. */
export function checkpointMessage(body: CheckpointBody): Uint8Array<ArrayBuffer> {
  const { chain, count, head, reason, signedAt, keyFingerprint } = body;
  return new TextEncoder().encode(canonicalJson({ chain, count, head, keyFingerprint, reason, signedAt }));
}

/** Files a row refers to: a row with `object_key` and `sha256` (inspection photos, protest evidence). */
export function fileReference(
  row: Record<string, unknown> | null | undefined,
): { objectKey: string; sha256: string } | null {
  if (!row || typeof row.object_key !== 'string' || typeof row.sha256 !== 'string') return null;
  return { objectKey: row.object_key, sha256: row.sha256 };
}
