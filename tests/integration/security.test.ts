// Browser-facing protections: security headers (OWASP Secure Headers Project recommendations; CSP
// Level 3 nonces with 'strict-dynamic' for pages),
// session cookie flags (RFC 6265bis: HttpOnly, SameSite), the cross-site origin check on
// state-changing route handlers, next-auth's own CSRF token, and sign-in throttling stored in
// PostgreSQL (so it holds across app servers).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { HttpSession } from '../support/http-session';
import { BASE_URL, DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { query } from '../support/db';

test('pages and API answers carry the security headers', async () => {
  for (const path of ['/', '/sign-in', '/api/health']) {
    const res = await fetch(`${BASE_URL}${path}`);
    const csp = res.headers.get('content-security-policy') ?? '';
    if (path.startsWith('/api/')) {
      assert.match(csp, /default-src 'none'/, `${path}: an API answer runs nothing`);
    } else {
      assert.match(csp, /default-src 'self'/, path);
      assert.match(csp, /script-src 'self' 'nonce-[^']+' 'strict-dynamic'/, `${path}: scripts by nonce only`);
      assert.doesNotMatch(csp, /script-src[^;]*unsafe-inline/, path);
      assert.match(csp, /object-src 'none'/, path);
    }
    assert.equal(csp.split(', ').length, 1, `${path}: one policy, not two`);
    assert.match(csp, /frame-ancestors 'none'/, path);
    assert.equal(res.headers.get('x-content-type-options'), 'nosniff', path);
    assert.equal(res.headers.get('referrer-policy'), 'strict-origin-when-cross-origin', path);
    assert.equal(res.headers.get('x-frame-options'), 'DENY', path);
    assert.equal(res.headers.get('x-powered-by'), null, path);
  }
});

test('the session cookie is HttpOnly and SameSite=Lax', async () => {
  const s = new HttpSession();
  const csrf = await s.csrfToken();
  const res = await s.fetch('/api/auth/callback/password', {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ csrfToken: csrf, email: DEMO.organiser, password: DEMO_PASSWORD, json: 'true' }),
  });
  const cookie = res.headers.getSetCookie().find((c) => /next-auth\.session-token=/.test(c));
  assert.ok(cookie, 'a session cookie is set');
  assert.match(cookie!, /HttpOnly/i);
  assert.match(cookie!, /SameSite=Lax/i);
  assert.match(cookie!, /Path=\//);
});

test('a state-changing request from another site is refused and changes nothing', async () => {
  const email = uniqueEmail('csrf');
  const res = await fetch(`${BASE_URL}/api/accounts`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: 'https://evil.example' },
    body: JSON.stringify({ name: 'Mallory', email, password: 'long-enough-pw' }),
  });
  assert.equal(res.status, 403);
  assert.equal((await res.json()).error.code, 'bad_origin');
  assert.equal((await query('select 1 from users where email = $1', [email])).length, 0);
});

test('next-auth refuses a sign-in without its CSRF token', async () => {
  const s = new HttpSession();
  await s.fetch('/api/auth/callback/password', {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ email: DEMO.organiser, password: DEMO_PASSWORD, json: 'true' }),
  });
  assert.equal(await s.session(), null);
});

test('sign-in is throttled per account at one address after 10 failures, with the counter kept in PostgreSQL', async () => {
  const email = uniqueEmail('throttle');
  await new HttpSession().json('/api/accounts', { name: 'Throttle Test', email, password: 'the-right-password' });
  for (let i = 0; i < 10; i++) {
    const res = await new HttpSession().signInWithPassword(email, `wrong-${i}`);
    assert.equal(res.status, 401);
  }
  const blocked = new HttpSession();
  const res = await blocked.signInWithPassword(email, 'the-right-password');
  const body = await res.json();
  assert.match(body.url ?? '', /error=TooManyAttempts/, 'even the right password waits');
  assert.equal(await blocked.session(), null);
  const [row] = await query<{ attempts: number }>('select attempts from auth_throttles where key like $1', [
    `signin-fail:pair:${email}|%`,
  ]);
  assert.ok(row.attempts >= 10, 'failures counted for the account at this address');
});
