// Behind TLS (NEXTAUTH_URL https://…) the session and CSRF cookies must carry the Secure flag and
// the __Secure- / __Host- name prefixes (RFC 6265bis, sections 4.1.2.5 and 4.1.3). A second app
// server is started from the same build with an https NEXTAUTH_URL, as a deployment behind a
// TLS-terminating proxy would run it; the proxy's part (TLS itself) is not needed to read the cookies.
// HSTS (RFC 6797) is sent on every answer.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { spawn, type ChildProcess } from 'node:child_process';
import { DEMO, DEMO_PASSWORD } from '../support/env';

const PORT = Number(process.env.PORT ?? 3100) + 7;
const BASE = `http://127.0.0.1:${PORT}`;
let app: ChildProcess;

before(async () => {
  // Another server already answering on this port would be read instead of ours: refuse to start.
  const isTaken = await fetch(`${BASE}/api/health`).then(
    () => true,
    () => false,
  );
  if (isTaken) throw new Error(`port ${PORT} is already in use: stop what listens there (or set TEST_PORT)`);
  app = spawn('node_modules/.bin/next', ['start', '-p', String(PORT)], {
    env: { ...process.env, PORT: String(PORT), NEXTAUTH_URL: `https://boreline.test:${PORT}` },
    stdio: 'ignore',
    detached: true,
  });
  for (let i = 0; i < 150; i++) {
    try {
      if ((await fetch(`${BASE}/api/health`)).ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error('the https-configured app server did not start');
});

after(() => {
  if (app.pid) process.kill(-app.pid, 'SIGTERM');
});

test('behind TLS the session and CSRF cookies are Secure, HttpOnly and prefixed; HSTS is sent', async () => {
  const csrfRes = await fetch(`${BASE}/api/auth/csrf`);
  const csrfCookie = csrfRes.headers.getSetCookie().find((c) => c.startsWith('__Host-next-auth.csrf-token='));
  assert.ok(csrfCookie, 'the CSRF cookie has the __Host- prefix');
  assert.match(csrfCookie!, /;\s*Secure/i);
  assert.match(csrfCookie!, /;\s*HttpOnly/i);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };

  const res = await fetch(`${BASE}/api/auth/callback/password`, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded', cookie: csrfCookie!.split(';')[0] },
    body: new URLSearchParams({ csrfToken, email: DEMO.organiser, password: DEMO_PASSWORD, json: 'true' }),
  });
  const session = res.headers.getSetCookie().find((c) => c.startsWith('__Secure-next-auth.session-token='));
  assert.ok(
    session,
    `a __Secure- session cookie is set (got ${res.status}: ${res.headers
      .getSetCookie()
      .map((c) => c.split('=')[0])
      .join(', ')})`,
  );
  assert.match(session!, /;\s*Secure/i);
  assert.match(session!, /;\s*HttpOnly/i);
  assert.match(session!, /;\s*SameSite=Lax/i);

  // The session works on that server (the proxy would forward the cookie over http).
  const me = await fetch(`${BASE}/api/boats`, { headers: { cookie: session!.split(';')[0] } });
  assert.equal(me.status, 200);
  assert.equal(
    (await fetch(`${BASE}/sign-in`)).headers.get('strict-transport-security'),
    'max-age=31536000; includeSubDomains',
  );
});
