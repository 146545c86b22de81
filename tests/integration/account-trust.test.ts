// Trust in accounts, through the real HTTP API and database: addresses proven by their mailbox, no
// staff role caught by pre-registering an official's address, sessions that end when they should,
// throttles that stop an attacker but not the owner, and answers that do not reveal who has an
// account. The attacks are those of the OWASP Authentication Cheat Sheet and the OWASP Session
// Management Cheat Sheet (account enumeration, credential stuffing, lockout abuse, session expiry).
// Runs alone (scripts/test.sh): it counts every account (a refused sign-up stores none) and makes a steward at the
// demo meeting.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { HttpSession } from '../support/http-session';
import { BASE_URL, DEMO, DEMO_PASSWORD, MAIL_INBOX, uniqueEmail } from '../support/env';
import { waitForMail, firstLink } from '../support/mail';
import { query } from '../support/db';

const PW = 'a-long-enough-password';
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

async function timed<T>(fn: () => Promise<T>): Promise<[T, number]> {
  const t0 = performance.now();
  const out = await fn();
  return [out, performance.now() - t0];
}

test("pre-registering an official's address catches no role; the invitation from that mailbox ends the impostor's password and sessions", async () => {
  const address = uniqueEmail('new-steward');
  const attacker = new HttpSession();
  assert.equal((await attacker.signUp({ name: 'Not The Steward', email: address, password: PW })).res.status, 202);
  assert.equal((await attacker.signInWithPassword(address, PW)).status, 200);

  const organiser = new HttpSession();
  await organiser.signInWithPassword(DEMO.organiser, DEMO_PASSWORD);
  const assigned = await organiser.json(`/api/events/${DEMO.meetingId}/staff`, { email: address, role: 'steward' });
  assert.equal(assigned.res.status, 201, JSON.stringify(assigned.body));
  assert.equal(assigned.body.data.outcome, 'invited', 'an unproven account gets an invitation, not the role');
  const roles = () =>
    query('select 1 from event_staff s join users u on u.id = s.user_id where u.email = $1 and s.event_id = $2', [
      address,
      DEMO.meetingId,
    ]);
  assert.equal((await roles()).length, 0);
  assert.equal((await attacker.fetch(`/api/events/${DEMO.meetingId}/audit`)).status, 403, 'the impostor is no steward');

  // The real steward follows the invitation mailed to the address.
  const mail = await waitForMail(address, { subject: /invited/ });
  const token = new URL(firstLink(mail)).pathname.split('/').pop()!;
  const steward = new HttpSession();
  const csrfToken = await steward.csrfToken();
  const accepted = await steward.fetch('/api/auth/callback/invitation', {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ csrfToken, token, json: 'true' }),
  });
  assert.equal(accepted.status, 200);
  assert.equal((await roles()).length, 1, 'the role goes to whoever holds the mailbox');
  assert.equal((await steward.fetch(`/api/events/${DEMO.meetingId}/audit`)).status, 200);
  assert.equal((await attacker.fetch('/api/boats')).status, 401, "the impostor's open session has ended");
  assert.equal(
    (await new HttpSession().signInWithPassword(address, PW)).status,
    401,
    "the impostor's password no longer works",
  );
});

test('an e-mailed sign-in link on an unproven account removes the password somebody else chose', async () => {
  const address = uniqueEmail('mailbox-owner');
  const attacker = new HttpSession();
  await attacker.signUp({ name: 'Squatter', email: address, password: PW });
  assert.equal((await attacker.signInWithPassword(address, PW)).status, 200);
  const owner = new HttpSession();
  const csrfToken = await owner.csrfToken();
  await owner.fetch('/api/auth/signin/email', {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ csrfToken, email: address, json: 'true' }),
  });
  const link = firstLink(await waitForMail(address, { subject: /sign-in link/ }));
  assert.equal((await owner.fetch(link)).status, 302);
  assert.equal((await owner.session())?.user?.email, address);
  assert.equal((await attacker.fetch('/api/boats')).status, 401);
  assert.equal((await new HttpSession().signInWithPassword(address, PW)).status, 401);
  const [row] = await query<{ verified: Date | null; name: string | null }>(
    'select email_verified as verified, name from users where email = $1',
    [address],
  );
  assert.ok(row.verified, 'the address is proven by the link');
  assert.equal(row.name, null, 'the name the squatter chose is gone too');
});

