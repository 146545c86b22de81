// The object-storage fake driven by the real @aws-sdk/client-s3: the SDK's error classes, its
// flexible checksums (CRC32, aws-chunked streaming uploads) and node:crypto's MD5/SHA-256 are the
// references. Runs under scripts/test.sh, which starts the fakes with S3_* set.
import { test, after } from 'node:test';
import assert from 'node:assert/strict';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import {
  S3Client,
  CreateBucketCommand,
  HeadBucketCommand,
  PutObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  DeleteObjectCommand,
  ListObjectsV2Command,
  NoSuchKey,
  NoSuchBucket,
  S3ServiceException,
} from '@aws-sdk/client-s3';
import { startStorageFake } from '../../scripts/fakes/storage';

const ENDPOINT = process.env.S3_ENDPOINT ?? 'http://127.0.0.1:9850';
const BUCKET = `${process.env.S3_BUCKET ?? 'boreline-test'}-${Date.now().toString(36)}`;
const credentials = {
  accessKeyId: process.env.S3_ACCESS_KEY_ID ?? 'boreline-local',
  secretAccessKey: process.env.S3_SECRET_ACCESS_KEY ?? 'x',
};
const client = (endpoint = ENDPOINT, appSettings = false) =>
  new S3Client({
    endpoint,
    region: process.env.S3_REGION ?? 'us-east-1',
    forcePathStyle: true,
    credentials,
    // The app's client (lib/server/storage/objects.ts) sends checksums only when required; the SDK's
    // default sends CRC32 on every upload and aws-chunked bodies for streams. Both must work.
    ...(appSettings && { requestChecksumCalculation: 'WHEN_REQUIRED', responseChecksumValidation: 'WHEN_REQUIRED' }),
  });
const sdkDefault = client();
const appLike = client(ENDPOINT, true);
const sha256 = (b: Uint8Array) => createHash('sha256').update(b).digest('hex');

// Every byte value, then random bytes: binary safety, no text assumptions.
const BYTES = Buffer.concat([Buffer.from(Array.from({ length: 256 }, (_, i) => i)), randomBytes(300_000)]);

test('a bucket created twice is fine', async () => {
  await sdkDefault.send(new CreateBucketCommand({ Bucket: BUCKET }));
  await sdkDefault.send(new CreateBucketCommand({ Bucket: BUCKET }));
  const head = await sdkDefault.send(new HeadBucketCommand({ Bucket: BUCKET }));
  assert.equal(head.$metadata.httpStatusCode, 200);
});

for (const [name, s3] of [
  ['SDK defaults (CRC32 on upload, validation on download)', sdkDefault],
  ['the app settings (WHEN_REQUIRED)', appLike],
] as const) {
  test(`put, get and head round-trip binary bytes with ${name}`, async () => {
    const key = `evidence/2026/05/${randomUUID()}`;
    const put = await s3.send(
      new PutObjectCommand({
        Bucket: BUCKET,
        Key: key,
        Body: BYTES,
        ContentType: 'video/mp4',
        Metadata: { sha256: sha256(BYTES), 'uploaded-by': 'tester' },
      }),
    );
    const md5 = createHash('md5').update(BYTES).digest('hex'); // node:crypto, for the S3 ETag of a single-part upload
    assert.equal(put.ETag, `"${md5}"`);
    const got = await s3.send(new GetObjectCommand({ Bucket: BUCKET, Key: key }));
    const body = await got.Body!.transformToByteArray();
    assert.equal(sha256(body), sha256(BYTES));
    assert.equal(got.ContentType, 'video/mp4');
    assert.equal(got.ContentLength, BYTES.length);
    assert.equal(got.ETag, `"${md5}"`);
    assert.deepEqual(got.Metadata, { sha256: sha256(BYTES), 'uploaded-by': 'tester' });
    const head = await s3.send(new HeadObjectCommand({ Bucket: BUCKET, Key: key }));
    assert.equal(head.ContentLength, BYTES.length);
    assert.equal(head.ETag, `"${md5}"`);
    assert.equal(head.Metadata?.['uploaded-by'], 'tester');
  });
}

test('a streamed upload (aws-chunked with a CRC32 trailer, as the SDK sends it) stores the decoded bytes', async () => {
  const key = `photos/${randomUUID()}`;
  const parts = [BYTES.subarray(0, 70_000), BYTES.subarray(70_000, 200_000), BYTES.subarray(200_000)];
  await sdkDefault.send(
    new PutObjectCommand({ Bucket: BUCKET, Key: key, Body: Readable.from(parts), ContentLength: BYTES.length }),
  );
  const got = await sdkDefault.send(new GetObjectCommand({ Bucket: BUCKET, Key: key }));
  assert.equal(sha256(await got.Body!.transformToByteArray()), sha256(BYTES));
  assert.ok(got.ChecksumCRC32, 'the stored CRC32 is returned and the SDK validated it');
});

test('a wrong SHA-256 checksum is refused with BadDigest', async () => {
  const wrong = createHash('sha256').update('something else').digest('base64');
  await assert.rejects(
    appLike.send(
      new PutObjectCommand({ Bucket: BUCKET, Key: `x/${randomUUID()}`, Body: BYTES, ChecksumSHA256: wrong }),
    ),
    (err: unknown) =>
      err instanceof S3ServiceException && err.name === 'BadDigest' && err.$metadata.httpStatusCode === 400,
  );
  const right = createHash('sha256').update(BYTES).digest('base64');
  const ok = await appLike.send(
    new PutObjectCommand({ Bucket: BUCKET, Key: `x/${randomUUID()}`, Body: BYTES, ChecksumSHA256: right }),
  );
  assert.equal(ok.ChecksumSHA256, right);
});

