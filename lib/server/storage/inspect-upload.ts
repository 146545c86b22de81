// What an uploaded file really is, decided from its first bytes (never from its name or the
// browser's claimed type), plus its size, SHA-256 and a name that is safe to show and to save.
// Framework-free: runs in route handlers and in unit tests alike.
import crypto from 'node:crypto';
import { AppError } from '../../core/errors';

export type DetectedType =
  | 'application/pdf'
  | 'image/png'
  | 'image/jpeg'
  | 'image/webp'
  | 'image/heic'
  | 'image/heif'
  | 'video/mp4'
  | 'video/quicktime';

export const DOCUMENT_TYPES: readonly DetectedType[] = ['application/pdf', 'image/png', 'image/jpeg', 'image/webp'];
export const PHOTO_TYPES: readonly DetectedType[] = [
  'image/png',
  'image/jpeg',
  'image/webp',
  'image/heic',
  'image/heif',
];
export const EVIDENCE_TYPES: readonly DetectedType[] = [
  ...PHOTO_TYPES,
  'application/pdf',
  'video/mp4',
  'video/quicktime',
];

// Extension to write, other extensions accepted from the person's own file name, and a label.
const TYPE_INFO: Record<DetectedType, { ext: string; aliases: string[]; label: string }> = {
  'application/pdf': { ext: 'pdf', aliases: [], label: 'PDF' },
  'image/png': { ext: 'png', aliases: [], label: 'PNG' },
  'image/jpeg': { ext: 'jpg', aliases: ['jpeg', 'jpe', 'jfif'], label: 'JPEG' },
  'image/webp': { ext: 'webp', aliases: [], label: 'WebP' },
  'image/heic': { ext: 'heic', aliases: ['heif'], label: 'HEIC' },
  'image/heif': { ext: 'heif', aliases: ['heic'], label: 'HEIF' },
  'video/mp4': { ext: 'mp4', aliases: ['m4v'], label: 'MP4 video' },
  'video/quicktime': { ext: 'mov', aliases: ['qt'], label: 'QuickTime video' },
};

const ascii = (b: Uint8Array, start: number, end: number) =>
  String.fromCharCode(...b.subarray(start, Math.min(end, b.length)));
const startsWith = (b: Uint8Array, sig: number[], at = 0) => sig.every((v, i) => b[at + i] === v);

// ISO base media file format brands (the `ftyp` box). HEIF brands: ISO/IEC 23008-12 (heic, heix,
// heim, heis, hevc, hevx for HEVC images; mif1/msf1 for HEIF in general; avif is AV1, not HEIC).
const HEIC_BRANDS = new Set(['heic', 'heix', 'heim', 'heis', 'hevc', 'hevx']);
const HEIF_BRANDS = new Set(['mif1', 'msf1']);
const AVIF_BRANDS = new Set(['avif', 'avis']);
// MP4 brands: ISO/IEC 14496-12 (isom, iso2..iso9) and 14496-14 (mp41, mp42), plus avc1 and the
// widely written dash, mmp4 and 'M4V ' (common practice, no single source).
const MP4_BRANDS = new Set([
  'isom',
  'iso2',
  'iso3',
  'iso4',
  'iso5',
  'iso6',
  'iso7',
  'iso8',
  'iso9',
  'mp41',
  'mp42',
  'avc1',
  'dash',
  'mmp4',
  'M4V ',
]);
// Apple QuickTime File Format: 'qt  ' brand, or old files that open with a moov/mdat/wide atom.
const QT_FIRST_ATOMS = new Set(['moov', 'mdat', 'wide', 'free', 'skip', 'pnot']);

