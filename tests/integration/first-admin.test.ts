// A real install's first site administrator (npm run serve): created at a prompt on the machine's
// console (scripts/create-first-admin.ts), only while no administrator exists, never in a database
// that holds the demo's public-password accounts. Passwords stored as salted scrypt hashes (RFC 7914;
// NIST SP 800-63B, section 5.1.1.2: salted, one-way) with at least 10 characters (the sign-up rule).
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { spawnSync } from 'node:child_process';
import { scryptSync, timingSafeEqual } from 'node:crypto';
import pg from 'pg';
import { query } from '../support/db';

const scratch = `boreline_setup_${Date.now().toString(36)}`;
const base = new URL(process.env.DATABASE_URL!);
const scratchUrl = (() => {
  const u = new URL(base);
  u.pathname = `/${scratch}`;
  return u.toString();
})();

function createAdmin(databaseUrl: string, input: string) {
  return spawnSync('node_modules/.bin/tsx', ['scripts/create-first-admin.ts'], {
    input,
    encoding: 'utf8',
    timeout: 60_000,
    env: { ...process.env, DATABASE_URL: databaseUrl },
  });
}
async function inScratch<T>(sql: string, params: unknown[] = []): Promise<T[]> {
  const c = new pg.Client({ connectionString: scratchUrl });
  await c.connect();
  try {
    return (await c.query(sql, params)).rows as T[];
  } finally {
    await c.end();
  }
}

before(async () => {
  await query(`create database ${scratch}`);
  const migrated = spawnSync('npx', ['sequelize-cli', 'db:migrate'], {
    encoding: 'utf8',
    env: { ...process.env, DATABASE_URL: scratchUrl },
    timeout: 120_000,
  });
  assert.equal(migrated.status, 0, migrated.stderr);
});
after(async () => {
  await query(`drop database if exists ${scratch} with (force)`);
});

test('refuses bad answers and an empty console; creates nothing', async () => {
  const short = createAdmin(scratchUrl, 'Ana Reyes\nana@club.example\nshort\n');
  assert.equal(short.status, 1);
  assert.match(short.stderr, /password: Use at least 10 characters/);
  const badEmail = createAdmin(scratchUrl, 'Ana Reyes\nnot-an-address\nlong-enough-password\n');
  assert.equal(badEmail.status, 1);
  assert.match(badEmail.stderr, /email: /);
  const silent = createAdmin(scratchUrl, '');
  assert.equal(silent.status, 1);
  assert.match(silent.stderr, /no administrator was created/);
  assert.deepEqual(await inScratch('select id from users'), []);
});

test('the first answers make the site administrator, once; a second run changes nothing', async () => {
  const run = createAdmin(scratchUrl, 'Ana Reyes\n  Ana@Club.Example \nriver-gauge-4471\n');
  assert.equal(run.status, 0, run.stderr);
  assert.match(run.stdout, /site administrator ana@club\.example created/);
  assert.doesNotMatch(run.stdout + run.stderr, /river-gauge-4471/, 'the password is never printed');
  const rows = await inScratch<{
    name: string;
    email: string;
    is_admin: boolean;
    password_hash: string;
    email_verified: Date | null;
  }>('select * from users');
  assert.equal(rows.length, 1);
  assert.equal(rows[0].email, 'ana@club.example');
  assert.equal(rows[0].name, 'Ana Reyes');
  assert.equal(rows[0].is_admin, true);
  assert.ok(rows[0].email_verified);
  // Checked with node:crypto's scrypt directly, not with the app's own verifier.
  const [kind, N, r, p, salt, key] = rows[0].password_hash.split('$');
  assert.equal(kind, 'scrypt', 'a scrypt hash');
  const derived = scryptSync('river-gauge-4471', Buffer.from(salt, 'base64url'), 32, {
    N: Number(N),
    r: Number(r),
    p: Number(p),
    maxmem: 64 * 1024 * 1024,
  });
  assert.ok(timingSafeEqual(derived, Buffer.from(key, 'base64url')), 'the password verifies');

  const again = createAdmin(scratchUrl, 'Mallory\nmallory@evil.example\nmallory-password-1\n');
  assert.equal(again.status, 0, again.stderr);
  assert.doesNotMatch(again.stdout, /Name:/, 'no prompt once an administrator exists');
  assert.equal((await inScratch('select 1 from users')).length, 1);
});

test('refuses a database that holds the demo accounts (their password is public)', () => {
  const run = createAdmin(process.env.DATABASE_URL!, 'Ana Reyes\nana2@club.example\nriver-gauge-4471\n');
  assert.equal(run.status, 1);
  assert.match(run.stderr, /demo accounts/);
});
