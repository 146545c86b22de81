// Short bursts of inspection records with a fault in the middle (the small version of
// npm run bench:reliability): PostgreSQL stopped cleanly, PostgreSQL crashed (SIGKILL, then its WAL
// replayed at start) and the app server crashed (SIGKILL, then started again). While the database is
// down the app answers 503, never another 5xx; it recovers by itself; and clients retrying with their
// idempotency keys end with every acknowledged record stored exactly once.
// Runs alone (scripts/test.sh): it stops and kills PostgreSQL and kills the app server.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { runFaultLoad } from '../../scripts/bench-reliability';

test('a database restart during a burst loses and duplicates nothing', async () => {
  const r = await runFaultLoad({ clients: 6, perClient: 8, faultAfter: 12, downS: 2, fault: 'pg-stop' });
  assert.equal(r.acknowledged, r.expected, 'every record was acknowledged in the end');
  assert.equal(r.lost, 0);
  assert.equal(r.duplicated, 0);
  assert.equal(r.storedRows, r.expected);
  assert.equal(r.s5xx, 0, 'no 5xx other than 503');
  assert.ok(r.s503 + r.networkErrors > 0, 'the fault happened while requests were in flight');
  assert.ok(r.secondsToRecover !== null && r.secondsToRecover < 15, `recovered in ${r.secondsToRecover} s`);
});

test('PostgreSQL killed with SIGKILL during a burst: every acknowledged record is there exactly once', async () => {
  const r = await runFaultLoad({ clients: 10, perClient: 8, faultAfter: 20, downS: 1, fault: 'pg-kill' });
  assert.equal(r.acknowledged, r.expected, 'every record was acknowledged in the end');
  assert.equal(r.lost, 0, 'no acknowledged record lost to the crash');
  assert.equal(r.duplicated, 0);
  assert.equal(r.storedRows, r.expected);
  assert.equal(r.s5xx, 0, 'no 5xx other than 503');
  assert.ok(r.s503 + r.networkErrors > 0, 'the crash happened while requests were in flight');
  assert.ok(r.secondsToRecover !== null && r.secondsToRecover < 30, `recovered in ${r.secondsToRecover} s`);
});

test('the app server killed with SIGKILL during a burst and started again: nothing lost or doubled', async () => {
  const r = await runFaultLoad({ clients: 10, perClient: 8, faultAfter: 20, downS: 1, fault: 'app-kill' });
  assert.equal(r.acknowledged, r.expected, 'every record was acknowledged in the end');
  assert.equal(r.lost, 0);
  assert.equal(r.duplicated, 0);
  assert.equal(r.storedRows, r.expected);
  assert.equal(r.s5xx, 0, 'no 5xx answers');
  assert.ok(r.networkErrors > 0, 'the crash cut requests in flight');
  assert.ok(r.secondsToRecover !== null && r.secondsToRecover < 60, `recovered in ${r.secondsToRecover} s`);
});
