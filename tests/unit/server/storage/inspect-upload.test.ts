// Upload inspection: types from content, refusals with honest statuses, hashes and safe names.
// References: real files built here (a PNG encoded by pngjs; headers laid out as their standards
// describe, cited beside each), and node:crypto for SHA-256.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import crypto from 'node:crypto';
import { PNG } from 'pngjs';
import { PDFDocument } from 'pdf-lib';
import { AppError } from '../../../../lib/core/errors';
import {
  inspectUpload,
  safeFileName,
  DOCUMENT_TYPES,
  PHOTO_TYPES,
  EVIDENCE_TYPES,
} from '../../../../lib/server/storage/inspect-upload';

const MB = 1024 * 1024;

function pngBytes() {
  const png = new PNG({ width: 3, height: 2 });
  png.data.fill(200);
  return PNG.sync.write(png); // pngjs writes the real signature, IHDR, IDAT and IEND
}
// ITU-T T.81 B.1.1.3 SOI (FF D8) then an APP0 "JFIF" segment (JFIF 1.02) as cameras and editors write.
const JPEG = Buffer.from([
  0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01, 0x02, 0x00, 0x00, 0x01, 0x00, 0x01, 0x00,
  0x00, 0xff, 0xd9,
]);
// ISO 32000-1 §7.5.2 header line; a minimal body follows.
const PDF_TEXT = Buffer.from('%PDF-1.7\n%\xe2\xe3\xcf\xd3\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n', 'latin1');
// RFC 9649: "RIFF", little-endian size, "WEBP", then a chunk header.
const WEBP = Buffer.concat([
  Buffer.from('RIFF'),
  Buffer.from([0x1a, 0, 0, 0]),
  Buffer.from('WEBPVP8 '),
  Buffer.alloc(18),
]);
/** ISO/IEC 14496-12 §4.3 File Type Box: size, 'ftyp', major brand, minor version, compatible brands. */
function ftyp(major: string, compatible: string[]) {
  const box = Buffer.alloc(16 + 4 * compatible.length);
  box.writeUInt32BE(box.length, 0);
  box.write('ftyp', 4, 'latin1');
  box.write(major, 8, 'latin1');
  compatible.forEach((b, i) => box.write(b, 16 + 4 * i, 'latin1'));
  return Buffer.concat([box, Buffer.alloc(32)]);
}

const inspect = (bytes: Uint8Array, declaredName: string, allowed = EVIDENCE_TYPES, maxBytes = 10 * MB) =>
  inspectUpload({ bytes, declaredName, allowed, maxBytes });
const isAppError = (status: number, code: string, message?: RegExp) => (err: unknown) =>
  err instanceof AppError && err.status === status && err.code === code && (!message || message.test(err.message));

test('types come from the content: PDF, PNG, JPEG, WebP, HEIC, HEIF, MP4, QuickTime', async () => {
  const realPdf = await (await PDFDocument.create()).save(); // a real, complete PDF written by pdf-lib
  const cases: [Uint8Array, string, string][] = [
    [PDF_TEXT, 'scan.pdf', 'application/pdf'],
    [realPdf, 'made-by-pdf-lib', 'application/pdf'],
    [pngBytes(), 'photo.png', 'image/png'],
    [JPEG, 'IMG_0001.JPG', 'image/jpeg'],
    [WEBP, 'x.webp', 'image/webp'],
    [ftyp('heic', ['mif1', 'heic']), 'IMG_0002.HEIC', 'image/heic'],
    [ftyp('mif1', ['mif1', 'miaf']), 'generic.heif', 'image/heif'],
    [ftyp('isom', ['isom', 'iso2', 'avc1', 'mp41']), 'dock.mp4', 'video/mp4'],
    [ftyp('qt  ', ['qt  ']), 'IMG_0003.MOV', 'video/quicktime'],
  ];
  for (const [bytes, name, type] of cases) assert.equal(inspect(bytes, name).detectedType, type, name);
  assert.equal(inspect(JPEG, 'IMG_0001.JPG').safeName, 'IMG_0001.jpg');
  assert.equal(inspect(JPEG, 'photo.jpeg').extension, 'jpg');
  assert.equal(inspect(JPEG, 'photo.jpeg').safeName, 'photo.jpeg');
});

test('the declared name never decides: a PNG named .pdf is a PNG and gets a .png name', () => {
  const r = inspect(pngBytes(), 'rules.pdf', DOCUMENT_TYPES);
  assert.equal(r.detectedType, 'image/png');
  assert.equal(r.safeName, 'rules.png');
});

