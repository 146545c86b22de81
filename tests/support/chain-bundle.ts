// A small export bundle made in the test from invented rows, chained and signed by the definitions in
// DEVELOPERS.md ("The record chain"): SHA-256 (FIPS 180-4, via node:crypto here, independent of the app's
// WebCrypto code), RFC 8785 canonical JSON, Ed25519 (RFC 8032) through node:crypto.
import { createHash, generateKeyPairSync, sign, type KeyObject } from 'node:crypto';
import { canonicalJson } from '../../lib/core/chain/canonical-json';

const sha = (b: Buffer | string) => createHash('sha256').update(b).digest('hex');

export type Line = Record<string, unknown> & { type: string };

export function makeBundle(opts: { rows?: number; signWith?: KeyObject } = {}): {
  lines: Line[];
  privateKey: KeyObject;
} {
  const { privateKey, publicKey } = generateKeyPairSync('ed25519');
  const spki = publicKey.export({ format: 'der', type: 'spki' });
  const fingerprint = sha(spki);
  const chain = '11111111-2222-4333-8444-555555555555';
  const photo = Buffer.from('invented photo bytes');
  const lines: Line[] = [
    { type: 'bundle', version: 1, chain, scope: 'meeting', createdAt: '2027-05-01T10:00:00.000Z' },
    { type: 'key', publicKey: spki.toString('base64'), fingerprint },
  ];
  let prev = '0'.repeat(64);
  const n = opts.rows ?? 6;
  for (let seq = 1; seq <= n; seq++) {
    const table = seq === 3 ? 'inspection_photos' : 'inspections';
    const row: Record<string, unknown> =
      table === 'inspection_photos'
        ? { id: `photo-${seq}`, object_key: 'photos/p3.jpg', sha256: sha(photo), size_bytes: photo.length }
        : { id: `insp-${seq}`, overall_result: 'conforms', measurements: { nozzleMm: [101.2 + seq / 100] } };
    const rowHash = sha(canonicalJson({ row, table }));
    const linkHash = createHash('sha256')
      .update(Buffer.concat([Buffer.from(prev, 'hex'), Buffer.from(rowHash, 'hex')]))
      .digest('hex');
    lines.push({
      type: 'record',
      seq,
      table,
      rowId: String(row.id),
      prevHash: prev,
      rowHash,
      linkHash,
      linkedAt: '2027-05-01T09:00:00.000Z',
      row,
    });
    prev = linkHash;
  }
  const body = {
    chain,
    count: n,
    head: prev,
    keyFingerprint: fingerprint,
    reason: 'test',
    signedAt: '2027-05-01T09:30:00.000Z',
  };
  const signature = sign(null, Buffer.from(canonicalJson(body)), opts.signWith ?? privateKey).toString('base64');
  lines.push({ type: 'checkpoint', ...body, signature });
  lines.push({
    type: 'file',
    objectKey: 'photos/p3.jpg',
    sha256: sha(photo),
    contentType: 'image/jpeg',
    base64: photo.toString('base64'),
  });
  return { lines, privateKey };
}

export const bundleText = (lines: Line[]) => lines.map((l) => JSON.stringify(l)).join('\n') + '\n';
