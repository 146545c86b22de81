// Sign-in, sign-up and staff invitations through the real HTTP endpoints and the real database.
// Runs alone (scripts/test.sh): it counts every account and every staff invitation (a refused request stores none).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { waitForMail, firstLink } from '../support/mail';
import { query } from '../support/db';

test('password sign-in: the right password signs in, a wrong one does not', async () => {
  const good = new HttpSession();
  const res = await good.signInWithPassword(DEMO.organiser, DEMO_PASSWORD);
  assert.equal(res.status, 200);
  assert.ok(good.hasCookie(/next-auth\.session-token$/), 'session cookie set');
  assert.equal((await good.session())?.user?.email, DEMO.organiser);

  const bad = new HttpSession();
  const badRes = await bad.signInWithPassword(DEMO.organiser, 'not-the-password');
  assert.equal(badRes.status, 401);
  assert.equal(bad.hasCookie(/next-auth\.session-token$/), false);
  assert.equal(await bad.session(), null);
});

test('e-mail link sign-in: the link reaches the fake outbox and signs the person in', async () => {
  const s = new HttpSession();
  const csrfToken = await s.csrfToken();
  const res = await s.fetch('/api/auth/signin/email', {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ csrfToken, email: DEMO.steward, json: 'true' }),
  });
  assert.equal(res.status, 200);
  const mail = await waitForMail(DEMO.steward, { subject: /sign-in link/ });
  const link = firstLink(mail);
  assert.match(link, /\/api\/auth\/callback\/email\?/);
  const callback = await s.fetch(link);
  assert.equal(callback.status, 302);
  assert.equal((await s.session())?.user?.email, DEMO.steward);

  const again = new HttpSession();
  const reuse = await again.fetch(link);
  assert.match(reuse.headers.get('location') ?? '', /error=Verification/, 'a used link does not work twice');
});

test('sign-up creates an entrant with an unproven address; the mailed link and the password confirm it', async () => {
  const email = uniqueEmail('entrant');
  const s = new HttpSession();
  const { res, body } = await s.signUp({ name: 'Tess Marram', email, password: 'long-enough-pw' });
  assert.equal(res.status, 202, JSON.stringify(body));
  assert.deepEqual(body.data, { email, next: 'confirm-address' });
  const [row] = await query<{ verified: Date | null }>(
    'select email_verified as verified from users where email = $1',
    [email],
  );
  assert.equal(row.verified, null, 'unproven until the link is followed');
  assert.equal((await s.signInWithPassword(email, 'long-enough-pw')).status, 200, 'an unproven account can sign in');

  const stranger = new HttpSession();
  assert.equal((await stranger.confirmAddress(email, 'not-the-password')).status, 401, 'the link alone is not enough');
  const owner = new HttpSession();
  assert.equal((await owner.confirmAddress(email, 'long-enough-pw')).status, 200);
  assert.equal((await owner.session())?.user?.email, email, 'confirming signs the owner in');
  const [after] = await query<{ verified: Date | null }>(
    'select email_verified as verified from users where email = $1',
    [email],
  );
  assert.ok(after.verified, 'proven');
  assert.equal((await new HttpSession().confirmAddress(email, 'long-enough-pw')).status, 401, 'a link works once');
});

test('sign-up bad input: malformed e-mail, short password, missing name each get a field message and create nothing', async () => {
  const before = await query<{ n: string }>('select count(*) as n from users');
  const s = new HttpSession();
  const cases = [
    { body: { name: 'A', email: 'not-an-email', password: 'long-enough-pw' }, field: 'email', status: 400 },
    { body: { name: 'A', email: uniqueEmail(), password: 'short' }, field: 'password', status: 400 },
    { body: { email: uniqueEmail(), password: 'long-enough-pw' }, field: 'name', status: 400 },
  ];
  for (const c of cases) {
    const { res, body } = await s.json('/api/accounts', c.body);
    assert.equal(res.status, c.status, JSON.stringify(body));
    const detail = body.error.details.find((d: { field: string }) => d.field === c.field);
    assert.ok(detail, `names the field ${c.field}: ${JSON.stringify(body)}`);
    assert.ok(detail.message.length > 10, 'a readable message');
  }
  const after = await query<{ n: string }>('select count(*) as n from users');
  assert.equal(after[0].n, before[0].n);
});

