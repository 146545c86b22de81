// Issue 17, item 4: reads that may lag (reports, public pages, lists) go to a replica when one is
// configured; everything else, transactions included, stays on the primary. Checked through
// Sequelize's read/write split (Sequelize 6 documentation, "Read replication") against the real
// PostgreSQL: the "replica" here is a second database on the test cluster, so each query's
// current_database() says where it went. The streaming replica itself is in npm run bench:replica.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { spawnSync } from 'node:child_process';
import { query } from '../support/db';

test('with a replica configured, only FROM_REPLICA reads outside a transaction reach it', async () => {
  await query('drop database if exists boreline_replica_probe');
  await query('create database boreline_replica_probe');
  try {
    const primary = process.env.DATABASE_URL!;
    const replica = Object.assign(new URL(primary), { pathname: '/boreline_replica_probe' }).toString();
    const run = spawnSync(
      'node_modules/.bin/tsx',
      ['--conditions=react-server', 'tests/support/replica-probe.ts', primary, replica],
      { encoding: 'utf8', timeout: 60_000 },
    );
    assert.equal(run.status, 0, run.stderr);
    const where = JSON.parse(run.stdout.trim().split('\n').at(-1)!) as Record<string, string>;
    const primaryDb = new URL(primary).pathname.slice(1);
    assert.deepEqual(where, {
      plainSelect: primaryDb, // Sequelize's own default would send this one to the replica
      fromReplica: 'boreline_replica_probe',
      rawQuery: primaryDb,
      inTransaction: primaryDb,
    });
  } finally {
    await query('drop database if exists boreline_replica_probe with (force)');
  }
});
