// requestJson against a real HTTP server (node:http) and Node's own fetch (undici), the same Fetch API a browser
// has: an answer cut off while its body arrives must never come back as a good answer with no data.
// The behaviour checked against the WHATWG Fetch Standard (fetch.spec.whatwg.org, "abort fetch" and the body's
// "fully read" steps; from memory): aborting after the headers rejects the body read with an "AbortError"
// DOMException, and a connection that drops mid-body rejects it with a TypeError.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { ANSWER_CUT_MESSAGE, requestJson } from '../../../components/forms/request-json';

let server: http.Server;
let base: string;
/** Called when a /slow answer has sent its headers and the first part of its body. */
let onHeadersSent: () => void = () => {};

before(async () => {
  server = http.createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://x');
    if (url.pathname === '/good') {
      res.writeHead(200, { 'content-type': 'application/json' });
      return res.end(JSON.stringify({ data: { thrustN: 13004.56 } }));
    }
    if (url.pathname === '/empty') {
      res.writeHead(204);
      return res.end();
    }
    if (url.pathname === '/refused') {
      res.writeHead(400, { 'content-type': 'application/json' });
      return res.end(
        JSON.stringify({
          error: { code: 'invalid_input', message: 'Bad input.', details: [{ field: 'powerKw', message: 'Too low.' }] },
        }),
      );
    }
    if (url.pathname === '/broken') {
      res.writeHead(502, { 'content-type': 'text/html' });
      return res.end('<h1>Bad gateway</h1>');
    }
    // /slow and /cut: the headers and half a body, then nothing (slow) or a dropped connection (cut).
    res.writeHead(200, { 'content-type': 'application/json', 'content-length': '64' });
    res.write('{"data":{"points":[');
    if (url.pathname === '/cut') setTimeout(() => res.socket?.destroy(), 30);
    else onHeadersSent();
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});

after(async () => {
  server.closeAllConnections();
  await new Promise((resolve) => server.close(resolve));
});

test('a whole answer: its data; an empty 204: ok with no data', async () => {
  const good = await requestJson<{ thrustN: number }>(`${base}/good`, { body: { powerKw: 300 } });
  assert.equal(good.ok, true);
  assert.deepEqual(good.ok && good.data, { thrustN: 13004.56 });
  const empty = await requestJson(`${base}/empty`, { method: 'DELETE' });
  assert.equal(empty.ok, true);
  assert.equal(empty.status, 204);
});

test('a refusal: its message and field errors; a non-JSON error page: the fallback message', async () => {
  const refused = await requestJson(`${base}/refused`, { body: {} });
  assert.equal(refused.ok, false);
  assert.equal(!refused.ok && refused.message, 'Bad input.');
  assert.deepEqual(!refused.ok && refused.fieldErrors, { powerKw: 'Too low.' });
  const broken = await requestJson(`${base}/broken`, { body: {}, fallbackMessage: (s) => `answered ${s}` });
  assert.equal(broken.ok, false);
  assert.equal(broken.status, 502);
  assert.equal(!broken.ok && broken.message, 'answered 502');
});

test('aborted after the headers, while the body arrives: thrown as an abort, never a good answer with no data', async () => {
  const controller = new AbortController();
  onHeadersSent = () => setTimeout(() => controller.abort(), 30);
  await assert.rejects(requestJson(`${base}/slow`, { body: {}, signal: controller.signal }), (err: Error) => {
    assert.equal(err.name, 'AbortError');
    return true;
  });
});

test('the connection dropped mid-body: no answer (status 0), and a POST says it may have been saved', async () => {
  const posted = await requestJson(`${base}/cut`, { body: { idempotencyKey: 'k1' } });
  assert.equal(posted.ok, false);
  assert.equal(posted.status, 0);
  assert.equal(!posted.ok && posted.message, ANSWER_CUT_MESSAGE);
  const read = await requestJson(`${base}/cut`, { method: 'GET' });
  assert.equal(read.ok, false);
  assert.equal(read.status, 0);
  assert.match(!read.ok ? read.message : '', /^No connection to the server/);
});
