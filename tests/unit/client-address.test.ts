// The client address behind proxies. X-Forwarded-For lists "<client>, <proxy1>, <proxy2>": each proxy
// appends the address it received the request from (MDN Web Docs, "X-Forwarded-For"; the same
// model as RFC 7239, section 5.2, for the standard Forwarded header). Only entries appended by
// our own proxies can be trusted, so with N trusted proxies the client is the Nth entry from the right.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { getClientAddress, readTrustedProxyHops } from '../../lib/http/client-address';

const h = (init: Record<string, string>) => new Headers(init);

test('one load balancer: the entry it appended is the client, whatever the client put in front', () => {
  assert.equal(getClientAddress(h({ 'x-forwarded-for': '203.0.113.9' }), 1), '203.0.113.9');
  assert.equal(getClientAddress(h({ 'x-forwarded-for': '1.2.3.4, 203.0.113.9' }), 1), '203.0.113.9', 'a forged first entry is ignored');
  assert.equal(getClientAddress(h({ 'x-forwarded-for': ' 6.6.6.6 ,7.7.7.7,  203.0.113.9 ' }), 1), '203.0.113.9');
});

test('two proxies (a CDN, then a load balancer): the second entry from the right', () => {
  assert.equal(getClientAddress(h({ 'x-forwarded-for': '1.2.3.4, 198.51.100.20, 10.0.0.7' }), 2), '198.51.100.20');
  assert.equal(getClientAddress(h({ 'x-forwarded-for': '198.51.100.20' }), 2), '198.51.100.20', 'a shorter chain falls back to its first entry');
});

test('without the header: x-real-ip, else local; IPv6 is lower-cased; a huge header is capped', () => {
  assert.equal(getClientAddress(h({ 'x-real-ip': '2001:DB8::1' }), 1), '2001:db8::1');
  assert.equal(getClientAddress(h({}), 1), 'local');
  assert.equal(getClientAddress(h({ 'x-forwarded-for': ' , ' }), 1), 'local');
  assert.equal(getClientAddress(h({ 'x-forwarded-for': 'x'.repeat(500) }), 1).length, 64);
});

test('TRUSTED_PROXY_HOPS: a whole number from 1 to 10, else 1', () => {
  assert.equal(readTrustedProxyHops(undefined), 1);
  assert.equal(readTrustedProxyHops('2'), 2);
  for (const bad of ['0', '-1', '1.5', 'two', '11', '']) assert.equal(readTrustedProxyHops(bad), 1, bad);
});
