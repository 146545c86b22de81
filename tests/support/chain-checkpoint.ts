// The signed checkpoint that covers one chained row, read straight from the database, and its signature
// checked with Node's crypto: Ed25519 (RFC 8032) over the RFC 8785 canonical JSON of the checkpoint's fields
// (keys in code-point order, so JSON.stringify of this literal is already canonical).
import { createPublicKey, verify } from 'node:crypto';
import { query } from './db';

export type StoredCheckpoint = {
  count: string;
  head: string;
  signature: string;
  key_fingerprint: string;
  spki: Buffer;
  signed_at: Date;
  reason: string;
};

export async function checkpointCovering(
  chainKey: string,
  table: string,
  rowId: string,
): Promise<StoredCheckpoint | undefined> {
  const [cp] = await query<StoredCheckpoint>(
    `select c.count, c.head, c.signature, c.key_fingerprint, k.public_key_spki as spki, c.signed_at, c.reason
       from chain_links l
       join chain_checkpoints c on c.chain_key = l.chain_key and c.count >= l.seq
       join chain_keys k on k.fingerprint = c.key_fingerprint
      where l.chain_key = $1 and l.table_name = $2 and l.row_id = $3
      order by c.id limit 1`,
    [chainKey, table, rowId],
  );
  return cp;
}

export function checkpointSignatureHolds(chainKey: string, cp: StoredCheckpoint): boolean {
  const message = Buffer.from(
    JSON.stringify({
      chain: chainKey,
      count: Number(cp.count),
      head: cp.head,
      keyFingerprint: cp.key_fingerprint,
      reason: cp.reason,
      signedAt: cp.signed_at.toISOString(),
    }),
  );
  return verify(
    null,
    message,
    createPublicKey({ key: cp.spki, format: 'der', type: 'spki' }),
    Buffer.from(cp.signature, 'base64'),
  );
}
