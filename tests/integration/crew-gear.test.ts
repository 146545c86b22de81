// Crew and dated gear per entry through the HTTP API and the database (issue 21, items 1 and 2). The
// meeting runs in Pacific/Kiritimati (UTC+14:00 all year, IANA tz database), the zone furthest ahead of
// UTC, so its calendar day is often not UTC's. The day rule checked here — an item is valid through the
// end of its date in the meeting's zone, expired from the next day there — is common practice, no source;
// so is 18 as the age under which a guardian's consent is asked. Body size limit: 64 KB for this route
// (413 past it: RFC 9110, 15.5.14 "413 Content Too Large"). Control characters refused in any text:
// Unicode Standard Annex #9 and CVE-2021-42574 for the direction controls; NUL cannot be stored in
// PostgreSQL text (PostgreSQL documentation, 8.3 Character Types).
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { query } from '../support/db';
import { InspectionMeeting, inspectionBody, rulesWith, type TestEntry } from '../support/inspection-meeting';

const ZONE = 'Pacific/Kiritimati';
const dayInZone = (offsetDays = 0) =>
  new Intl.DateTimeFormat('en-CA', { timeZone: ZONE }).format(new Date(Date.now() + offsetDays * 86_400_000));

let meeting: InspectionMeeting;
let classId: string;
let entry: TestEntry;
let otherEntry: TestEntry;
const entrant = new HttpSession();
const chief = new HttpSession();
const scrutineer = new HttpSession();
const otherEntrant = new HttpSession();
const anonymous = new HttpSession();

// Born 20 years before the meeting's first day (an adult), and 15 years before (a minor).
const yearsBefore = (day: string, years: number) => `${Number(day.slice(0, 4)) - years}${day.slice(4)}`;

const gear = (kind: string, serial: string, dueOn: string, over: Record<string, unknown> = {}) => ({
  kind,
  standard: kind === 'life_jacket' ? 'ISO 12402-5' : 'Invented Std 7',
  serial,
  dateKind: 'expires',
  dueOn,
  ...over,
});
const person = (over: Record<string, unknown> = {}) => ({
  role: 'driver',
  name: 'Rua Tester',
  bornOn: yearsBefore(dayInZone(-1), 20),
  licence: { issuedBy: 'Invented Racing Body', grade: 'A', number: 'IRB-2041', expiresOn: '2030-12-31' },
  medicalExpiresOn: '2030-12-31',
  gear: [gear('helmet', 'HM-1', dayInZone(0)), gear('life_jacket', 'LJ-1', '2030-12-31')],
  ...over,
});

const put = (s: HttpSession, entryId: string, body: unknown) => s.json(`/api/entries/${entryId}/crew`, body, 'PUT');

before(async () => {
  meeting = await new InspectionMeeting().create(`Crew ${Date.now()}`, [
    { email: DEMO.chief, role: 'chief_scrutineer' },
    { email: DEMO.scrutineer, role: 'scrutineer' },
  ]);
  // Today in the meeting's zone lies inside it (the dock confirms gear on a meeting day only).
  await query('update events set starts_on = $2, ends_on = $3, time_zone = $4 where id = $1', [
    meeting.eventId,
    dayInZone(-1),
    dayInZone(2),
    ZONE,
  ]);
  classId = await meeting.addClass('CR', rulesWith({ safetyItems: ['helmet', 'life_jacket', 'fire_extinguisher'] }));
  entry = await meeting.addEntry(classId);
  const otherEmail = uniqueEmail('crew-other');
  await otherEntrant.json('/api/accounts', { name: 'Other Entrant', email: otherEmail, password: 'crew-password-1' });
  await otherEntrant.signInWithPassword(otherEmail, 'crew-password-1');
  otherEntry = await meeting.addEntry(classId, { ownerEmail: otherEmail });
  await entrant.signInWithPassword(DEMO.entrant, DEMO_PASSWORD);
  await chief.signInWithPassword(DEMO.chief, DEMO_PASSWORD);
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
});

