// The record chain (issue 24) through the real database and HTTP API: inspections recorded concurrently
// at one meeting while several linkers run at once are chained in one strict order with no fork; a
// meeting's export bundle verifies, and the same bundle with one byte of one record changed, one record
// removed, two records swapped, one file replaced or one checkpoint signed by another key is refused with
// the right record named; a row changed directly in PostgreSQL with its append-only trigger disabled (as a
// superuser could) is found by the self-check. Hash and signature definitions: FIPS 180-4 (SHA-256),
// RFC 8785 (canonical JSON), RFC 8032 (Ed25519); the tamper cases are the issue's own list.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import {
  createHash,
  createPrivateKey,
  createPublicKey,
  generateKeyPairSync,
  randomUUID,
  sign,
  verify,
} from 'node:crypto';
import { execFileSync } from 'node:child_process';
import pg from 'pg';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { InspectionMeeting, inspectionBody, rulesWith } from '../support/inspection-meeting';
import {
  buildBundle,
  bundleFileLines,
  planBundle,
  checkChain,
  linkChain,
  signCheckpoint,
  signEndOfDayCheckpoints,
} from '../../lib/server/chain/chain-db';
import { verifyBundle } from '../../lib/core/chain/verify-bundle';
import { checkpointMessage, type Checkpoint } from '../../lib/core/chain/bundle-format';

const meeting = new InspectionMeeting();
const scrutineer = new HttpSession();
// The app's key folder (scripts/test.sh makes a fresh one per run): publications through the API sign with
// the same meeting key as this test's checkpoints.
const keyDir = process.env.BORELINE_KEY_DIR ?? fs.mkdtempSync(path.join(os.tmpdir(), 'boreline-chain-keys-'));
const scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'boreline-chain-test-'));
const clients: pg.Client[] = [];
const files = new Map<string, Buffer>();
let bundle = '';

async function client(url = process.env.DATABASE_URL!): Promise<pg.Client> {
  const c = new pg.Client({ connectionString: url });
  await c.connect();
  clients.push(c);
  return c;
}

/** The superuser of the test cluster (scripts/pg.sh trusts loopback): what an insider with the database could do. */
function superuserUrl(): string {
  const u = new URL(process.env.DATABASE_URL!);
  u.username = 'postgres';
  u.password = '';
  return u.toString();
}

before(async () => {
  await meeting.create(`Chain Meeting ${Date.now()}`, [{ email: DEMO.scrutineer, role: 'scrutineer' }]);
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
});

after(async () => {
  for (const c of clients) await c.end();
  fs.rmSync(scratch, { recursive: true, force: true });
});

test('concurrent records at one meeting are chained in one strict order, with no fork', async () => {
  const classId = await meeting.addClass('CH', rulesWith());
  const entries = await Promise.all(Array.from({ length: 12 }, () => meeting.addEntry(classId)));
  const linkers = await Promise.all([client(), client(), client()]);
  let recording = true;
  // Three linkers drain the queue while 12 records arrive at once.
  const linking = linkers.map(async (c) => {
    while (recording) await linkChain(c, meeting.eventId);
  });
  const answers = await Promise.all(
    entries.map((e) => scrutineer.json(`/api/events/${meeting.eventId}/inspections`, inspectionBody(e.id, 101.5))),
  );
  for (const a of answers) assert.equal(a.res.status, 201, JSON.stringify(a.body));
  recording = false;
  await Promise.all(linking);
  await linkChain(linkers[0], meeting.eventId);

  const links = await query<{ seq: string; table_name: string; row_id: string; prev_hash: string; link_hash: string }>(
    'select seq, table_name, row_id, prev_hash, link_hash from chain_links where chain_key = $1 order by seq',
    [meeting.eventId],
  );
  const inspectionIds = answers.map((a) => a.body.data.id as string).sort();
  assert.deepEqual(
    links
      .filter((l) => l.table_name === 'inspections')
      .map((l) => l.row_id)
      .sort(),
    inspectionIds,
    'every record is linked once',
  );
  links.forEach((l, k) => {
    assert.equal(Number(l.seq), k + 1, 'seq 1, 2, 3 … with no gap');
    assert.equal(l.prev_hash, k === 0 ? '0'.repeat(64) : links[k - 1].link_hash, `link ${k + 1} builds on link ${k}`);
  });
  assert.equal(new Set(links.map((l) => l.prev_hash)).size, links.length, 'no two links share a predecessor');
  // Each link hash is SHA-256(prev_hash || row_hash) over the raw 32-byte values (FIPS 180-4), recomputed here.
  const [own] = await query<{ row_hash: string; prev_hash: string; link_hash: string }>(
    'select row_hash, prev_hash, link_hash from chain_links where chain_key = $1 and seq = 1',
    [meeting.eventId],
  );
  const recomputed = createHash('sha256')
    .update(Buffer.concat([Buffer.from(own.prev_hash, 'hex'), Buffer.from(own.row_hash, 'hex')]))
    .digest('hex');
  assert.equal(own.link_hash, recomputed);
  await assert.rejects(
    query('update chain_links set row_hash = $2 where chain_key = $1 and seq = 1', [meeting.eventId, '0'.repeat(64)]),
    /append-only/,
    'links are append-only',
  );
  const q = await query<{ n: string }>('select count(*) as n from chain_queue where chain_key = $1', [meeting.eventId]);
  assert.equal(Number(q[0].n), 0, 'the queue is drained');
});

