// Attack finding F7: a declaration edited between the scrutineer opening the boat card and pressing
// Record was filed as inspected. The dock now sends the declaration version it showed; a record of a
// version that is no longer the boat's is refused (409, both versions named, nothing stored), and one of
// the current version pins exactly that version. Through the real HTTP API and database; the boat and
// class figures are invented for this test.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { InspectionMeeting, inspectionBody, rulesWith, type TestEntry } from '../support/inspection-meeting';

const meeting = new InspectionMeeting();
const scrutineer = new HttpSession();
const owner = new HttpSession();
let entry: TestEntry;

before(async () => {
  await meeting.create(`Declaration Shown Meeting ${Date.now()}`, [{ email: DEMO.scrutineer, role: 'scrutineer' }]);
  const classId = await meeting.addClass('DS', rulesWith());
  entry = await meeting.addEntry(classId, { declaredPowerKw: 220 });
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
  await owner.signInWithPassword(DEMO.entrant, DEMO_PASSWORD);
});

const stored = async (key: string) =>
  (await query('select 1 from inspections where idempotency_key = $1', [key])).length;

test('a record of the version the card showed is refused once the owner has edited it, and kept when current', async () => {
  // The scrutineer opens the card: it shows declaration version 1 (the board's rows say the same).
  const card = await scrutineer.fetch(`/api/events/${meeting.eventId}/race-numbers/${entry.raceNumber}`);
  assert.equal(card.status, 200);
  assert.equal((await card.json()).data.boat.declarationVersion, 1);
  const board = await scrutineer.fetch(`/api/events/${meeting.eventId}/inspections`);
  const row = (await board.json()).data.rows.find((r: { entryId: string }) => r.entryId === entry.id);
  assert.equal(row.declarationVersion, 1);

  // Meanwhile the owner changes the declared power: version 2.
  const patched = await owner.json(`/api/boats/${entry.boatId}`, { power: 240, powerUnit: 'kW' }, 'PATCH');
  assert.equal(patched.res.status, 200, JSON.stringify(patched.body));

  // Recording against version 1 now: 409 naming both versions, and nothing stored.
  const stale = { ...inspectionBody(entry.id, 101.9), declarationVersion: 1 };
  const refused = await scrutineer.json(`/api/events/${meeting.eventId}/inspections`, stale);
  assert.equal(refused.res.status, 409, JSON.stringify(refused.body));
  assert.equal(refused.body.error.code, 'declaration_changed');
  assert.match(refused.body.error.message, /version 1\b.*version 2\b/);
  assert.equal(await stored(stale.idempotencyKey), 0);
  const [{ count }] = await query<{ count: string }>('select count(*) from inspections where entry_id = $1', [
    entry.id,
  ]);
  assert.equal(Number(count), 0);

  // The reloaded card shows version 2; the same record (same key, as the dock resends it) against it is kept and pins it.
  const reloaded = await scrutineer.fetch(`/api/events/${meeting.eventId}/race-numbers/${entry.raceNumber}`);
  assert.equal((await reloaded.json()).data.boat.declarationVersion, 2);
  const current = await scrutineer.json(`/api/events/${meeting.eventId}/inspections`, {
    ...stale,
    declarationVersion: 2,
    power: { declaredKw: 240, evidenceSeen: true },
  });
  assert.equal(current.res.status, 201, JSON.stringify(current.body));
  const [pinned] = await query<{ version: number }>(
    `select d.version from inspections i join boat_declaration_versions d on d.id = i.declaration_version_id where i.id = $1`,
    [current.body.data.id],
  );
  assert.equal(pinned.version, 2);
});

test('a version the boat never had is refused the same way, and a record without one (an older client) is kept', async () => {
  const ahead = { ...inspectionBody(entry.id, 101.9), declarationVersion: 7 };
  const refused = await scrutineer.json(`/api/events/${meeting.eventId}/inspections`, ahead);
  assert.equal(refused.res.status, 409);
  assert.match(refused.body.error.message, /version 7\b.*version 2\b/);
  assert.equal(await stored(ahead.idempotencyKey), 0);
  const older = await scrutineer.json(`/api/events/${meeting.eventId}/inspections`, inspectionBody(entry.id, 101.9));
  assert.equal(older.res.status, 201, JSON.stringify(older.body));
});
