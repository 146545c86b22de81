// The offline verifier on a bundle made here from invented rows (tests/support/chain-bundle.ts, hashed
// with node:crypto's SHA-256 per FIPS 180-4, RFC 8785 canonical JSON, Ed25519 per RFC 8032): it verifies,
// and each tampering the issue lists is refused with the record named, plus a record rewritten with its
// own hashes recomputed (the next record's link then names the break) and a malformed file.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { generateKeyPairSync } from 'node:crypto';
import { createHash } from 'node:crypto';
import { verifyBundle } from '../../../../lib/core/chain/verify-bundle';
import { canonicalJson } from '../../../../lib/core/chain/canonical-json';
import { bundleText, makeBundle, type Line } from '../../../support/chain-bundle';

async function problem(lines: Line[] | string) {
  const r = await verifyBundle(typeof lines === 'string' ? lines : bundleText(lines));
  assert.equal(r.ok, false);
  return (r as Extract<typeof r, { ok: false }>).problem;
}
const recordAt = (lines: Line[], seq: number) => lines.findIndex((l) => l.type === 'record' && l.seq === seq);

test('an untouched bundle verifies: records, the file, the checkpoint', async () => {
  const r = await verifyBundle(bundleText(makeBundle().lines));
  assert.ok(r.ok, JSON.stringify(r));
  assert.equal(r.records, 6);
  assert.equal(r.files, 1);
  assert.equal(r.checkpoints[0].count, 6);
});

test('one changed, one removed, two swapped, a file replaced, a foreign signature: each names its record', async () => {
  const { lines } = makeBundle();
  const changed = structuredClone(lines);
  (changed[recordAt(changed, 4)].row as Record<string, unknown>).overall_result = 'conformz';
  let p = await problem(changed);
  assert.deepEqual([p.kind, p.record?.seq], ['row-hash', 4]);

  p = await problem(lines.filter((_, k) => k !== recordAt(lines, 2)));
  assert.deepEqual([p.kind, p.record?.seq], ['sequence', 3]);

  const swapped = [...lines];
  [swapped[recordAt(lines, 5)], swapped[recordAt(lines, 6)]] = [lines[recordAt(lines, 6)], lines[recordAt(lines, 5)]];
  p = await problem(swapped);
  assert.equal(p.record?.seq, 6);

  const replaced = lines.map((l) =>
    l.type === 'file' ? { ...l, base64: Buffer.from('other').toString('base64') } : l,
  );
  p = await problem(replaced);
  assert.deepEqual([p.kind, p.record?.seq, p.record?.table], ['file-hash', 3, 'inspection_photos']);

  const missing = lines.filter((l) => l.type !== 'file');
  p = await problem(missing);
  assert.deepEqual([p.kind, p.record?.seq], ['file-missing', 3]);

  const foreign = makeBundle({ signWith: generateKeyPairSync('ed25519').privateKey }).lines;
  p = await problem(foreign);
  assert.deepEqual([p.kind, p.record?.seq], ['signature', 6]);
});

test('a record rewritten with its own hashes recomputed breaks the link of the record after it', async () => {
  const { lines } = makeBundle();
  const k = recordAt(lines, 2);
  const r = structuredClone(lines[k]);
  (r.row as Record<string, unknown>).overall_result = 'does_not_conform';
  r.rowHash = createHash('sha256')
    .update(canonicalJson({ row: r.row, table: r.table }))
    .digest('hex');
  r.linkHash = createHash('sha256')
    .update(Buffer.concat([Buffer.from(String(r.prevHash), 'hex'), Buffer.from(String(r.rowHash), 'hex')]))
    .digest('hex');
  const forged = [...lines];
  forged[k] = r;
  const p = await problem(forged);
  assert.deepEqual([p.kind, p.record?.seq], ['previous-link', 3]);
});

test('malformed input is a format problem, never an exception', async () => {
  for (const bad of ['', 'not json\n', '{"type":"bundle","version":9}\n', '{"type":"record"}\n', '[1]\n'])
    assert.equal((await problem(bad)).kind, 'format', bad);
});

