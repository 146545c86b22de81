import 'server-only';
import { randomUUID } from 'node:crypto';
import {
  S3Client,
  HeadBucketCommand,
  CreateBucketCommand,
  PutObjectCommand,
  GetObjectCommand,
  S3ServiceException,
  NoSuchKey,
} from '@aws-sdk/client-s3';
import { AppError } from '../../core/errors';
import { isPublishedSecret } from '../config/published-values';
import { serverEnv } from '../config/env';

// Object storage (documents, photos, evidence) behind one module. Keys are always made here by
// newObjectKey(), never taken from a request, so no upload can choose or overwrite another's key.
const globalForS3 = globalThis as unknown as { __borelineS3?: S3Client; __borelineBucket?: Promise<void> };

const bucket = () => serverEnv().S3_BUCKET;

function s3(): S3Client {
  if (!globalForS3.__borelineS3) {
    const {
      S3_ENDPOINT: endpoint,
      S3_ACCESS_KEY_ID: accessKeyId,
      S3_SECRET_ACCESS_KEY: secretAccessKey,
      S3_REGION: region,
    } = serverEnv();
    // A key pair published in this repository is nobody's: refuse it rather than use it.
    if (
      accessKeyId &&
      (isPublishedSecret('S3_ACCESS_KEY_ID', accessKeyId) || isPublishedSecret('S3_SECRET_ACCESS_KEY', secretAccessKey))
    ) {
      throw new AppError('storage_unavailable', 503, 'File storage is not configured on this server.');
    }
    globalForS3.__borelineS3 = new S3Client({
      region,
      endpoint,
      // S3-compatible services (and the local fake) address buckets by path; AWS itself by host.
      forcePathStyle: Boolean(endpoint),
      // Without an explicit pair the SDK's default chain applies (instance role, AWS_* variables).
      ...(accessKeyId && secretAccessKey && { credentials: { accessKeyId, secretAccessKey } }),
      // Recent SDKs add CRC32 checksums and aws-chunked bodies to every upload, which several
      // S3-compatible services reject; integrity is covered by the SHA-256 we send (putObject).
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
    });
  }
  return globalForS3.__borelineS3;
}

const isStatus = (err: unknown, status: number) =>
  err instanceof S3ServiceException && err.$metadata.httpStatusCode === status;

/** Makes sure the bucket exists, once per process (a failure is retried on the next call). */
export function ensureBucket(): Promise<void> {
  globalForS3.__borelineBucket ??= (async () => {
    try {
      await s3().send(new HeadBucketCommand({ Bucket: bucket() }));
    } catch (err) {
      if (!isStatus(err, 404)) throw err;
      try {
        await s3().send(new CreateBucketCommand({ Bucket: bucket() }));
      } catch (e) {
        // Another instance may have created it between our two calls.
        if (!(e instanceof S3ServiceException && e.name === 'BucketAlreadyOwnedByYou')) throw e;
      }
    }
  })().catch((err) => {
    globalForS3.__borelineBucket = undefined;
    throw err;
  });
  return globalForS3.__borelineBucket;
}

/** `${prefix}/${yyyy}/${mm}/${uuid}` (UTC); the prefix is a fixed app value such as 'evidence'. */
export function newObjectKey(prefix: string, now = new Date()): string {
  if (!/^[a-z0-9]+(?:[-/][a-z0-9]+)*$/.test(prefix))
    throw new Error(`object key prefix "${prefix}" must be lower-case words joined by - or /`);
  const yyyy = String(now.getUTCFullYear());
  const mm = String(now.getUTCMonth() + 1).padStart(2, '0');
  return `${prefix}/${yyyy}/${mm}/${randomUUID()}`;
}

// Metadata travels as HTTP headers (ASCII only): values are percent-encoded on the way in, so a
// person's name or a file name survives (decodeURIComponent reads one back).
const encodeMeta = (m: Record<string, string> = {}) =>
  Object.fromEntries(Object.entries(m).map(([k, v]) => [k.toLowerCase(), encodeURIComponent(v)]));

/**
 * Stores bytes under an app-made key. With sha256Hex (from inspectUpload) the storage service
 * checks the upload against it and refuses a body damaged on the way.
 */
export async function putObject(input: {
  key: string;
  bytes: Uint8Array;
  contentType: string;
  metadata?: Record<string, string>;
  sha256Hex?: string;
}) {
  await ensureBucket();
  const res = await s3().send(
    new PutObjectCommand({
      Bucket: bucket(),
      Key: input.key,
      Body: input.bytes,
      ContentType: input.contentType,
      ContentLength: input.bytes.byteLength,
      Metadata: encodeMeta(input.metadata),
      ...(input.sha256Hex && { ChecksumSHA256: Buffer.from(input.sha256Hex, 'hex').toString('base64') }),
    }),
  );
  return { key: input.key, etag: res.ETag ?? '', sizeBytes: input.bytes.byteLength };
}

/** The whole object; a missing key is a 404 AppError. */
export async function getObjectBytes(key: string): Promise<Buffer> {
  try {
    const res = await s3().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
    return Buffer.from(await res.Body!.transformToByteArray());
  } catch (err) {
    if (err instanceof NoSuchKey || isStatus(err, 404))
      throw new AppError('not_found', 404, 'The stored file was not found.');
    throw err;
  }
}
