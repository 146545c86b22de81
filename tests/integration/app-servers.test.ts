// Issue 17, item 3 (the part in npm test): a second app server from the same build, started beside
// the first, honours a session made on the first, and a sign-out on the second ends it on both. App
// servers keep no state of their own (sessions, throttles and records live in PostgreSQL), which is
// what lets several run behind a proxy (npm run bench:multi runs them behind nginx).
// Runs alone (scripts/test.sh): it starts a second app server and signs the demo entrant out, which ends every
// session of that person.
import { test, after } from 'node:test';
import assert from 'node:assert/strict';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { startAppServer, stopAll } from '../../scripts/app-servers';

after(stopAll);

test('a session made on one app server works on another, and signing out on either ends it on both', async () => {
  const second = await startAppServer(Number(process.env.PORT) + 23);
  // Same host name as the first server (cookies belong to a host, not a port).
  const other = `http://localhost:${second.port}`;
  const s = new HttpSession();
  await s.signInWithPassword(DEMO.entrant, DEMO_PASSWORD);
  assert.equal((await s.fetch('/api/boats')).status, 200, 'signed in on the first');

  const there = await s.fetch(`${other}/api/auth/session`);
  assert.equal(there.status, 200);
  assert.equal(((await there.json()) as { user?: { email?: string } }).user?.email, DEMO.entrant);
  assert.equal((await s.fetch(`${other}/api/boats`)).status, 200, 'the same cookie is honoured on the second');
  const boatsHere = (await (await s.fetch('/api/boats')).json()) as { data: unknown[] };
  const boatsThere = (await (await s.fetch(`${other}/api/boats`)).json()) as { data: unknown[] };
  assert.deepEqual(boatsThere.data, boatsHere.data, 'both read the one database');

  const kept = new HttpSession().copyCookiesFrom(s);
  const csrfToken = ((await (await s.fetch(`${other}/api/auth/csrf`)).json()) as { csrfToken: string }).csrfToken;
  const out = await s.fetch(`${other}/api/auth/signout`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ csrfToken, json: 'true' }),
  });
  assert.equal(out.status, 200);
  assert.equal((await kept.fetch('/api/boats')).status, 401, 'signed out on the second: ended on the first too');
  assert.equal((await kept.fetch(`${other}/api/boats`)).status, 401);
});
