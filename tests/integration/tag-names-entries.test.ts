// Issue 13 through HTTP and the database: where a scanned tag sends each person (/t/<token>), the
// name given on accepting a staff invitation, hull numbers with a minus sign, an honest answer when
// the race number asked for is taken, and protest e-mails that name the protested boat.
// Runs alone (scripts/test.sh): it counts every boat and takes the demo meeting's next free race number.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { randomBytes } from 'node:crypto';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { query } from '../support/db';
import { firstLink, waitForMail } from '../support/mail';
import { EVENT, competitor, lodgedProtest, publishResults, setUpMeeting } from './protest-fixtures';

const CLUB = '0b0e0000-0000-4000-8000-000000000001';
// Two meetings of this test's own: one on before the demo meeting (2027-03-13), one already over.
const SOONER = '7e570000-0000-4000-8000-000000001301';
const SOONER_CLASS = '7e570000-0000-4000-8000-000000001302';
const PAST = '7e570000-0000-4000-8000-000000001303';
const PAST_CLASS = '7e570000-0000-4000-8000-000000001304';
const MAIL_CLASS = '7e570000-0000-4000-8000-000000001305'; // a class of this test's own at the protest test meeting
const PW = 'tag-names-test-password';

type DemoBoat = { boatId: string; name: string; raceNumber: number; token: string; ownerId: string };
let sessions: Record<'scrutineer' | 'chief' | 'steward' | 'organiser' | 'entrant', HttpSession>;
let demoClassId: string;

async function signedIn(email: string, password = DEMO_PASSWORD) {
  const s = new HttpSession();
  assert.equal((await s.signInWithPassword(email, password)).status, 200, `sign-in as ${email}`);
  return s;
}

/** A demo boat entered at the demo meeting, owned by someone other than the given addresses, with its current tag. */
async function demoBoat(notOwnedBy: string[], offset = 0): Promise<DemoBoat> {
  const [b] = await query<DemoBoat>(
    `select b.id as "boatId", b.name, e.race_number as "raceNumber", t.token, b.owner_id as "ownerId"
       from entries e join boats b on b.id = e.boat_id join users u on u.id = b.owner_id
       join boat_tags t on t.boat_id = b.id and t.retired_at is null
      where e.event_id = $1 and e.status in ('awaiting_payment', 'entered') and u.email <> all($2)
      order by e.race_number limit 1 offset $3`,
    [DEMO.meetingId, notOwnedBy, offset],
  );
  assert.ok(b, 'a demo boat with a current tag');
  return b;
}

before(async () => {
  sessions = {
    scrutineer: await signedIn(DEMO.scrutineer),
    chief: await signedIn(DEMO.chief),
    steward: await signedIn(DEMO.steward),
    organiser: await signedIn(DEMO.organiser),
    entrant: await signedIn(DEMO.entrant),
  };
  [{ id: demoClassId }] = await query<{ id: string }>(
    `select id from race_classes where event_id = $1 and code = 'SS'`,
    [DEMO.meetingId],
  );
});

test('a tag sends the scrutineer and the chief scrutineer of the boat’s meeting to its card at the dock', async () => {
  const boat = await demoBoat([DEMO.scrutineer, DEMO.chief, DEMO.entrant]);
  for (const who of ['scrutineer', 'chief'] as const) {
    const res = await sessions[who].fetch(`/t/${boat.token}`);
    assert.equal(res.status, 307, `${who}: a redirect, not the public card`);
    assert.equal(res.headers.get('location'), `/inspect/${DEMO.meetingId}?tag=${boat.token}`, who);
  }
  // The dock finds the boat from that token (the same lookup a scanned tag uses).
  const card = await sessions.scrutineer.fetch(`/api/events/${DEMO.meetingId}/tags/${boat.token}`);
  assert.equal(card.status, 200);
  assert.equal((await card.json()).data.boat.name, boat.name);
});

