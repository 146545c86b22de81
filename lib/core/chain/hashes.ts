// Hashes of the record chain. Everything here runs in Node.js (20+) and in the browser: SHA-256 and
// Ed25519 come from WebCrypto (`globalThis.crypto.subtle`; FIPS 180-4 and RFC 8032), nothing else.
//
// Definitions (version 1, also in DEVELOPERS.md):
//   row_hash  = SHA-256( UTF-8( JCS({"row": <the row as to_jsonb gives it>, "table": <table name>}) ) )
//   link_hash = SHA-256( bytes(prev_hash) || bytes(row_hash) )   (32 + 32 bytes, not hex text)
//   prev_hash of the first link of a chain = 64 zeros (GENESIS_HASH)
// Changing a row changes its row_hash and so its link_hash and every later link; removing or swapping
// rows breaks the prev_hash of the first link after the change.
import { canonicalJson } from './canonical-json';

export const GENESIS_HASH = '0'.repeat(64);

function subtle(): SubtleCrypto {
  const s = globalThis.crypto?.subtle;
  if (!s) throw new Error('WebCrypto is not available here (a browser page needs HTTPS or localhost)');
  return s;
}

export function hexToBytes(hex: string): Uint8Array<ArrayBuffer> {
  if (!/^([0-9a-f]{2})*$/.test(hex)) throw new Error('not lower-case hex');
  const out = new Uint8Array(hex.length / 2);
  for (let k = 0; k < out.length; k++) out[k] = parseInt(hex.slice(2 * k, 2 * k + 2), 16);
  return out;
}

export function bytesToHex(bytes: Uint8Array): string {
  let s = '';
  for (const b of bytes) s += b.toString(16).padStart(2, '0');
  return s;
}

export function base64ToBytes(b64: string): Uint8Array<ArrayBuffer> {
  const bin = atob(b64);
  const out = new Uint8Array(bin.length);
  for (let k = 0; k < bin.length; k++) out[k] = bin.charCodeAt(k);
  return out;
}

export function bytesToBase64(bytes: Uint8Array): string {
  let bin = '';
  for (let k = 0; k < bytes.length; k += 0x8000) bin += String.fromCharCode(...bytes.subarray(k, k + 0x8000));
  return btoa(bin);
}

export async function sha256Hex(data: Uint8Array<ArrayBuffer> | string): Promise<string> {
  const bytes = typeof data === 'string' ? new TextEncoder().encode(data) : data;
  return bytesToHex(new Uint8Array(await subtle().digest('SHA-256', bytes)));
}

/** row_hash: the SHA-256 of the record's canonical envelope. */
export function rowHash(table: string, row: unknown): Promise<string> {
  return sha256Hex(canonicalJson({ row, table }));
}

/** link_hash: SHA-256 over the 64 bytes prev_hash || row_hash. */
export function linkHash(prevHash: string, ownRowHash: string): Promise<string> {
  const bytes = new Uint8Array(64);
  bytes.set(hexToBytes(prevHash), 0);
  bytes.set(hexToBytes(ownRowHash), 32);
  return sha256Hex(bytes);
}

/** Fingerprint of a public key: SHA-256 of its SubjectPublicKeyInfo DER, hex. */
export function keyFingerprint(spkiDer: Uint8Array<ArrayBuffer>): Promise<string> {
  return sha256Hex(spkiDer);
}

/** Ed25519 verification (RFC 8032, pure Ed25519) of a signature over `message`, key as SPKI DER. */
export async function verifyEd25519(
  spkiDer: Uint8Array<ArrayBuffer>,
  message: Uint8Array<ArrayBuffer>,
  signature: Uint8Array<ArrayBuffer>,
): Promise<boolean> {
  const key = await subtle().importKey('spki', spkiDer, { name: 'Ed25519' }, false, ['verify']);
  return subtle().verify({ name: 'Ed25519' }, key, signature, message);
}
