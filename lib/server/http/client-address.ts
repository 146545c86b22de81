// The client's address for per-client limits, from the X-Forwarded-For chain. Framework-free.
//
// Each proxy appends the address it received the request from (MDN, "X-Forwarded-For"; nginx
// $proxy_add_x_forwarded_for), so only entries added by our own side can be trusted: the client can
// put anything in front of them. Boreline's own server (scripts/server.mjs) appends the socket's
// address last, as a proxy would, so the chain always ends with the app's own entry. With
// TRUSTED_PROXY_HOPS proxies declared in front of the app, the client is the entry that many places
// left of the app's own; with none (0, the default: one machine, no proxy) it is the socket itself,
// and nothing a client writes in a header counts. X-Real-IP is never read: no proxy of ours sets it.
import { serverEnv } from '../config/env';

// TRUSTED_PROXY_HOPS is read with the rest of the environment (lib/server/config/env.ts).
export { readTrustedProxyHops } from '../config/env';

/** Capped in length so a forged header cannot bloat the counter's key. */
export function getClientAddress(headers: Headers, hops = serverEnv().TRUSTED_PROXY_HOPS): string {
  const chain = (headers.get('x-forwarded-for') ?? '')
    .split(',')
    .map((s) => s.trim())
    .filter(Boolean);
  // chain[length - 1] is the app's own entry (the socket); each declared proxy moves one further left.
  const fromChain = chain.length ? chain[Math.max(0, chain.length - 1 - hops)] : '';
  return (fromChain || 'local').toLowerCase().slice(0, 64);
}
