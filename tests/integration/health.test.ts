// GET /api/health: 200 with the database up, 503 while it is stopped, and 200 again after; the public
// calculation API answers meanwhile.
// Runs alone (scripts/test.sh): it stops PostgreSQL.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { execFileSync } from 'node:child_process';
import { BASE_URL } from '../support/env';
import pkg from '../../package.json';

const pgCtl = (action: 'start' | 'stop') =>
  execFileSync('bash', ['scripts/pg.sh', 'boreline_test'], {
    env: { ...process.env, PG_ACTION: action },
    stdio: 'pipe',
  });

test('health is 200 with the version when the database answers', async () => {
  const res = await fetch(`${BASE_URL}/api/health`);
  assert.equal(res.status, 200);
  const body = await res.json();
  assert.equal(body.data.version, pkg.version);
  assert.equal(body.data.database, 'up');
});

test('health is 503 while PostgreSQL is stopped and recovers by itself', async () => {
  pgCtl('stop');
  try {
    const started = Date.now();
    const res = await fetch(`${BASE_URL}/api/health`);
    assert.equal(res.status, 503);
    assert.equal((await res.json()).data.database, 'down');
    assert.ok(Date.now() - started < 5000, 'answers promptly, no hang');
    // The public calculation needs no database: it goes on answering, its rate limit counted in the
    // app server's memory meanwhile (attack finding F20), and the figures are the usual ones.
    const calc = await fetch(`${BASE_URL}/api/v1/jet-performance`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ powerKw: 300, nozzleDiameterMm: 100, speedsMs: [0] }),
    });
    const calcBody = await calc.json();
    assert.equal(calc.status, 200, JSON.stringify(calcBody));
    // Default fresh water at 15 °C, 999.1026 kg/m³ (ITTC Recommended Procedure 7.5-02-01-03).
    assert.ok(Math.abs(calcBody.data.densityKgM3 - 999.1026) < 1e-4);
  } finally {
    pgCtl('start');
  }
  let status = 0;
  for (let i = 0; i < 50 && status !== 200; i++) {
    status = (await fetch(`${BASE_URL}/api/health`)).status;
    if (status !== 200) await new Promise((r) => setTimeout(r, 200));
  }
  assert.equal(status, 200);
});
