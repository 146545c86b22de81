// The one capped body reader, on Request objects whose bodies are ReadableStreams that count what
// is pulled from them. References: RFC 9110 section 15.5.14 (413 Content Too Large) and 15.5.16
// (415 Unsupported Media Type); RFC 8259 (JSON text); RFC 7578 (multipart/form-data); WHATWG
// Streams (a stream is pulled on demand, so an unread rest is never produced); the UTF-8 bytes
// of "é" are C3 A9 (RFC 3629 section 3).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { AppError } from '../../../../lib/core/errors';
import {
  readCappedBytes,
  readJsonBody,
  readRawText,
  readFormBody,
  type FormRefusals,
} from '../../../../lib/server/http/read-body';

const KB = 1024;

/**
 * A stream of `count` chunks of `size` bytes, made only when pulled; `pulled()` says how many bytes
 * left it, `cancelled` settles when the reader cancels it. With `stallAfter`, it stops producing
 * (a client that went quiet) once that many bytes have left it.
 */
function countingStream(count: number, size: number, fill = 0x61, stallAfter = Infinity) {
  let made = 0;
  let bytes = 0;
  let onCancel: () => void = () => undefined;
  const cancelled = new Promise<void>((resolve) => (onCancel = resolve));
  const stream = new ReadableStream<Uint8Array>(
    {
      pull(controller) {
        if (made === count) return controller.close();
        if (bytes >= stallAfter) return new Promise<void>(() => undefined);
        made++;
        bytes += size;
        controller.enqueue(new Uint8Array(size).fill(fill));
      },
      cancel() {
        onCancel();
      },
    },
    { highWaterMark: 0 },
  );
  return { stream, pulled: () => bytes, cancelled };
}

function post(body: ReadableStream<Uint8Array> | string | Uint8Array | null, headers: Record<string, string> = {}) {
  return new Request('http://test.invalid/x', { method: 'POST', body, headers, duplex: 'half' } as RequestInit);
}

const isAppError = (status: number, code: string, message?: RegExp) => (err: unknown) => {
  assert.ok(err instanceof AppError, `expected an AppError, got ${err}`);
  assert.equal(err.status, status);
  assert.equal(err.code, code);
  if (message) assert.match(err.message, message);
  return true;
};

test('a body under the cap is read whole, byte for byte', async () => {
  const { stream, pulled } = countingStream(10, KB);
  const bytes = await readCappedBytes(post(stream), 10 * KB);
  assert.equal(bytes.byteLength, 10 * KB);
  assert.equal(pulled(), 10 * KB);
  assert.ok(bytes.every((b) => b === 0x61));
});

test('a stream with no length is refused with 413 as soon as it passes the cap; at most the linger budget more is read, then it is cancelled', async () => {
  const { stream, pulled, cancelled } = countingStream(1000, 64 * KB); // 64 MB on offer
  let pulledAtRefusal = -1;
  const refuse = () => (
    (pulledAtRefusal = pulled()),
    new AppError('too_large', 413, 'The body is larger than 8192 bytes.')
  );
  const t = Date.now();
  await assert.rejects(
    readCappedBytes(post(stream), 8 * KB, refuse, { bytes: 256 * KB, ms: 150 }),
    isAppError(413, 'too_large', /8192 bytes/),
  );
  // Refused on the chunk that crossed the cap (plus at most one the Request pulled ahead).
  assert.ok(
    pulledAtRefusal > 8 * KB && pulledAtRefusal <= 2 * 64 * KB,
    `refused after ${pulledAtRefusal} bytes for an 8 KB cap`,
  );
  // Then at most the linger budget is read and thrown away, nothing more is pulled, and the stream is
  // cancelled when the linger time is up; the rest is never pulled.
  await cancelled;
  assert.ok(Date.now() - t >= 140, `cancelled after ${Date.now() - t} ms, before the linger time`);
  assert.ok(pulled() <= 8 * KB + 256 * KB + 3 * 64 * KB, `pulled ${pulled()} bytes before the cancel`);
});

test('a client that goes quiet after the cap is cut off when the linger time runs out', async () => {
  const { stream, cancelled } = countingStream(1000, KB, 0x61, 16 * KB);
  const t = Date.now();
  await assert.rejects(
    readCappedBytes(post(stream), 8 * KB, undefined, { bytes: 1024 * KB, ms: 150 }),
    isAppError(413, 'too_large'),
  );
  await cancelled;
  assert.ok(Date.now() - t >= 140 && Date.now() - t < 2000, `cancelled after ${Date.now() - t} ms`);
});

