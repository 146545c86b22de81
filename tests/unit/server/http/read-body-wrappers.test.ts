// The wrappers around the one body reader (lib/server/http/read-body.ts): next-auth's copy of a
// request, an optional JSON body and a file upload all go through the same capped read.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { AppError } from '../../../../lib/core/errors';
import { readMultipartUpload, readOptionalJsonBody, withCappedBody } from '../../../../lib/server/http/read-body';

const isAppError = (status: number, code: string) => (e: unknown) =>
  e instanceof AppError && e.status === status && e.code === code;

class TaggedRequest extends Request {
  readonly tag = 'mine';
}

test('withCappedBody hands on a copy of the same class holding the bytes read under the cap', async () => {
  const req = new TaggedRequest('http://test.invalid/api/auth/signin/email', {
    method: 'POST',
    body: 'email=a%40b.example',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
  });
  const copy = await withCappedBody(req, 1024);
  assert.ok(copy instanceof TaggedRequest);
  assert.equal(copy.headers.get('content-type'), 'application/x-www-form-urlencoded');
  assert.equal(await copy.text(), 'email=a%40b.example');
});

test('withCappedBody refuses a body past the cap (413) and leaves a GET alone', async () => {
  const big = new Request('http://test.invalid/x', { method: 'POST', body: 'x'.repeat(2048) });
  await assert.rejects(withCappedBody(big, 1024), isAppError(413, 'too_large'));
  const get = new Request('http://test.invalid/x');
  assert.equal(await withCappedBody(get, 1024), get);
});

test('an optional JSON body: Content-Length 0 reads as {}, anything else as JSON through the cap', async () => {
  const empty = new Request('http://test.invalid/x', { method: 'POST', headers: { 'content-length': '0' } });
  assert.deepEqual(await readOptionalJsonBody(empty), {});
  const json = new Request('http://test.invalid/x', {
    method: 'POST',
    body: '{"note":"v2"}',
    headers: { 'content-type': 'application/json' },
  });
  assert.deepEqual(await readOptionalJsonBody(json), { note: 'v2' });
  const large = new Request('http://test.invalid/x', {
    method: 'POST',
    body: JSON.stringify({ note: 'x'.repeat(100) }),
    headers: { 'content-type': 'application/json' },
  });
  await assert.rejects(readOptionalJsonBody(large, 64), isAppError(413, 'too_large'));
});

test('a file upload names its limit when refused', async () => {
  const form = new FormData();
  form.set('file', new File(['x'.repeat(4096)], 'results.csv', { type: 'text/csv' }));
  const encoded = new Response(form);
  const req = new Request('http://test.invalid/x', {
    method: 'POST',
    body: new Uint8Array(await encoded.arrayBuffer()),
    headers: { 'content-type': encoded.headers.get('content-type')! },
  });
  await assert.rejects(
    readMultipartUpload(req, 1024, '1 KB'),
    (e: unknown) => isAppError(413, 'too_large')(e) && /larger than 1 KB/.test((e as AppError).message),
  );
  const json = new Request('http://test.invalid/x', {
    method: 'POST',
    body: '{}',
    headers: { 'content-type': 'application/json' },
  });
  await assert.rejects(readMultipartUpload(json, 1024, '1 KB'), isAppError(415, 'unsupported_media_type'));
});