test('a tag sends the owner to their own boat; anyone else, signed in or not, sees the public card without a sign-in loop', async () => {
  const [own] = await query<{ boatId: string; token: string }>(
    `select b.id as "boatId", t.token from boats b join users u on u.id = b.owner_id join boat_tags t on t.boat_id = b.id and t.retired_at is null
      where u.email = $1 limit 1`,
    [DEMO.entrant],
  );
  const mine = await sessions.entrant.fetch(`/t/${own.token}`);
  assert.equal(mine.status, 307);
  assert.equal(mine.headers.get('location'), `/boats/${own.boatId}`);

  const other = await demoBoat([DEMO.entrant]);
  const entrantSees = await sessions.entrant.fetch(`/t/${other.token}`);
  assert.equal(entrantSees.status, 200, 'another entrant’s boat: the public card');
  const html = await entrantSees.text();
  assert.match(html, /data-testid="tag-signed-in-note"/);
  assert.doesNotMatch(html, /callbackUrl=/, 'no sign-in link for someone already signed in');

  const anon = await new HttpSession().fetch(`/t/${other.token}`);
  assert.equal(anon.status, 200);
  assert.ok(
    (await anon.text()).includes(`href="/sign-in?callbackUrl=${encodeURIComponent(`/t/${other.token}`)}"`),
    'the sign-in link comes back to this tag',
  );
});

test('a steward and the organiser of the meeting stay on the public card with links to the pages their role opens', async () => {
  const boat = await demoBoat([DEMO.steward, DEMO.organiser, DEMO.entrant]);
  const steward = await sessions.steward.fetch(`/t/${boat.token}`);
  assert.equal(steward.status, 200, 'a steward may not record: no dock');
  const sHtml = await steward.text();
  assert.match(sHtml, /data-testid="tag-official-links"/);
  assert.ok(sHtml.includes(`/stewards/${DEMO.meetingId}`), 'the protest queue');
  assert.ok(
    sHtml.includes(`/organise/events/${DEMO.meetingId}/entries?q=${boat.raceNumber}`),
    'the entries list at this boat',
  );
  assert.doesNotMatch(sHtml, /callbackUrl=/);
  const organiser = await sessions.organiser.fetch(`/t/${boat.token}`);
  assert.equal(organiser.status, 200);
  assert.ok(
    (await organiser.text()).includes(`/inspect/${DEMO.meetingId}/board`),
    'the organiser reads the inspection board',
  );
});

test('a boat entered at several meetings: the scrutineer goes to the one on next where they inspect; a past meeting or one they do not staff never counts', async () => {
  const [scrutineer] = await query<{ id: string }>('select id from users where email = $1', [DEMO.scrutineer]);
  for (const [id, cls, name, starts, ends] of [
    [SOONER, SOONER_CLASS, 'Tag test sooner meeting', '2027-01-09', '2027-01-10'],
    [PAST, PAST_CLASS, 'Tag test past meeting', '2026-01-10', '2026-01-11'],
  ]) {
    await query(
      `insert into events (id, organisation_id, name, slug, venue, starts_on, ends_on, time_zone, status) values ($1, $2, $3, $4, 'Test Reach', $5, $6, 'Pacific/Auckland', 'entries_open') on conflict do nothing`,
      [id, CLUB, name, name.toLowerCase().replaceAll(' ', '-'), starts, ends],
    );
    await query(
      `insert into race_classes (id, event_id, name, code) values ($1, $2, 'Tag test', 'TT') on conflict do nothing`,
      [cls, id],
    );
  }
  const boat = await demoBoat([DEMO.scrutineer, DEMO.entrant], 1);
  // Entered at the demo meeting (staffed), the past meeting (staffed) and the sooner one (not yet staffed).
  for (const [ev, cls, n] of [
    [PAST, PAST_CLASS, 801],
    [SOONER, SOONER_CLASS, 802],
  ] as const) {
    await query(
      `insert into entries (event_id, class_id, boat_id, entrant_id, race_number, status, fee_minor, currency) values ($1, $2, $3, $4, $5, 'entered', 0, 'NZD') on conflict do nothing`,
      [ev, cls, boat.boatId, boat.ownerId, n],
    );
  }
  await query(
    `insert into event_staff (event_id, user_id, role) values ($1, $2, 'scrutineer') on conflict do nothing`,
    [PAST, scrutineer.id],
  );
  const before = await sessions.scrutineer.fetch(`/t/${boat.token}`);
  assert.equal(
    before.headers.get('location'),
    `/inspect/${DEMO.meetingId}?tag=${boat.token}`,
    'not the past meeting; not the sooner one, where they are not staff',
  );
  await query(
    `insert into event_staff (event_id, user_id, role) values ($1, $2, 'scrutineer') on conflict do nothing`,
    [SOONER, scrutineer.id],
  );
  const after = await sessions.scrutineer.fetch(`/t/${boat.token}`);
  assert.equal(
    after.headers.get('location'),
    `/inspect/${SOONER}?tag=${boat.token}`,
    'the meeting on next, now they inspect there',
  );
  await query(`delete from event_staff where user_id = $1 and event_id in ($2, $3)`, [scrutineer.id, SOONER, PAST]);
});

