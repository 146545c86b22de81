// The client address behind proxies. X-Forwarded-For lists "<client>, <proxy1>, <proxy2>": each proxy
// appends the address it received the request from (MDN Web Docs, "X-Forwarded-For"; the same
// model as RFC 7239, section 5.2, for the standard Forwarded header). Boreline's own server
// (scripts/server.mjs) appends the socket's address last, as a proxy would, so with N declared
// proxies the client is the entry N places left of the app's own, and with none it is the socket.
// Entries a client writes itself sit further left and count for nothing (OWASP, "Denial of Service
// Cheat Sheet": do not key limits on client-controlled headers).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { getClientAddress, readTrustedProxyHops } from '../../../../lib/server/http/client-address';
import {
  forwardHeaders,
  isLoopbackHost,
  parseProxyHops,
  readListenHost,
  socketAddress,
} from '../../../../scripts/forwarding.mjs';

const h = (init: Record<string, string>) => new Headers(init);

/** What the app sees for a request whose socket is `socket` and whose own headers are `sent`. */
function seenByApp(sent: Record<string, string>, socket: string, hops: number) {
  const headers: Record<string, string | string[] | undefined> = { ...sent };
  forwardHeaders(headers, socket, hops);
  return getClientAddress(new Headers(headers as Record<string, string>), hops);
}

test('no proxy declared (hops 0): the socket is the client, whatever X-Forwarded-For or X-Real-IP say', () => {
  assert.equal(seenByApp({}, '203.0.113.9', 0), '203.0.113.9');
  assert.equal(
    seenByApp({ 'x-forwarded-for': '198.51.100.1' }, '203.0.113.9', 0),
    '203.0.113.9',
    'a forged header buys nothing',
  );
  assert.equal(seenByApp({ 'x-forwarded-for': '1.1.1.1, 2.2.2.2, 3.3.3.3' }, '203.0.113.9', 0), '203.0.113.9');
  assert.equal(seenByApp({ 'x-real-ip': '198.51.100.1' }, '203.0.113.9', 0), '203.0.113.9', 'X-Real-IP is never read');
  assert.equal(seenByApp({}, '::ffff:127.0.0.1', 0), '127.0.0.1', 'an IPv4-mapped socket address is the IPv4 address');
});

test("one proxy declared: the entry the proxy appended (left of the app's own) is the client", () => {
  // The proxy at 10.0.0.7 appended the client 203.0.113.9 after whatever the client forged.
  assert.equal(seenByApp({ 'x-forwarded-for': '203.0.113.9' }, '10.0.0.7', 1), '203.0.113.9');
  assert.equal(
    seenByApp({ 'x-forwarded-for': '1.2.3.4, 203.0.113.9' }, '10.0.0.7', 1),
    '203.0.113.9',
    'a forged first entry is ignored',
  );
  assert.equal(
    getClientAddress(h({ 'x-forwarded-for': ' 6.6.6.6 ,7.7.7.7,  203.0.113.9 , 10.0.0.7' }), 1),
    '203.0.113.9',
  );
});

test("two proxies (a CDN, then a load balancer): two places left of the app's own entry", () => {
  assert.equal(seenByApp({ 'x-forwarded-for': '1.2.3.4, 198.51.100.20, 10.0.0.7' }, '10.0.0.8', 2), '198.51.100.20');
  assert.equal(
    getClientAddress(h({ 'x-forwarded-for': '198.51.100.20' }), 2),
    '198.51.100.20',
    'a shorter chain falls back to its first entry',
  );
});

test('without any entry: local; IPv6 is lower-cased; a huge header is capped', () => {
  assert.equal(getClientAddress(h({}), 0), 'local');
  assert.equal(getClientAddress(h({ 'x-real-ip': '2001:db8::1' }), 0), 'local', 'X-Real-IP alone is not an address');
  assert.equal(getClientAddress(h({ 'x-forwarded-for': ' , ' }), 0), 'local');
  assert.equal(seenByApp({}, '2001:DB8::1', 0), '2001:db8::1');
  assert.equal(getClientAddress(h({ 'x-forwarded-for': 'x'.repeat(500) }), 0).length, 64);
});

test("without a declared proxy the client's own forwarding headers are dropped; behind one they are kept", () => {
  const sent = {
    host: 'app',
    'x-forwarded-host': 'evil.example',
    'x-forwarded-proto': 'https',
    forwarded: 'for=1.2.3.4',
    'x-real-ip': '1.2.3.4',
  };
  const direct = forwardHeaders({ ...sent }, '203.0.113.9', 0);
  assert.deepEqual(Object.keys(direct).sort(), ['host', 'x-forwarded-for']);
  const proxied = forwardHeaders({ ...sent }, '10.0.0.7', 1);
  assert.equal(proxied['x-forwarded-host'], 'evil.example', 'the proxy set it, so it stays');
  assert.equal(proxied['x-real-ip'], undefined, 'X-Real-IP is dropped either way');
  assert.equal(socketAddress(undefined), 'unknown');
});

test('TRUSTED_PROXY_HOPS: a whole number from 0 to 10; the app reads anything else as 0, the server refuses it', () => {
  assert.equal(readTrustedProxyHops(undefined), 0);
  assert.equal(readTrustedProxyHops(''), 0);
  assert.equal(readTrustedProxyHops('0'), 0);
  assert.equal(readTrustedProxyHops('2'), 2);
  for (const bad of ['-1', '1.5', 'two', '11']) assert.equal(readTrustedProxyHops(bad), 0, bad);
  assert.equal(parseProxyHops(undefined), 0);
  assert.equal(parseProxyHops(' 1 '), 1);
  for (const bad of ['-1', '1.5', 'two', '11']) assert.throws(() => parseProxyHops(bad), /TRUSTED_PROXY_HOPS/, bad);
});

test('the listen address: loopback unless asked', () => {
  assert.equal(readListenHost(undefined), '127.0.0.1');
  assert.equal(readListenHost('  '), '127.0.0.1');
  assert.equal(readListenHost('0.0.0.0'), '0.0.0.0');
  assert.equal(readListenHost(undefined, '0.0.0.0'), '0.0.0.0');
  for (const host of ['127.0.0.1', '::1', 'localhost']) assert.equal(isLoopbackHost(host), true, host);
  for (const host of ['0.0.0.0', '::', '192.168.1.10']) assert.equal(isLoopbackHost(host), false, host);
});
