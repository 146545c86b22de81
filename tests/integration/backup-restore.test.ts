// npm run db:backup and db:restore: a backup of the test database restored into an empty
// database holds the same records (compared table by table with an md5 of every row, a
// general-purpose PostgreSQL checksum), and the append-only triggers come back with it.
// Runs alone (scripts/test.sh): it dumps the whole test database and compares the restore table by table.
import { test, after } from 'node:test';
import assert from 'node:assert/strict';
import { execFileSync } from 'node:child_process';
import os from 'node:os';
import path from 'node:path';
import fs from 'node:fs';
import pg from 'pg';

const sourceUrl = process.env.DATABASE_URL!;
const target = `boreline_restore_${process.pid}`;
const targetUrl = sourceUrl.replace(/\/[^/]+$/, `/${target}`);
const adminUrl = sourceUrl.replace(/\/[^/]+$/, '/postgres');
const dump = path.join(os.tmpdir(), `boreline-${process.pid}.dump`);
const TABLES = [
  'users',
  'events',
  'race_classes',
  'class_rule_versions',
  'boats',
  'entries',
  'boat_tags',
  'instruments',
];

async function fingerprint(url: string) {
  const c = new pg.Client({ connectionString: url });
  await c.connect();
  const out: Record<string, { n: number; md5: string }> = {};
  for (const t of TABLES) {
    const r = await c.query(
      `select count(*)::int as n, coalesce(md5(string_agg(md5(x::text), '' order by x::text)), '') as md5 from ${t} x`,
    );
    out[t] = r.rows[0];
  }
  await c.end();
  return out;
}

after(async () => {
  const c = new pg.Client({ connectionString: adminUrl });
  await c.connect();
  await c.query(`drop database if exists ${target} with (force)`);
  await c.end();
  fs.rmSync(dump, { force: true });
});

test('a backup restored into an empty database has the same records', async () => {
  const written = execFileSync('bash', ['scripts/db-backup.sh', dump], { env: process.env, encoding: 'utf8' }).trim();
  assert.equal(written, dump);
  assert.ok(fs.statSync(dump).size > 1000);
  execFileSync('bash', ['scripts/db-restore.sh', dump, target], { env: process.env, encoding: 'utf8' });
  const [a, b] = await Promise.all([fingerprint(sourceUrl), fingerprint(targetUrl)]);
  assert.ok(a.users.n > 0 && a.entries.n > 0, 'the test database has demo data to compare');
  assert.deepEqual(b, a);

  const c = new pg.Client({ connectionString: targetUrl });
  await c.connect();
  await assert.rejects(
    c.query(`update class_rule_versions set change_note = 'x' where status = 'published'`),
    /frozen/,
  );
  await c.end();
});

test('restoring over a database that already has tables is refused', () => {
  assert.throws(
    () => execFileSync('bash', ['scripts/db-restore.sh', dump, target], { env: process.env, stdio: 'pipe' }),
    /already has/,
  );
});
