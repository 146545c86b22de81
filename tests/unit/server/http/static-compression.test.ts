// Brotli for the build's static files (scripts/static-compression.mjs), against a build folder made here.
// Accept-Encoding and q-values: RFC 9110, sections 12.5.3 and 12.4.2 (q=0 means "not acceptable").
// Conditional requests: RFC 9110, section 13.1.2 (If-None-Match, weak comparison) and 15.4.5 (304).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import type { IncomingMessage, ServerResponse } from 'node:http';
import { acceptsBrotli, createStaticCompression } from '../../../../scripts/static-compression.mjs';

test('acceptsBrotli reads Accept-Encoding as RFC 9110 says', () => {
  assert.equal(acceptsBrotli('gzip, deflate, br, zstd'), true, 'what Chromium sends');
  assert.equal(acceptsBrotli('BR;q=0.5'), true, 'codings are case-insensitive');
  assert.equal(acceptsBrotli('gzip, br;q=0'), false, 'q=0: not acceptable');
  assert.equal(acceptsBrotli('gzip'), false);
  assert.equal(acceptsBrotli('brotli'), false, 'only the registered token "br"');
  assert.equal(acceptsBrotli(undefined), false);
});

type Sent = { status: number; headers: Record<string, string | number>; body?: Buffer };
function fakeResponse(sent: Sent) {
  return {
    set statusCode(s: number) {
      sent.status = s;
    },
    setHeader(k: string, v: string | number) {
      sent.headers[k.toLowerCase()] = v;
    },
    end(body?: Buffer) {
      sent.body = body;
    },
  } as unknown as ServerResponse;
}
const request = (url: string, headers: Record<string, string> = {}, method = 'GET') =>
  ({ url, method, headers }) as unknown as IncomingMessage;

test('static files: Brotli once ready, with the security headers, immutable caching, HEAD, 304; everything else left to Next.js', async () => {
  const dist = fs.mkdtempSync(path.join(os.tmpdir(), 'boreline-static-'));
  const chunks = path.join(dist, 'static', 'chunks');
  fs.mkdirSync(chunks, { recursive: true });
  const js = 'function boreline(){return "a nozzle bore, measured"}\n'.repeat(200);
  fs.writeFileSync(path.join(chunks, 'app-1a2b.js'), js);
  fs.writeFileSync(path.join(chunks, 'tiny.js'), 'x()');
  fs.writeFileSync(path.join(dist, 'secret.js'), js);
  const files = createStaticCompression({ distDir: dist, headers: [['X-Content-Type-Options', 'nosniff']] });
  const br = { 'accept-encoding': 'gzip, deflate, br' };

  assert.equal(
    files.handle(request('/_next/static/chunks/app-1a2b.js', br), fakeResponse({ status: 0, headers: {} })),
    false,
    'not compressed yet: Next.js answers, nobody waits',
  );
  await files.warm();
  assert.equal(files.size, 1, 'files under 1 KiB are left to Next.js');

  const sent: Sent = { status: 0, headers: {} };
  assert.equal(files.handle(request('/_next/static/chunks/app-1a2b.js?dpl=x', br), fakeResponse(sent)), true);
  assert.equal(sent.status, 200);
  assert.equal(sent.headers['content-encoding'], 'br');
  assert.equal(zlib.brotliDecompressSync(sent.body!).toString(), js, 'the same bytes after decoding');
  assert.ok(sent.body!.length < js.length / 10);
  assert.equal(sent.headers['content-length'], sent.body!.length);
  assert.equal(sent.headers['cache-control'], 'public, max-age=31536000, immutable');
  assert.equal(sent.headers['vary'], 'Accept-Encoding');
  assert.equal(sent.headers['x-content-type-options'], 'nosniff');
  assert.match(String(sent.headers['content-type']), /^application\/javascript/);

  const head: Sent = { status: 0, headers: {} };
  assert.equal(files.handle(request('/_next/static/chunks/app-1a2b.js', br, 'HEAD'), fakeResponse(head)), true);
  assert.equal(head.body, undefined, 'HEAD: headers only');
  assert.equal(head.headers['content-length'], sent.body!.length);

  const again: Sent = { status: 0, headers: {} };
  const etag = String(sent.headers['etag']);
  files.handle(
    request('/_next/static/chunks/app-1a2b.js', { ...br, 'if-none-match': `W/${etag}` }),
    fakeResponse(again),
  );
  assert.equal(again.status, 304);
  assert.equal(again.body, undefined);

  const leftAlone = [
    request('/_next/static/chunks/app-1a2b.js', { 'accept-encoding': 'gzip' }),
    request('/_next/static/chunks/app-1a2b.js', { 'accept-encoding': 'br;q=0' }),
    request('/_next/static/chunks/app-1a2b.js', { ...br, range: 'bytes=0-99' }),
    request('/_next/static/chunks/app-1a2b.js', br, 'POST'),
    request('/_next/static/../secret.js', br),
    request('/_next/static/chunks/../../secret.js', br),
    request('/api/health', br),
  ];
  for (const req of leftAlone)
    assert.equal(
      files.handle(req, fakeResponse({ status: 0, headers: {} })),
      false,
      `${req.method} ${req.url} ${JSON.stringify(req.headers)}`,
    );
  fs.rmSync(dist, { recursive: true, force: true });
});
