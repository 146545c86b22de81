// GET /api/health: 200 with the database up, 503 while it is stopped, and 200 again after.
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