test('no fee is tied to an unproven address: paying an entry is refused until the address is confirmed', async () => {
  const email = uniqueEmail('unproven-payer');
  const s = new HttpSession();
  await s.signUp({ name: 'Ada Penhallow', email, password: PW });
  await s.signInWithPassword(email, PW);
  const boat = await s.json('/api/boats', { name: 'Slate Heron', nozzleDiameter: 101.2, power: 220 });
  assert.equal(boat.res.status, 201, JSON.stringify(boat.body));
  const open = await s.fetch('/api/events/open');
  const events = (await open.json()).data as { id: string; classes: { id: string }[] }[];
  const event = events.find((e) => e.classes?.length);
  assert.ok(event, 'an open meeting with a class');
  const entry = await s.json('/api/entries', {
    boatId: boat.body.data.id,
    eventId: event!.id,
    classId: event!.classes[0].id,
  });
  assert.equal(entry.res.status, 201, JSON.stringify(entry.body));
  const pay = await s.fetch(`/api/entries/${entry.body.data.entry.id}/checkout`, { method: 'POST' });
  assert.equal(pay.status, 403);
  assert.equal((await pay.json()).error.code, 'address_unproven');
  await s.confirmAddress(email, PW);
  const again = await s.fetch(`/api/entries/${entry.body.data.entry.id}/checkout`, { method: 'POST' });
  assert.equal(again.status, 200, 'confirmed: the payment page opens');
});

test('sign-up answers the same for a registered address as for a new one, and tells the owner by e-mail', async () => {
  const fresh = uniqueEmail('fresh');
  const usersBefore = await query<{ n: string }>('select count(*) as n from users');
  const known = await new HttpSession().signUp({ name: 'Someone', email: DEMO.entrant, password: PW });
  const unknown = await new HttpSession().signUp({ name: 'Someone', email: fresh, password: PW });
  assert.equal(known.res.status, unknown.res.status);
  assert.deepEqual({ ...known.body.data, email: 'x' }, { ...unknown.body.data, email: 'x' });
  const usersAfter = await query<{ n: string }>('select count(*) as n from users');
  assert.equal(Number(usersAfter[0].n), Number(usersBefore[0].n) + 1, 'only the new address made an account');
  await waitForMail(DEMO.entrant, { subject: /tried to create a Boreline account/ });
  assert.equal(
    (await new HttpSession().signInWithPassword(DEMO.entrant, PW)).status,
    401,
    'the existing account is unchanged',
  );
});

test('a registered and an unknown address cost about the same time, at sign-up and at password sign-in', async () => {
  // A registered account with a password set through sign-up (scrypt, as every hash is after its
  // owner's next sign-in); the first round warms both paths and is not counted.
  const registered = uniqueEmail('registered');
  await new HttpSession().signUp({ name: 'Registered', email: registered, password: PW });
  const known: number[] = [];
  const unknown: number[] = [];
  for (let i = 0; i < 6; i++) {
    // From an address of its own, so these failures do not count against the rest of the suite's.
    const k = (
      await timed(() => new HttpSession('127.0.0.71').signInWithPassword(registered, `wrong-password-${i}`))
    )[1];
    const u = (
      await timed(() => new HttpSession('127.0.0.71').signInWithPassword(uniqueEmail('nobody'), `wrong-password-${i}`))
    )[1];
    if (i === 0) continue;
    known.push(k);
    unknown.push(u);
  }
  const ratio = median(known) / median(unknown);
  console.log(
    `# password sign-in, median ms: registered ${median(known).toFixed(0)}, unknown ${median(unknown).toFixed(0)} (ratio ${ratio.toFixed(2)})`,
  );
  assert.ok(ratio > 0.5 && ratio < 2, `sign-in time ratio ${ratio.toFixed(2)} should be near 1`);

  const knownUp: number[] = [];
  const unknownUp: number[] = [];
  for (let i = 0; i < 4; i++) {
    knownUp.push((await timed(() => new HttpSession().signUp({ name: 'Twin', email: DEMO.chief, password: PW })))[1]);
    unknownUp.push(
      (await timed(() => new HttpSession().signUp({ name: 'Twin', email: uniqueEmail('twin'), password: PW })))[1],
    );
  }
  const upRatio = median(knownUp) / median(unknownUp);
  console.log(
    `# sign-up, median ms: registered ${median(knownUp).toFixed(0)}, new ${median(unknownUp).toFixed(0)} (ratio ${upRatio.toFixed(2)})`,
  );
  assert.ok(upRatio > 0.5 && upRatio < 2, `sign-up time ratio ${upRatio.toFixed(2)} should be near 1`);
});

