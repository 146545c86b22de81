// How Boreline's own server (scripts/server.mjs) passes the client's address to the app, as a
// proxy would: the socket's address is appended to X-Forwarded-For (MDN, "X-Forwarded-For"; the
// model of RFC 7239, section 5.2). lib/server/http/client-address.ts reads the chain back. Plain
// JavaScript so that node runs it without a build step; the unit test imports it.

/** The socket's address as an address, not an IPv4-mapped IPv6 form ("::ffff:127.0.0.1"). */
export function socketAddress(remoteAddress) {
  const a = String(remoteAddress ?? '')
    .trim()
    .toLowerCase();
  return a.startsWith('::ffff:') && a.includes('.') ? a.slice(7) : a || 'unknown';
}

/**
 * Rewrites the forwarding headers of one request in place. Without a declared proxy (hops 0) the
 * client's own X-Forwarded-Host/-Proto/-Port, Forwarded and X-Real-IP are dropped (only a proxy
 * may say those) and its X-Forwarded-For keeps no weight, because the socket's entry comes last.
 * @param {import('node:http').IncomingHttpHeaders} headers
 * @param {string | undefined} remoteAddress
 * @param {number} hops
 */
export function forwardHeaders(headers, remoteAddress, hops) {
  if (hops === 0) {
    for (const name of ['x-forwarded-host', 'x-forwarded-proto', 'x-forwarded-port', 'forwarded', 'x-real-ip'])
      delete headers[name];
  }
  delete headers['x-real-ip'];
  const received = [headers['x-forwarded-for']].flat().filter(Boolean).join(', ');
  headers['x-forwarded-for'] = received ? `${received}, ${socketAddress(remoteAddress)}` : socketAddress(remoteAddress);
  return headers;
}

/** TRUSTED_PROXY_HOPS: unset or empty is 0; anything but a whole number from 0 to 10 is an error. */
export function parseProxyHops(raw) {
  const text = String(raw ?? '').trim();
  if (text === '') return 0;
  if (!/^\d+$/.test(text) || Number(text) > 10)
    throw new Error(`TRUSTED_PROXY_HOPS=${text} is not a whole number from 0 to 10`);
  return Number(text);
}

/** Loopback unless the person asks for the network (BORELINE_HOST); the demo and serve defaults differ. */
export function readListenHost(raw, fallback = '127.0.0.1') {
  const text = String(raw ?? '').trim();
  return text || fallback;
}

export const isLoopbackHost = (host) => host === 'localhost' || host === '::1' || /^127\.\d+\.\d+\.\d+$/.test(host);