test('a declared Content-Length over the cap is refused before a byte is pulled', async () => {
  const { stream, pulled } = countingStream(100, KB);
  await assert.rejects(
    readCappedBytes(post(stream, { 'content-length': String(100 * KB) }), 8 * KB),
    isAppError(413, 'too_large'),
  );
  await new Promise((r) => setTimeout(r, 20));
  assert.equal(pulled(), 0);
});

test('the caller chooses the 413 it throws; a body exactly at the cap is accepted', async () => {
  const custom = () => new AppError('too_large', 413, 'The webhook body is too large.');
  await assert.rejects(
    readCappedBytes(post(countingStream(3, KB).stream), 2 * KB, custom),
    isAppError(413, 'too_large', /webhook/),
  );
  assert.equal((await readCappedBytes(post(countingStream(2, KB).stream), 2 * KB)).byteLength, 2 * KB);
  assert.equal(
    (await readCappedBytes(new Request('http://test.invalid/x', { method: 'POST' }), KB)).byteLength,
    0,
    'no body reads as no bytes',
  );
});

test('raw text keeps the exact characters, even when a UTF-8 sequence is split across chunks', async () => {
  const parts = [new Uint8Array([0x7b, 0x22, 0x6e, 0x22, 0x3a, 0x22, 0xc3]), new Uint8Array([0xa9, 0x22, 0x7d])]; // {"n":"é"} split inside é
  const stream = new ReadableStream<Uint8Array>({
    start(c) {
      for (const p of parts) c.enqueue(p);
      c.close();
    },
  });
  assert.equal(await readRawText(post(stream), KB), '{"n":"é"}');
});

test('JSON: 415 for another type, 400-worthy SyntaxError when it does not parse, 413 past the cap, the value otherwise', async () => {
  await assert.rejects(
    readJsonBody(post('{}', { 'content-type': 'text/plain' })),
    isAppError(415, 'unsupported_media_type'),
  );
  await assert.rejects(readJsonBody(post('{"a": ', { 'content-type': 'application/json' })), SyntaxError);
  await assert.rejects(
    readJsonBody(post(countingStream(100, KB, 0x20).stream, { 'content-type': 'application/json' }), 64 * KB),
    isAppError(413, 'too_large'),
  );
  assert.deepEqual(
    await readJsonBody(post('{"powerKw": 200}', { 'content-type': 'application/json; charset=utf-8' })),
    { powerKw: 200 },
  );
});

test('forms: 415 and 413 name the field; an unreadable form is 400; a good one parses', async () => {
  const say: FormRefusals = {
    field: 'file',
    wrongType: 'Send a form.',
    tooLarge: 'Too large.',
    tooLargeField: 'The file is too large.',
    unreadable: 'Unreadable.',
  };
  await assert.rejects(
    readFormBody(post('{}', { 'content-type': 'application/json' }), KB, say),
    (e) => isAppError(415, 'unsupported_media_type')(e) && (e as AppError).details !== undefined,
  );
  await assert.rejects(
    readFormBody(
      post(countingStream(100, KB).stream, { 'content-type': 'multipart/form-data; boundary=b' }),
      4 * KB,
      say,
    ),
    (e: unknown) => {
      isAppError(413, 'too_large', /Too large/)(e);
      assert.deepEqual((e as AppError).details, [{ field: 'file', message: 'The file is too large.' }]);
      return true;
    },
  );
  await assert.rejects(
    readFormBody(post('not a form at all', { 'content-type': 'multipart/form-data; boundary=b' }), KB, say),
    isAppError(400, 'invalid_input', /Unreadable/),
  );
  const form = new FormData();
  form.set('kind', 'dyno');
  form.set('file', new Blob([new Uint8Array([1, 2, 3])]), 'x.bin');
  const encoded = new Response(form);
  const parsed = await readFormBody(
    post(new Uint8Array(await encoded.arrayBuffer()), { 'content-type': encoded.headers.get('content-type')! }),
    KB,
    say,
  );
  assert.equal(parsed.get('kind'), 'dyno');
  assert.deepEqual(new Uint8Array(await (parsed.get('file') as File).arrayBuffer()), new Uint8Array([1, 2, 3]));
});