/** The type from the content, or a description of what it looked like (for the refusal message). */
export function detectType(b: Uint8Array): { type: DetectedType } | { type: null; looksLike: string } {
  // ISO 32000-1 §7.5.2: a PDF file begins with the header "%PDF-" followed by the version.
  if (startsWith(b, [0x25, 0x50, 0x44, 0x46, 0x2d])) return { type: 'application/pdf' };
  // PNG (W3C PNG spec / ISO/IEC 15948) §5.2: the 8-byte signature 89 50 4E 47 0D 0A 1A 0A.
  if (startsWith(b, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return { type: 'image/png' };
  // JPEG (ITU-T T.81 §B.1.1.3): the SOI marker FF D8, then the next marker's FF.
  if (startsWith(b, [0xff, 0xd8, 0xff])) return { type: 'image/jpeg' };
  // WebP (RFC 9649 §2.5): a RIFF container ("RIFF", 4-byte size, then the form type "WEBP").
  if (ascii(b, 0, 4) === 'RIFF' && ascii(b, 8, 12) === 'WEBP') return { type: 'image/webp' };
  // ISO/IEC 14496-12 §4.3: the File Type Box, size(4) 'ftyp' major_brand(4) minor_version(4)
  // compatible_brands(4 each) up to the box size.
  if (b.length >= 12 && ascii(b, 4, 8) === 'ftyp') {
    const size = Math.min(((b[0] << 24) | (b[1] << 16) | (b[2] << 8) | b[3]) >>> 0, b.length, 4096);
    const brands = [ascii(b, 8, 12)];
    for (let at = 16; at + 4 <= size; at += 4) brands.push(ascii(b, at, at + 4));
    if (brands.some((x) => AVIF_BRANDS.has(x))) return { type: null, looksLike: 'an AVIF image' };
    if (brands.some((x) => HEIC_BRANDS.has(x))) return { type: 'image/heic' };
    if (brands.some((x) => HEIF_BRANDS.has(x))) return { type: 'image/heif' };
    if (brands[0] === 'qt  ') return { type: 'video/quicktime' };
    if (brands.some((x) => MP4_BRANDS.has(x))) return { type: 'video/mp4' };
    return { type: null, looksLike: `an ISO media file (brand "${brands[0].trim()}")` };
  }
  if (b.length >= 8 && QT_FIRST_ATOMS.has(ascii(b, 4, 8))) return { type: 'video/quicktime' };
  // A few common refusals, named so the message can say what was received.
  if (ascii(b, 0, 6) === 'GIF87a' || ascii(b, 0, 6) === 'GIF89a') return { type: null, looksLike: 'a GIF image' };
  if (startsWith(b, [0x50, 0x4b, 0x03, 0x04]))
    return { type: null, looksLike: 'a ZIP archive (or an Office document)' };
  const head = b.subarray(0, 512);
  if (head.length && head.every((c) => c === 0x09 || c === 0x0a || c === 0x0d || (c >= 0x20 && c !== 0x7f)))
    return { type: null, looksLike: 'plain text' };
  return { type: null, looksLike: 'an unrecognised binary file' };
}

// Windows reserved device names refuse to be file names, with or without an extension.
const RESERVED_NAMES = /^(con|prn|aux|nul|com[0-9¹²³]|lpt[0-9¹²³])$/i;
const MAX_NAME_CHARS = 100;

/** A display and download name: no folders, control or reserved characters, sane length, the right extension. */
export function safeFileName(declaredName: string | null | undefined, type: DetectedType): string {
  const info = TYPE_INFO[type];
  let name = String(declaredName ?? '').normalize('NFC');
  name = name.split(/[/\\]/).pop() ?? ''; // keep only the last path segment
  // C0/C1 controls, and bidirectional overrides that can disguise an extension ("txt.exe" shown reversed).
  name = name.replace(/[\u0000-\u001f\u007f-\u009f\u200e\u200f\u202a-\u202e\u2066-\u2069]/g, '');
  name = name.replace(/[<>:"|?*'`]/g, '_').replace(/\s+/g, ' ');
  const dot = name.lastIndexOf('.');
  const declaredExt = dot > 0 ? name.slice(dot + 1).toLowerCase() : '';
  let base = (dot > 0 ? name.slice(0, dot) : name).replace(/^[\s.]+|[\s.]+$/g, '');
  if (RESERVED_NAMES.test(base.split('.')[0])) base = `_${base}`;
  if (!base) base = 'upload';
  const ext = declaredExt === info.ext || info.aliases.includes(declaredExt) ? declaredExt : info.ext;
  const chars = Array.from(base); // by code point, so a surrogate pair is never cut in half
  if (chars.length + ext.length + 1 > MAX_NAME_CHARS)
    base = chars
      .slice(0, MAX_NAME_CHARS - ext.length - 1)
      .join('')
      .replace(/[\s.]+$/, '');
  return `${base}.${ext}`;
}

// extension is the type's usual one (jpg, mov); safeName may keep the person's own alias (.jpeg).
export type InspectedUpload = {
  detectedType: DetectedType;
  extension: string;
  sizeBytes: number;
  sha256Hex: string;
  safeName: string;
};

/**
 * Checks an upload before it is stored: size first (413 before any hashing), then the type from
 * the content (415 naming what was found and what is allowed), then SHA-256 and a safe name.
 */
export function inspectUpload(input: {
  bytes: Uint8Array;
  declaredName?: string | null;
  allowed: readonly DetectedType[];
  maxBytes: number;
}): InspectedUpload {
  const sizeBytes = input.bytes.byteLength;
  if (sizeBytes > input.maxBytes) {
    throw new AppError(
      'too_large',
      413,
      `The file is ${formatBytes(sizeBytes)}; the limit is ${formatBytes(input.maxBytes)}.`,
      { sizeBytes, maxBytes: input.maxBytes },
    );
  }
  const allowedLabels = input.allowed
    .map((t) => TYPE_INFO[t].label)
    .filter((l, i, all) => all.indexOf(l) === i)
    .join(', ');
  if (sizeBytes === 0)
    throw new AppError('unsupported_type', 415, `The file is empty. Allowed: ${allowedLabels}.`, {
      detected: 'empty',
      allowed: input.allowed,
    });
  const found = detectType(input.bytes);
  if (found.type === null || !input.allowed.includes(found.type)) {
    const what = found.type === null ? found.looksLike : `a ${TYPE_INFO[found.type].label} file`;
    throw new AppError(
      'unsupported_type',
      415,
      `This file is ${what}, whatever its name says. Allowed: ${allowedLabels}.`,
      {
        detected: found.type ?? found.looksLike,
        allowed: input.allowed,
      },
    );
  }
  const sha256Hex = crypto.createHash('sha256').update(input.bytes).digest('hex');
  const safeName = safeFileName(input.declaredName, found.type);
  return { detectedType: found.type, extension: TYPE_INFO[found.type].ext, sizeBytes, sha256Hex, safeName };
}

function formatBytes(n: number): string {
  if (n >= 1024 * 1024) return `${(n / (1024 * 1024)).toFixed(1)} MB`;
  if (n >= 1024) return `${(n / 1024).toFixed(1)} KB`;
  return `${n} bytes`;
}

/**
 * Several photos sent in one upload, each checked as inspectUpload does (types from PHOTO_TYPES, at most
 * maxBytes). A refusal names the field `photo` (and which photo, when there are several), so a form shows
 * it beside its photo input.
 */
export function inspectPhotos<P extends { bytes: Uint8Array; declaredName: string }>(
  photos: P[],
  maxBytes: number,
): { photo: P; file: InspectedUpload }[] {
  return photos.map((photo, i) => {
    try {
      return {
        photo,
        file: inspectUpload({ bytes: photo.bytes, declaredName: photo.declaredName, allowed: PHOTO_TYPES, maxBytes }),
      };
    } catch (err) {
      if (err instanceof AppError)
        throw new AppError(err.code, err.status, err.message, [
          { field: 'photo', message: photos.length > 1 ? `Photo ${i + 1}: ${err.message}` : err.message },
        ]);
      throw err;
    }
  });
}