test("an attacker's failures at one address stop the attacker but not the owner at another address", async () => {
  const email = uniqueEmail('owner');
  const owner = new HttpSession('127.0.0.21');
  await owner.signUp({ name: 'Lowri Fenn', email, password: PW });
  for (let i = 0; i < 11; i++) await new HttpSession('127.0.0.22').signInWithPassword(email, `guess-${i}`);
  const attacker = new HttpSession('127.0.0.22');
  const blocked = await attacker.signInWithPassword(email, PW);
  assert.match(
    (await blocked.json()).url ?? '',
    /error=TooManyAttempts/,
    "the attacker's address is stopped, even with the right password",
  );
  assert.equal(await attacker.session(), null);
  assert.equal((await owner.signInWithPassword(email, PW)).status, 200, 'the owner signs in from their own address');
  assert.equal((await owner.session())?.user?.email, email);
});

test('a session ends on sign-out, on "sign out everywhere" and for good on suspension', async () => {
  const email = uniqueEmail('sessions');
  const s = new HttpSession();
  await s.signUpAndConfirm({ name: 'Cai Morrow', email, password: PW });
  // A copy of the cookie, as a thief or a shared computer would keep it.
  const stolen = new HttpSession().copyCookiesFrom(s);
  assert.equal((await stolen.fetch('/api/boats')).status, 200);
  const csrfToken = await s.csrfToken();
  const out = await s.fetch('/api/auth/signout', {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ csrfToken, json: 'true' }),
  });
  assert.equal(out.status, 200);
  assert.equal((await stolen.fetch('/api/boats')).status, 401, 'the copied cookie no longer works after sign-out');
  assert.equal(await stolen.session(), null, "next-auth's own session endpoint refuses it too");

  // Suspension ends sessions for good: lifting it does not bring an old session back.
  const again = new HttpSession();
  await again.signInWithPassword(email, PW);
  assert.equal((await again.fetch('/api/boats')).status, 200);
  const [{ id }] = await query<{ id: string }>('select id from users where email = $1', [email]);
  const admin = new HttpSession();
  await admin.signInWithPassword(DEMO.admin, DEMO_PASSWORD);
  assert.equal(
    (await admin.json(`/api/admin/people/${id}/suspension`, { reason: 'Testing that sessions end' }, 'PUT')).res.status,
    200,
  );
  assert.equal((await again.fetch('/api/boats')).status, 401);
  assert.equal((await admin.fetch(`/api/admin/people/${id}/suspension`, { method: 'DELETE' })).status, 200);
  assert.equal((await again.fetch('/api/boats')).status, 401, 'the session stays ended after the suspension is lifted');
});

test('a burst of 30 sign-ups leaves the health check answering 200 (password hashing is off the event loop)', async () => {
  let stop = false;
  const health: { status: number; ms: number }[] = [];
  const poller = (async () => {
    while (!stop) {
      const [res, ms] = await timed(() => fetch(`${BASE_URL}/api/health`));
      health.push({ status: res.status, ms });
      await res.arrayBuffer();
      await new Promise((r) => setTimeout(r, 50));
    }
  })();
  const signUps = await Promise.all(
    Array.from({ length: 30 }, (_, i) =>
      new HttpSession('127.0.0.31').signUp({ name: `Burst ${i}`, email: uniqueEmail(`burst${i}`), password: PW }),
    ),
  );
  stop = true;
  await poller;
  assert.deepEqual([...new Set(signUps.map((r) => r.res.status))], [202]);
  assert.ok(health.length >= 3, `health was polled during the burst (${health.length} times)`);
  console.log(
    `# health during a 30 sign-up burst: ${health.length} polls, max ${Math.max(...health.map((h) => h.ms)).toFixed(0)} ms, median ${median(health.map((h) => h.ms)).toFixed(0)} ms`,
  );
  assert.deepEqual([...new Set(health.map((h) => h.status))], [200]);
});

