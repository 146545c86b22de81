// The client's address for per-client limits, from the X-Forwarded-For chain. Framework-free.
//
// Each proxy appends the address it received the request from (MDN, "X-Forwarded-For"; nginx
// $proxy_add_x_forwarded_for), so only the entries added by our own proxies can be trusted: the
// client can put anything in front of them. With TRUSTED_PROXY_HOPS proxies in front of the app
// (default 1: one load balancer), the client is the entry that many places from the right. Without
// the header, x-real-ip, else 'local'. Without any proxy the headers are the client's own words:
// deployments put one in front of the app (README, "Scaling past one machine").

export function readTrustedProxyHops(raw = process.env.TRUSTED_PROXY_HOPS): number {
  const n = Number(raw?.trim() || 1);
  return Number.isInteger(n) && n >= 1 && n <= 10 ? n : 1;
}

/** Capped in length so a forged header cannot bloat the counter's key. */
export function getClientAddress(headers: Headers, hops = readTrustedProxyHops()): string {
  const chain = (headers.get('x-forwarded-for') ?? '').split(',').map((s) => s.trim()).filter(Boolean);
  const fromChain = chain.length ? chain[Math.max(0, chain.length - hops)] : '';
  const real = headers.get('x-real-ip')?.trim();
  return (fromChain || real || 'local').toLowerCase().slice(0, 64);
}