test("a meeting's bundle verifies, with its files and a checkpoint signed by the meeting's key", async () => {
  const c = await client();
  // A protest's evidence photo: its row names the file's SHA-256 (the app stores it on upload).
  const entry = await meeting.addEntry(await meeting.addClass('EV', rulesWith()));
  const [{ id: lodger }] = await query<{ id: string }>('select id from users where email = $1', [DEMO.entrant]);
  const [{ id: protestId }] = await query<{ id: string }>(
    `insert into protests (event_id, lodged_by_id, against_entry_id, matter_key, rule_reference, grounds, status, fee_minor, currency, paid_at, window_deadline)
     values ($1, $2, $3, 'nozzle', 'CH 3.1', 'Nozzle looks oversized', 'lodged', 0, 'NZD', now(), now() + interval '1 hour') returning id`,
    [meeting.eventId, lodger, entry.id],
  );
  const photo = Buffer.from('a photo of a nozzle, stood in for by these bytes');
  const objectKey = `evidence/chain-test-${Date.now()}.jpg`;
  files.set(objectKey, photo);
  await query(
    `insert into protest_evidence (protest_id, added_by_id, kind, object_key, file_name, content_type, size_bytes, sha256)
     values ($1, $2, 'file', $3, 'nozzle.jpg', 'image/jpeg', $4, $5)`,
    [protestId, lodger, objectKey, photo.length, createHash('sha256').update(photo).digest('hex')],
  );
  const checkpoint = await signCheckpoint(c, meeting.eventId, 'test publication', keyDir);
  assert.ok(checkpoint.count >= 13);
  const keyFile = path.join(keyDir, `${meeting.eventId}.ed25519.pem`);
  assert.equal(fs.statSync(keyFile).mode & 0o777, 0o600, 'the private key file is readable by its owner only');
  const [stored] = await query<{ n: string }>(
    'select count(*) as n from chain_keys where chain_key = $1 and public_key_spki is not null',
    [meeting.eventId],
  );
  assert.equal(Number(stored.n), 1, 'the public key is in the database, the private key is not');

  // The meeting goes on while the bundle is built: a record queued after the checkpoint is linked by the
  // export but no signature covers it yet, so it waits for the next export (the verifier would refuse it).
  await query(
    `insert into audit_events (event_id, actor_id, subject_type, subject_id, action) values ($1, $2, 'entry', $3, 'entry.noted')`,
    [meeting.eventId, lodger, entry.id],
  );
  bundle = await buildBundle(c, meeting.eventId, { readFile: async (k) => files.get(k) ?? null });
  const result = await verifyBundle(bundle);
  assert.ok(result.ok, JSON.stringify(result));
  assert.equal(result.records, checkpoint.count);
  assert.equal(result.files, 1);
  // Each class's rules were published through the API (one checkpoint each), then this test's own.
  assert.deepEqual(
    result.checkpoints.map((c) => c.reason.replace(/ [A-Z]+ /, ' X ')),
    ['rules of X version 1 published', 'rules of X version 1 published', 'test publication'],
  );
  assert.equal(result.checkpoints.at(-1)!.count, checkpoint.count);

  // The files come after the records, read one at a time as the bundle is consumed (the app streams it): the
  // plan holds their names, not their bytes; the first file line costs one read, not all of them.
  const plan = await planBundle(c, meeting.eventId);
  assert.ok(plan.head.endsWith('\n') && !plan.head.includes('"type":"file"'), 'no file in the records part');
  assert.deepEqual(
    plan.files.map((f) => f.objectKey),
    [objectKey],
  );
  const reads: string[] = [];
  const lines = bundleFileLines(
    [...plan.files, { ...plan.files[0], objectKey: 'evidence/never-stored.jpg' }],
    async (k) => {
      reads.push(k);
      return files.get(k) ?? null;
    },
  );
  const first = await lines.next();
  assert.deepEqual(reads, [objectKey], 'one file read for the first file line');
  assert.equal(JSON.parse(first.value as string).base64, photo.toString('base64'));
  assert.equal((await lines.next()).done, true, 'a file storage does not have is left out');
  // Storage failing (not a missing file) stops the bundle: it must not look like a file removed from the record.
  const failing = bundleFileLines(plan.files, async () => {
    throw new Error('storage answered 503');
  });
  await assert.rejects(failing.next(), /storage answered 503/);
  const afterHeader = (text: string) => text.slice(text.indexOf('\n') + 1); // the header line carries its time
  assert.equal(afterHeader(plan.head + first.value), afterHeader(bundle), 'the same lines as the bundle in one piece');

  // The command-line verifier says the same, with exit code 0.
  const file = path.join(scratch, 'bundle.jsonl');
  fs.writeFileSync(file, bundle);
  const out = execFileSync('node_modules/.bin/tsx', ['scripts/verify-bundle.ts', file], { encoding: 'utf8' });
  assert.match(out, /^VERIFIED/);
  // With the key fingerprint printed on the meeting's pages: still verified; with another key's, refused (exit 1).
  const [{ key_fingerprint: published }] = await query<{ key_fingerprint: string }>(
    'select key_fingerprint from chain_checkpoints where chain_key = $1 limit 1',
    [meeting.eventId],
  );
  const withKey = execFileSync('node_modules/.bin/tsx', ['scripts/verify-bundle.ts', file, '--key', published], {
    encoding: 'utf8',
  });
  assert.match(withKey, /^VERIFIED[\s\S]*\(the published one\)/);
  let refusedStatus = 0;
  let refusedOut = '';
  try {
    execFileSync('node_modules/.bin/tsx', ['scripts/verify-bundle.ts', file, '--key', 'ab'.repeat(32)], {
      encoding: 'utf8',
    });
  } catch (err) {
    refusedStatus = (err as { status: number }).status;
    refusedOut = (err as { stdout: string }).stdout;
  }
  assert.equal(refusedStatus, 1);
  assert.match(refusedOut, /NOT VERIFIED \(key, line 1\): the bundle is signed with another key/);

  // A protest's case file: the protest's rows, every other record's link without its row; still verifies.
  const caseFile = await buildBundle(c, meeting.eventId, { readFile: async (k) => files.get(k) ?? null, protestId });
  const cased = await verifyBundle(caseFile);
  assert.ok(cased.ok, JSON.stringify(cased));
  const present = caseFile
    .trim()
    .split('\n')
    .map((l) => JSON.parse(l))
    .filter((l) => l.type === 'record' && l.row !== undefined)
    .map((l) => `${l.seq} ${l.table}`);
  assert.deepEqual(
    present.map((p: string) => p.split(' ')[1]),
    ['protest_evidence'],
    `only the evidence row: ${present}`,
  );
  assert.equal(cased.records - cased.withheld, 1);
  // Another matter's record gives only its place and hashes: no row, and no table, id or time that would show the
  // meeting's other protests and when they were made.
  const jsonLines = (text: string) =>
    text
      .trim()
      .split('\n')
      .map((l) => JSON.parse(l) as Record<string, unknown>);
  const withheld = jsonLines(caseFile).filter((l) => l.type === 'record' && l.row === undefined);
  assert.equal(withheld.length, cased.withheld);
  for (const l of withheld)
    assert.deepEqual(
      Object.keys(l).sort(),
      ['linkHash', 'prevHash', 'rowHash', 'rowId', 'seq', 'table', 'type'],
      JSON.stringify(l),
    );
  assert.deepEqual([...new Set(withheld.map((l) => `${l.table}|${l.rowId}`))], ['withheld|']);
  const withheldSeqs = new Set(withheld.map((l) => l.seq));
  const hiddenIds = jsonLines(bundle)
    .filter((l) => l.type === 'record' && withheldSeqs.has(l.seq))
    .map((l) => l.rowId as string)
    .filter((id) => /^[0-9a-f]{8}-[0-9a-f]{4}-/.test(id)); // uuids (a bigint id such as "7" is no test)
  assert.ok(hiddenIds.length > 0);
  for (const id of hiddenIds) assert.ok(!caseFile.includes(id), `another record's id ${id} is not in the case file`);
});