test('a scrutineer scanning a boat not entered where they inspect, or a replaced tag, sees the public card', async () => {
  const [owner] = await query<{ id: string }>('select id from users where email = $1', [DEMO.entrant]);
  const [boat] = await query<{ id: string }>(
    `insert into boats (owner_id, name, declared_nozzle_mm, declared_power_kw) values ($1, 'Unentered Tern', 101.5, 220) returning id`,
    [owner.id],
  );
  const token = randomBytes(18).toString('base64url');
  await query(`insert into boat_tags (boat_id, token) values ($1, $2)`, [boat.id, token]);
  const res = await sessions.scrutineer.fetch(`/t/${token}`);
  assert.equal(res.status, 200);
  const html = await res.text();
  assert.match(html, /Unentered Tern/);
  assert.match(html, /data-testid="tag-signed-in-note"/);

  // A demo boat's old tag, replaced: the old token names the boat but leads nowhere.
  const demo = await demoBoat([DEMO.scrutineer, DEMO.entrant], 2);
  const oldToken = randomBytes(18).toString('base64url');
  await query(
    `insert into boat_tags (boat_id, token, issued_at, retired_at) values ($1, $2, now() - interval '2 days', now() - interval '1 day')`,
    [demo.boatId, oldToken],
  );
  const retired = await sessions.scrutineer.fetch(`/t/${oldToken}`);
  assert.equal(retired.status, 200, 'a replaced tag never leads to a card');
  assert.match(await retired.text(), /data-testid="tag-retired"/);
  assert.equal((await sessions.scrutineer.fetch(`/t/${demo.token}`)).status, 307, 'a current tag still does');
});

async function invitationToken(email: string) {
  const { res, body } = await sessions.organiser.json(`/api/events/${DEMO.meetingId}/invitations`, {
    email,
    role: 'scrutineer',
  });
  assert.equal(res.status, 201, JSON.stringify(body));
  return new URL(firstLink(await waitForMail(email, { subject: /invited/ }))).pathname.split('/').pop()!;
}
async function accept(token: string, name?: string) {
  const s = new HttpSession();
  const csrfToken = await s.csrfToken();
  const res = await s.fetch('/api/auth/callback/invitation', {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ csrfToken, token, json: 'true', ...(name !== undefined && { name }) }),
  });
  return { s, res, body: await res.json().catch(() => null) };
}

test('accepting an invitation sets the name given (trimmed, at most 120 characters) on a new account, never over a name its owner chose', async () => {
  const email = uniqueEmail('named');
  const token = await invitationToken(email);
  const page = await new HttpSession().fetch(`/invite/${token}`);
  assert.match(await page.text(), /Your name/, 'the acceptance page asks for a name');
  for (const bad of ['x'.repeat(121), 'Rowan\u202Eyawollah', 'Rowan\nBcc: someone']) {
    const refused = await accept(token, bad);
    assert.match(String(refused.body?.url), /error=NameInvalid/, JSON.stringify(bad));
    assert.equal(await refused.s.session(), null);
  }
  assert.equal(
    (await query('select 1 from staff_invitations where email = $1 and accepted_at is null', [email])).length,
    1,
    'the invitation stays unused',
  );
  const ok = await accept(token, '  Rowan Tidewell  ');
  assert.equal(ok.res.status, 200);
  assert.equal((await ok.s.session())?.user?.email, email);
  assert.deepEqual(await query('select name from users where email = $1', [email]), [{ name: 'Rowan Tidewell' }]);

  // Someone with an account and a name of their own choosing keeps it.
  const named = uniqueEmail('keeps');
  await new HttpSession().signUpAndConfirm({ name: 'Ada Quayle', email: named, password: PW });
  const t2 = await invitationToken(named);
  assert.doesNotMatch(
    await (await new HttpSession().fetch(`/invite/${t2}`)).text(),
    /Your name/,
    'no name asked of a named account',
  );
  assert.equal((await accept(t2, 'Somebody Else')).res.status, 200);
  assert.deepEqual(await query('select name from users where email = $1', [named]), [{ name: 'Ada Quayle' }]);
});