test('the entrant records driver and navigator with gear; dates are judged at the day boundary in the meeting’s zone', async () => {
  const minor = person({
    role: 'navigator',
    name: 'Tama Tester',
    bornOn: yearsBefore(dayInZone(-1), 15),
    guardian: { name: 'Guardian Tester', consentOn: dayInZone(-2) },
    gear: [gear('helmet', 'HM-2', dayInZone(-1)), gear('life_jacket', 'LJ-2', '2030-12-31')],
  });
  const { res, body } = await put(entrant, entry.id, {
    members: [person({ isEntrant: true }), minor],
    boatGear: [gear('fire_extinguisher', 'FX-1', '2030-06-30', { dateKind: 'service_due', standard: 'EN 3-7' })],
  });
  assert.equal(res.status, 200, JSON.stringify(body));
  const a = body.data.assessment;
  assert.equal(a.day, dayInZone(0), 'today in Kiritimati, not in UTC');
  const byserial = Object.fromEntries(a.gear.map((g: { serial: string }) => [g.serial, g]));
  // Dated today in the meeting's zone: still valid; dated yesterday there: expired.
  assert.equal(byserial['HM-1'].isValidOnDay, true);
  assert.equal(byserial['HM-2'].isValidOnDay, false);
  const codes = a.findings.map((f: { code: string }) => f.code);
  assert.ok(codes.includes('gear_expired'), JSON.stringify(a.findings));
  assert.ok(codes.includes('expires_during_meeting'), 'HM-1 runs out before the last day');
  assert.ok(!codes.includes('consent_missing'));
  assert.equal(a.isInOrder, false);
  const stored = await query<{ name: string; user_id: string | null; guardian_name: string | null }>(
    'select name, user_id, guardian_name from entry_crew_members where entry_id = $1 order by position',
    [entry.id],
  );
  assert.deepEqual(
    stored.map((r) => [r.name, r.user_id !== null, r.guardian_name]),
    [
      ['Rua Tester', true, null],
      ['Tama Tester', false, 'Guardian Tester'],
    ],
  );
  const [{ n }] = await query<{ n: string }>('select count(*) as n from entry_gear_items where entry_id = $1', [
    entry.id,
  ]);
  assert.equal(Number(n), 5);
  // The entrant reads the dates of birth they gave; the meeting's chief scrutineer reads whether each person is a
  // minor on the day, not the date (data minimisation, GDPR Art. 5(1)(c)), and the licence the dock checks.
  const own = (await (await entrant.fetch(`/api/entries/${entry.id}/crew`)).json()).data.members;
  assert.deepEqual(
    own.map((m: { bornOn: string | null; isMinor: boolean }) => [m.bornOn, m.isMinor]),
    [
      [yearsBefore(dayInZone(-1), 20), false],
      [yearsBefore(dayInZone(-1), 15), true],
    ],
  );
  const official = (await (await chief.fetch(`/api/entries/${entry.id}/crew`)).json()).data.members;
  assert.deepEqual(
    official.map((m: { bornOn: string | null; isMinor: boolean; licence: { number: string } | null }) => [
      m.bornOn,
      m.isMinor,
      m.licence?.number ?? null,
    ]),
    [
      [null, false, 'IRB-2041'],
      [null, true, 'IRB-2041'],
    ],
  );
  // The entrant's screen shows the expired helmet.
  const page = await entrant.fetch('/entries');
  const html = await page.text();
  assert.ok(html.includes('HM-2') && html.includes('Not in order'), 'the entries page names the expired helmet');
});

test('a minor without a guardian’s consent is refused with a clear error, and nothing is lost', async () => {
  const before = await query('select id from entry_crew_members where entry_id = $1 order by id', [entry.id]);
  const { res, body } = await put(entrant, entry.id, {
    members: [
      person(),
      person({ role: 'navigator', name: 'Young Tester', bornOn: yearsBefore(dayInZone(-1), 15), gear: [] }),
    ],
    boatGear: [],
  });
  assert.equal(res.status, 400);
  assert.equal(body.error.code, 'consent_required');
  assert.equal(body.error.details[0].field, 'members.1.guardian');
  assert.match(
    body.error.details[0].message,
    /Young Tester is 15 .* under 18: record a parent's or guardian's consent/,
  );
  assert.deepEqual(
    await query('select id from entry_crew_members where entry_id = $1 order by id', [entry.id]),
    before,
  );
});