test('a text file renamed .png is refused with 415, saying what it is and what is allowed', () => {
  const text = Buffer.from('this is not a picture\nreally\n');
  assert.throws(
    () => inspect(text, 'boat.png', PHOTO_TYPES),
    isAppError(415, 'unsupported_type', /plain text.*Allowed: PNG, JPEG, WebP, HEIC, HEIF/),
  );
  assert.throws(
    () => inspect(ftyp('avif', ['avif', 'mif1']), 'x.heic', PHOTO_TYPES),
    isAppError(415, 'unsupported_type', /AVIF/),
  );
  assert.throws(
    () => inspect(Buffer.from('GIF89a\x01\x00', 'latin1'), 'x.png', PHOTO_TYPES),
    isAppError(415, 'unsupported_type', /GIF/),
  );
  assert.throws(
    () => inspect(ftyp('isom', ['isom']), 'clip.mp4', DOCUMENT_TYPES),
    isAppError(415, 'unsupported_type', /MP4 video.*Allowed: PDF, PNG, JPEG, WebP/),
  );
  assert.throws(() => inspect(Buffer.alloc(0), 'empty.pdf'), isAppError(415, 'unsupported_type', /empty/));
});

test('over the size limit is 413 and is refused before any hashing', (t) => {
  const createHash = t.mock.method(crypto, 'createHash');
  const big = Buffer.concat([PDF_TEXT, Buffer.alloc(2048)]);
  assert.throws(() => inspect(big, 'big.pdf', DOCUMENT_TYPES, 1024), isAppError(413, 'too_large', /limit is 1\.0 KB/));
  assert.equal(createHash.mock.callCount(), 0, 'no hash was computed for a refused upload');
  inspect(PDF_TEXT, 'ok.pdf', DOCUMENT_TYPES, 1024); // exactly the limit or under is fine, and hashed once
  assert.equal(createHash.mock.callCount(), 1); // t.mock restores crypto.createHash after this test
});

test('sha256Hex and sizeBytes equal node:crypto and the byte count', () => {
  const bytes = pngBytes();
  const r = inspect(bytes, 'p.png');
  assert.equal(r.sha256Hex, crypto.createHash('sha256').update(bytes).digest('hex'));
  assert.equal(r.sizeBytes, bytes.length);
});

test('hostile names are made safe', () => {
  const pdf = 'application/pdf' as const;
  assert.equal(safeFileName('../../etc/passwd', pdf), 'passwd.pdf');
  assert.equal(safeFileName('..\\..\\windows\\system32\\evil.pdf', pdf), 'evil.pdf');
  assert.equal(safeFileName('a\u0000b.pdf', pdf), 'ab.pdf');
  assert.equal(safeFileName('CON', pdf), '_CON.pdf');
  assert.equal(safeFileName('lpt1.pdf', pdf), '_lpt1.pdf');
  assert.equal(safeFileName("quote\"s and 'ticks' <b>|?*.pdf", pdf), 'quote_s and _ticks_ _b____.pdf');
  assert.equal(safeFileName('folder/sub/"report".pdf', pdf), '_report_.pdf');
  assert.equal(safeFileName('invoice\u202Efdp.exe', pdf), 'invoicefdp.pdf'); // a right-to-left override removed
  assert.equal(safeFileName('...', pdf), 'upload.pdf');
  assert.equal(safeFileName(null, pdf), 'upload.pdf');
  assert.equal(safeFileName('.hidden', pdf), 'hidden.pdf');
  assert.equal(safeFileName('trailing dots. . .pdf', pdf), 'trailing dots.pdf');

  const long = safeFileName(`${'x'.repeat(300)}.pdf`, pdf);
  assert.equal(long.length, 100);
  assert.ok(long.endsWith('.pdf'));
  const emoji = safeFileName(`${'🚤'.repeat(150)}.pdf`, pdf);
  assert.equal(Array.from(emoji).length, 100);
  assert.ok(emoji.isWellFormed(), 'no surrogate pair was cut');
  assert.equal(safeFileName('Ōtākou Ħ.pdf', pdf), 'Ōtākou Ħ.pdf'); // letters outside ASCII are kept
});

test('the type groups are as documented', () => {
  assert.deepEqual([...DOCUMENT_TYPES], ['application/pdf', 'image/png', 'image/jpeg', 'image/webp']);
  assert.deepEqual([...PHOTO_TYPES], ['image/png', 'image/jpeg', 'image/webp', 'image/heic', 'image/heif']);
  assert.deepEqual(
    new Set(EVIDENCE_TYPES),
    new Set([...PHOTO_TYPES, 'application/pdf', 'video/mp4', 'video/quicktime']),
  );
});