test('sign-up is throttled per client address, counted in PostgreSQL; another address is unaffected', async () => {
  const limit = Number(process.env.SIGN_UP_LIMIT_PER_HOUR);
  assert.ok(limit > 0, 'the test run sets SIGN_UP_LIMIT_PER_HOUR');
  const from = new HttpSession('127.0.0.41');
  assert.equal((await from.signUp({ name: 'First', email: uniqueEmail('quota'), password: PW })).res.status, 202);
  const rows = await query<{ key: string }>(`select key from auth_throttles where key like 'signup:addr:%127.0.0.41'`);
  assert.equal(rows.length, 1, 'one counter for the address');
  await query('update auth_throttles set attempts = $2 where key = $1', [rows[0].key, limit]);
  const email = uniqueEmail('over-quota');
  const refused = await from.signUp({ name: 'Too Many', email, password: PW });
  assert.equal(refused.res.status, 429);
  assert.ok(Number(refused.res.headers.get('retry-after')) > 0);
  assert.equal((await query('select 1 from users where email = $1', [email])).length, 0);
  assert.equal(
    (await new HttpSession('127.0.0.42').signUp({ name: 'Elsewhere', email, password: PW })).res.status,
    202,
  );
});

test('e-mailed sign-in links are throttled per client address and per mailbox, and expired counters are purged', async () => {
  const ask = async (s: HttpSession, email: string) => {
    const csrfToken = await s.csrfToken();
    return s.fetch('/api/auth/signin/email', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ csrfToken, email, json: 'true' }),
    });
  };
  // Per mailbox: five links an hour, whoever asks; the answer does not change.
  const target = uniqueEmail('flooded');
  for (let i = 0; i < 7; i++) assert.equal((await ask(new HttpSession(`127.0.0.${50 + i}`), target)).status, 200);
  // next-auth answers each request only once its sendVerificationRequest has finished; a link asked for
  // after the seven, to another mailbox, has arrived: any sixth or seventh link would be there before it.
  const later = uniqueEmail('after-flood');
  assert.equal((await ask(new HttpSession('127.0.0.58'), later)).status, 200);
  await waitForMail(later, { subject: /sign-in link/ });
  const inbox = await (await fetch(`${MAIL_INBOX}?to=${encodeURIComponent(target)}`)).json();
  assert.equal(inbox.data.length, 5, 'only five links reach the mailbox');

  // Per client address: the counter filled to its limit refuses the next request with 429.
  const s = new HttpSession('127.0.0.61');
  assert.equal((await ask(s, uniqueEmail('linked'))).status, 200);
  const [row] = await query<{ key: string }>(
    `select key from auth_throttles where key like 'link-request:%127.0.0.61'`,
  );
  await query('update auth_throttles set attempts = 30 where key = $1', [row.key]);
  const refused = await ask(s, uniqueEmail('linked'));
  assert.equal(refused.status, 429);
  assert.equal((await refused.json()).error.code, 'rate_limited');

  // Expired counters are removed by the app itself (purge interval 1 s in the test run).
  await query(
    `insert into auth_throttles (key, window_started_at, attempts, expires_at) values ('test:expired', now() - interval '2 hours', 3, now() - interval '1 hour')`,
  );
  await new Promise((r) => setTimeout(r, 1200));
  await ask(new HttpSession('127.0.0.62'), uniqueEmail('purge'));
  // The purge runs beside the request: poll for the row to go, up to a deadline.
  const deadline = Date.now() + 5_000;
  let left = await query(`select 1 from auth_throttles where key = 'test:expired'`);
  while (left.length && Date.now() < deadline) {
    await new Promise((r) => setTimeout(r, 50));
    left = await query(`select 1 from auth_throttles where key = 'test:expired'`);
  }
  assert.equal(left.length, 0);
});

test('a bcrypt hash from before still signs in, and is replaced by a scrypt hash', async () => {
  const [before] = await query<{ hash: string }>('select password_hash as hash from users where email = $1', [
    DEMO.steward,
  ]);
  assert.equal((await new HttpSession().signInWithPassword(DEMO.steward, DEMO_PASSWORD)).status, 200);
  const [after] = await query<{ hash: string }>('select password_hash as hash from users where email = $1', [
    DEMO.steward,
  ]);
  assert.match(after.hash, /^scrypt\$/);
  if (/^\$2[aby]\$/.test(before.hash)) assert.notEqual(after.hash, before.hash, 'upgraded at sign-in');
  assert.equal(
    (await new HttpSession().signInWithPassword(DEMO.steward, DEMO_PASSWORD)).status,
    200,
    'and still signs in',
  );
});
