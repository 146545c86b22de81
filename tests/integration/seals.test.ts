// The seal register through the real HTTP API and database (issue 15, item 4): numbered batches
// issued to a meeting, seals applied at the dock, checked at later meetings, the finding in the
// verdict, the seal's whole history, append-only storage, and the free-text seals of older records
// carried over by the migration. That a broken scrutineering seal means the sealed component is no
// longer in its verified state is common practice, no source. All numbers and boats are invented.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { randomBytes, randomUUID } from 'node:crypto';
import QRCode from 'qrcode';
import { Sequelize } from 'sequelize';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { query } from '../support/db';
import { InspectionMeeting, inspectionBody, rulesWith, type TestEntry } from '../support/inspection-meeting';
import { initModels, BoatComponent } from '../../models';
import carry from '../../migrations/20261203005200-carry-free-text-seals.js';

const meetings = [new InspectionMeeting(), new InspectionMeeting(), new InspectionMeeting()];
const classIds: string[] = [];
const scrutineer = new HttpSession();
let sequelize: Sequelize;
let entry: TestEntry; // the boat's entry at the first meeting
const entryAt: string[] = []; // the same boat's entry at each meeting
let engineId = '';
let scrutineerId = '';
const PREFIX = `T${randomBytes(3).toString('hex').toUpperCase()}-`;

const post = (m: InspectionMeeting, body: unknown) => scrutineer.json(`/api/events/${m.eventId}/inspections`, body);
const issue = (m: InspectionMeeting, body: unknown) => m.organiser.json(`/api/events/${m.eventId}/seal-batches`, body);
const sealEventsOf = (number: string) =>
  query<{ action: string; event_id: string; inspection_id: string; component_id: string; boat_id: string }>(
    `select e.action, e.event_id, e.inspection_id, e.component_id, e.boat_id, e.position, e.recorded_by_id
       from seal_events e join seals s on s.id = e.seal_id where upper(s.number) = upper($1) order by e.created_at`,
    [number],
  );

/** The same boat entered at another meeting (SQL, as the meeting helper enters boats). */
async function enterAgain(m: InspectionMeeting, classId: string, e: TestEntry, raceNumber: number) {
  const [owner] = await query<{ id: string }>('select owner_id as id from boats where id = $1', [e.boatId]);
  const [row] = await query<{ id: string }>(
    `insert into entries (event_id, class_id, boat_id, entrant_id, race_number, status, fee_minor, currency, paid_at)
     values ($1, $2, $3, $4, $5, 'entered', 10000, 'NZD', now()) returning id`,
    [m.eventId, classId, e.boatId, owner.id, raceNumber],
  );
  return row.id;
}

before(async () => {
  sequelize = new Sequelize(process.env.DATABASE_URL!, { logging: false });
  initModels(sequelize);
  const stamp = Date.now();
  for (const [i, m] of meetings.entries()) {
    await m.create(`Seal Test Meeting ${i + 1} ${stamp}`, [{ email: DEMO.scrutineer, role: 'scrutineer' }]);
    classIds.push(await m.addClass(`SL${i + 1}`, rulesWith()));
  }
  entry = await meetings[0].addEntry(classIds[0]);
  entryAt.push(entry.id);
  entryAt.push(await enterAgain(meetings[1], classIds[1], entry, 200));
  entryAt.push(await enterAgain(meetings[2], classIds[2], entry, 201));
  [{ id: scrutineerId }] = await query<{ id: string }>('select id from users where email = $1', [DEMO.scrutineer]);
  // A component of the boat, through the model (the screens that register components are another part of the issue).
  const engine = await BoatComponent.create({
    kind: 'engine',
    maker: 'Test Motor Works',
    model: 'TM-6',
    serialNumber: `SN-${randomBytes(4).toString('hex')}`,
    boatId: entry.boatId,
    createdById: scrutineerId,
  });
  engineId = engine.id;
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
});
after(async () => {
  await sequelize?.close();
});