type Line = Record<string, unknown> & { type: string };
const parse = (text: string): Line[] =>
  text
    .trim()
    .split('\n')
    .map((l) => JSON.parse(l) as Line);
const unparse = (lines: Line[]) => lines.map((l) => JSON.stringify(l)).join('\n') + '\n';

async function refusal(text: string) {
  const r = await verifyBundle(text);
  assert.equal(r.ok, false, 'the tampered bundle must be refused');
  return (r as Extract<typeof r, { ok: false }>).problem;
}

test('a tampered bundle is refused, naming the record where it differs', async () => {
  const lines = parse(bundle);
  const records = lines.filter((l) => l.type === 'record');
  const k = 4; // the fifth record
  const target = records[k];

  // One byte of one record changed (in its row's text, as stored in the bundle).
  const lineText = bundle.trim().split('\n');
  const at = lines.indexOf(target);
  const original = lineText[at];
  const pos = original.indexOf('"results"') > 0 ? original.indexOf('"results"') + 2 : original.indexOf('"row"') + 10;
  const changed = original.slice(0, pos) + (original[pos] === 'x' ? 'y' : 'x') + original.slice(pos + 1);
  const oneByte = [...lineText];
  oneByte[at] = changed;
  let p = await refusal(oneByte.join('\n') + '\n');
  assert.equal(p.record?.seq, target.seq, p.message);
  assert.equal(p.record?.rowId, target.rowId);

  // One record removed: the record after the gap is named.
  p = await refusal(unparse(lines.filter((l) => l !== target)));
  assert.equal(p.kind, 'sequence');
  assert.equal(p.record?.seq, records[k + 1].seq, p.message);

  // Two records swapped: the one that now stands too early is named.
  const swapped = [...lines];
  swapped[at] = records[k + 1];
  swapped[at + 1] = target;
  p = await refusal(unparse(swapped));
  assert.equal(p.record?.seq, records[k + 1].seq, p.message);
  assert.equal(p.record?.rowId, records[k + 1].rowId);

  // A record altered and re-hashed with its row hash and link recomputed: every later link breaks.
  // (Covered by the row-hash check above; the link of the next record names the break otherwise.)

  // One file replaced: the record that names it is refused.
  const evidence = records.find((r) => r.table === 'protest_evidence')!;
  const replaced = lines.map((l) =>
    l.type === 'file' ? { ...l, base64: Buffer.from('another photo entirely').toString('base64') } : l,
  );
  p = await refusal(unparse(replaced));
  assert.equal(p.kind, 'file-hash');
  assert.equal(p.record?.rowId, evidence.rowId, p.message);

  // One checkpoint signed by another key (claiming the meeting's fingerprint).
  const other = generateKeyPairSync('ed25519').privateKey;
  const forged = lines.map((l) =>
    l.type === 'checkpoint'
      ? { ...l, signature: sign(null, checkpointMessage(l as unknown as Checkpoint), other).toString('base64') }
      : l,
  );
  p = await refusal(unparse(forged));
  assert.equal(p.kind, 'signature');
  const head = lines.find((l) => l.type === 'checkpoint')!;
  assert.equal(p.record?.seq, head.count, p.message);

  // The command line exits non-zero and names the record.
  const file = path.join(scratch, 'forged.jsonl');
  fs.writeFileSync(file, unparse(replaced));
  let status = 0;
  let stdout = '';
  try {
    execFileSync('node_modules/.bin/tsx', ['scripts/verify-bundle.ts', file], { encoding: 'utf8' });
  } catch (err) {
    status = (err as { status: number }).status;
    stdout = (err as { stdout: string }).stdout;
  }
  assert.equal(status, 1);
  assert.match(stdout, new RegExp(`protest_evidence ${evidence.rowId}`));

  // The meeting's bundle with its checkpoints left out (the one thing a forger cannot remake) is refused even
  // though its key line is the meeting's own and matches the published fingerprint.
  const [{ key_fingerprint: published }] = await query<{ key_fingerprint: string }>(
    'select key_fingerprint from chain_checkpoints where chain_key = $1 limit 1',
    [meeting.eventId],
  );
  const unsigned = path.join(scratch, 'unsigned.jsonl');
  fs.writeFileSync(unsigned, unparse(lines.filter((l) => l.type !== 'checkpoint')));
  status = 0;
  stdout = '';
  try {
    execFileSync('node_modules/.bin/tsx', ['scripts/verify-bundle.ts', unsigned, '--key', published], {
      encoding: 'utf8',
    });
  } catch (err) {
    status = (err as { status: number }).status;
    stdout = (err as { stdout: string }).stdout;
  }
  assert.equal(status, 1, stdout);
  assert.match(stdout, /NOT VERIFIED \(unsigned, line 1\): the bundle carries no signed checkpoint/);
});

