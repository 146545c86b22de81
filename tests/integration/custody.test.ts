// Parts in the officials' custody, through the HTTP API and the database: a scrutineer takes a part
// at the dock (bad race number refused beside its field, nothing stored), only the chief scrutineer
// or a steward releases it, never while the protest it is kept for is open (parts are held pending
// protests: common practice, no single source), once only; the records are append-only.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { randomUUID } from 'node:crypto';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { InspectionMeeting, rulesWith, type TestEntry } from '../support/inspection-meeting';

const meeting = new InspectionMeeting();
const scrutineer = new HttpSession();
const steward = new HttpSession();
const entrant = new HttpSession();
let entry: TestEntry;
const url = () => `/api/events/${meeting.eventId}/custody`;
const count = async () =>
  Number(
    (await query<{ n: string }>('select count(*) as n from custody_items where event_id = $1', [meeting.eventId]))[0].n,
  );

before(async () => {
  await meeting.create(`Custody Meeting ${Date.now()}`, [
    { email: DEMO.scrutineer, role: 'scrutineer' },
    { email: DEMO.steward, role: 'steward' },
  ]);
  entry = await meeting.addEntry(await meeting.addClass('CU', rulesWith()));
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
  await steward.signInWithPassword(DEMO.steward, DEMO_PASSWORD);
  await entrant.signInWithPassword(DEMO.entrant, DEMO_PASSWORD);
});

test('take, refuse, release once; held pending an open protest; append-only', async () => {
  const unknown = await scrutineer.json(url(), { raceNumber: 9876, description: 'Impeller' });
  assert.equal(unknown.res.status, 400);
  assert.equal(unknown.body.error.details[0].field, 'raceNumber');
  const noPart = await scrutineer.json(url(), { raceNumber: entry.raceNumber, description: ' ' });
  assert.equal(noPart.body.error.details[0].field, 'description');
  assert.equal(await count(), 0, 'nothing stored for refused requests');

  const taken = await scrutineer.json(url(), {
    raceNumber: entry.raceNumber,
    description: 'Impeller, bent leading edge',
    sealNumber: 'BAG-0412',
  });
  assert.equal(taken.res.status, 201, JSON.stringify(taken.body));
  assert.equal(taken.body.data.raceNumber, entry.raceNumber);
  assert.equal(taken.body.data.sealNumber, 'BAG-0412');
  assert.equal(taken.body.data.release, null);
  assert.equal((await entrant.fetch(url())).status, 403, "an entrant does not read the officials' list");
  const byScrutineer = await scrutineer.json(`${url()}/${taken.body.data.id}/release`, { releasedTo: 'the entrant' });
  assert.equal(byScrutineer.res.status, 403, 'releasing is for the chief scrutineer or the stewards');

  // A part kept for an open protest stays until the stewards decide it.
  const [{ id: lodger }] = await query<{ id: string }>('select id from users where email = $1', [DEMO.entrant]);
  const [{ id: protestId }] = await query<{ id: string }>(
    `insert into protests (event_id, lodged_by_id, against_entry_id, matter_key, rule_reference, grounds, status, fee_minor, currency, paid_at, window_deadline)
     values ($1, $2, $3, $4, 'CU 3.1 impeller', 'Impeller swapped after inspection', 'lodged', 0, 'NZD', now(), now() + interval '1 hour') returning id`,
    [meeting.eventId, lodger, entry.id, `custody:${randomUUID()}`],
  );
  const otherMeetingProtest = await steward.json(url(), {
    raceNumber: entry.raceNumber,
    description: 'Nozzle insert',
    protestId: randomUUID(),
  });
  assert.equal(otherMeetingProtest.body.error.details[0].field, 'protestId');
  const kept = await steward.json(url(), {
    raceNumber: entry.raceNumber,
    description: 'Nozzle insert',
    sealNumber: 'BAG-0413',
    protestId,
  });
  assert.equal(kept.res.status, 201, JSON.stringify(kept.body));
  assert.equal(kept.body.data.protest.id, protestId);
  const protestPage = (
    await (await steward.fetch(`/stewards/${meeting.eventId}/protests/${protestId}`)).text()
  ).replace(/<!-- -->/g, '');
  assert.match(protestPage, /Parts kept for this protest/);
  assert.match(protestPage, /Nozzle insert \(seal\/bag BAG-0413\)/, 'the stewards see the part on the protest');
  const early = await steward.json(`${url()}/${kept.body.data.id}/release`, { releasedTo: 'the entrant' });
  assert.equal(early.res.status, 409);
  assert.equal(early.body.error.code, 'protest_pending');
  await query(`update protests set status = 'dismissed', decided_at = now() where id = $1`, [protestId]);
  const released = await steward.json(`${url()}/${kept.body.data.id}/release`, {
    releasedTo: 'Crew chief of no. ' + entry.raceNumber,
    note: 'Protest dismissed.',
  });
  assert.equal(released.res.status, 200, JSON.stringify(released.body));
  assert.match(released.body.data.release.releasedTo, /Crew chief/);
  const twice = await steward.json(`${url()}/${kept.body.data.id}/release`, { releasedTo: 'someone else' });
  assert.equal(twice.res.status, 409);
  assert.equal(twice.body.error.code, 'already_released');

  const list = (await (await scrutineer.fetch(url())).json()).data as { id: string; release: unknown }[];
  assert.deepEqual(
    list.map((i) => i.id),
    [taken.body.data.id, kept.body.data.id],
    'held first, then released',
  );
  await assert.rejects(
    query(`update custody_items set description = 'changed' where id = $1`, [taken.body.data.id]),
    /append-only/,
  );
  await assert.rejects(query('delete from custody_releases where item_id = $1', [kept.body.data.id]), /append-only/);
});
