// The running app (scripts/server.mjs, no proxy declared) sends its build's static files as Brotli to
// clients that accept br, gzip to those that accept only gzip, and leaves ranges to Next.js.
// Accept-Encoding: RFC 9110, section 12.5.3; Brotli: RFC 7932; ranges: RFC 9110, section 14;
// immutable: RFC 8246.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import zlib from 'node:zlib';
import http from 'node:http';
import { BASE_URL } from '../support/env';

/** A raw GET (node:http, so the body arrives as sent, not decoded). */
function rawGet(path: string, headers: Record<string, string>) {
  return new Promise<{ status: number; headers: http.IncomingHttpHeaders; body: Buffer }>((resolve, reject) => {
    http
      .get(`${BASE_URL}${path}`, { headers }, (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () =>
          resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }),
        );
      })
      .on('error', reject);
  });
}

test('static scripts: br when accepted (same bytes once decoded), gzip otherwise, ranges untouched, year-long immutable caching', async () => {
  const html = await (await fetch(`${BASE_URL}/calculator`)).text();
  const scripts = [...new Set(html.match(/\/_next\/static\/chunks\/[\w.-]+\.js/g) ?? [])];
  assert.ok(scripts.length > 0, 'the page names its scripts');
  // The server compresses in the background after it starts: wait (up to 60 s) for one of them.
  let script = '';
  for (let i = 0; i < 120 && !script; i++) {
    for (const s of scripts) {
      const head = await fetch(`${BASE_URL}${s}`, { method: 'HEAD', headers: { 'accept-encoding': 'br' } });
      if (head.headers.get('content-encoding') === 'br') script = s;
    }
    if (!script) await new Promise((r) => setTimeout(r, 500));
  }
  assert.ok(script, 'a script is served as br');

  const plain = await rawGet(script, { 'accept-encoding': 'identity' });
  assert.equal(plain.status, 200);
  assert.equal(plain.headers['content-encoding'], undefined);

  const br = await rawGet(script, { 'accept-encoding': 'gzip, deflate, br' });
  assert.equal(br.status, 200);
  assert.equal(br.headers['content-encoding'], 'br');
  assert.ok(zlib.brotliDecompressSync(br.body).equals(plain.body), 'decodes to the very same file');
  assert.ok(br.body.length < plain.body.length / 2);
  assert.equal(br.headers['cache-control'], 'public, max-age=31536000, immutable');
  assert.match(String(br.headers['vary']), /Accept-Encoding/i);
  assert.equal(br.headers['x-content-type-options'], 'nosniff', 'the security headers come along');
  assert.match(String(br.headers['content-security-policy']), /default-src 'none'/);

  const gz = await rawGet(script, { 'accept-encoding': 'gzip' });
  assert.equal(gz.headers['content-encoding'], 'gzip');
  assert.ok(zlib.gunzipSync(gz.body).equals(plain.body));
  assert.ok(br.body.length < gz.body.length, `br ${br.body.length} B, gzip ${gz.body.length} B`);

  const range = await rawGet(script, { 'accept-encoding': 'br', range: 'bytes=0-99' });
  assert.equal(range.status, 206);
  assert.ok(range.body.equals(plain.body.subarray(0, 100)), 'the first 100 bytes of the file itself');

  const again = await rawGet(script, { 'accept-encoding': 'br', 'if-none-match': String(br.headers.etag) });
  assert.equal(again.status, 304);
});

test('every hashed static file keeps a year-long immutable copy, whichever encoding: scripts, styles and fonts', async () => {
  const IMMUTABLE = 'public, max-age=31536000, immutable'; // RFC 8246 (immutable), RFC 9111 section 5.2.2.1 (max-age)
  const html = await (await fetch(`${BASE_URL}/`)).text();
  const script = html.match(/\/_next\/static\/chunks\/[\w.-]+\.js/)?.[0];
  const style = html.match(/\/_next\/static\/chunks\/[\w.-]+\.css/)?.[0];
  assert.ok(script && style, 'the page names a script and a style sheet');
  const css = await (await fetch(`${BASE_URL}${style}`)).text();
  // The sheet names its fonts relative to itself (url(../media/….woff2)).
  const fontRef = css.match(/url\(([^)]+\.woff2)\)/)?.[1];
  const font = fontRef && new URL(fontRef, `${BASE_URL}${style}`).pathname;
  assert.ok(font, 'the style sheet names a font shipped with the build');
  for (const file of [script, style, font])
    for (const encoding of ['br', 'gzip', 'identity']) {
      const res = await rawGet(file, { 'accept-encoding': encoding });
      assert.equal(res.status, 200, `${file} (${encoding})`);
      assert.equal(res.headers['cache-control'], IMMUTABLE, `${file} (${encoding})`);
    }
});