test('hostile input: strangers, huge or malformed bodies, impossible dates, control characters, borrowed ids', async () => {
  const valid = { members: [person()], boatGear: [] };
  assert.equal((await put(anonymous, entry.id, valid)).res.status, 401);
  assert.equal((await put(otherEntrant, entry.id, valid)).res.status, 404, 'another entrant cannot write');
  assert.equal(
    (await otherEntrant.fetch(`/api/entries/${entry.id}/crew`)).status,
    404,
    'nor read (as a missing entry)',
  );
  assert.equal(
    (await chief.fetch(`/api/entries/${entry.id}/crew`)).status,
    200,
    'the meeting’s chief scrutineer reads',
  );
  assert.equal((await put(chief, entry.id, valid)).res.status, 404, 'officials do not write an entrant’s crew');
  assert.equal((await entrant.fetch(`/api/entries/not-an-id/crew`)).status, 404);
  const huge = await entrant.fetch(`/api/entries/${entry.id}/crew`, {
    method: 'PUT',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ members: [person({ name: 'x'.repeat(70_000) })], boatGear: [] }),
  });
  assert.equal(huge.status, 413);
  const malformed = await entrant.fetch(`/api/entries/${entry.id}/crew`, {
    method: 'PUT',
    headers: { 'content-type': 'application/json' },
    body: '{"members": [',
  });
  assert.equal(malformed.status, 400);
  for (const [over, field] of [
    [{ bornOn: '0000-01-01' }, 'members.0.bornOn'],
    [{ medicalExpiresOn: '9999-12-31' }, 'members.0.medicalExpiresOn'],
    [{ medicalExpiresOn: '2027-02-30' }, 'members.0.medicalExpiresOn'],
    [
      { licence: { issuedBy: 'B', grade: 'A', number: 'IRB\u0000204', expiresOn: '2030-01-01' } },
      'members.0.licence.number',
    ],
    [
      { licence: { issuedBy: 'B', grade: 'A', number: 'IRB\u202e204', expiresOn: '2030-01-01' } },
      'members.0.licence.number',
    ],
  ] as const) {
    const { res, body } = await put(entrant, entry.id, { members: [person(over)], boatGear: [] });
    assert.equal(res.status, 400, JSON.stringify(over));
    assert.equal(body.error.details[0].field, field, JSON.stringify(body));
  }
  // Another entry's gear id cannot be borrowed (it might carry the dock's confirmation).
  const [foreign] = await query<{ id: string }>(
    `insert into entry_gear_items (entry_id, position, kind, standard, serial, date_kind, due_on)
     values ($1, 1000, 'first_aid_kit', 'x', 'FA-9', 'expires', '2030-01-01') returning id`,
    [otherEntry.id],
  );
  const borrowed = await put(entrant, entry.id, {
    members: [person()],
    boatGear: [gear('first_aid_kit', 'FA-9', '2030-01-01', { id: foreign.id })],
  });
  assert.equal(borrowed.res.status, 400);
  assert.equal(borrowed.body.error.details[0].field, 'boatGear.0.id');
});

test('licence grades: the class accepts some; only the organiser sets them', async () => {
  const body = { classId, acceptedLicenceGrades: ['B', 'C'], navigatorRequired: true };
  assert.equal((await chief.json(`/api/events/${meeting.eventId}/crew-requirements`, body, 'PUT')).res.status, 403);
  const set = await meeting.organiser.json(`/api/events/${meeting.eventId}/crew-requirements`, body, 'PUT');
  assert.equal(set.res.status, 200, JSON.stringify(set.body));
  const foreignClass = await meeting.organiser.json(
    `/api/events/${meeting.eventId}/crew-requirements`,
    { ...body, classId: otherEntry.id },
    'PUT',
  );
  assert.equal(foreignClass.res.status, 400);
  const view = await (await entrant.fetch(`/api/entries/${otherEntry.id}/crew`)).json();
  assert.equal(view.error.code, 'not_found', 'another entrant learns nothing, as for a missing entry');
  const { body: mine } = await put(entrant, entry.id, { members: [person()], boatGear: [] });
  const codes = mine.data.assessment.findings.map((f: { code: string }) => f.code);
  assert.ok(codes.includes('licence_grade'), JSON.stringify(mine.data.assessment.findings));
  assert.ok(codes.includes('no_navigator'));
  assert.equal(mine.data.requirements.gradesFrom, 'class');
  // Back to any grade, no navigator, for the tests that follow.
  await meeting.organiser.json(
    `/api/events/${meeting.eventId}/crew-requirements`,
    { classId, acceptedLicenceGrades: [], navigatorRequired: false },
    'PUT',
  );
});

