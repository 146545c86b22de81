import { randomBytes, scrypt as scryptCb, timingSafeEqual, type ScryptOptions } from 'node:crypto';
import bcrypt from 'bcryptjs';
import { createSlots } from '@/lib/core/concurrency/slots';

// Password hashes: scrypt from Node's own crypto, which runs on libuv's thread pool, so a burst of
// sign-ups or sign-ins never blocks the event loop that answers everyone else.
// Parameters: N = 2^14, r = 8, p = 5, one of the equal-strength settings the OWASP Password Storage
// Cheat Sheet lists for scrypt (16 MiB per hash). Stored as scrypt$N$r$p$salt$hash (base64url).
// Hashes made earlier with bcrypt still verify and are replaced at the next successful sign-in.

const PARAMS = { N: 2 ** 14, r: 8, p: 5 } as const;

// At most half of libuv's thread pool (4 threads unless UV_THREADPOOL_SIZE says otherwise) hashes at once. The
// pool also serves file reads, DNS lookups and compression for every other request: with all of it hashing, a
// burst of 30 sign-ups held a health check for 3 seconds (tests/integration/account-trust.test.ts). The rest wait
// their turn; on 2 cores that costs the burst nothing, as two hashes at once already use both.
const hashSlots = createSlots(Math.max(1, Math.floor((Number(process.env.UV_THREADPOOL_SIZE) || 4) / 2)));
const KEY_BYTES = 32;
const SALT_BYTES = 16;

function scrypt(password: string, salt: Buffer, params: { N: number; r: number; p: number }): Promise<Buffer> {
  const options: ScryptOptions = { ...params, maxmem: 256 * params.N * params.r + 1024 * 1024 };
  return hashSlots.run(
    () =>
      new Promise<Buffer>((resolve, reject) =>
        scryptCb(password.normalize('NFKC'), salt, KEY_BYTES, options, (err, key) =>
          err ? reject(err) : resolve(key),
        ),
      ),
  );
}

export async function hashPassword(password: string): Promise<string> {
  const salt = randomBytes(SALT_BYTES);
  const key = await scrypt(password, salt, PARAMS);
  return ['scrypt', PARAMS.N, PARAMS.r, PARAMS.p, salt.toString('base64url'), key.toString('base64url')].join('$');
}

export type PasswordCheck = { isMatch: boolean; needsRehash: boolean };

/** Checks a password against a stored hash of either kind; false for anything unreadable. */
export async function verifyPassword(password: string, stored: string | null | undefined): Promise<PasswordCheck> {
  if (!stored) return { isMatch: false, needsRehash: false };
  if (/^\$2[aby]\$/.test(stored)) return { isMatch: await bcrypt.compare(password, stored), needsRehash: true };
  const parts = stored.split('$');
  if (parts.length !== 6 || parts[0] !== 'scrypt') return { isMatch: false, needsRehash: false };
  const [N, r, p] = parts.slice(1, 4).map(Number);
  if (![N, r, p].every((n) => Number.isInteger(n) && n > 0) || N > 2 ** 20)
    return { isMatch: false, needsRehash: false };
  const expected = Buffer.from(parts[5], 'base64url');
  const actual = await scrypt(password, Buffer.from(parts[4], 'base64url'), { N, r, p });
  const isMatch = expected.length === actual.length && timingSafeEqual(expected, actual);
  return { isMatch, needsRehash: isMatch && (N !== PARAMS.N || r !== PARAMS.r || p !== PARAMS.p) };
}

let dummy: Promise<string> | undefined;

/**
 * Spends the same work as checking a real password, for an address with no account (or no
 * password), so that the time taken does not tell a stranger which addresses are registered.
 */
export async function spendPasswordCheck(password: string): Promise<void> {
  dummy ??= hashPassword(randomBytes(12).toString('base64url'));
  await verifyPassword(password, await dummy);
}
