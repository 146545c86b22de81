// Boreline's HTTP server: Next.js's request handler behind a plain node:http server (Next.js
// "Custom Server": next({ dev: false }) and getRequestHandler()), so that the client's address is
// the socket's and not whatever the client wrote in X-Forwarded-For. `next build` comes first.
//
// Environment: PORT (3000), BORELINE_HOST (listen address), BORELINE_MODE (demo | serve),
// TRUSTED_PROXY_HOPS (0 = no proxy: compression on, forwarded headers from clients dropped).
import { createServer } from 'node:http';
import next from 'next';
import { forwardHeaders, isLoopbackHost, parseProxyHops, readListenHost } from './forwarding.mjs';

const say = (msg) => console.log(`[boreline] ${msg}`);

let hops;
try {
  hops = parseProxyHops(process.env.TRUSTED_PROXY_HOPS);
} catch (err) {
  console.error(`[boreline] ${err.message}`);
  process.exit(1);
}
// next.config.mjs reads the same value when the app is prepared (compression on without a proxy).
process.env.TRUSTED_PROXY_HOPS = String(hops);

const mode = process.env.BORELINE_MODE === 'serve' ? 'serve' : 'demo';
const port = Number(process.env.PORT || 3000);
// The demo stays on loopback unless asked; a real install listens on the network unless a proxy
// is declared in front of it (then only the proxy, on this machine, should reach the app).
const host = readListenHost(process.env.BORELINE_HOST, mode === 'serve' && hops === 0 ? '0.0.0.0' : '127.0.0.1');

if (mode === 'demo' && !isLoopbackHost(host)) {
  console.warn(`
[boreline] WARNING: the demo is listening on ${host}, reachable from the network.
[boreline] Its accounts (including the site administrator) share the public password in README.md,
[boreline] and its outbox shows every sign-in link. Anyone who can reach this port can sign in.
`);
}
if (hops > 0 && !isLoopbackHost(host)) {
  console.warn(
    `[boreline] TRUSTED_PROXY_HOPS=${hops} but listening on ${host}: clients that reach the app directly can forge their address. Listen on 127.0.0.1 behind the proxy.`,
  );
}

const app = next({ dev: false, hostname: host, port });
const handle = app.getRequestHandler();
await app.prepare();

const server = createServer((req, res) => {
  forwardHeaders(req.headers, req.socket.remoteAddress, hops);
  handle(req, res).catch((err) => {
    console.error('[boreline] unhandled request error', err);
    if (!res.headersSent) res.statusCode = 500;
    res.end();
  });
});
server.on('error', (err) => {
  console.error(`[boreline] could not listen on ${host}:${port}: ${err.message}`);
  process.exit(1);
});
server.listen(port, host, () =>
  say(
    `listening on http://${host.includes(':') ? `[${host}]` : host}:${port} (${mode}; ${hops ? `${hops} trusted proxy hop(s), compression left to the proxy` : 'no proxy declared: client address from the socket, compression on'})`,
  ),
);

for (const sig of ['SIGTERM', 'SIGINT']) process.on(sig, () => process.exit(0));