test('the dock confirms each item for the day; a changed item is no longer confirmed; checks are append-only', async () => {
  const { body: saved } = await put(entrant, entry.id, {
    members: [person({ gear: [gear('helmet', 'HM-7', dayInZone(-1)), gear('life_jacket', 'LJ-7', '2030-12-31')] })],
    boatGear: [gear('fire_extinguisher', 'FX-7', '2030-06-30')],
  });
  const items = saved.data.assessment.gear as { id: string; serial: string }[];
  const url = `/api/events/${meeting.eventId}/gear-checks`;
  const checks = { entryId: entry.id, items: items.map((g) => ({ gearItemId: g.id, outcome: 'confirmed' })) };
  assert.equal((await entrant.json(url, checks)).res.status, 403, 'an entrant is not a scrutineer');
  const other = await scrutineer.json(url, {
    entryId: entry.id,
    items: [{ gearItemId: otherEntry.id, outcome: 'confirmed' }],
  });
  assert.equal(other.res.status, 400, 'an id that is not this boat’s item');
  const { res, body } = await scrutineer.json(url, checks);
  assert.equal(res.status, 201, JSON.stringify(body));
  const a = body.data.assessment;
  assert.ok(a.gear.every((g: { dock: string }) => g.dock === 'confirmed'));
  // The helmet dated yesterday in the meeting's zone is still a finding, confirmed or not.
  assert.deepEqual(
    a.findings.filter((f: { severity: string }) => f.severity === 'finding').map((f: { code: string }) => f.code),
    ['gear_expired'],
  );
  const [row] = await query<{ meeting_day: string; serial: string }>(
    `select to_char(meeting_day, 'YYYY-MM-DD') as meeting_day, serial from gear_checks where entry_id = $1 and serial = 'HM-7'`,
    [entry.id],
  );
  assert.equal(row.meeting_day, dayInZone(0));
  await assert.rejects(query(`update gear_checks set outcome = 'not_presented' where entry_id = $1`, [entry.id]));
  // The entrant changes the life jacket's serial: the check no longer counts for it.
  const members = saved.data.members.map((m: Record<string, unknown>) => ({
    ...m,
    gear: (m.gear as { serial: string }[]).map((g) => (g.serial === 'LJ-7' ? { ...g, serial: 'LJ-8' } : g)),
  }));
  const { res: res2, body: after } = await put(entrant, entry.id, {
    members: members.map(({ hasAccount: _h, ...m }: Record<string, unknown>) => m),
    boatGear: saved.data.boatGear,
  });
  assert.equal(res2.status, 200, JSON.stringify(after));
  const states = Object.fromEntries(
    after.data.assessment.gear.map((g: { serial: string; dock: string }) => [g.serial, g.dock]),
  );
  assert.deepEqual(states, { 'HM-7': 'confirmed', 'LJ-8': 'changed_since_check', 'FX-7': 'confirmed' });
  // The driver signs on for today, once; a person whose licence has lapsed is refused, named.
  const signOnUrl = `/api/events/${meeting.eventId}/crew-sign-ons`;
  const driverId = after.data.members[0].id as string;
  assert.equal((await entrant.json(signOnUrl, { entryId: entry.id, crewMemberIds: [driverId] })).res.status, 403);
  for (let i = 0; i < 2; i++) {
    const signed = await scrutineer.json(signOnUrl, { entryId: entry.id, crewMemberIds: [driverId] });
    assert.equal(signed.res.status, 201, JSON.stringify(signed.body));
    assert.deepEqual(signed.body.data.assessment.signedOn, [driverId]);
  }
  const signOns = await query<{ meeting_day: string }>(
    `select to_char(meeting_day, 'YYYY-MM-DD') as meeting_day from crew_sign_ons where crew_member_id = $1`,
    [driverId],
  );
  assert.deepEqual(signOns, [{ meeting_day: dayInZone(0) }], 'once a day, on the meeting’s calendar day');
  await put(entrant, entry.id, {
    members: [
      person({ id: driverId, gear: [] }),
      person({
        role: 'navigator',
        name: 'Lapsed Tester',
        licence: { issuedBy: 'B', grade: 'A', number: 'IRB-1', expiresOn: dayInZone(-1) },
        gear: [],
      }),
    ],
    boatGear: [],
  });
  const [lapsed] = await query<{ id: string }>(
    `select id from entry_crew_members where entry_id = $1 and name = 'Lapsed Tester'`,
    [entry.id],
  );
  const refused = await scrutineer.json(signOnUrl, { entryId: entry.id, crewMemberIds: [lapsed.id] });
  assert.equal(refused.res.status, 409);
  assert.equal(refused.body.error.code, 'not_in_order');
  assert.match(refused.body.error.message, /Lapsed Tester: licence expired on/);
  // The dock reads it; the chief scrutineer's board lists the boat before it arrives.
  const dock = await scrutineer.fetch(`${url}?entryId=${entry.id}`);
  assert.equal(dock.status, 200);
  const board = await (await chief.fetch(`/inspect/${meeting.eventId}/board`)).text();
  assert.ok(board.includes('crew-board') && board.includes('Lapsed Tester'), 'the board names the lapsed licence');
});

