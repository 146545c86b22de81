// Incidents through the HTTP API and the database: the organiser or the chief scrutineer records what
// happened to a boat; damage makes a re-inspection mandatory before its next run (a task on the board,
// named by the incident, in the boat's logbook); a correction is a new record; photos are stored like the
// dock's (type from the bytes: PNG signature, W3C PNG §5.2); nothing can be edited or deleted. That a
// damaged boat is inspected again before it races is common practice, no source; the local rulebook governs.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { randomUUID } from 'node:crypto';
import QRCode from 'qrcode';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { extractPdfText } from '../support/pdf-text';
import { InspectionMeeting, rulesWith, type TestEntry } from '../support/inspection-meeting';

const meeting = new InspectionMeeting();
const chief = new HttpSession();
const scrutineer = new HttpSession();
const steward = new HttpSession();
const entrant = new HttpSession();
let classId = '';
const url = () => `/api/events/${meeting.eventId}/incidents`;
const minutesAgo = (m: number) => new Date(Date.now() - m * 60_000).toISOString();
const incident = (entryId: string, over: Record<string, unknown> = {}) => ({
  entryId,
  occurredAt: minutesAgo(20),
  description: 'Rolled at the second hairpin; starboard sponson cracked.',
  damage: true,
  ...over,
});
const openTasks = async (entryId: string) =>
  query<{ id: string; reason: string }>(
    'select id, reason from reinspections where entry_id = $1 and done_at is null',
    [entryId],
  );

before(async () => {
  await meeting.create(`Incidents Meeting ${Date.now()}`, [
    { email: DEMO.chief, role: 'chief_scrutineer' },
    { email: DEMO.scrutineer, role: 'scrutineer' },
    { email: DEMO.steward, role: 'steward' },
  ]);
  // The meeting runs from yesterday to tomorrow (UTC), so an incident a few minutes ago is on its days.
  await query(
    `update events set time_zone = 'UTC', starts_on = current_date - 1, ends_on = current_date + 1 where id = $1`,
    [meeting.eventId],
  );
  classId = await meeting.addClass('IN', rulesWith());
  for (const [s, email] of [
    [chief, DEMO.chief],
    [scrutineer, DEMO.scrutineer],
    [steward, DEMO.steward],
    [entrant, DEMO.entrant],
  ] as const)
    assert.equal((await s.signInWithPassword(email, DEMO_PASSWORD)).status, 200);
});

test('an incident with damage forces a re-inspection, linked to it, on the board and in the boat’s logbook', async () => {
  const entry: TestEntry = await meeting.addEntry(classId);
  const r = await chief.json(url(), incident(entry.id));
  assert.equal(r.res.status, 201, JSON.stringify(r.body));
  assert.equal(r.body.data.damage, true);
  assert.ok(r.body.data.reinspection?.id, 'a task is named');
  assert.equal(r.body.data.reinspection.doneAt, null);
  const tasks = await openTasks(entry.id);
  assert.equal(tasks.length, 1);
  assert.equal(tasks[0].id, r.body.data.reinspection.id);
  assert.match(tasks[0].reason, /Incident with damage/);
  assert.match(tasks[0].reason, /sponson cracked/);
  // The board's list of open tasks carries it.
  const board = await scrutineer.fetch(`/api/events/${meeting.eventId}/reinspections?open=1`);
  const open = (await board.json()).data as { id: string; entryId: string }[];
  assert.ok(open.some((t) => t.id === r.body.data.reinspection.id && t.entryId === entry.id));
  // The boat's logbook (its history, printed as a PDF) lists the task with the incident's reason.
  const [{ id: boatId }] = await query<{ id: string }>('select boat_id as id from entries where id = $1', [entry.id]);
  const log = await chief.fetch(`/api/boats/${boatId}/logbook/pdf`);
  assert.equal(log.status, 200);
  const logText = (await extractPdfText(new Uint8Array(await log.arrayBuffer()))).join('\n');
  assert.match(logText, /Incident with damage, /, 'the re-inspection task, with the incident as its reason');
  assert.match(logText, /Incident with damage: Rolled/, 'the incident itself, an item of the history');

  // A second damage incident of the same boat joins the open task; one without damage opens none.
  const second = await chief.json(url(), incident(entry.id, { description: 'Touched the buoy at the finish.' }));
  assert.equal(second.body.data.reinspection.id, r.body.data.reinspection.id);
  const other = await meeting.addEntry(classId);
  const noDamage = await chief.json(
    url(),
    incident(other.id, { damage: false, description: 'Stalled on the start line.' }),
  );
  assert.equal(noDamage.res.status, 201);
  assert.equal(noDamage.body.data.reinspection, null);
  assert.equal((await openTasks(other.id)).length, 0);
});