test('a missing key is the SDK NoSuchKey; HEAD of it is NotFound; a missing bucket is NoSuchBucket', async () => {
  await assert.rejects(
    sdkDefault.send(new GetObjectCommand({ Bucket: BUCKET, Key: 'no/such/key' })),
    (err: unknown) => err instanceof NoSuchKey,
  );
  await assert.rejects(
    sdkDefault.send(new HeadObjectCommand({ Bucket: BUCKET, Key: 'no/such/key' })),
    (err: unknown) =>
      err instanceof S3ServiceException && err.name === 'NotFound' && err.$metadata.httpStatusCode === 404,
  );
  await assert.rejects(
    sdkDefault.send(new GetObjectCommand({ Bucket: 'boreline-no-such-bucket', Key: 'k' })),
    (err: unknown) => err instanceof NoSuchBucket,
  );
});

test('delete removes an object; list is sorted, filtered by prefix and paged', async () => {
  const prefix = `list-${randomUUID()}/`;
  for (const k of ['c', 'a', 'b'])
    await appLike.send(new PutObjectCommand({ Bucket: BUCKET, Key: `${prefix}${k}`, Body: k }));
  await appLike.send(new PutObjectCommand({ Bucket: BUCKET, Key: `other-${randomUUID()}`, Body: 'z' }));
  const page1 = await appLike.send(new ListObjectsV2Command({ Bucket: BUCKET, Prefix: prefix, MaxKeys: 2 }));
  assert.deepEqual(
    page1.Contents?.map((c) => c.Key),
    [`${prefix}a`, `${prefix}b`],
  );
  assert.equal(page1.IsTruncated, true);
  const page2 = await appLike.send(
    new ListObjectsV2Command({ Bucket: BUCKET, Prefix: prefix, ContinuationToken: page1.NextContinuationToken }),
  );
  assert.deepEqual(
    page2.Contents?.map((c) => [c.Key, c.Size]),
    [[`${prefix}c`, 1]],
  );
  assert.equal(page2.IsTruncated, false);

  await appLike.send(new DeleteObjectCommand({ Bucket: BUCKET, Key: `${prefix}a` }));
  await assert.rejects(
    appLike.send(new GetObjectCommand({ Bucket: BUCKET, Key: `${prefix}a` })),
    (err: unknown) => err instanceof NoSuchKey,
  );
  const left = await appLike.send(new ListObjectsV2Command({ Bucket: BUCKET, Prefix: prefix }));
  assert.equal(left.KeyCount, 2);
});

test('a request without an Authorization header is AccessDenied', async () => {
  const res = await fetch(`${ENDPOINT}/${BUCKET}/anything`);
  assert.equal(res.status, 403);
  assert.match(await res.text(), /<Code>AccessDenied<\/Code>/);
});

test('an object over the size limit is EntityTooLarge, plain or streamed', async () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'boreline-storage-'));
  after(() => fs.rmSync(dir, { recursive: true, force: true }));
  const fake = startStorageFake({
    port: 0,
    rootDir: dir,
    accessKeyId: credentials.accessKeyId,
    maxObjectBytes: 64 * 1024,
  });
  await new Promise((r) => fake.server.once('listening', r));
  const small = client(`http://127.0.0.1:${(fake.server.address() as AddressInfo).port}`);
  try {
    await small.send(new CreateBucketCommand({ Bucket: 'limits' }));
    const big = randomBytes(64 * 1024 + 1);
    await assert.rejects(
      small.send(new PutObjectCommand({ Bucket: 'limits', Key: 'big', Body: big })),
      (err: unknown) => err instanceof S3ServiceException && err.name === 'EntityTooLarge',
    );
    await assert.rejects(
      small.send(
        new PutObjectCommand({ Bucket: 'limits', Key: 'big', Body: Readable.from([big]), ContentLength: big.length }),
      ),
      (err: unknown) => err instanceof S3ServiceException && err.name === 'EntityTooLarge',
    );
    await small.send(new PutObjectCommand({ Bucket: 'limits', Key: 'fits', Body: big.subarray(1) }));
    assert.equal((await small.send(new HeadObjectCommand({ Bucket: 'limits', Key: 'fits' }))).ContentLength, 64 * 1024);
  } finally {
    small.destroy();
    await fake.close();
  }
});

test('a signed request with another access key id is InvalidAccessKeyId (the fake checks the key it was started with)', async () => {
  const stranger = new S3Client({
    endpoint: ENDPOINT,
    region: process.env.S3_REGION ?? 'us-east-1',
    forcePathStyle: true,
    credentials: { accessKeyId: 'boreline-local', secretAccessKey: 'boreline-local-secret' }, // the values .env.example once held
  });
  await assert.rejects(
    stranger.send(new ListObjectsV2Command({ Bucket: BUCKET })),
    (err: unknown) => err instanceof S3ServiceException && err.name === 'InvalidAccessKeyId',
  );
});