test('with the published key fingerprint, a bundle re-signed whole with another key is refused; the genuine one passes', async () => {
  const genuine = makeBundle().lines;
  const keyLine = genuine.find((l) => l.type === 'key') as unknown as { fingerprint: string };
  const published = keyLine.fingerprint;
  // A forger rebuilds the whole bundle (every hash recomputed) and signs it with a key of their own: on its own
  // the bundle is consistent, which is why the published fingerprint must be compared.
  const forged = makeBundle().lines;
  assert.equal((await verifyBundle(bundleText(forged))).ok, true, 'consistent with its own key');
  const r = await verifyBundle(bundleText(forged), { expectedFingerprint: published });
  assert.equal(r.ok, false);
  const p = (r as Extract<typeof r, { ok: false }>).problem;
  assert.equal(p.kind, 'key');
  assert.match(p.message, /another key/);
  // The genuine bundle passes, with the fingerprint typed as printed, in capitals or with colons.
  const typed = published.toUpperCase().match(/.{2}/g)!.join(':');
  const ok = await verifyBundle(bundleText(genuine), { expectedFingerprint: typed });
  assert.ok(ok.ok, JSON.stringify(ok));
  // A fingerprint of separators only, or cut short, is no fingerprint: refused rather than taken as checked.
  for (const bad of [':'.repeat(64), published.slice(0, 63)]) {
    const r2 = await verifyBundle(bundleText(forged), { expectedFingerprint: bad });
    assert.equal(r2.ok, false, bad);
    assert.equal((r2 as Extract<typeof r2, { ok: false }>).problem.kind, 'key');
  }
});

test('records no signed checkpoint covers are refused: checkpoints stripped, or invented records added after the last', async () => {
  const { lines } = makeBundle();
  const published = (lines.find((l) => l.type === 'key') as unknown as { fingerprint: string }).fingerprint;
  // A forger keeps the genuine key line (so the published fingerprint matches), rewrites record 2, recomputes
  // every hash and link after it (anyone can: SHA-256 needs no key) and leaves out the checkpoint they cannot sign.
  const forged = structuredClone(lines).filter((l) => l.type !== 'checkpoint');
  let prev = '0'.repeat(64);
  for (const r of forged.filter((l) => l.type === 'record')) {
    if (r.seq === 2) (r.row as Record<string, unknown>).overall_result = 'does_not_conform';
    r.prevHash = prev;
    r.rowHash = createHash('sha256')
      .update(canonicalJson({ row: r.row, table: r.table }))
      .digest('hex');
    r.linkHash = createHash('sha256')
      .update(Buffer.concat([Buffer.from(prev, 'hex'), Buffer.from(String(r.rowHash), 'hex')]))
      .digest('hex');
    prev = String(r.linkHash);
  }
  const r = await verifyBundle(bundleText(forged), { expectedFingerprint: published });
  assert.equal(r.ok, false, 'a bundle with no signature must not verify against the published key');
  assert.equal((r as Extract<typeof r, { ok: false }>).problem.kind, 'unsigned');

  // The genuine bundle with a record added after the checkpoint (hashed and linked correctly): the first
  // record the signature does not cover is named.
  const last = lines.filter((l) => l.type === 'record').at(-1)!;
  const row = { id: 'insp-7', overall_result: 'conforms', measurements: { nozzleMm: [99.1] } };
  const rowHash = createHash('sha256')
    .update(canonicalJson({ row, table: 'inspections' }))
    .digest('hex');
  const linkHash = createHash('sha256')
    .update(Buffer.concat([Buffer.from(String(last.linkHash), 'hex'), Buffer.from(rowHash, 'hex')]))
    .digest('hex');
  const added = [...lines];
  added.splice(recordAt(lines, 6) + 1, 0, {
    type: 'record',
    seq: 7,
    table: 'inspections',
    rowId: 'insp-7',
    prevHash: last.linkHash,
    rowHash,
    linkHash,
    linkedAt: '2027-05-01T09:40:00.000Z',
    row,
  });
  const p = await problem(added);
  assert.deepEqual([p.kind, p.record?.seq], ['unsigned', 7]);
  assert.match(p.message, /not covered by any signed checkpoint/);
});

test("a meeting with nothing chained yet: its export's checkpoint of zero records (the genesis hash) verifies", async () => {
  const r = await verifyBundle(bundleText(makeBundle({ rows: 0 }).lines));
  assert.ok(r.ok, JSON.stringify(r));
  assert.equal(r.records, 0);
});