test('the organiser records one too, and the damage still opens the task', async () => {
  const entry = await meeting.addEntry(classId);
  const r = await meeting.organiser.json(url(), incident(entry.id));
  assert.equal(r.res.status, 201, JSON.stringify(r.body));
  assert.equal((await openTasks(entry.id)).length, 1);
});

test('a correction is a new record that supersedes; the original stays; only the newest may be corrected', async () => {
  const entry = await meeting.addEntry(classId);
  const first = await chief.json(url(), incident(entry.id, { damage: false, description: 'Spun out.' }));
  const fix = await chief.json(
    url(),
    incident(entry.id, { supersedesId: first.body.data.id, correctionReason: 'The hull was holed after all.' }),
  );
  assert.equal(fix.res.status, 201, JSON.stringify(fix.body));
  assert.equal(fix.body.data.supersedesId, first.body.data.id);
  assert.ok(fix.body.data.reinspection, 'the corrected damage opens the task');
  const list = (await (await chief.fetch(url())).json()).data as { id: string; isCurrent: boolean }[];
  assert.equal(list.find((i) => i.id === first.body.data.id)?.isCurrent, false);
  assert.equal(list.find((i) => i.id === fix.body.data.id)?.isCurrent, true);
  const twice = await chief.json(
    url(),
    incident(entry.id, { supersedesId: first.body.data.id, correctionReason: 'x y z' }),
  );
  assert.equal(twice.res.status, 409);
  const noReason = await chief.json(url(), incident(entry.id, { supersedesId: fix.body.data.id }));
  assert.equal(noReason.res.status, 400);
  assert.equal(noReason.body.error.details[0].field, 'correctionReason');
  const otherBoat = await meeting.addEntry(classId);
  const wrongBoat = await chief.json(
    url(),
    incident(otherBoat.id, { supersedesId: fix.body.data.id, correctionReason: 'Wrong boat.' }),
  );
  assert.equal(wrongBoat.res.status, 400);
  assert.equal(wrongBoat.body.error.details[0].field, 'supersedesId');
});

test('incidents are append-only: 405 on the API, refused by the database', async () => {
  const entry = await meeting.addEntry(classId);
  const r = await chief.json(url(), incident(entry.id, { damage: false }));
  for (const method of ['PUT', 'PATCH', 'DELETE']) {
    const res = await chief.fetch(url(), { method, headers: { 'content-type': 'application/json' }, body: '{}' });
    assert.equal(res.status, 405, method);
    assert.match(res.headers.get('allow') ?? '', /POST/);
  }
  await assert.rejects(query(`update incidents set damage = true where id = $1`, [r.body.data.id]), /append-only/);
  await assert.rejects(query(`delete from incidents where id = $1`, [r.body.data.id]), /append-only/);
  // Damage without its task cannot be stored, whatever writes the row.
  const [{ id: userId }] = await query<{ id: string }>('select id from users where email = $1', [DEMO.chief]);
  await assert.rejects(
    query(
      `insert into incidents (event_id, entry_id, occurred_at, description, damage, recorded_by_id) values ($1, $2, now(), 'abc', true, $3)`,
      [meeting.eventId, entry.id, userId],
    ),
    /incidents_damage_task_check/,
  );
});

