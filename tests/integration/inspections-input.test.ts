// Inspections through the real HTTP API and database: bad input refused on its field with nothing
// stored, photos and their size limit, tag and race-number lookups, the board, re-inspection tasks
// and the instrument list. Budget check: U = 2·√(a²/3 + δ²/12) (JCGM 100:2008, 4.3.7, F.2.2.1, 6.2.1).
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import http from 'node:http';
import { randomUUID } from 'node:crypto';
import QRCode from 'qrcode';
import { HttpSession } from '../support/http-session';
import { BASE_URL, DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { InspectionMeeting, inspectionBody, rulesWith, type TestEntry } from '../support/inspection-meeting';

const meeting = new InspectionMeeting();
const scrutineer = new HttpSession();
let classId: string;
let entry: TestEntry;
const post = (body: unknown) => scrutineer.json(`/api/events/${meeting.eventId}/inspections`, body);
const total = async () =>
  Number(
    (await query<{ n: string }>('select count(*) as n from inspections where event_id = $1', [meeting.eventId]))[0].n,
  );
const photoCount = async () =>
  Number(
    (
      await query<{ n: string }>(
        'select count(*) as n from inspection_photos p join inspections i on i.id = p.inspection_id where i.event_id = $1',
        [meeting.eventId],
      )
    )[0].n,
  );
const fields = (body: { error?: { details?: { field: string }[] } }) => (body.error?.details ?? []).map((d) => d.field);

before(async () => {
  await meeting.create(`Inspection Input Meeting ${Date.now()}`, [
    { email: DEMO.scrutineer, role: 'scrutineer' },
    { email: DEMO.steward, role: 'steward' },
  ]);
  classId = await meeting.addClass('INP', rulesWith({ decisionRule: 'iso14253' }));
  entry = await meeting.addEntry(classId);
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
});

test('bad input is refused with 400 naming the field, and nothing is stored', async () => {
  const before = await total();
  const base = inspectionBody(entry.id, 101.9);
  const readings = (list: unknown[]) => ({ ...base.nozzle, readings: list });
  const demoCaliper = '0b0e0000-0000-4000-8501-000000000001'; // on the demo meeting's list, not this one's
  const cases: [string, Record<string, unknown>, string][] = [
    [
      'fewer readings than the class requires (3)',
      { nozzle: readings(base.nozzle.readings.slice(0, 2)) },
      'nozzle.readings',
    ],
    [
      'a reading of -5 mm',
      { nozzle: readings([{ diameterMm: -5, angleDeg: 0 }, ...base.nozzle.readings.slice(1)]) },
      'nozzle.readings.0.diameterMm',
    ],
    [
      'a reading of 5000 mm',
      { nozzle: readings([...base.nozzle.readings.slice(0, 2), { diameterMm: 5000, angleDeg: 120 }]) },
      'nozzle.readings.2.diameterMm',
    ],
    [
      'a string for a number',
      { nozzle: readings([{ diameterMm: '101.9', angleDeg: 0 }, ...base.nozzle.readings.slice(1)]) },
      'nozzle.readings.0.diameterMm',
    ],
    [
      'an angle of 400°',
      { nozzle: readings([{ diameterMm: 101.9, angleDeg: 400 }, ...base.nozzle.readings.slice(1)]) },
      'nozzle.readings.0.angleDeg',
    ],
    [
      'an unknown instrument',
      { nozzle: { ...base.nozzle, expandedUncertaintyMm: null, instrumentId: randomUUID() } },
      'nozzle.instrumentId',
    ],
    [
      'an instrument of another meeting',
      { nozzle: { ...base.nozzle, expandedUncertaintyMm: null, instrumentId: demoCaliper } },
      'nozzle.instrumentId',
    ],
    // U = 0 is never credible (JCGM 100:2008, F.2.2.1: the resolution alone contributes); found by an outside test.
    ['a typed U of zero', { nozzle: { ...base.nozzle, expandedUncertaintyMm: 0 } }, 'nozzle.expandedUncertaintyMm'],
    ['a capture time an hour ahead', { capturedAt: new Date(Date.now() + 3600_000).toISOString() }, 'capturedAt'],
    ['a capture time 15 days ago', { capturedAt: new Date(Date.now() - 15 * 86_400_000).toISOString() }, 'capturedAt'],
    ['an entry of another meeting', { entryId: '0b0e0000-0000-4000-8401-000000000001' }, 'entryId'],
    ['a key that is not a UUID', { idempotencyKey: 'tap-1' }, 'idempotencyKey'],
  ];
  for (const [what, over, field] of cases) {
    const { res, body } = await post({ ...base, idempotencyKey: randomUUID(), ...over });
    assert.equal(res.status, 400, `${what}: ${JSON.stringify(body)}`);
    assert.ok(fields(body).includes(field), `${what}: ${field} in ${JSON.stringify(body.error?.details)}`);
  }
  assert.equal(await total(), before, 'nothing stored');
});

test('photos: a real PNG is stored once (a retry adds nothing); one over 8 MB, or a declared length over the cap, is 413 on the field', async () => {
  const { body } = await post(inspectionBody(entry.id, 101.9));
  const url = `/api/events/${meeting.eventId}/inspections/${body.data.id}/photos`;
  const png = await QRCode.toBuffer('photo of the nozzle exit', { type: 'png' });
  const form = () => {
    const f = new FormData();
    f.append('photo', new Blob([new Uint8Array(png)], { type: 'image/png' }), 'nozzle.png');
    return f;
  };
  const first = await scrutineer.fetch(url, { method: 'POST', body: form() });
  assert.equal(first.status, 201, await first.clone().text());
  const again = await scrutineer.fetch(url, { method: 'POST', body: form() });
  assert.equal(again.status, 201);
  const [row] = await query<{ n: string; content_type: string }>(
    'select count(*) as n, min(content_type) as content_type from inspection_photos where inspection_id = $1',
    [body.data.id],
  );
  assert.equal(row.n, '1', 'the same bytes twice are one photo');
  assert.equal(row.content_type, 'image/png');

  const before = await photoCount();
  // PNG signature (W3C PNG §5.2) then padding past 8 MB: refused for its size by inspectUpload.
  const big = new Uint8Array(8 * 1024 * 1024 + 1);
  big.set([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  const bigForm = new FormData();
  bigForm.append('photo', new Blob([big], { type: 'image/png' }), 'big.png');
  const tooBig = await scrutineer.fetch(url, { method: 'POST', body: bigForm });
  assert.equal(tooBig.status, 413);
  assert.ok(fields(await tooBig.json()).includes('photo'));
  // A declared Content-Length over the cap is refused before the body is read.
  const early = await new Promise<{ status: number; body: string }>((resolve, reject) => {
    const req = http.request(
      `${BASE_URL}${url}`,
      {
        method: 'POST',
        headers: {
          cookie: scrutineer.cookieHeader(),
          'content-type': 'multipart/form-data; boundary=x',
          'content-length': String(64 * 1024 * 1024),
        },
      },
      (res) => {
        let text = '';
        res.on('data', (c) => (text += c));
        res.on('end', () => {
          resolve({ status: res.statusCode ?? 0, body: text });
          req.destroy();
        });
      },
    );
    req.on('error', reject);
    req.write('--x\r\n'); // a few bytes only: the answer must not wait for the rest
  });
  assert.equal(early.status, 413);
  assert.ok(fields(JSON.parse(early.body)).includes('photo'));
  // Not a photo at all: 415.
  const textForm = new FormData();
  textForm.append('photo', new Blob(['just text'], { type: 'image/png' }), 'fake.png');
  assert.equal((await scrutineer.fetch(url, { method: 'POST', body: textForm })).status, 415);
  assert.equal(await photoCount(), before, 'no photo stored');
});

test('tag lookups: the current tag gives the card with the rule version; a replaced tag 410; an unknown one 404', async () => {
  const ok = await scrutineer.fetch(`/api/events/${meeting.eventId}/tags/${entry.token}`);
  assert.equal(ok.status, 200);
  const card = (await ok.json()).data;
  assert.equal(card.entry.id, entry.id);
  assert.equal(card.ruleVersion.version, 1);
  assert.equal(card.entry.isPaid, true);
  assert.ok(Array.isArray(card.inspections) && card.inspections.length > 0, 'earlier records at this meeting');
  assert.ok(
    card.inspections.every(
      (i: { recordedBy: { name: string }; device: string; ruleVersion: number }) =>
        i.recordedBy.name && i.ruleVersion === 1 && i.device === 'integration test',
    ),
  );
  const fromUrl = await scrutineer.fetch(
    `/api/events/${meeting.eventId}/tags/${encodeURIComponent(`${BASE_URL}/t/${entry.token}`)}`,
  );
  assert.equal(fromUrl.status, 200, 'the scanned URL works as well as the bare token');

  const other = await meeting.addEntry(classId);
  await query('update boat_tags set retired_at = now() where token = $1', [other.token]);
  const retired = await scrutineer.fetch(`/api/events/${meeting.eventId}/tags/${other.token}`);
  assert.equal(retired.status, 410);
  const rb = await retired.json();
  assert.equal(rb.error.code, 'retired_tag');
  assert.match(rb.error.message, /replaced/);
  const unknown = await scrutineer.fetch(`/api/events/${meeting.eventId}/tags/NotATokenAnyoneIssued123`);
  assert.equal(unknown.status, 404);
  assert.equal((await unknown.json()).error.code, 'unknown_tag');
  assert.equal((await scrutineer.fetch(`/api/events/${meeting.eventId}/race-numbers/9998`)).status, 404);
  assert.equal((await scrutineer.fetch(`/api/events/${meeting.eventId}/race-numbers/${entry.raceNumber}`)).status, 200);
});

test('the board lists every entry with its latest result, filters by class and result, and counts what waits', async () => {
  const waiting = await meeting.addEntry(classId);
  const failing = await meeting.addEntry(classId);
  assert.equal((await post(inspectionBody(failing.id, 102.06))).res.status, 201);
  const all = (await (await scrutineer.fetch(`/api/events/${meeting.eventId}/inspections`)).json()).data;
  assert.equal(all.rows.find((r: { entryId: string }) => r.entryId === waiting.id).state, 'waiting');
  const f = all.rows.find((r: { entryId: string }) => r.entryId === failing.id);
  assert.equal(f.state, 'does_not_conform');
  assert.ok(f.latest.recordedBy.length > 0);
  assert.equal(all.counts.total, all.rows.length);
  assert.equal(all.counts.waiting, all.rows.filter((r: { state: string }) => r.state === 'waiting').length);
  const failed = (
    await (
      await scrutineer.fetch(`/api/events/${meeting.eventId}/inspections?class=INP&result=does_not_conform`)
    ).json()
  ).data;
  assert.ok(failed.rows.length >= 1 && failed.rows.every((r: { state: string }) => r.state === 'does_not_conform'));
  assert.equal(failed.counts.total, all.counts.total, 'counts ignore the result filter');
  const bad = await scrutineer.fetch(`/api/events/${meeting.eventId}/inspections?result=maybe`);
  assert.equal(bad.status, 400);
  assert.ok(fields(await bad.json()).includes('result'));
});

test('re-inspection: a steward asks, a scrutineer cannot; recording with the task marks it done', async () => {
  const steward = new HttpSession();
  await steward.signInWithPassword(DEMO.steward, DEMO_PASSWORD);
  const target = await meeting.addEntry(classId);
  assert.equal(
    (
      await scrutineer.json(`/api/events/${meeting.eventId}/reinspections`, {
        entryIds: [target.id],
        reason: 'top three',
      })
    ).res.status,
    403,
  );
  const asked = await steward.json(`/api/events/${meeting.eventId}/reinspections`, {
    entryIds: [target.id],
    reason: 'top three, final',
  });
  assert.equal(asked.res.status, 201, JSON.stringify(asked.body));
  const again = await steward.json(`/api/events/${meeting.eventId}/reinspections`, {
    entryIds: [target.id],
    reason: 'asked twice',
  });
  assert.equal(again.body.data[0].id, asked.body.data[0].id, 'one open task per entry');
  const board = (
    await (await scrutineer.fetch(`/api/events/${meeting.eventId}/inspections?result=reinspection`)).json()
  ).data;
  assert.ok(board.rows.some((r: { entryId: string }) => r.entryId === target.id));
  const done = await post(
    inspectionBody(target.id, 101.9, { kind: 'post_race', reinspectionId: asked.body.data[0].id }),
  );
  assert.equal(done.res.status, 201, JSON.stringify(done.body));
  const tasks = (await (await steward.fetch(`/api/events/${meeting.eventId}/reinspections`)).json()).data;
  const t = tasks.find((x: { id: string }) => x.id === asked.body.data[0].id);
  assert.ok(t.doneAt);
  assert.equal(t.inspectionId, done.body.data.id);
});

test('instruments: the organiser adds one with its budget; scrutineers list it but cannot add', async () => {
  const added = await meeting.organiser.json(`/api/events/${meeting.eventId}/instruments`, {
    name: 'Test caliper',
    quantity: 'length',
    errorLimit: 0.03,
    resolution: 0.01,
  });
  assert.equal(added.res.status, 201, JSON.stringify(added.body));
  // JCGM 100:2008 4.3.7 and F.2.2.1, k = 2 (6.2.1).
  assert.ok(
    Math.abs(added.body.data.appliedExpandedUncertainty - 2 * Math.sqrt(0.03 ** 2 / 3 + 0.01 ** 2 / 12)) < 1e-12,
  );
  assert.equal(
    (
      await scrutineer.json(`/api/events/${meeting.eventId}/instruments`, {
        name: 'Mine',
        quantity: 'length',
        errorLimit: 0.01,
      })
    ).res.status,
    403,
  );
  const noBudget = await meeting.organiser.json(`/api/events/${meeting.eventId}/instruments`, {
    name: 'No figures',
    quantity: 'length',
  });
  assert.equal(noBudget.res.status, 400);
  const list = (await (await scrutineer.fetch(`/api/events/${meeting.eventId}/instruments`)).json()).data;
  assert.ok(list.some((i: { id: string }) => i.id === added.body.data.id));
  // Recording with it: U comes from the budget, and 101.98 mm is within it of 102.00 (ISO 14253-1:2017).
  const base = inspectionBody(entry.id, 101.98);
  const rec = await post({
    ...base,
    nozzle: { ...base.nozzle, expandedUncertaintyMm: null, instrumentId: added.body.data.id },
  });
  assert.equal(rec.res.status, 201, JSON.stringify(rec.body));
  const nozzle = rec.body.data.rules.find((r: { rule: string }) => r.rule === 'nozzle_max');
  assert.ok(Math.abs(nozzle.expandedUncertainty - added.body.data.appliedExpandedUncertainty) < 1e-12);
  assert.equal(nozzle.verdict, 'inconclusive');
  assert.match(nozzle.explanation, /measure again with a better instrument/i);
});
