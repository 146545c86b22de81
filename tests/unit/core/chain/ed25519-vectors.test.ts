// Ed25519 as the checkpoints use it, against RFC 8032 section 7.1 ("Test Vectors for Ed25519"), TEST 1,
// TEST 2 and TEST 3: Node's crypto, given each SECRET KEY, must derive the PUBLIC KEY and produce the
// SIGNATURE byte for byte, and the chain's own verifier (WebCrypto, lib/core/chain/hashes.ts, the code the
// /verify page runs) must accept it and refuse a changed message or signature. Hex typed from the RFC.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { createPrivateKey, createPublicKey, sign } from 'node:crypto';
import { verifyEd25519 } from '../../../../lib/core/chain/hashes';

const RFC8032_7_1 = [
  {
    name: 'TEST 1',
    secret: '9d61b19deffd5a60ba844af492ec2cc44449c5697b326919703bac031cae7f60',
    public: 'd75a980182b10ab7d54bfed3c964073a0ee172f3daa62325af021a68f707511a',
    message: '',
    signature:
      'e5564300c360ac729086e2cc806e828a84877f1eb8e5d974d873e065224901555fb8821590a33bacc61e39701cf9b46bd25bf5f0595bbe24655141438e7a100b',
  },
  {
    name: 'TEST 2',
    secret: '4ccd089b28ff96da9db6c346ec114e0f5b8a319f35aba624da8cf6ed4fb8a6fb',
    public: '3d4017c3e843895a92b70aa74d1b7ebc9c982ccf2ec4968cc0cd55f12af4660c',
    message: '72',
    signature:
      '92a009a9f0d4cab8720e820b5f642540a2b27b5416503f8fb3762223ebdb69da085ac1e43e15996e458f3613d0f11d8c387b2eaeb4302aeeb00d291612bb0c00',
  },
  {
    name: 'TEST 3',
    secret: 'c5aa8df43f9f837bedb7442f31dcb7b166d38535076f094b85ce3a2e0b4458f7',
    public: 'fc51cd8e6218a1a38da47ed00230f0580816ed13ba3303ac5deb911548908025',
    message: 'af82',
    signature:
      '6291d657deec24024827e69c3abe01a30ce548a284743a445e3680d7db5ac3ac18ff9b538d16f290ae67f760984dc6594a7c15e9716ed28dc027beceea1ec40a',
  },
];

// PKCS#8 and SPKI wrappers for a raw Ed25519 key (RFC 8410 section 7 and section 4: OID 1.3.101.112).
const PKCS8_PREFIX = '302e020100300506032b657004220420';
const SPKI_PREFIX = '302a300506032b6570032100';

for (const v of RFC8032_7_1) {
  test(`RFC 8032 section 7.1 ${v.name}: Node's crypto signs as published, WebCrypto verifies`, async () => {
    const privateKey = createPrivateKey({
      key: Buffer.from(PKCS8_PREFIX + v.secret, 'hex'),
      format: 'der',
      type: 'pkcs8',
    });
    const spki = createPublicKey(privateKey).export({ format: 'der', type: 'spki' });
    assert.equal(spki.toString('hex'), SPKI_PREFIX + v.public, 'public key derived from the secret');
    const message = Buffer.from(v.message, 'hex');
    const signature = sign(null, message, privateKey);
    assert.equal(signature.toString('hex'), v.signature, 'signature');

    const der = new Uint8Array(spki);
    assert.equal(await verifyEd25519(der, new Uint8Array(message), new Uint8Array(signature)), true);
    const otherMessage = new Uint8Array([...message, 0x00]);
    assert.equal(await verifyEd25519(der, otherMessage, new Uint8Array(signature)), false, 'message changed');
    const flipped = new Uint8Array(signature);
    flipped[0] ^= 1;
    assert.equal(await verifyEd25519(der, new Uint8Array(message), flipped), false, 'signature changed');
  });
}