test('photos are stored once each, checked from their bytes; only those who record incidents add them', async () => {
  const entry = await meeting.addEntry(classId);
  const r = await chief.json(url(), incident(entry.id));
  const photosUrl = `${url()}/${r.body.data.id}/photos`;
  const png = await QRCode.toBuffer(`incident ${r.body.data.id}`, { type: 'png' });
  const form = (bytes: Buffer, name: string, type: string) => {
    const f = new FormData();
    f.append('photo', new Blob([new Uint8Array(bytes)], { type }), name);
    return f;
  };
  const up = await chief.fetch(photosUrl, { method: 'POST', body: form(png, 'hull.png', 'image/png') });
  const upBody = await up.json();
  assert.equal(up.status, 201, JSON.stringify(upBody));
  assert.equal(upBody.data[0].contentType, 'image/png');
  const again = await chief.fetch(photosUrl, { method: 'POST', body: form(png, 'hull-again.png', 'image/png') });
  assert.equal((await again.json()).data[0].id, upBody.data[0].id, 'the same photo twice is stored once');
  const fake = await chief.fetch(photosUrl, {
    method: 'POST',
    body: form(Buffer.from('<script>alert(1)</script>'), 'hull.png', 'image/png'),
  });
  assert.ok([400, 415].includes(fake.status), `a script named .png: ${fake.status}`);
  await fake.arrayBuffer();
  const bySteward = await steward.fetch(photosUrl, { method: 'POST', body: form(png, 'hull.png', 'image/png') });
  assert.equal(bySteward.status, 403);
  await bySteward.arrayBuffer();
  const missing = await chief.fetch(`${url()}/${randomUUID()}/photos`, {
    method: 'POST',
    body: form(png, 'hull.png', 'image/png'),
  });
  assert.equal(missing.status, 404);
  await missing.arrayBuffer();
  const list = (await (await scrutineer.fetch(url())).json()).data as { id: string; photos: unknown[] }[];
  assert.equal(list.find((i) => i.id === r.body.data.id)?.photos.length, 1);
  await assert.rejects(query('delete from incident_photos where incident_id = $1', [r.body.data.id]), /append-only/);
});

test('refused: entrants and stewards, times off the meeting or in the future, unknown boats, huge bodies; nothing stored', async () => {
  const entry = await meeting.addEntry(classId);
  assert.equal((await entrant.json(url(), incident(entry.id))).res.status, 403);
  assert.equal((await steward.json(url(), incident(entry.id))).res.status, 403);
  assert.equal((await scrutineer.json(url(), incident(entry.id))).res.status, 403);
  assert.equal((await entrant.fetch(url())).status, 403, 'entrants do not read the officials’ incidents');
  assert.equal((await new HttpSession().json(url(), incident(entry.id))).res.status, 401);
  const elsewhere = new InspectionMeeting();
  await elsewhere.create(`Elsewhere ${Date.now()}`, []);
  const foreign = await elsewhere.addEntry(await elsewhere.addClass('EL', rulesWith()));
  const cases: [Record<string, unknown>, string][] = [
    [{ occurredAt: '2020-05-01T10:00:00Z' }, 'occurredAt'],
    [{ occurredAt: new Date(Date.now() + 3_600_000).toISOString() }, 'occurredAt'],
    [{ occurredAt: 'yesterday' }, 'occurredAt'],
    [{ entryId: foreign.id }, 'entryId'],
    [{ entryId: randomUUID() }, 'entryId'],
    [{ description: 'x'.repeat(4001) }, 'description'],
    [{ description: ' ' }, 'description'],
    [{ damage: 'yes' }, 'damage'],
  ];
  for (const [over, field] of cases) {
    const r = await chief.json(url(), incident(entry.id, over));
    assert.equal(r.res.status, 400, `${JSON.stringify(over).slice(0, 60)}: ${JSON.stringify(r.body)}`);
    assert.equal(r.body.error.details[0].field, field);
  }
  const huge = await chief.fetch(url(), {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify(incident(entry.id, { description: 'x'.repeat(3 * 1024 * 1024) })),
  });
  assert.equal(huge.status, 413);
  await huge.arrayBuffer();
  assert.equal((await query('select id from incidents where entry_id = $1', [entry.id])).length, 0);
  assert.equal((await openTasks(entry.id)).length, 0);
});
