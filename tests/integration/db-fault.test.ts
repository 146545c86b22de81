// A short burst of inspection records with PostgreSQL restarted in the middle (the small version of
// npm run bench:reliability): the app answers 503 while the database is down — never another 5xx —
// recovers by itself, and clients retrying with their idempotency keys end with every record
// stored exactly once.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { runFaultLoad } from '../../scripts/bench-reliability';

test('a database restart during a burst loses and duplicates nothing', async () => {
  const r = await runFaultLoad({ clients: 6, perClient: 8, faultAfter: 12, downS: 2 });
  assert.equal(r.acknowledged, r.expected, 'every record was acknowledged in the end');
  assert.equal(r.lost, 0);
  assert.equal(r.duplicated, 0);
  assert.equal(r.storedRows, r.expected);
  assert.equal(r.s5xx, 0, 'no 5xx other than 503');
  assert.ok(r.s503 + r.networkErrors > 0, 'the fault happened while requests were in flight');
  assert.ok(r.secondsToRecover !== null && r.secondsToRecover < 15, `recovered in ${r.secondsToRecover} s`);
});