test('a batch is issued to a meeting with every seal at once; a number already in the register is a 409 naming it', async () => {
  const { res, body } = await issue(meetings[0], { prefix: PREFIX, firstNumber: 1, lastNumber: 20, note: 'test bag' });
  assert.equal(res.status, 201, JSON.stringify(body));
  assert.deepEqual([body.data.count, body.data.firstSeal, body.data.lastSeal], [20, `${PREFIX}01`, `${PREFIX}20`]);
  const rows = await query<{ n: string }>('select count(*) as n from seals where batch_id = $1', [body.data.id]);
  assert.equal(Number(rows[0].n), 20);

  // Another meeting's batch overlapping 15..20 is refused whole, naming the six numbers.
  const clash = await issue(meetings[1], { prefix: PREFIX.toLowerCase(), firstNumber: 15, lastNumber: 25 });
  assert.equal(clash.res.status, 409, JSON.stringify(clash.body));
  assert.equal(clash.body.error.code, 'seal_numbers_taken');
  assert.deepEqual(
    clash.body.error.details.numbers,
    [15, 16, 17, 18, 19, 20].map((n) => `${PREFIX}${n}`),
  );
  assert.match(clash.body.error.message, new RegExp(`${PREFIX}15`));
  const none = await query('select 1 from seal_batches where event_id = $1', [meetings[1].eventId]);
  assert.equal(none.length, 0, 'nothing of the refused batch is stored');

  const tooMany = await issue(meetings[1], { prefix: `${PREFIX}X`, firstNumber: 1, lastNumber: 1001 });
  assert.equal(tooMany.res.status, 400);
  assert.equal(tooMany.body.error.details[0].field, 'lastNumber');
  // A scrutineer may read the register but not issue seals (instrument.manage: chief scrutineer, organiser).
  const refused = await scrutineer.json(`/api/events/${meetings[1].eventId}/seal-batches`, {
    prefix: `${PREFIX}Y`,
    firstNumber: 1,
    lastNumber: 2,
  });
  assert.equal(refused.res.status, 403);
  // Attack finding F6: another organisation's register is its own. Its organiser issues the same numbers
  // to a meeting of theirs (accepted: no word about this club's register), and their clash names only
  // their own numbers.
  const [{ id: otherOrg }] = await query<{ id: string }>(
    `insert into organisations (id, name, slug, created_at, updated_at)
     values (gen_random_uuid(), $1, $2, now(), now()) returning id`,
    [`Seal Test Club ${PREFIX}`, `seal-test-club-${PREFIX.toLowerCase()}${Date.now()}`],
  );
  const rival = new HttpSession();
  const rivalEmail = uniqueEmail('seal-rival');
  await rival.json('/api/accounts', { name: 'Seal Rival', email: rivalEmail, password: 'seal-rival-password-1' });
  await query(
    `insert into organisation_members (id, organisation_id, user_id, role, created_at, updated_at)
     select gen_random_uuid(), $1, id, 'organiser', now(), now() from users where email = $2`,
    [otherOrg, rivalEmail],
  );
  assert.equal((await rival.signInWithPassword(rivalEmail, 'seal-rival-password-1')).status, 200);
  const rivalEvent = await rival.json('/api/events', {
    organisationId: otherOrg,
    name: `Seal Rival Meeting ${PREFIX}`,
    venue: 'Other Reach',
    startsOn: '2027-06-01',
    endsOn: '2027-06-02',
    timeZone: 'Pacific/Auckland',
    status: 'entries_open',
    waterKind: 'fresh',
    waterTemperatureC: 15,
    waterDensityKgM3: null,
    protestWindowMinutes: 30,
    currency: 'NZD',
    entryFeeMinor: 10000,
    protestFeeMinor: 3000,
  });
  assert.equal(rivalEvent.res.status, 201, JSON.stringify(rivalEvent.body));
  const rivalIssue = (body: unknown) => rival.json(`/api/events/${rivalEvent.body.data.id}/seal-batches`, body);
  const same = await rivalIssue({ prefix: PREFIX, firstNumber: 1, lastNumber: 30 });
  assert.equal(same.res.status, 201, JSON.stringify(same.body));
  const theirClash = await rivalIssue({ prefix: PREFIX, firstNumber: 29, lastNumber: 31 });
  assert.equal(theirClash.res.status, 409, JSON.stringify(theirClash.body));
  assert.deepEqual(theirClash.body.error.details.numbers, [`${PREFIX}29`, `${PREFIX}30`]);
  // And this club's 21..30 are still free for this club: the rival's 21..30 do not count here.
  const ours = await issue(meetings[0], { prefix: PREFIX, firstNumber: 21, lastNumber: 22 });
  assert.equal(ours.res.status, 201, JSON.stringify(ours.body));
  const issuers = await query<{ organisation_id: string }>(
    'select distinct organisation_id from seals where upper(number) = upper($1) order by 1',
    [`${PREFIX}21`],
  );
  assert.equal(issuers.length, 2, 'one seal KR-21 per register');

  // Batches for the next meetings, so each has seals of its own.
  for (const [i, m] of meetings.slice(1).entries()) {
    const r = await issue(m, { prefix: `${PREFIX}M${i + 2}-`, firstNumber: 1, lastNumber: 5 });
    assert.equal(r.res.status, 201, JSON.stringify(r.body));
  }
});

