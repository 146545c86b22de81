// The meeting's instruments through the HTTP API: the chief scrutineer adds and retires them, a
// scrutineer may only read; a retired instrument leaves the dock's list and records naming it are
// refused; another meeting's instrument is "not found" (no cross-meeting retiring).
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { InspectionMeeting, inspectionBody, rulesWith, type TestEntry } from '../support/inspection-meeting';

let meeting: InspectionMeeting;
let entry: TestEntry;
const chief = new HttpSession();
const scrutineer = new HttpSession();

before(async () => {
  meeting = await new InspectionMeeting().create(`Instruments ${Date.now()}`, [
    { email: DEMO.chief, role: 'chief_scrutineer' },
    { email: DEMO.scrutineer, role: 'scrutineer' },
  ]);
  const classId = await meeting.addClass('IN', rulesWith());
  entry = await meeting.addEntry(classId);
  await chief.signInWithPassword(DEMO.chief, DEMO_PASSWORD);
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
});

const caliper = {
  name: 'Caliper 300 mm',
  quantity: 'length',
  errorLimit: 0.02,
  resolution: 0.01,
  expandedUncertainty: null,
};

test('the chief scrutineer adds an instrument; a scrutineer may not, and bad input names its field', async () => {
  const added = await chief.json(`/api/events/${meeting.eventId}/instruments`, caliper);
  assert.equal(added.res.status, 201, JSON.stringify(added.body));
  assert.equal(added.body.data.retiredAt, null);
  // U = 2·√(a²/3 + δ²/12) with a 0.02 mm, δ 0.01 mm (JCGM 100:2008 4.3.7, F.2.2.1; k = 2) = 0.02380 mm
  assert.ok(
    Math.abs(added.body.data.appliedExpandedUncertainty - 2 * Math.sqrt(0.02 ** 2 / 3 + 0.01 ** 2 / 12)) < 1e-12,
  );
  const refused = await scrutineer.json(`/api/events/${meeting.eventId}/instruments`, caliper);
  assert.equal(refused.res.status, 403);
  const bad = await chief.json(`/api/events/${meeting.eventId}/instruments`, { name: 'X', quantity: 'volume' });
  assert.equal(bad.res.status, 400);
  assert.ok(bad.body.error.details.some((d: { field: string }) => d.field === 'quantity'));
});

test('retiring takes it off the dock list, refuses new records that name it, and cannot be repeated', async () => {
  const added = await chief.json(`/api/events/${meeting.eventId}/instruments`, {
    ...caliper,
    name: `Retire me ${Date.now()}`,
  });
  const id = added.body.data.id as string;
  const byScrutineer = await scrutineer.json(`/api/events/${meeting.eventId}/instruments/${id}/retire`, {});
  assert.equal(byScrutineer.res.status, 403, 'a scrutineer cannot retire');
  const retired = await chief.json(`/api/events/${meeting.eventId}/instruments/${id}/retire`, {});
  assert.equal(retired.res.status, 200, JSON.stringify(retired.body));
  assert.ok(retired.body.data.retiredAt);
  const again = await chief.json(`/api/events/${meeting.eventId}/instruments/${id}/retire`, {});
  assert.equal(again.res.status, 409);
  assert.equal(again.body.error.code, 'conflict');

  const list = await scrutineer.fetch(`/api/events/${meeting.eventId}/instruments`);
  const ids = ((await list.json()).data as { id: string }[]).map((i) => i.id);
  assert.ok(!ids.includes(id), 'the dock is no longer offered it');

  const record = await scrutineer.json(
    `/api/events/${meeting.eventId}/inspections`,
    inspectionBody(entry.id, 101.9, {
      nozzle: {
        readings: [
          { diameterMm: 101.5, angleDeg: 0 },
          { diameterMm: 101.9, angleDeg: 60 },
          { diameterMm: 101.8, angleDeg: 120 },
        ],
        instrumentId: id,
      },
    }),
  );
  assert.equal(record.res.status, 400, JSON.stringify(record.body));
  assert.ok(record.body.error.details.some((d: { field: string }) => d.field === 'nozzle.instrumentId'));
});

test('another meeting’s instrument and an unknown id are not found; nothing changes', async () => {
  const [other] = await query<{ id: string }>(
    `select id from instruments where event_id = $1 and retired_at is null limit 1`,
    [DEMO.meetingId],
  );
  assert.ok(other, 'the demo meeting has an instrument in service');
  const cross = await chief.json(`/api/events/${meeting.eventId}/instruments/${other.id}/retire`, {});
  assert.equal(cross.res.status, 404);
  const [still] = await query<{ retired_at: Date | null }>('select retired_at from instruments where id = $1', [
    other.id,
  ]);
  assert.equal(still.retired_at, null);
  const unknown = await chief.json(`/api/events/${meeting.eventId}/instruments/not-a-uuid/retire`, {});
  assert.equal(unknown.res.status, 404);
  const anonymous = await new HttpSession().json(`/api/events/${meeting.eventId}/instruments/${other.id}/retire`, {});
  assert.equal(anonymous.res.status, 401);
});
