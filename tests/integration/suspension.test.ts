// Suspending an account (site administrator only): the person cannot sign in by password,
// e-mailed link or staff invitation, an open session stops working on its next request, a wrong password still gets the
// ordinary refusal (a stranger learns nothing), and lifting the suspension restores access.
// Common practice for account administration, no single source.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD, uniqueEmail, MAIL_INBOX } from '../support/env';
import { query } from '../support/db';
import { firstLink, waitForMail } from '../support/mail';

const PASSWORD = 'suspension-test-pw-1';

async function signInAnswer(s: HttpSession, email: string, password: string) {
  const res = await s.signInWithPassword(email, password);
  const body = await res.json().catch(() => null);
  return { status: res.status, url: String(body?.url ?? res.headers.get('location') ?? '') };
}

test('suspend: refused sign-in and a dead open session; lift: signing in works again, the old session stays ended; only the administrator may', async () => {
  const email = uniqueEmail('suspended');
  const person = new HttpSession();
  assert.equal((await person.json('/api/accounts', { name: 'Orrin Vale', email, password: PASSWORD })).res.status, 202);
  await person.signInWithPassword(email, PASSWORD);
  assert.equal((await person.fetch('/api/boats')).status, 200, 'signed in');
  const [{ id }] = await query<{ id: string }>('select id from users where email = $1', [email]);
  const url = `/api/admin/people/${id}/suspension`;

  const organiser = new HttpSession();
  await organiser.signInWithPassword(DEMO.organiser, DEMO_PASSWORD);
  assert.equal((await organiser.json(url, { reason: 'not mine to do' }, 'PUT')).res.status, 403);

  const admin = new HttpSession();
  await admin.signInWithPassword(DEMO.admin, DEMO_PASSWORD);
  const noReason = await admin.json(url, { reason: ' ' }, 'PUT');
  assert.equal(noReason.res.status, 400);
  assert.equal(noReason.body.error.details[0].field, 'reason');
  assert.equal(
    (await query('select suspended_at from users where id = $1', [id]))[0].suspended_at,
    null,
    'nothing changed on a refused request',
  );

  const done = await admin.json(url, { reason: 'Left the club; login reported shared.' }, 'PUT');
  assert.equal(done.res.status, 200, JSON.stringify(done.body));
  assert.ok(done.body.data.suspendedAt);
  assert.equal(done.body.data.suspendedReason, 'Left the club; login reported shared.');
  assert.equal((await admin.json(url, { reason: 'again' }, 'PUT')).res.status, 409, 'already suspended');

  assert.equal((await person.fetch('/api/boats')).status, 401, 'the open session stops working at once');
  const fresh = new HttpSession();
  const refused = await signInAnswer(fresh, email, PASSWORD);
  assert.match(refused.url, /error=AccountSuspended/, 'the right password meets the suspension');
  assert.equal(await fresh.session(), null);
  const wrong = await signInAnswer(new HttpSession(), email, 'not-the-password');
  assert.match(wrong.url, /error=CredentialsSignin/, 'a wrong password learns nothing about the suspension');
  const link = new HttpSession();
  const csrfToken = await link.csrfToken();
  const linkRes = await link.fetch('/api/auth/signin/email', {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ csrfToken, email, json: 'true' }),
  });
  // The same answer as for any address (nothing to learn about the account), and no link is sent.
  assert.match(
    String((await linkRes.json()).url),
    /verify-request/,
    'the answer does not say the account is suspended',
  );

  // An invitation to a meeting's staff does not get a suspended person in, nor give them the role.
  const invite = await organiser.json(`/api/events/${DEMO.meetingId}/invitations`, { email, role: 'scrutineer' });
  assert.equal(invite.res.status, 201, JSON.stringify(invite.body));
  const token = new URL(firstLink(await waitForMail(email, { subject: /invited/ }))).pathname.split('/').pop()!;
  // next-auth answers a link request only once its sendVerificationRequest has finished, so a link would have
  // reached the mailbox before the invitation asked for after it; the invitation is there, the link is not.
  const links = await (await fetch(`${MAIL_INBOX}?to=${encodeURIComponent(email)}`)).json();
  assert.equal(
    links.data.filter((m: { subject: string }) => /sign-in link/.test(m.subject)).length,
    0,
    'no sign-in link for a suspended account',
  );
  const invited = new HttpSession();
  const invitedCsrf = await invited.csrfToken();
  const viaInvitation = await invited.fetch('/api/auth/callback/invitation', {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ csrfToken: invitedCsrf, token, json: 'true' }),
  });
  assert.match(String((await viaInvitation.json()).url), /error=AccountSuspended/);
  assert.equal(await invited.session(), null);
  assert.equal(
    (await query('select 1 from event_staff where user_id = $1', [id])).length,
    0,
    'no role for a suspended account',
  );
  assert.equal(
    (await query('select 1 from staff_invitations where email = $1 and accepted_at is null', [email])).length,
    1,
    'the invitation stays unused',
  );

  const [{ id: adminId }] = await query<{ id: string }>('select id from users where email = $1', [DEMO.admin]);
  assert.equal(
    (await admin.json(`/api/admin/people/${adminId}/suspension`, { reason: 'testing myself' }, 'PUT')).res.status,
    409,
    "not one's own account",
  );

  const lifted = await admin.fetch(url, { method: 'DELETE' });
  assert.equal(lifted.status, 200);
  assert.equal((await lifted.json()).data.suspendedAt, null);
  assert.equal((await admin.fetch(url, { method: 'DELETE' })).status, 409, 'not suspended any more');
  assert.equal((await person.fetch('/api/boats')).status, 401, 'a session ended by the suspension stays ended');
  const again = new HttpSession();
  await again.signInWithPassword(email, PASSWORD);
  assert.equal((await again.session())?.user?.email, email);
  assert.equal((await again.fetch('/api/boats')).status, 200, 'a new sign-in works again');
});
