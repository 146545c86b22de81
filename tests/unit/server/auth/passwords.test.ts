// Password hashing: scrypt (RFC 7914) through node:crypto, legacy bcrypt hashes still verified.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import bcrypt from 'bcryptjs';
import { hashPassword, verifyPassword } from '../../../../lib/server/auth/passwords';

const b64url = (hex: string) => Buffer.from(hex, 'hex').toString('base64url');

test('verifies against the scrypt test vectors of RFC 7914, section 12 (first 32 bytes of each derived key)', async () => {
  // scrypt(P="password", S="NaCl", N=1024, r=8, p=16, dkLen=64) and
  // scrypt(P="pleaseletmein", S="SodiumChloride", N=16384, r=8, p=1, dkLen=64), RFC 7914 section 12.
  // PBKDF2's first block does not depend on dkLen, so the first 32 bytes are the 32-byte key.
  const v2 = `scrypt$1024$8$16$${Buffer.from('NaCl').toString('base64url')}$${b64url('fdbabe1c9d3472007856e7190d01e9fe7c6ad7cbc8237830e77376634b373162')}`;
  const v3 = `scrypt$16384$8$1$${Buffer.from('SodiumChloride').toString('base64url')}$${b64url('7023bdcb3afd7348461c06cd81fd38ebfda8fbba904f8e3ea9b543f6545da1f2')}`;
  assert.deepEqual(await verifyPassword('password', v2), { isMatch: true, needsRehash: true });
  assert.deepEqual(
    await verifyPassword('pleaseletmein', v3),
    { isMatch: true, needsRehash: true },
    'other parameters than ours: rehash',
  );
  assert.equal((await verifyPassword('Password', v2)).isMatch, false);
});

test('a new hash verifies, carries its own salt and the current parameters, and needs no rehash', async () => {
  const a = await hashPassword('correct horse battery staple');
  const b = await hashPassword('correct horse battery staple');
  assert.match(a, /^scrypt\$16384\$8\$5\$[A-Za-z0-9_-]{22}\$[A-Za-z0-9_-]{43}$/);
  assert.notEqual(a, b, 'a fresh salt each time');
  assert.deepEqual(await verifyPassword('correct horse battery staple', a), { isMatch: true, needsRehash: false });
  assert.equal((await verifyPassword('correct horse battery stapl', a)).isMatch, false);
});

test('a bcrypt hash made by bcryptjs (the reference implementation on the registry) verifies and asks to be replaced', async () => {
  const legacy = bcrypt.hashSync('tarnwater-demo', 4);
  assert.deepEqual(await verifyPassword('tarnwater-demo', legacy), { isMatch: true, needsRehash: true });
  assert.deepEqual(await verifyPassword('wrong', legacy), { isMatch: false, needsRehash: true });
});

test('anything unreadable never matches', async () => {
  for (const stored of [
    null,
    '',
    'plain',
    'scrypt$1$2$3',
    'scrypt$x$8$1$AAAA$AAAA',
    'scrypt$16384$8$1$$',
    `scrypt$${2 ** 24}$8$1$AAAA$AAAA`,
  ]) {
    assert.equal((await verifyPassword('x', stored)).isMatch, false, String(stored));
  }
});