test('a hull number with a minus sign is refused with a field error and stores nothing; hull numbers as painted are kept', async () => {
  const entrant = new HttpSession();
  await entrant.signUpAndConfirm({ name: 'Hull Tester', email: uniqueEmail('hull'), password: PW });
  const boat = (hullNumber: string) => ({
    name: `Hull ${hullNumber || 'blank'}`,
    hullNumber,
    nozzleDiameter: 101.5,
    nozzleUnit: 'mm',
    power: 220,
    powerUnit: 'kW',
  });
  const [{ n: before }] = await query<{ n: string }>('select count(*) as n from boats');
  for (const bad of ['-7', '−7', '- 7', '#7']) {
    const { res, body } = await entrant.json('/api/boats', boat(bad));
    assert.equal(res.status, 400, bad);
    assert.deepEqual(
      body.error.details.map((d: { field: string }) => d.field),
      ['hullNumber'],
      bad,
    );
    assert.match(body.error.details[0].message, /hull or sail number/);
  }
  assert.deepEqual(await query('select count(*) as n from boats'), [{ n: before }]);
  for (const good of ['7', 'NZ-42', 'K 12', '']) {
    const { res, body } = await entrant.json('/api/boats', boat(good));
    assert.equal(res.status, 201, `${good}: ${JSON.stringify(body)}`);
  }
});

test('a race number that is taken gives the next free number after it, and the answer says which of each', async () => {
  const entrant = new HttpSession();
  await entrant.signUpAndConfirm({ name: 'Number Tester', email: uniqueEmail('number'), password: PW });
  const [taken] = await query<{ n: number }>(
    `select race_number as n from entries where event_id = $1 order by race_number limit 1`,
    [DEMO.meetingId],
  );
  const [next] = await query<{ n: number }>(
    `select n from generate_series($2::int + 1, 9999) n where not exists (select 1 from entries where event_id = $1 and race_number = n) order by n limit 1`,
    [DEMO.meetingId, taken.n],
  );
  const { body: boat } = await entrant.json('/api/boats', {
    name: 'Numbered Petrel',
    nozzleDiameter: 101.5,
    power: 220,
  });
  const { res, body } = await entrant.json('/api/entries', {
    boatId: boat.data.id,
    eventId: DEMO.meetingId,
    classId: demoClassId,
    requestedRaceNumber: taken.n,
  });
  assert.equal(res.status, 201, JSON.stringify(body));
  assert.equal(
    body.data.entry.raceNumber,
    next.n,
    'the next free number after the one asked for, not the lowest free one',
  );
  assert.equal(body.data.requestedRaceNumber, taken.n);
  assert.equal(body.data.gotRequestedNumber, false);
  assert.equal(
    body.data.raceNumberNote,
    `Race number ${taken.n} is already taken at this meeting, so you have ${next.n}, the next free number.`,
  );
});

test('protest e-mails name the protested boat, to the protested entrant above all', async () => {
  const { organiser } = await setUpMeeting();
  await query(
    `insert into race_classes (id, event_id, name, code) values ($1, $2, 'Test TM', 'TM') on conflict do nothing`,
    [MAIL_CLASS, EVENT],
  );
  const lodger = await competitor('mail-lodger', MAIL_CLASS);
  const target = await competitor('mail-target', MAIL_CLASS);
  await publishResults(organiser, MAIL_CLASS, [target, lodger]);
  await lodgedProtest(lodger, target, 'TP 2.1 nozzle exit diameter maximum');
  const boat = `No. ${target.raceNumber} mail-target boat`;
  const toTarget = await waitForMail(target.email, { subject: /Protest lodged/ });
  assert.ok(toTarget.subject.includes(`your boat ${boat}`), toTarget.subject);
  assert.ok(toTarget.text.startsWith(`This protest is against your boat ${boat} at `), toTarget.text);
  const toLodger = await waitForMail(lodger.email, { subject: /Protest lodged/ });
  assert.ok(toLodger.text.includes(`The protested boat: ${boat}.`), toLodger.text);
});
