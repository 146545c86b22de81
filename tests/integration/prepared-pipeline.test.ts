// The dock's record is written as BEGIN, two prepared statements and COMMIT sent in one round trip
// (lib/server/db/prepared-query.ts, preparedPipeline). Checked against the real PostgreSQL that this
// keeps the meaning of a transaction: a later statement sees an earlier one's insert (READ COMMITTED
// takes a new snapshot per statement: PostgreSQL documentation, "Transaction Isolation"); once a
// statement fails, the rest of the block is refused and COMMIT rolls everything back (PostgreSQL
// documentation, COMMIT, and the frontend/backend protocol's "Pipelining" section: after an error the
// server discards what follows until the next Sync); the error raised is the statement that failed
// (23505 unique_violation, PostgreSQL documentation, Appendix A "Error Codes"), never the refusals it
// caused (25P02); and the pooled connection is usable afterwards, by the pipeline and by Sequelize.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { spawnSync } from 'node:child_process';

test('a pipelined transaction commits together, rolls back together, and leaves its connection usable', () => {
  const run = spawnSync('node_modules/.bin/tsx', ['--conditions=react-server', 'tests/support/pipeline-probe.ts'], {
    encoding: 'utf8',
    timeout: 60_000,
    env: { ...process.env, DB_POOL_MAX: '1' },
  });
  assert.equal(run.status, 0, run.stderr);
  const out = JSON.parse(run.stdout.trim().split('\n').at(-1)!);
  assert.deepEqual(out.first, [[{ id: 1 }], [{ n: 1 }]], 'the count, sent before the insert was answered, sees it');
  assert.deepEqual(out.secondFails, { code: '23505' }, 'the duplicate key is the error raised');
  assert.deepEqual(out.afterSecondFails, [1], 'the insert of 2 before the failure was rolled back');
  assert.deepEqual(out.firstFails, { code: '23505' }, 'not 25P02, the refusal of the statement after it');
  assert.deepEqual(out.afterFirstFails, [1], 'the statement after the failure was not run');
  assert.deepEqual(out.unbound, { code: null }, 'a missing value is refused before anything reaches PostgreSQL');
  assert.equal(out.outside, true, 'and no transaction was left open on the connection');
  assert.deepEqual(out.again, [[{ id: 4 }], [{ n: 2 }]]);
  assert.deepEqual(out.plainQueryAfter, { one: 1 });
});