test('a scrutineer does not check the gear or sign on the crew of a boat they own', async () => {
  const own = await meeting.addEntry(classId, { ownerEmail: DEMO.scrutineer });
  const [{ id: itemId }] = await query<{ id: string }>(
    `insert into entry_gear_items (entry_id, position, kind, standard, serial, date_kind, due_on)
     values ($1, 1000, 'first_aid_kit', 'x', 'FA-OWN', 'expires', '2030-01-01') returning id`,
    [own.id],
  );
  const [{ id: memberId }] = await query<{ id: string }>(
    `insert into entry_crew_members (entry_id, position, role, name, born_on) values ($1, 0, 'driver', 'Own Tester', '1980-01-01') returning id`,
    [own.id],
  );
  const checked = await scrutineer.json(`/api/events/${meeting.eventId}/gear-checks`, {
    entryId: own.id,
    items: [{ gearItemId: itemId, outcome: 'confirmed' }],
  });
  assert.equal(checked.res.status, 403);
  const signed = await scrutineer.json(`/api/events/${meeting.eventId}/crew-sign-ons`, {
    entryId: own.id,
    crewMemberIds: [memberId],
  });
  assert.equal(signed.res.status, 403);
  const [{ n }] = await query<{ n: string }>(
    'select (select count(*) from gear_checks where entry_id = $1) + (select count(*) from crew_sign_ons where entry_id = $1) as n',
    [own.id],
  );
  assert.equal(Number(n), 0);
});

test('an expired helmet is a finding in the dock record’s verdict; gear all in date is one conforming line', async () => {
  // Two boats of their own (this file's other tests keep changing the first one's gear).
  const lapsed = await meeting.addEntry(classId);
  const current = await meeting.addEntry(classId);
  const crewWith = (helmetDue: string) => ({
    members: [person({ gear: [gear('helmet', 'HM-9', helmetDue), gear('life_jacket', 'LJ-9', '2030-12-31')] })],
    boatGear: [gear('fire_extinguisher', 'FX-9', '2030-12-31', { standard: 'EN 3-7', dateKind: 'service_due' })],
  });
  assert.equal((await put(entrant, lapsed.id, crewWith(dayInZone(-1)))).res.status, 200);
  assert.equal((await put(entrant, current.id, crewWith(dayInZone(0)))).res.status, 200);
  const record = (entryId: string) =>
    scrutineer.json(`/api/events/${meeting.eventId}/inspections`, {
      ...inspectionBody(entryId, 101.8),
      safety: { helmet: true, life_jacket: true, fire_extinguisher: true },
    });
  // Expired yesterday in the meeting's zone: not valid today, so the record does not conform on that line alone.
  const a = await record(lapsed.id);
  assert.equal(a.res.status, 201, JSON.stringify(a.body));
  const lines = a.body.data.rules as { rule: string; verdict: string; explanation: string }[];
  const gearLines = lines.filter((l) => l.rule.startsWith('gear:'));
  assert.equal(gearLines.length, 1, JSON.stringify(gearLines));
  assert.equal(gearLines[0].verdict, 'does_not_conform');
  assert.match(gearLines[0].explanation, /helmet HM-9: expires .*past\..*local rulebook and the officials decide/i);
  assert.ok(
    lines.filter((l) => !l.rule.startsWith('gear:')).every((l) => l.verdict === 'conforms'),
    'every other line conforms: the helmet decides',
  );
  assert.equal(a.body.data.overallResult, 'does_not_conform');
  // Valid through the end of today in the meeting's zone: in date, one conforming line for the three items.
  const b = await record(current.id);
  assert.equal(b.res.status, 201, JSON.stringify(b.body));
  const inDate = (b.body.data.rules as { rule: string; verdict: string; explanation: string }[]).filter((l) =>
    l.rule.startsWith('gear:'),
  );
  assert.deepEqual(
    inDate.map((l) => [l.rule, l.verdict]),
    [['gear:in_date', 'conforms']],
  );
  assert.match(inDate[0].explanation, /\(3\) is within its expiry or service date/);
  assert.equal(b.body.data.overallResult, 'conforms');
});