test('sign-up refuses a body that is not JSON, with a clear error', async () => {
  const s = new HttpSession();
  const res = await s.fetch('/api/accounts', {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: '{nope',
  });
  assert.equal(res.status, 400);
  assert.equal((await res.json()).error.code, 'invalid_json');
});

test('an organiser invites a scrutineer; the e-mailed link signs them in with the role at that event', async () => {
  const organiser = new HttpSession();
  await organiser.signInWithPassword(DEMO.organiser, DEMO_PASSWORD);
  const email = uniqueEmail('scrut');
  const { res, body } = await organiser.json(`/api/events/${DEMO.meetingId}/invitations`, {
    email,
    role: 'scrutineer',
  });
  assert.equal(res.status, 201, JSON.stringify(body));

  const mail = await waitForMail(email, { subject: /invited/ });
  const link = firstLink(mail);
  const token = new URL(link).pathname.split('/').pop()!;
  const invitee = new HttpSession();
  const csrfToken = await invitee.csrfToken();
  const signIn = await invitee.fetch('/api/auth/callback/invitation', {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ csrfToken, token, json: 'true' }),
  });
  assert.equal(signIn.status, 200);
  assert.equal((await invitee.session())?.user?.email, email);
  const roles = await query<{ role: string }>(
    'select s.role from event_staff s join users u on u.id = s.user_id where u.email = $1 and s.event_id = $2',
    [email, DEMO.meetingId],
  );
  assert.deepEqual(
    roles.map((r) => r.role),
    ['scrutineer'],
  );

  const reuse = new HttpSession();
  const t2 = await reuse.csrfToken();
  const second = await reuse.fetch('/api/auth/callback/invitation', {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ csrfToken: t2, token, json: 'true' }),
  });
  assert.equal(second.status, 401, 'an invitation works once');
});

test('only the event organiser may invite or appoint staff: an entrant gets 403, anonymous 401, before the body is read; nothing stored', async () => {
  const before = await query<{ n: string }>('select count(*) as n from staff_invitations');
  const entrant = new HttpSession();
  await entrant.signInWithPassword(DEMO.entrant, DEMO_PASSWORD);
  const r1 = await entrant.json(`/api/events/${DEMO.meetingId}/invitations`, { email: uniqueEmail(), role: 'steward' });
  assert.equal(r1.res.status, 403);
  const anon = new HttpSession();
  const r2 = await anon.json(`/api/events/${DEMO.meetingId}/invitations`, { email: uniqueEmail(), role: 'steward' });
  assert.equal(r2.res.status, 401);
  // The permission is asked before the body is read: a malformed, an oversized or a wrongly typed body from
  // someone who may not appoint gets the same refusal (read first, they would be 400, 413 and 415).
  for (const path of ['invitations', 'staff']) {
    for (const [who, s, status] of [
      ['an entrant', entrant, 403],
      ['anonymous', anon, 401],
    ] as const) {
      const post = (body: string, type = 'application/json') =>
        s.fetch(`/api/events/${DEMO.meetingId}/${path}`, { method: 'POST', headers: { 'content-type': type }, body });
      assert.equal((await post('{nope')).status, status, `${path}, ${who}: malformed body`);
      assert.equal(
        (await post(JSON.stringify({ email: 'x'.repeat(300_000) }))).status,
        status,
        `${path}, ${who}: huge`,
      );
      assert.equal((await post('email=a', 'text/plain')).status, status, `${path}, ${who}: wrong type`);
    }
  }
  const after = await query<{ n: string }>('select count(*) as n from staff_invitations');
  assert.equal(after[0].n, before[0].n);
});
