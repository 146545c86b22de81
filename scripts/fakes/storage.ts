// A local stand-in for S3-type object storage: the handful of path-style calls Boreline makes with
// @aws-sdk/client-s3 (CreateBucket, HeadBucket, PutObject, GetObject, HeadObject, DeleteObject,
// ListObjectsV2), on loopback, with objects on disk. The access key id named in the SigV4 credential
// (header or presigned URL) must be the one this fake was started with; the signature itself is not
// recomputed, because the point is to exercise the app, not SigV4.
import http from 'node:http';
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import { createHash, randomBytes } from 'node:crypto';

type ObjectMeta = {
  key: string;
  sizeBytes: number;
  contentType: string;
  etag: string; // quoted MD5 hex, as S3 gives for single-part uploads
  lastModified: string;
  metadata: Record<string, string>;
  checksums: Record<string, string>; // algorithm (crc32, sha256...) -> base64 value
};

class S3Failure extends Error {
  constructor(
    public status: number,
    public code: string,
    message: string,
    public extra: Record<string, string> = {},
  ) {
    super(message);
  }
}

const xmlEscape = (s: string) => s.replace(/[<>&'"]/g, (c) => `&#${c.charCodeAt(0)};`);
const BUCKET_NAME = /^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/; // S3 bucket naming rules (3-63 chars)

// Checksums the fake can recompute; others (crc32c, crc64nvme) are stored as sent.
const CHECKERS: Record<string, (b: Buffer) => string> = {
  crc32: (b) => {
    const out = Buffer.alloc(4);
    out.writeUInt32BE(zlib.crc32(b) >>> 0);
    return out.toString('base64');
  },
  sha1: (b) => createHash('sha1').update(b).digest('base64'),
  sha256: (b) => createHash('sha256').update(b).digest('base64'),
};

/**
 * Decodes an `aws-chunked` body: `<hex size>[;chunk-signature=...]\r\n<data>\r\n` repeated, a
 * zero-size chunk, then optional trailer lines such as `x-amz-checksum-crc32:<base64>`.
 * (Format as described in the Amazon S3 API reference, "Signature Version 4 ... chunked upload".)
 */
export function decodeAwsChunked(raw: Buffer): { body: Buffer; trailers: Record<string, string> } {
  const parts: Buffer[] = [];
  let pos = 0;
  for (;;) {
    const eol = raw.indexOf('\r\n', pos);
    if (eol < 0) throw new S3Failure(400, 'IncompleteBody', 'The chunked body ended early.');
    const size = parseInt(raw.subarray(pos, eol).toString('latin1').split(';')[0], 16);
    if (!Number.isFinite(size) || size < 0) throw new S3Failure(400, 'InvalidRequest', 'Bad chunk header.');
    pos = eol + 2;
    if (size === 0) break;
    if (pos + size > raw.length) throw new S3Failure(400, 'IncompleteBody', 'The chunked body ended early.');
    parts.push(raw.subarray(pos, pos + size));
    pos += size + 2; // data and its CRLF
  }
  const trailers: Record<string, string> = {};
  for (const line of raw.subarray(pos).toString('latin1').split('\r\n')) {
    const colon = line.indexOf(':');
    if (colon > 0) trailers[line.slice(0, colon).trim().toLowerCase()] = line.slice(colon + 1).trim();
  }
  return { body: Buffer.concat(parts), trailers };
}

export function startStorageFake(opts: {
  port: number;
  rootDir: string;
  accessKeyId: string;
  maxObjectBytes?: number;
}) {
  if (!opts.accessKeyId) throw new Error('the storage fake needs the access key id it should accept');
  const maxBytes = opts.maxObjectBytes ?? 50 * 1024 * 1024;
  const bucketDir = (bucket: string) => path.join(opts.rootDir, bucket);
  // Objects are stored under the SHA-256 of their key, so no key can reach outside the folder.
  const objectPath = (bucket: string, key: string) =>
    path.join(bucketDir(bucket), createHash('sha256').update(key).digest('hex'));

  const requireBucket = (bucket: string) => {
    if (!fs.existsSync(bucketDir(bucket))) {
      throw new S3Failure(404, 'NoSuchBucket', 'The specified bucket does not exist.', { BucketName: bucket });
    }
  };
  const readMeta = (bucket: string, key: string): ObjectMeta => {
    requireBucket(bucket);
    const file = `${objectPath(bucket, key)}.json`;
    if (!fs.existsSync(file)) throw new S3Failure(404, 'NoSuchKey', 'The specified key does not exist.', { Key: key });
    return JSON.parse(fs.readFileSync(file, 'utf8')) as ObjectMeta;
  };

  const readBody = (req: http.IncomingMessage, limit: number) =>
    new Promise<Buffer>((resolve, reject) => {
      const chunks: Buffer[] = [];
      let total = 0;
      req.on('data', (c: Buffer) => {
        total += c.length;
        if (total > limit) {
          req.removeAllListeners('data');
          req.resume();
          reject(
            new S3Failure(400, 'EntityTooLarge', 'Your proposed upload exceeds the maximum allowed size.', {
              MaxSizeAllowed: String(maxBytes),
            }),
          );
        } else chunks.push(c);
      });
      req.on('end', () => resolve(Buffer.concat(chunks)));
      req.on('error', reject);
    });

  const objectHeaders = (meta: ObjectMeta, withChecksums: boolean) => {
    const h: Record<string, string> = {
      'Content-Type': meta.contentType,
      'Content-Length': String(meta.sizeBytes),
      ETag: meta.etag,
      'Last-Modified': new Date(meta.lastModified).toUTCString(),
      'Accept-Ranges': 'none',
    };
    for (const [k, v] of Object.entries(meta.metadata)) h[`x-amz-meta-${k}`] = v;
    if (withChecksums) for (const [alg, v] of Object.entries(meta.checksums)) h[`x-amz-checksum-${alg}`] = v;
    return h;
  };

  async function putObject(req: http.IncomingMessage, res: http.ServerResponse, bucket: string, key: string) {
    requireBucket(bucket);
    if (req.headers['x-amz-copy-source'])
      throw new S3Failure(501, 'NotImplemented', 'CopyObject is not supported by this fake.');
    const declared = Number(req.headers['x-amz-decoded-content-length'] ?? req.headers['content-length'] ?? 0);
    if (declared > maxBytes) {
      req.resume();
      throw new S3Failure(400, 'EntityTooLarge', 'Your proposed upload exceeds the maximum allowed size.', {
        MaxSizeAllowed: String(maxBytes),
      });
    }
    const sha256Header = String(req.headers['x-amz-content-sha256'] ?? '');
    const chunked =
      /aws-chunked/.test(String(req.headers['content-encoding'] ?? '')) || sha256Header.startsWith('STREAMING-');
    // Chunk framing adds a little; the decoded size is checked again below.
    const raw = await readBody(req, chunked ? maxBytes + 64 * 1024 + 1024 : maxBytes);
    const { body, trailers } = chunked ? decodeAwsChunked(raw) : { body: raw, trailers: {} as Record<string, string> };
    if (body.length > maxBytes)
      throw new S3Failure(400, 'EntityTooLarge', 'Your proposed upload exceeds the maximum allowed size.');
    if (
      req.headers['x-amz-decoded-content-length'] &&
      Number(req.headers['x-amz-decoded-content-length']) !== body.length
    ) {
      throw new S3Failure(400, 'IncompleteBody', 'The body is not the declared length.');
    }
    if (/^[0-9a-f]{64}$/.test(sha256Header) && createHash('sha256').update(body).digest('hex') !== sha256Header) {
      throw new S3Failure(
        400,
        'XAmzContentSHA256Mismatch',
        "The provided 'x-amz-content-sha256' header does not match what was computed.",
      );
    }
    const md5 = createHash('md5').update(body);
    const md5Hex = md5.copy().digest('hex');
    if (req.headers['content-md5'] && md5.digest('base64') !== req.headers['content-md5']) {
      throw new S3Failure(400, 'BadDigest', 'The Content-MD5 you specified did not match what we received.');
    }
    const checksums: Record<string, string> = {};
    const sent = { ...trailers, ...Object.fromEntries(Object.entries(req.headers).map(([k, v]) => [k, String(v)])) };
    for (const [name, value] of Object.entries(sent)) {
      const alg = /^x-amz-checksum-(crc32|crc32c|crc64nvme|sha1|sha256)$/.exec(name)?.[1];
      if (!alg) continue;
      if (CHECKERS[alg] && CHECKERS[alg](body) !== value) {
        throw new S3Failure(
          400,
          'BadDigest',
          `The ${alg.toUpperCase()} you specified did not match the calculated checksum.`,
        );
      }
      checksums[alg] = value;
    }
    const metadata: Record<string, string> = {};
    for (const [k, v] of Object.entries(req.headers))
      if (k.startsWith('x-amz-meta-')) metadata[k.slice(11)] = String(v);
    const meta: ObjectMeta = {
      key,
      sizeBytes: body.length,
      contentType: String(req.headers['content-type'] ?? 'binary/octet-stream'),
      etag: `"${md5Hex}"`,
      lastModified: new Date().toISOString(),
      metadata,
      checksums,
    };
    // Body first, then the sidecar: a reader never sees metadata for a half-written body.
    const file = objectPath(bucket, key);
    fs.writeFileSync(`${file}.tmp`, body);
    fs.renameSync(`${file}.tmp`, file);
    fs.writeFileSync(`${file}.json`, JSON.stringify(meta));
    res.writeHead(200, {
      ETag: meta.etag,
      ...Object.fromEntries(Object.entries(checksums).map(([a, v]) => [`x-amz-checksum-${a}`, v])),
    });
    res.end();
  }

  function listObjects(url: URL, res: http.ServerResponse, bucket: string) {
    requireBucket(bucket);
    const prefix = url.searchParams.get('prefix') ?? '';
    const maxKeys = Math.min(1000, Number(url.searchParams.get('max-keys') ?? 1000));
    const token = url.searchParams.get('continuation-token');
    const after = token
      ? Buffer.from(token, 'base64url').toString('utf8')
      : (url.searchParams.get('start-after') ?? '');
    const all = fs
      .readdirSync(bucketDir(bucket))
      .filter((f) => f.endsWith('.json'))
      .map((f) => JSON.parse(fs.readFileSync(path.join(bucketDir(bucket), f), 'utf8')) as ObjectMeta)
      .filter((m) => m.key.startsWith(prefix) && m.key > after)
      .sort((a, b) => (a.key < b.key ? -1 : 1));
    const page = all.slice(0, maxKeys);
    const truncated = all.length > page.length;
    const contents = page
      .map(
        (m) =>
          `<Contents><Key>${xmlEscape(m.key)}</Key><LastModified>${m.lastModified}</LastModified><ETag>${xmlEscape(m.etag)}</ETag><Size>${m.sizeBytes}</Size><StorageClass>STANDARD</StorageClass></Contents>`,
      )
      .join('');
    const next = truncated
      ? `<NextContinuationToken>${Buffer.from(page[page.length - 1].key).toString('base64url')}</NextContinuationToken>`
      : '';
    sendXml(
      res,
      200,
      `<ListBucketResult xmlns="http://s3.amazonaws.com/doc/2006-03-01/"><Name>${xmlEscape(bucket)}</Name><Prefix>${xmlEscape(prefix)}</Prefix><KeyCount>${page.length}</KeyCount><MaxKeys>${maxKeys}</MaxKeys><IsTruncated>${truncated}</IsTruncated>${contents}${next}</ListBucketResult>`,
    );
  }

  function sendXml(res: http.ServerResponse, status: number, xml: string) {
    res.writeHead(status, { 'Content-Type': 'application/xml' });
    res.end(`<?xml version="1.0" encoding="UTF-8"?>\n${xml}`);
  }

  async function route(req: http.IncomingMessage, res: http.ServerResponse) {
    const url = new URL(req.url ?? '/', 'http://127.0.0.1');
    if (url.pathname === '/_fake/health') {
      res.writeHead(200, { 'Content-Type': 'application/json' });
      return res.end(JSON.stringify({ data: { ok: true } }));
    }
    // Signed headers or a presigned URL: either way something claiming to be a signature.
    if (!req.headers.authorization && !url.searchParams.has('X-Amz-Signature')) {
      throw new S3Failure(403, 'AccessDenied', 'Access Denied (no Authorization header).');
    }
    // "Credential=<access key id>/<date>/<region>/s3/aws4_request" (AWS SigV4, header or query form).
    const credential =
      /Credential=([^/,\s]+)\//.exec(req.headers.authorization ?? '')?.[1] ??
      url.searchParams.get('X-Amz-Credential')?.split('/')[0];
    if (credential !== opts.accessKeyId) {
      throw new S3Failure(
        403,
        'InvalidAccessKeyId',
        'The AWS Access Key Id you provided does not exist in our records.',
      );
    }
    const [, bucket = '', ...rest] = url.pathname.split('/');
    let key: string;
    try {
      key = decodeURIComponent(rest.join('/'));
    } catch {
      throw new S3Failure(400, 'InvalidURI', "Couldn't parse the specified URI.");
    }
    if (!bucket) throw new S3Failure(501, 'NotImplemented', 'ListBuckets is not supported by this fake.');
    if (!BUCKET_NAME.test(bucket))
      throw new S3Failure(400, 'InvalidBucketName', 'The specified bucket is not valid.', { BucketName: bucket });
    const method = req.method ?? 'GET';

    if (!key) {
      if (method === 'PUT') {
        req.resume(); // CreateBucketConfiguration is accepted and ignored
        fs.mkdirSync(bucketDir(bucket), { recursive: true }); // idempotent, as S3 in us-east-1
        res.writeHead(200, { Location: `/${bucket}` });
        return res.end();
      }
      if (method === 'HEAD') {
        res.writeHead(fs.existsSync(bucketDir(bucket)) ? 200 : 404);
        return res.end();
      }
      if (method === 'GET' && url.searchParams.get('list-type') === '2') return listObjects(url, res, bucket);
      throw new S3Failure(501, 'NotImplemented', `${method} on a bucket is not supported by this fake.`);
    }
    if (Buffer.byteLength(key) > 1024) throw new S3Failure(400, 'KeyTooLongError', 'Your key is too long.');
    if (method === 'PUT') return putObject(req, res, bucket, key);
    if (method === 'GET' || method === 'HEAD') {
      const meta = readMeta(bucket, key);
      res.writeHead(200, objectHeaders(meta, req.headers['x-amz-checksum-mode'] === 'ENABLED'));
      if (method === 'HEAD') return res.end();
      return fs.createReadStream(objectPath(bucket, key)).pipe(res);
    }
    if (method === 'DELETE') {
      requireBucket(bucket);
      for (const f of [objectPath(bucket, key), `${objectPath(bucket, key)}.json`]) fs.rmSync(f, { force: true });
      res.writeHead(204);
      return res.end();
    }
    throw new S3Failure(405, 'MethodNotAllowed', 'The specified method is not allowed against this resource.');
  }

  fs.mkdirSync(opts.rootDir, { recursive: true });
  const server = http.createServer((req, res) => {
    const requestId = randomBytes(8).toString('hex').toUpperCase();
    res.setHeader('x-amz-request-id', requestId);
    route(req, res).catch((err: unknown) => {
      const f =
        err instanceof S3Failure ? err : new S3Failure(500, 'InternalError', 'We encountered an internal error.');
      if (!(err instanceof S3Failure)) console.error('[fakes] storage error', err);
      if (res.headersSent) return res.destroy();
      if (req.method === 'HEAD') {
        res.writeHead(f.status); // HEAD answers carry no body; the SDK names the error from the status
        return res.end();
      }
      const extra = Object.entries(f.extra)
        .map(([k, v]) => `<${k}>${xmlEscape(v)}</${k}>`)
        .join('');
      sendXml(
        res,
        f.status,
        `<Error><Code>${f.code}</Code><Message>${xmlEscape(f.message)}</Message>${extra}<RequestId>${requestId}</RequestId></Error>`,
      );
    });
  });
  server.listen(opts.port, '127.0.0.1');
  return { server, close: () => new Promise((r) => server.close(() => r(null))) };
}