test('a seal applied at one meeting is found intact at a second, then broken at a third, and the third verdict shows the finding', async () => {
  const number = `${PREFIX}03`;
  const applied = await post(
    meetings[0],
    inspectionBody(entryAt[0], 101.9, {
      seals: { applied: [{ number: number.toLowerCase(), componentId: engineId, position: 'head bolt, port side' }] },
    }),
  );
  assert.equal(applied.res.status, 201, JSON.stringify(applied.body));
  assert.equal(applied.body.data.overallResult, 'conforms', 'applying a seal is no finding');
  let events = await sealEventsOf(number);
  assert.deepEqual(
    events.map((e) => [e.action, e.event_id, e.inspection_id, e.component_id, e.boat_id]),
    [['applied', meetings[0].eventId, applied.body.data.id, engineId, entry.boatId]],
  );
  assert.deepEqual(applied.body.data.measurements.sealActions, [
    {
      number,
      action: 'applied',
      componentId: engineId,
      component: applied.body.data.measurements.sealActions[0].component,
      position: 'head bolt, port side',
      reason: '',
    },
  ]);

  // At the second meeting the dock's card lists the seal on the boat's engine.
  const card = await scrutineer.fetch(`/api/events/${meetings[1].eventId}/race-numbers/200`);
  const cardBody = await card.json();
  assert.equal(card.status, 200, JSON.stringify(cardBody));
  assert.deepEqual(
    cardBody.data.seals.map((s: { number: string; componentId: string; position: string }) => [
      s.number,
      s.componentId,
      s.position,
    ]),
    [[number, engineId, 'head bolt, port side']],
  );
  const intact = await post(
    meetings[1],
    inspectionBody(entryAt[1], 101.9, { seals: { checks: [{ number, state: 'intact' }] } }),
  );
  assert.equal(intact.res.status, 201, JSON.stringify(intact.body));
  const intactRule = intact.body.data.rules.find((r: { rule: string }) => r.rule === `seal:${number}`);
  assert.equal(intactRule.verdict, 'conforms');
  assert.equal(intact.body.data.overallResult, 'conforms');

  const broken = await post(
    meetings[2],
    inspectionBody(entryAt[2], 101.9, { seals: { checks: [{ number, state: 'broken' }] } }),
  );
  assert.equal(broken.res.status, 201, JSON.stringify(broken.body));
  const rule = broken.body.data.rules.find((r: { rule: string }) => r.rule === `seal:${number}`);
  assert.equal(rule.verdict, 'does_not_conform');
  assert.match(rule.explanation, new RegExp(`Seal ${number} on the engine Test Motor Works TM-6, serial SN-`));
  assert.match(rule.explanation, /found broken/);
  assert.equal(broken.body.data.overallResult, 'does_not_conform', 'a broken seal is a finding against the boat');
  const [stored] = await query<{ overall_result: string }>('select overall_result from inspections where id = $1', [
    broken.body.data.id,
  ]);
  assert.equal(stored.overall_result, 'does_not_conform');

  events = await sealEventsOf(number);
  assert.deepEqual(
    events.map((e) => [e.action, e.event_id]),
    [
      ['applied', meetings[0].eventId],
      ['intact', meetings[1].eventId],
      ['broken', meetings[2].eventId],
    ],
  );
  // The seal's whole history as one list, read at the third meeting.
  const [{ id: sealId }] = await query<{ id: string }>('select id from seals where number = $1', [number]);
  const history = await scrutineer.fetch(`/api/events/${meetings[2].eventId}/seals/${sealId}`);
  const h = await history.json();
  assert.equal(history.status, 200, JSON.stringify(h));
  assert.deepEqual(
    h.data.events.map((e: { action: string; eventId: string; inspectionId: string; recordedBy: string }) => [
      e.action,
      e.eventId,
      e.inspectionId,
    ]),
    [
      ['applied', meetings[0].eventId, applied.body.data.id],
      ['intact', meetings[1].eventId, intact.body.data.id],
      ['broken', meetings[2].eventId, broken.body.data.id],
    ],
  );
  // The register shows the state from the latest event.
  const list = await scrutineer.fetch(`/api/events/${meetings[0].eventId}/seals?q=${encodeURIComponent(number)}`);
  const l = await list.json();
  assert.equal(list.status, 200, JSON.stringify(l));
  assert.deepEqual(
    l.data.seals.map((s: { number: string; lastAction: string }) => [s.number, s.lastAction]),
    [[number, 'broken']],
  );
  assert.match(l.data.seals[0].state, /^Broken \(engine Test Motor Works TM-6/);
  // The register screen shows the same history (server-rendered; streamed after its access check).
  const page = await scrutineer.fetch(`/inspect/${meetings[2].eventId}/seals?seal=${sealId}`);
  assert.equal(page.status, 200);
  const html = await page.text();
  assert.match(html, /data-testid="seal-history"/);
  for (const action of ['applied', 'intact', 'broken']) assert.match(html, new RegExp(`data-action="${action}"`));
  const entrant = new HttpSession();
  await entrant.signInWithPassword(DEMO.entrant, DEMO_PASSWORD);
  const refused = await entrant.fetch(`/inspect/${meetings[2].eventId}/seals`);
  assert.notEqual(refused.status, 200, 'an entrant does not open the register');
});

test('a seal not from this meeting’s batches, an unknown number or a used seal is refused by field; nothing is stored', async () => {
  const storedBefore = await query('select id from inspections where entry_id = $1', [entryAt[1]]);
  const cases: [string, RegExp][] = [
    [`${PREFIX}07`, /not in a batch issued to this meeting/], // issued to the first meeting
    [`${PREFIX}NOPE-1`, /not in a batch issued to this meeting/],
    [`${PREFIX}03`, /not in a batch issued to this meeting/],
  ];
  for (const [number, message] of cases) {
    const r = await post(
      meetings[1],
      inspectionBody(entryAt[1], 101.9, { seals: { applied: [{ number, componentId: engineId, position: 'sump' }] } }),
    );
    assert.equal(r.res.status, 400, JSON.stringify(r.body));
    assert.equal(r.body.error.details[0].field, 'seals.applied.0.number');
    assert.match(r.body.error.details[0].message, message);
  }
  // A seal of this meeting, used already (applied, then applied again).
  const first = await post(
    meetings[1],
    inspectionBody(entryAt[1], 101.9, {
      seals: { applied: [{ number: `${PREFIX}M2-1`, componentId: engineId, position: 'sump' }] },
    }),
  );
  assert.equal(first.res.status, 201, JSON.stringify(first.body));
  const again = await post(
    meetings[1],
    inspectionBody(entryAt[1], 101.9, {
      seals: { applied: [{ number: `${PREFIX}M2-1`, componentId: engineId, position: 'sump' }] },
    }),
  );
  assert.equal(again.res.status, 400);
  assert.match(again.body.error.details[0].message, /used already/);
  // A component of another boat, and a check of a seal that is not on this boat.
  const other = await meetings[1].addEntry(classIds[1]);
  const elsewhere = await post(
    meetings[1],
    inspectionBody(other.id, 101.9, {
      seals: {
        applied: [{ number: `${PREFIX}M2-2`, componentId: engineId, position: 'sump' }],
        checks: [{ number: `${PREFIX}03`, state: 'intact' }],
      },
    }),
  );
  assert.equal(elsewhere.res.status, 400);
  assert.deepEqual(elsewhere.body.error.details.map((d: { field: string }) => d.field).sort(), [
    'seals.applied.0.componentId',
    'seals.checks.0.number',
  ]);
  // The old free-text shape gets a clear refusal.
  const old = await post(
    meetings[1],
    inspectionBody(entryAt[1], 101.9, { seals: [{ number: 'S-1', location: 'pump' }] }),
  );
  assert.equal(old.res.status, 400);
  assert.match(old.body.error.message, /seals: Record seals as the register asks/);
  const afterRows = await query('select id from inspections where entry_id = $1', [entryAt[1]]);
  assert.equal(afterRows.length, storedBefore.length + 1, 'only the one accepted record was stored');
});

test('a replayed record (same key) writes its seal events once', async () => {
  const body = inspectionBody(entryAt[2], 101.9, {
    seals: { applied: [{ number: `${PREFIX}M3-1`, componentId: engineId, position: 'flywheel cover' }] },
  });
  const answers = [await post(meetings[2], body), await post(meetings[2], body)];
  const parallel = await Promise.all([post(meetings[2], body), post(meetings[2], body)]);
  assert.deepEqual(
    [...answers, ...parallel].map((a) => a.res.status),
    [201, 200, 200, 200],
  );
  assert.equal((await sealEventsOf(`${PREFIX}M3-1`)).length, 1);
  // The same key with different seals (a retry after an edit) still returns the stored record and writes nothing.
  const changed = await post(meetings[2], {
    ...body,
    seals: { applied: [{ number: `${PREFIX}M3-2`, componentId: engineId, position: 'x' }] },
  });
  assert.equal(changed.res.status, 200);
  assert.equal((await sealEventsOf(`${PREFIX}M3-2`)).length, 0);
});

test('removing a seal needs a reason; once removed it is no longer on the boat', async () => {
  const number = `${PREFIX}M3-1`;
  const noReason = await post(
    meetings[2],
    inspectionBody(entryAt[2], 101.9, { seals: { removed: [{ number, reason: '' }] } }),
  );
  assert.equal(noReason.res.status, 400);
  assert.equal(noReason.body.error.details[0].field, 'seals.removed.0.reason');
  const removed = await post(
    meetings[2],
    inspectionBody(entryAt[2], 101.9, {
      seals: { checks: [{ number, state: 'intact' }], removed: [{ number, reason: 'engine opened for repair' }] },
    }),
  );
  assert.equal(removed.res.status, 201, JSON.stringify(removed.body));
  const events = await query<{ action: string; reason: string }>(
    `select e.action, e.reason from seal_events e join seals s on s.id = e.seal_id where s.number = $1 order by e.created_at`,
    [number],
  );
  assert.deepEqual(
    events.map((e) => [e.action, e.reason]),
    [
      ['applied', ''],
      ['intact', ''],
      ['removed', 'engine opened for repair'],
    ],
  );
  const card = await (await scrutineer.fetch(`/api/events/${meetings[2].eventId}/race-numbers/201`)).json();
  assert.ok(!card.data.seals.some((s: { number: string }) => s.number === number), 'a removed seal is not listed');
});

test('a photo of a seal applied at the dock is attached to its event once; nothing else of the event can change', async () => {
  const number = `${PREFIX}M3-3`;
  const rec = await post(
    meetings[2],
    inspectionBody(entryAt[2], 101.9, {
      seals: { applied: [{ number, componentId: engineId, position: 'timing cover' }] },
    }),
  );
  assert.equal(rec.res.status, 201, JSON.stringify(rec.body));
  const url = `/api/events/${meetings[2].eventId}/inspections/${rec.body.data.id}/photos`;
  // Photos are real PNG files (a QR code image; the type is detected from the bytes, W3C PNG §5.2).
  const png = (text: string) => QRCode.toBuffer(text, { type: 'png' });
  const form = (bytes: Buffer, seal: string) => {
    const f = new FormData();
    f.append('photo', new Blob([new Uint8Array(bytes)], { type: 'image/png' }), 'seal.png');
    f.append('sealNumber', seal);
    return f;
  };
  const photo = await png(`seal ${number}`);
  const unknown = await scrutineer.fetch(url, { method: 'POST', body: form(photo, `${PREFIX}03`) });
  assert.equal(unknown.status, 400, 'a seal this inspection did not record');
  assert.equal((await unknown.json()).error.details[0].field, 'sealNumber');
  const first = await scrutineer.fetch(url, { method: 'POST', body: form(photo, number.toLowerCase()) });
  const firstBody = await first.json();
  assert.equal(first.status, 201, JSON.stringify(firstBody));
  const retry = await scrutineer.fetch(url, { method: 'POST', body: form(photo, number) });
  assert.equal(retry.status, 201, 'the same photo again (an offline retry) is answered as before');
  const other = await scrutineer.fetch(url, { method: 'POST', body: form(await png('another photo'), number) });
  assert.equal(other.status, 409, 'a second, different photo for the same seal is refused');
  const [event] = await query<{ id: string; photo_id: string }>(
    `select e.id, e.photo_id from seal_events e join seals s on s.id = e.seal_id where s.number = $1`,
    [number],
  );
  assert.equal(event.photo_id, firstBody.data[0].id);
  // The database allows only that one change: the photo again, or any other column, is refused.
  const elsewhere = await post(meetings[2], inspectionBody(entryAt[2], 101.9));
  const plain = new FormData();
  plain.append('photo', new Blob([new Uint8Array(await png('another record'))], { type: 'image/png' }), 'p.png');
  const up = await scrutineer.fetch(`/api/events/${meetings[2].eventId}/inspections/${elsewhere.body.data.id}/photos`, {
    method: 'POST',
    body: plain,
  });
  const otherPhotoId = (await up.json()).data[0].id;
  await assert.rejects(
    query('update seal_events set photo_id = $2 where id = $1', [event.id, otherPhotoId]),
    /append-only/,
    'a photo already set is never replaced',
  );
  const [bare] = await query<{ id: string }>(
    `select e.id from seal_events e join seals s on s.id = e.seal_id where s.number = $1 and e.action = 'applied'`,
    [`${PREFIX}03`],
  );
  await assert.rejects(
    query('update seal_events set photo_id = $2 where id = $1', [bare.id, otherPhotoId]),
    /append-only/,
    'a photo of another inspection is refused',
  );
  await assert.rejects(query(`update seal_events set reason = 'x' where id = $1`, [event.id]), /append-only/);
  const history = await (
    await scrutineer.fetch(
      `/api/events/${meetings[2].eventId}/seals/${(await query<{ id: string }>('select id from seals where number = $1', [number]))[0].id}`,
    )
  ).json();
  assert.equal(history.data.events[0].photoId, firstBody.data[0].id);
});

test('seal batches, seals and seal events refuse UPDATE and DELETE (append-only triggers)', async () => {
  const [batch] = await query<{ id: string }>('select id from seal_batches where event_id = $1', [meetings[0].eventId]);
  const [seal] = await query<{ id: string }>('select id from seals where batch_id = $1 limit 1', [batch.id]);
  const [event] = await query<{ id: string }>('select id from seal_events where event_id = $1 limit 1', [
    meetings[0].eventId,
  ]);
  for (const [table, id, set] of [
    ['seal_batches', batch.id, "note = 'changed'"],
    ['seals', seal.id, "number = 'CHANGED'"],
    ['seal_events', event.id, "action = 'intact'"],
  ] as const) {
    await assert.rejects(query(`update ${table} set ${set} where id = $1`, [id]), /append-only|never/i, table);
    await assert.rejects(query(`delete from ${table} where id = $1`, [id]), /append-only|never/i, table);
  }
});

test('power evidence: the kind is stored, and a dyno sheet must be one of this boat’s own documents', async () => {
  const other = await meetings[0].addEntry(classIds[0]);
  const doc = async (boatId: string, fileName: string) =>
    (
      await query<{ id: string }>(
        `insert into boat_documents (boat_id, uploaded_by_id, kind, object_key, file_name, content_type, size_bytes, sha256)
         values ($1, (select owner_id from boats where id = $1), 'dyno_sheet', $2, $3, 'application/pdf', 1000, $4) returning id`,
        [boatId, `test/${randomUUID()}`, fileName, randomBytes(32).toString('hex')],
      )
    )[0].id;
  const foreign = await doc(other.boatId, 'other-boat-dyno.pdf');
  const own = await doc(entry.boatId, 'own-dyno.pdf');
  const power = (dynoDocumentId: string) => ({
    declaredKw: 220,
    evidenceSeen: true,
    evidenceKind: 'dyno_sheet',
    dynoDocumentId,
  });
  const refused = await post(meetings[0], inspectionBody(entryAt[0], 101.9, { power: power(foreign) }));
  assert.equal(refused.res.status, 400, JSON.stringify(refused.body));
  assert.equal(refused.body.error.details[0].field, 'power.dynoDocumentId');
  const ok = await post(meetings[0], inspectionBody(entryAt[0], 101.9, { power: power(own) }));
  assert.equal(ok.res.status, 201, JSON.stringify(ok.body));
  assert.deepEqual(
    [ok.body.data.measurements.power.evidenceKind, ok.body.data.measurements.power.dynoDocument],
    ['dyno_sheet', { id: own, fileName: 'own-dyno.pdf' }],
  );
  // Declaration only with "evidence seen" contradicts itself.
  const contradiction = await post(
    meetings[0],
    inspectionBody(entryAt[0], 101.9, {
      power: { declaredKw: 220, evidenceSeen: true, evidenceKind: 'declaration_only' },
    }),
  );
  assert.equal(contradiction.res.status, 400);
  assert.equal(contradiction.body.error.details[0].field, 'power.evidenceKind');
});

test('the migration carries free-text seals into the register where they can be read, and keeps the rest as notes', async () => {
  const a = await meetings[0].addEntry(classIds[0]);
  const b = await meetings[0].addEntry(classIds[0]);
  const base = await post(meetings[0], inspectionBody(a.id, 101.9));
  assert.equal(base.res.status, 201);
  const n = `FT${randomBytes(3).toString('hex').toUpperCase()}-1`;
  // Records as they were written before the register: the same columns, a free-text seals list.
  const oldRow = async (entryId: string, boatId: string, minutesAgo: number, seals: unknown[]) =>
    (
      await query<{ id: string }>(
        `insert into inspections (event_id, entry_id, boat_id, class_id, rule_version_id, kind, recorded_by_id, device, idempotency_key,
                                  captured_at, measurements, results, overall_result, notes)
         select event_id, $2, $3, class_id, rule_version_id, kind, recorded_by_id, device, gen_random_uuid(),
                now() - make_interval(mins => $4::int), jsonb_set(measurements, '{seals}', $5::jsonb), results, overall_result, 'before the register'
           from inspections where id = $1 returning id`,
        [base.body.data.id, entryId, boatId, minutesAgo, JSON.stringify(seals)],
      )
    )[0].id;
  const first = await oldRow(a.id, a.boatId, 30, [
    { number: n.toLowerCase(), location: 'pump housing' },
    { number: 'seal on the left #2', location: 'transom' },
  ]);
  const second = await oldRow(a.id, a.boatId, 20, [{ number: n, location: 'pump housing' }]);
  const third = await oldRow(b.id, b.boatId, 10, [{ number: n, location: 'engine' }]);

  const written = await carry.carryFreeTextSeals(sequelize, { inspectionIds: [first, second, third] });
  assert.deepEqual(written, { seals: 1, events: 2, notes: 2 });
  const events = await query<Record<string, unknown>>(
    `select e.action, e.position, e.inspection_id, e.event_id, e.boat_id, e.recorded_by_id = i.recorded_by_id as "byRecorder",
            e.created_at = i.captured_at as "atCapture", s.batch_id
       from seal_events e join seals s on s.id = e.seal_id join inspections i on i.id = e.inspection_id
      where s.number = $1 order by e.created_at`,
    [n],
  );
  assert.deepEqual(events, [
    {
      action: 'applied',
      position: 'pump housing',
      inspection_id: first,
      event_id: meetings[0].eventId,
      boat_id: a.boatId,
      byRecorder: true,
      atCapture: true,
      batch_id: null,
    },
    {
      action: 'intact',
      position: 'pump housing',
      inspection_id: second,
      event_id: meetings[0].eventId,
      boat_id: a.boatId,
      byRecorder: true,
      atCapture: true,
      batch_id: null,
    },
  ]);
  const notes = await query<{ boat_id: string; category: string; body: string; author_id: string; event_id: string }>(
    `select boat_id, category, body, author_id, event_id from boat_log_notes where body like '%' || $1 || '%' or body like '%' || $2 || '%' order by created_at`,
    [first, third],
  );
  assert.equal(notes.length, 2);
  assert.deepEqual(
    notes.map((x) => [x.boat_id, x.category, x.author_id, x.event_id]),
    [
      [a.boatId, 'observation', scrutineerId, meetings[0].eventId],
      [b.boatId, 'observation', scrutineerId, meetings[0].eventId],
    ],
  );
  assert.match(
    notes[0].body,
    new RegExp(`inspection ${first}.*not a plausible seal number.*seal on the left #2.*transom`),
  );
  assert.match(notes[1].body, new RegExp(`inspection ${third}.*another boat.*${n}`));
  // Run again: nothing more is written.
  assert.deepEqual(await carry.carryFreeTextSeals(sequelize, { inspectionIds: [first, second, third] }), {
    seals: 0,
    events: 0,
    notes: 0,
  });
});

test('leading zeros do not make another seal: "Z-01" and "Z-1" are one number in the register and at the dock', async () => {
  // Attack finding F13: a batch of 1–2 printed Z-1, Z-2 and a batch of 1–10 printed Z-01 … Z-10 without a
  // clash, and a scrutineer typing "Z-1" for the seal printed "Z-01" named another seal.
  const prefix = `${PREFIX}Z-`;
  const small = await issue(meetings[0], { prefix, firstNumber: 1, lastNumber: 2 });
  assert.equal(small.res.status, 201, JSON.stringify(small.body));
  const padded = await issue(meetings[0], { prefix, firstNumber: 1, lastNumber: 10 });
  assert.equal(padded.res.status, 409, JSON.stringify(padded.body));
  assert.deepEqual(padded.body.error.details.numbers, [`${prefix}1`, `${prefix}2`]);
  // The batch body is strict: an unknown field is refused, not ignored.
  const extra = await issue(meetings[0], { prefix, firstNumber: 3, lastNumber: 4, extra: 1 });
  assert.equal(extra.res.status, 400, JSON.stringify(extra.body));
  // Typed with zeros at the dock, the seal printed Z-2 is found and recorded under its printed number.
  const r = await post(
    meetings[0],
    inspectionBody(entry.id, 101.9, {
      seals: { applied: [{ number: `${prefix}002`, componentId: engineId, position: 'intake grille' }] },
    }),
  );
  assert.equal(r.res.status, 201, JSON.stringify(r.body));
  const events = await sealEventsOf(`${prefix}2`);
  assert.deepEqual(
    events.map((e) => [e.action, e.event_id]),
    [['applied', meetings[0].eventId]],
  );
});

test('photos of one seal sent at once: the first becomes its photo, the others are refused and not stored', async () => {
  // Attack finding F12: parallel uploads of different photos were all answered 201 as the seal's photo.
  const number = `${PREFIX}M3-4`;
  const rec = await post(
    meetings[2],
    inspectionBody(entryAt[2], 101.9, {
      seals: { applied: [{ number, componentId: engineId, position: 'pump bowl' }] },
    }),
  );
  assert.equal(rec.res.status, 201, JSON.stringify(rec.body));
  const url = `/api/events/${meetings[2].eventId}/inspections/${rec.body.data.id}/photos`;
  const upload = async (i: number) => {
    const f = new FormData();
    const bytes = await QRCode.toBuffer(`parallel photo ${i} ${number}`, { type: 'png' });
    f.append('photo', new Blob([new Uint8Array(bytes)], { type: 'image/png' }), `seal-${i}.png`);
    f.append('sealNumber', number);
    return scrutineer.fetch(url, { method: 'POST', body: f });
  };
  const answers = await Promise.all([0, 1, 2, 3, 4].map(upload));
  const statuses = answers.map((a) => a.status).sort();
  assert.deepEqual(statuses, [201, 409, 409, 409, 409]);
  const winner = await answers.find((a) => a.status === 201)!.json();
  const [event] = await query<{ photo_id: string }>(
    `select e.photo_id from seal_events e join seals s on s.id = e.seal_id where s.number = $1`,
    [number],
  );
  assert.equal(event.photo_id, winner.data[0].id);
  const photos = await query('select id from inspection_photos where inspection_id = $1', [rec.body.data.id]);
  assert.equal(photos.length, 1, 'the refused photos are not stored');
});
