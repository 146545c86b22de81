// Boats, documents, tags and entries through the real HTTP API and the real database: an entrant
// sees and changes only their own boats, bad input stores nothing, uploads are checked by content,
// entries follow the meeting's state and race numbers never collide.
// Runs alone (scripts/test.sh): it counts whole tables (nothing stored on refusal) and enters boats at the demo
// meeting.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { PDFDocument, StandardFonts } from 'pdf-lib';
import { HttpSession } from '../support/http-session';
import { BASE_URL, DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { query } from '../support/db';
import { DEFAULT_CLASS_RULES } from '../../lib/core/inputs/class-rules';

// Test-owned meetings (fixed ids; the demo club organises them). The demo meeting itself is never altered.
const CLUB = '0b0e0000-0000-4000-8000-000000000001';
const CLOSING_EVENT = '7e570000-0000-4000-8000-000000000101';
const CLOSING_CLASS = '7e570000-0000-4000-8000-000000000201';
const DRAFT_EVENT = '7e570000-0000-4000-8000-000000000102';
const DRAFT_CLASS = '7e570000-0000-4000-8000-000000000202';
const RULES = {
  ...DEFAULT_CLASS_RULES,
  nozzle: { ...DEFAULT_CLASS_RULES.nozzle, maxMm: 102 },
  power: { minKw: 180, maxKw: 260, defaultUncertaintyKw: 5 },
};

async function insertEvent(id: string, name: string, status: string, feeMinor = 0) {
  await query(
    `insert into events (id, organisation_id, name, slug, venue, starts_on, ends_on, time_zone, status, entry_fee_minor, currency)
     values ($1, $2, $3, $4, 'Test Reach', '2027-04-10', '2027-04-11', 'UTC', $5, $6, 'NZD') on conflict do nothing`,
    [id, CLUB, name, `test-${id}`, status, feeMinor],
  );
}
async function insertClass(id: string, eventId: string, code: string, published: boolean) {
  await query(`insert into race_classes (id, event_id, name, code) values ($1, $2, $3, $4) on conflict do nothing`, [
    id,
    eventId,
    `Test class ${code}`,
    code,
  ]);
  await query(
    published
      ? `insert into class_rule_versions (class_id, version, status, rules, effective_from, published_at) values ($1, 1, 'published', $2::jsonb, now(), now()) on conflict do nothing`
      : `insert into class_rule_versions (class_id, version, status, rules) values ($1, 1, 'draft', $2::jsonb) on conflict do nothing`,
    [id, JSON.stringify(RULES)],
  );
}

let demoClassId: string;
before(async () => {
  await insertEvent(CLOSING_EVENT, 'Test meeting that closes', 'entries_open');
  await insertClass(CLOSING_CLASS, CLOSING_EVENT, 'TC', true);
  await insertEvent(DRAFT_EVENT, 'Test meeting with draft rules', 'entries_open');
  await insertClass(DRAFT_CLASS, DRAFT_EVENT, 'TD', false);
  const [c] = await query<{ id: string }>(
    `select c.id from race_classes c join class_rule_versions v on v.class_id = c.id and v.status = 'published'
      where c.event_id = $1 order by c.code limit 1`,
    [DEMO.meetingId],
  );
  assert.ok(c, 'the demo seeder gives the demo meeting a class with published rules');
  demoClassId = c.id;
});

async function newEntrant(name: string) {
  const s = new HttpSession();
  const email = uniqueEmail('boats');
  await s.signUpAndConfirm({ name, email, password: 'long-enough-pw' });
  return Object.assign(s, { email });
}

const goodBoat = (over: Record<string, unknown> = {}) => ({
  name: 'Shingle Skua',
  hullNumber: '',
  pumpDescription: '2-stage mixed flow',
  nozzleDiameter: 101.5,
  nozzleUnit: 'mm',
  nozzleToleranceMm: 0.05,
  power: 230,
  powerUnit: 'kW',
  powerEvidence: 'dyno_sheet',
  declaredWeightKg: 660,
  ...over,
});
// React separates text parts with empty comments in server HTML; read the page as its visible text runs.
const pageText = async (url: string) => (await (await fetch(url)).text()).replace(/<!-- -->/g, '');
const count = async (table: string) => Number((await query<{ n: string }>(`select count(*) as n from ${table}`))[0].n);
const storageDir = path.join(process.env.FAKES_DIR ?? '.data/test-fakes', 'storage');
const storedFiles = (): number => {
  if (!fs.existsSync(storageDir)) return 0;
  let n = 0;
  const walk = (d: string) =>
    fs.readdirSync(d, { withFileTypes: true }).forEach((e) => (e.isDirectory() ? walk(path.join(d, e.name)) : n++));
  walk(storageDir);
  return n;
};
async function upload(s: HttpSession, boatId: string, bytes: Uint8Array, name: string, kind = 'dyno_sheet') {
  const form = new FormData();
  form.append('kind', kind);
  form.append('file', new Blob([bytes as Uint8Array<ArrayBuffer>]), name);
  const res = await s.fetch(`/api/boats/${boatId}/documents`, { method: 'POST', body: form });
  return { res, body: await res.json().catch(() => null) };
}

test('an entrant registers, lists and edits their own boats; units are stored as mm and kW', async () => {
  const a = await newEntrant('Ada Marrow');
  const { res, body } = await a.json(
    '/api/boats',
    goodBoat({ name: 'Braid Kite', nozzleDiameter: 4, nozzleUnit: 'in', power: 400, powerUnit: 'hp' }),
  );
  assert.equal(res.status, 201, JSON.stringify(body));
  const [row] = await query<{ declared_nozzle_mm: number; declared_power_kw: number; owner_id: string }>(
    'select * from boats where id = $1',
    [body.data.id],
  );
  // NIST SP 811 (2008) appendix B: 1 in = 25.4 mm exactly; 1 hp = 745.69987158227022 W
  assert.ok(Math.abs(row.declared_nozzle_mm - 101.6) < 1e-9);
  assert.ok(Math.abs(row.declared_power_kw - 298.279948632908) < 1e-9);
  const list = await a.fetch('/api/boats');
  assert.deepEqual(
    ((await list.json()).data as { id: string }[]).map((b) => b.id),
    [body.data.id],
  );
  const patch = await a.json(`/api/boats/${body.data.id}`, { name: 'Braid Kite II', nozzleDiameter: 101.9 }, 'PATCH');
  assert.equal(patch.res.status, 200, JSON.stringify(patch.body));
  assert.equal(patch.body.data.name, 'Braid Kite II');
  assert.equal(patch.body.data.declaredNozzleMm, 101.9);
  assert.equal(patch.body.data.declaredPowerKw, row.declared_power_kw, 'fields not sent stay as they were');
});

test('another entrant gets 404 for GET, PATCH, documents and tag of a boat that is not theirs; nothing changes', async () => {
  const a = await newEntrant('Bo Tolland');
  const b = await newEntrant('Cy Varley');
  const { body } = await a.json('/api/boats', goodBoat());
  const id = body.data.id;
  assert.equal((await b.fetch(`/api/boats/${id}`)).status, 404);
  assert.equal((await b.json(`/api/boats/${id}`, { name: 'Stolen' }, 'PATCH')).res.status, 404);
  assert.equal((await upload(b, id, new TextEncoder().encode('%PDF-1.4\n%%EOF\n'), 'x.pdf')).res.status, 404);
  assert.equal((await b.fetch(`/api/boats/${id}/tag`, { method: 'POST' })).status, 404);
  assert.equal((await b.fetch(`/api/boats/${id}/tag-pdf`)).status, 404);
  assert.deepEqual((await (await b.fetch('/api/boats')).json()).data as unknown[], []);
  const entries = await count('entries');
  assert.equal(
    (await b.json('/api/entries', { boatId: id, eventId: DEMO.meetingId, classId: demoClassId })).res.status,
    404,
    'nor enter it',
  );
  assert.equal(await count('entries'), entries);
  const [row] = await query<{ name: string }>('select name from boats where id = $1', [id]);
  assert.equal(row.name, 'Shingle Skua');
  assert.equal(await count(`boat_documents where boat_id = '${id}'`), 0);
  // A malformed id names nothing: 404, never a 500; anonymous callers get 401.
  assert.equal((await a.fetch('/api/boats/not-a-uuid')).status, 404);
  assert.equal((await a.fetch('/api/documents/123')).status, 404);
  assert.equal((await new HttpSession().fetch(`/api/boats/${id}`)).status, 401);
});

test('bad boat input gets 400 naming the field, and stores nothing', async () => {
  const a = await newEntrant('Di Carrow');
  const before = await count('boats');
  const cases: [Record<string, unknown>, string, RegExp][] = [
    [goodBoat({ nozzleDiameter: -3 }), 'nozzleDiameter', /above zero/],
    [goodBoat({ power: '300' }), 'power', /as a number/],
    [goodBoat({ name: undefined }), 'name', /name/],
    [goodBoat({ nozzleDiameter: undefined }), 'nozzleDiameter', /^Enter the nozzle exit diameter\.$/],
    [goodBoat({ nozzleDiameter: 1200 }), 'nozzleDiameter', /below 1000 mm/],
    [goodBoat({ nozzleToleranceMm: -0.1 }), 'nozzleToleranceMm', /negative/],
    [goodBoat({ powerEvidence: 'rumour' }), 'powerEvidence', /Choose/],
  ];
  for (const [input, field, message] of cases) {
    const { res, body } = await a.json('/api/boats', input);
    assert.equal(res.status, 400, `${field}: ${JSON.stringify(body)}`);
    const d = (body.error.details as { field: string; message: string }[]).find((x) => x.field === field);
    assert.ok(d, `names ${field}: ${JSON.stringify(body)}`);
    assert.match(d.message, message);
  }
  assert.equal(await count('boats'), before);
  const { body } = await a.json('/api/boats', goodBoat());
  const bad = await a.json(`/api/boats/${body.data.id}`, { nozzleDiameter: 0 }, 'PATCH');
  assert.equal(bad.res.status, 400);
  assert.equal(
    (await query<{ d: number }>('select declared_nozzle_mm as d from boats where id = $1', [body.data.id]))[0].d,
    101.5,
  );
});

test('a real PDF uploads with its SHA-256 and detected type; its owner downloads the same bytes', async () => {
  const a = await newEntrant('Eli Orrin');
  const { body } = await a.json('/api/boats', goodBoat());
  const pdf = await PDFDocument.create();
  pdf.addPage([300, 200]).drawText('Dyno sheet: 230 kW at 6400 rpm', {
    x: 20,
    y: 100,
    size: 12,
    font: await pdf.embedFont(StandardFonts.Helvetica),
  });
  const bytes = await pdf.save();
  const up = await upload(a, body.data.id, bytes, 'dyno "sheet".pdf');
  assert.equal(up.res.status, 201, JSON.stringify(up.body));
  const [doc] = await query<{
    sha256: string;
    content_type: string;
    size_bytes: string;
    file_name: string;
    object_key: string;
  }>('select * from boat_documents where id = $1', [up.body.data.id]);
  // The stored hash is node:crypto's SHA-256 of exactly the bytes sent (FIPS 180-4).
  assert.equal(doc.sha256, createHash('sha256').update(bytes).digest('hex'));
  assert.equal(doc.content_type, 'application/pdf');
  assert.equal(Number(doc.size_bytes), bytes.byteLength);
  assert.doesNotMatch(doc.file_name, /["/\\]/, 'the name is sanitised');
  assert.match(doc.object_key, /^boat-documents\//);
  const dl = await a.fetch(`/api/documents/${up.body.data.id}`);
  assert.equal(dl.status, 200);
  assert.equal(dl.headers.get('content-type'), 'application/pdf');
  assert.equal(dl.headers.get('x-content-type-options'), 'nosniff');
  assert.match(dl.headers.get('content-disposition') ?? '', /^attachment; filename="[^"]+\.pdf"/);
  assert.deepEqual(new Uint8Array(await dl.arrayBuffer()), bytes);
  const other = await newEntrant('Fay Upcott');
  assert.equal((await other.fetch(`/api/documents/${up.body.data.id}`)).status, 404);
});

test('refused uploads store nothing: text named .pdf (415), over 10 MB (413), not multipart (415)', async () => {
  const a = await newEntrant('Gil Redfern');
  const { body } = await a.json('/api/boats', goodBoat());
  const id = body.data.id;
  const [rows, files] = [await count('boat_documents'), storedFiles()];
  const text = await upload(
    a,
    id,
    new TextEncoder().encode('This is only text, whatever the name says.\n'),
    'dyno.pdf',
  );
  assert.equal(text.res.status, 415, JSON.stringify(text.body));
  assert.match(text.body.error.message, /plain text/);
  // 10 MB + 1 byte of PDF-looking bytes: refused by size once read (the body is under the header limit).
  const justOver = new Uint8Array(10 * 1024 * 1024 + 1);
  justOver.set(new TextEncoder().encode('%PDF-1.7\n'));
  const over = await upload(a, id, justOver, 'big.pdf');
  assert.equal(over.res.status, 413, JSON.stringify(over.body));
  // 11 MB: refused from Content-Length before the body is read.
  const huge = await upload(a, id, new Uint8Array(11 * 1024 * 1024), 'huge.pdf');
  assert.equal(huge.res.status, 413);
  assert.match(huge.body.error.message, /10 MB/);
  const json = await a.json(`/api/boats/${id}/documents`, { file: 'x' });
  assert.equal(json.res.status, 415);
  assert.equal(await count('boat_documents'), rows);
  assert.equal(storedFiles(), files, 'no object reached storage');
});

test('entering the demo meeting: awaiting payment, the requested number if free, fee from the meeting; one live entry per boat', async () => {
  const a = await newEntrant('Hal Inchley');
  const [free] = await query<{ n: number }>(
    `select n from generate_series(5000, 9999) n where not exists (select 1 from entries where event_id = $1 and race_number = n) limit 1`,
    [DEMO.meetingId],
  );
  const { body: boat } = await a.json('/api/boats', goodBoat({ hullNumber: String(free.n) }));
  const { res, body } = await a.json('/api/entries', {
    boatId: boat.data.id,
    eventId: DEMO.meetingId,
    classId: demoClassId,
  });
  assert.equal(res.status, 201, JSON.stringify(body));
  const [event] = await query<{ entry_fee_minor: number; currency: string }>('select * from events where id = $1', [
    DEMO.meetingId,
  ]);
  const [entry] = await query<{
    status: string;
    race_number: number;
    fee_minor: number;
    currency: string;
    entrant_id: string;
  }>('select * from entries where id = $1', [body.data.entry.id]);
  assert.equal(entry.status, 'awaiting_payment');
  assert.equal(entry.race_number, free.n, 'the hull number, free at this meeting, became the race number');
  assert.equal(entry.fee_minor, event.entry_fee_minor);
  assert.equal(entry.currency, event.currency);
  assert.equal(body.data.gotRequestedNumber, true);
  assert.ok(Array.isArray(body.data.declarationCheck.rows) && body.data.declarationCheck.rows.length > 0);
  const again = await a.json('/api/entries', { boatId: boat.data.id, eventId: DEMO.meetingId, classId: demoClassId });
  assert.equal(again.res.status, 409);
  assert.match(again.body.error.message, /already entered/);
  // The same number asked for by another boat: the lowest free number instead.
  const b = await newEntrant('Ina Jessop');
  const { body: boatB } = await b.json('/api/boats', goodBoat({ name: 'Eddy Wasp' }));
  const second = await b.json('/api/entries', {
    boatId: boatB.data.id,
    eventId: DEMO.meetingId,
    classId: demoClassId,
    requestedRaceNumber: free.n,
  });
  assert.equal(second.res.status, 201, JSON.stringify(second.body));
  assert.notEqual(second.body.data.entry.raceNumber, free.n);
  assert.equal(second.body.data.gotRequestedNumber, false);
  // Officials of the meeting may read an entered boat's documents; the entrant's list shows the entry.
  const doc = await upload(
    a,
    boat.data.id,
    new TextEncoder().encode('%PDF-1.4\n1 0 obj <<>> endobj\n%%EOF\n'),
    'cert.pdf',
    'registration',
  );
  assert.equal(doc.res.status, 201, JSON.stringify(doc.body));
  const organiser = new HttpSession();
  await organiser.signInWithPassword(DEMO.organiser, DEMO_PASSWORD);
  assert.equal((await organiser.fetch(`/api/documents/${doc.body.data.id}`)).status, 200);
  assert.equal((await b.fetch(`/api/documents/${doc.body.data.id}`)).status, 404);
  const mine = (await (await a.fetch('/api/entries')).json()).data as { id: string; statusLabel: string }[];
  assert.deepEqual(
    mine.map((e) => [e.id, e.statusLabel]),
    [[body.data.entry.id, 'Awaiting payment']],
  );
});

test('entries after the meeting closes (409), into a class without published rules (409) or of another meeting (404) store nothing', async () => {
  const a = await newEntrant('Jo Kestle');
  const { body: boat } = await a.json('/api/boats', goodBoat());
  await query(`update events set status = 'entries_closed' where id = $1`, [CLOSING_EVENT]);
  const before = await count('entries');
  const closed = await a.json('/api/entries', { boatId: boat.data.id, eventId: CLOSING_EVENT, classId: CLOSING_CLASS });
  assert.equal(closed.res.status, 409);
  assert.match(closed.body.error.message, /closed for entries/);
  const draft = await a.json('/api/entries', { boatId: boat.data.id, eventId: DRAFT_EVENT, classId: DRAFT_CLASS });
  assert.equal(draft.res.status, 409);
  assert.match(draft.body.error.message, /no published rules/);
  const wrongClass = await a.json('/api/entries', {
    boatId: boat.data.id,
    eventId: DEMO.meetingId,
    classId: CLOSING_CLASS,
  });
  assert.equal(wrongClass.res.status, 404);
  const bad = await a.json('/api/entries', { boatId: 'nope', eventId: DEMO.meetingId, classId: demoClassId });
  assert.equal(bad.res.status, 400);
  assert.ok(bad.body.error.details.some((d: { field: string }) => d.field === 'boatId'));
  const open = (await (await a.fetch('/api/events/open')).json()).data as { id: string; classes: { id: string }[] }[];
  assert.ok(!open.some((e) => e.id === CLOSING_EVENT), 'a closed meeting is not offered');
  assert.deepEqual(
    open.find((e) => e.id === DRAFT_EVENT)?.classes,
    [],
    'a class without published rules is not offered',
  );
  assert.equal(await count('entries'), before);
});

test('concurrent entries at one meeting all asking for the same number get distinct race numbers', async () => {
  const [free] = await query<{ n: number }>(
    `select n from generate_series(4000, 4999) n where not exists (select 1 from entries where event_id = $1 and race_number = n) limit 1`,
    [DEMO.meetingId],
  );
  const people = await Promise.all([0, 1, 2, 3, 4].map((i) => newEntrant(`Racer ${i}`)));
  const boats = await Promise.all(
    people.map(async (p, i) => (await p.json('/api/boats', goodBoat({ name: `Flume ${i}` }))).body.data.id as string),
  );
  const results = await Promise.all(
    people.map((p, i) =>
      p.json('/api/entries', {
        boatId: boats[i],
        eventId: DEMO.meetingId,
        classId: demoClassId,
        requestedRaceNumber: free.n,
      }),
    ),
  );
  for (const r of results) assert.equal(r.res.status, 201, JSON.stringify(r.body));
  const numbers = results.map((r) => r.body.data.entry.raceNumber as number);
  assert.equal(new Set(numbers).size, numbers.length, `distinct: ${numbers}`);
  assert.equal(numbers.filter((n) => n === free.n).length, 1, 'exactly one got the number asked for');
});

test('an entrant withdraws their own unpaid entry; others cannot (404); a second withdrawal is a 409', async () => {
  const a = await newEntrant('Kai Lowrie');
  const { body: boat } = await a.json('/api/boats', goodBoat());
  const { body } = await a.json('/api/entries', {
    boatId: boat.data.id,
    eventId: DEMO.meetingId,
    classId: demoClassId,
  });
  const other = await newEntrant('Lu Pellow');
  assert.equal((await other.fetch(`/api/entries/${body.data.entry.id}/withdraw`, { method: 'POST' })).status, 404);
  const res = await a.fetch(`/api/entries/${body.data.entry.id}/withdraw`, { method: 'POST' });
  assert.equal(res.status, 200);
  assert.equal((await res.json()).data.statusLabel, 'Withdrawn');
  assert.equal((await a.fetch(`/api/entries/${body.data.entry.id}/withdraw`, { method: 'POST' })).status, 409);
  assert.equal(
    (await query<{ status: string }>('select status from entries where id = $1', [body.data.entry.id]))[0].status,
    'withdrawn',
  );
});

test('reissuing a tag retires the old token (/t/<old> says replaced) and the new one is current; unknown tokens are named', async () => {
  const a = await newEntrant('Mo Quarry');
  const { body } = await a.json('/api/boats', goodBoat({ name: 'Riffle Comet' }));
  const entry = await a.json('/api/entries', { boatId: body.data.id, eventId: DEMO.meetingId, classId: demoClassId });
  assert.equal(entry.res.status, 201);
  const first = (await (await a.fetch(`/api/boats/${body.data.id}`)).json()).data.tag.token as string;
  const page1 = await pageText(`${BASE_URL}/t/${first}`);
  assert.match(page1, /Riffle Comet/);
  assert.match(page1, /Kelda Reach Spring Sprint/);
  assert.match(page1, new RegExp(`>${entry.body.data.entry.raceNumber}<`), 'the race number at the upcoming meeting');
  assert.match(page1, /sign in/);
  assert.doesNotMatch(page1, /101\.5|mixed flow/, 'the public page shows no declaration');
  const re = await a.fetch(`/api/boats/${body.data.id}/tag`, { method: 'POST' });
  assert.equal(re.status, 201);
  const second = (await re.json()).data.token as string;
  assert.notEqual(second, first);
  const old = await pageText(`${BASE_URL}/t/${first}`);
  assert.match(old, /This tag was replaced on \d{1,2} \w{3} \d{4}: it is no longer valid/);
  assert.doesNotMatch(old, /Current tag/);
  const current = await pageText(`${BASE_URL}/t/${second}`);
  assert.match(current, /Current tag/);
  assert.match(current, /Riffle Comet/);
  const unknown = await pageText(`${BASE_URL}/t/notARealTokenAtAll`);
  assert.match(unknown, /This is not a Boreline tag we know/);
  const [rows] = [
    await query<{ n: string }>('select count(*) as n from boat_tags where boat_id = $1 and retired_at is null', [
      body.data.id,
    ]),
  ];
  assert.equal(rows[0].n, '1', 'one current tag per boat');
  const pdf = await a.fetch(`/api/boats/${body.data.id}/tag-pdf`);
  assert.equal(pdf.status, 200);
  assert.equal(pdf.headers.get('content-type'), 'application/pdf');
  // ISO 32000-1 §7.5.2: a PDF file begins with "%PDF-".
  assert.equal(
    Buffer.from(await pdf.arrayBuffer())
      .subarray(0, 5)
      .toString('latin1'),
    '%PDF-',
  );
});