test('a row changed directly in PostgreSQL, behind a disabled trigger, is found by the self-check', async () => {
  const c = await client();
  const before = await checkChain(c, meeting.eventId);
  assert.equal(before.problem, null, JSON.stringify(before.problem));
  const [victim] = await query<{ seq: string; row_id: string }>(
    "select seq, row_id from chain_links where chain_key = $1 and table_name = 'inspections' order by seq offset 3 limit 1",
    [meeting.eventId],
  );
  const su = await client(superuserUrl());
  await su.query('begin');
  await su.query('alter table inspections disable trigger inspections_append_only');
  await su.query(`update inspections set overall_result = 'conforms', notes = 'changed quietly' where id = $1`, [
    victim.row_id,
  ]);
  await su.query('alter table inspections enable trigger inspections_append_only');
  await su.query('commit');

  const afterCheck = await checkChain(c, meeting.eventId);
  assert.ok(afterCheck.problem, 'the self-check finds the change');
  assert.equal(afterCheck.problem!.kind, 'row-hash');
  assert.equal(afterCheck.problem!.record?.seq, Number(victim.seq));
  assert.equal(afterCheck.problem!.record?.rowId, victim.row_id);
});

test("the meeting's bundle over HTTP verifies; the administrator's self-check names the break, on the admin page and in the metrics", async () => {
  const organiser = meeting.organiser;
  const res = await organiser.fetch(`/api/events/${meeting.eventId}/chain/bundle`);
  assert.equal(res.status, 200);
  assert.match(res.headers.get('content-disposition') ?? '', /attachment; filename="boreline-chain-/);
  const text = await res.text();
  const result = await verifyBundle(text);
  // The row changed behind the trigger's back (previous test) is what the bundle now carries: refused.
  assert.equal(result.ok, false);
  assert.equal((result as Extract<typeof result, { ok: false }>).problem.kind, 'row-hash');

  const entrant = new HttpSession();
  await entrant.signInWithPassword(DEMO.entrant, DEMO_PASSWORD);
  assert.equal((await entrant.fetch(`/api/events/${meeting.eventId}/chain/bundle`)).status, 403);
  assert.equal(
    (await scrutineer.fetch(`/api/events/${meeting.eventId}/chain/bundle`)).status,
    403,
    "the meeting's scrutineer may not read its audit trail or protest evidence, so not its bundle",
  );
  assert.equal(
    (await entrant.json('/api/admin/chain/check', {})).res.status,
    403,
    'the self-check is for the site administrator',
  );

  const admin = new HttpSession();
  await admin.signInWithPassword(DEMO.admin, DEMO_PASSWORD);
  const check = await admin.json('/api/admin/chain/check', {});
  assert.equal(check.res.status, 200, JSON.stringify(check.body));
  const broken = check.body.data.broken.find((b: { chain: string }) => b.chain === meeting.eventId);
  assert.ok(broken, 'the meeting is named as broken');
  assert.equal(broken.problem.kind, 'row-hash');
  assert.equal(broken.problem.record.table, 'inspections');
  const metrics = await (await admin.fetch('/api/metrics')).text();
  const gauge = /^boreline_chain_broken (\d+)$/m.exec(metrics);
  assert.ok(gauge && Number(gauge[1]) >= 1, 'the metrics raise the alert');
  const page = await (await admin.fetch('/admin')).text();
  assert.match(page, /A record chain is broken/);
  assert.ok(page.includes(meeting.eventId), 'the admin page names the chain');
});

test("a meeting day's end is signed once, dated in the meeting's time zone, and not before the day ends", async () => {
  const c = await client();
  const entry = await meeting.addEntry(await meeting.addClass('ED', rulesWith()));
  const rec = await scrutineer.json(`/api/events/${meeting.eventId}/inspections`, inspectionBody(entry.id, 101.4));
  assert.equal(rec.res.status, 201, JSON.stringify(rec.body));
  await linkChain(c, meeting.eventId);
  const [head] = await query<{ linked_at: Date }>(
    'select linked_at from chain_links where chain_key = $1 order by seq desc limit 1',
    [meeting.eventId],
  );
  assert.ok(
    !(await signEndOfDayCheckpoints(c, keyDir, head.linked_at)).includes(meeting.eventId),
    'the day is not over',
  );
  const nextDay = new Date(head.linked_at.getTime() + 36 * 3600 * 1000);
  await signEndOfDayCheckpoints(c, keyDir, nextDay);
  await signEndOfDayCheckpoints(c, keyDir, nextDay);
  // The meeting runs in Pacific/Auckland (tests/support/inspection-meeting.ts): the day is its local date.
  // (Counted by reason, not by what each call returns: the app's own worker may sign it first at local midnight.)
  const localDay = new Intl.DateTimeFormat('en-CA', { timeZone: 'Pacific/Auckland' }).format(head.linked_at);
  const signed = await query<{ count: string }>(
    'select count from chain_checkpoints where chain_key = $1 and reason = $2',
    [meeting.eventId, `end of meeting day ${localDay}`],
  );
  assert.equal(signed.length, 1, 'signed once');
  const [{ n }] = await query<{ n: string }>('select count(*) as n from chain_links where chain_key = $1', [
    meeting.eventId,
  ]);
  assert.equal(Number(signed[0].count), Number(n), 'it covers the whole chain');
});

test('a key file is never written over: with no public key in the database it is the chain key again; a damaged one is kept aside', async () => {
  const c = await client();
  // After a database restore (or a demo reset) that kept the key folder: chain_keys has no row for the chain, the
  // folder has the meeting's key. Its checkpoints must still verify with that key, so it is taken up, not replaced.
  const restored = randomUUID();
  const kept = generateKeyPairSync('ed25519');
  const keptFile = path.join(keyDir, `${restored}.ed25519.pem`);
  const pem = kept.privateKey.export({ format: 'pem', type: 'pkcs8' }) as string;
  fs.writeFileSync(keptFile, pem, { mode: 0o600 });
  const checkpoint = await signCheckpoint(c, restored, 'after a restore', keyDir);
  assert.equal(fs.readFileSync(keptFile, 'utf8'), pem, 'the key file is unchanged');
  const [row] = await query<{ spki: Buffer }>('select public_key_spki as spki from chain_keys where chain_key = $1', [
    restored,
  ]);
  assert.ok(
    row.spki.equals(kept.publicKey.export({ format: 'der', type: 'spki' })),
    'the stored public key is its key',
  );
  // Ed25519 (RFC 8032) through node:crypto: the new checkpoint verifies with the kept key.
  assert.ok(
    verify(null, checkpointMessage(checkpoint), kept.publicKey, Buffer.from(checkpoint.signature, 'base64')),
    'the checkpoint is signed by the kept key',
  );

  // A file that holds no usable key (cut short, or another kind of key) is moved aside, never deleted.
  const damaged = randomUUID();
  const damagedFile = path.join(keyDir, `${damaged}.ed25519.pem`);
  fs.writeFileSync(damagedFile, pem.slice(0, 40), { mode: 0o600 });
  await signCheckpoint(c, damaged, 'after a damaged key file', keyDir);
  const aside = fs.readdirSync(keyDir).filter((f) => f.startsWith(`${damaged}.ed25519.pem.unusable-`));
  assert.equal(aside.length, 1, 'the damaged file is kept under another name');
  assert.equal(fs.readFileSync(path.join(keyDir, aside[0]), 'utf8'), pem.slice(0, 40));
  const made = createPublicKey(createPrivateKey(fs.readFileSync(damagedFile, 'utf8'))).export({
    format: 'der',
    type: 'spki',
  });
  const [made2] = await query<{ spki: Buffer }>('select public_key_spki as spki from chain_keys where chain_key = $1', [
    damaged,
  ]);
  assert.ok(made2.spki.equals(made), 'a new key was made, and its public key stored');
});
