// Boreline's HTTP server: Next.js's request handler behind a plain node:http server (Next.js
// "Custom Server": next({ dev: false }) and getRequestHandler()), so that the client's address is
// the socket's and not whatever the client wrote in X-Forwarded-For. `next build` comes first.
//
// Environment: PORT (3000), BORELINE_HOST (listen address), BORELINE_MODE (demo | serve),
// TRUSTED_PROXY_HOPS (0 = no proxy: compression on, forwarded headers from clients dropped).
import { createServer } from 'node:http';
import next from 'next';
import { createStaticCompression } from './static-compression.mjs';
import { forwardHeaders, isLoopbackHost, parseProxyHops, readListenHost } from './forwarding.mjs';
import { logger, logPath, metrics, requestIdFor, routeLabel } from './observability.mjs';

// Every line this process writes is one JSON object (pino): operators filter and ship them as they are.
const log = logger();
const say = (msg, fields = {}) => log.info(fields, msg);

let hops;
try {
  hops = parseProxyHops(process.env.TRUSTED_PROXY_HOPS);
} catch (err) {
  log.fatal(err.message);
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
  log.warn(
    { host },
    `WARNING: the demo is listening on ${host}, reachable from the network. Its accounts (including the site administrator) share the public password in README.md, and its outbox shows every sign-in link. Anyone who can reach this port can sign in.`,
  );
}
if (hops > 0 && !isLoopbackHost(host)) {
  log.warn(
    { host, hops },
    `TRUSTED_PROXY_HOPS=${hops} but listening on ${host}: clients that reach the app directly can forge their address. Listen on 127.0.0.1 behind the proxy.`,
  );
}

const app = next({ dev: false, hostname: host, port });
const handle = app.getRequestHandler();
await app.prepare();
// No proxy declared: nobody else compresses, so the build's static files also go out as Brotli, with the
// headers next.config.mjs gives them (imported here, after TRUSTED_PROXY_HOPS is normalised above).
const config = await import('../next.config.mjs');
const staticBrotli =
  hops === 0
    ? createStaticCompression({
        distDir: config.default.distDir,
        headers: config.staticFileHeaders.map(({ key, value }) => [key, value]),
      })
    : null;

// Requests being answered right now, read by lib/server/http/in-flight.ts (same process): the mail outbox's
// worker holds back while the server is busy.
globalThis.__borelineRequestsInFlight = 0;

const server = createServer((req, res) => {
  globalThis.__borelineRequestsInFlight++;
  res.once('close', () => globalThis.__borelineRequestsInFlight--);
  forwardHeaders(req.headers, req.socket.remoteAddress, hops);
  // One id per request, on the request (route handlers put it in error answers and their log lines),
  // on the answer, and on this access line. A client's own X-Request-Id is only kept from a declared proxy.
  const requestId = requestIdFor(req.headers['x-request-id'], hops > 0);
  req.headers['x-request-id'] = requestId;
  res.setHeader('X-Request-Id', requestId);
  const started = process.hrtime.bigint();
  res.on('finish', () => {
    const seconds = Number(process.hrtime.bigint() - started) / 1e9;
    const route = routeLabel((req.url ?? '/').split('?')[0]);
    metrics().httpDuration.observe(
      { method: req.method, route, status: `${Math.floor(res.statusCode / 100)}xx` },
      seconds,
    );
    if (route !== '/_next/*')
      log.info(
        {
          requestId,
          method: req.method,
          path: logPath(req.url),
          status: res.statusCode,
          ms: Math.round(seconds * 10000) / 10,
        },
        'request',
      );
  });
  if (staticBrotli?.handle(req, res)) return;
  handle(req, res).catch((err) => {
    log.error({ requestId, err }, 'unhandled request error');
    if (!res.headersSent) res.statusCode = 500;
    res.end();
  });
});
server.on('error', (err) => {
  log.fatal({ host, port }, `could not listen on ${host}:${port}: ${err.message}`);
  process.exit(1);
});

// METRICS_PORT: the metrics for a scraper on this machine, on loopback only, without a session.
const metricsPort = Number(process.env.METRICS_PORT || 0);
if (metricsPort) {
  createServer(async (req, res) => {
    if (req.method !== 'GET' || (req.url ?? '').split('?')[0] !== '/metrics') {
      res.writeHead(404).end();
      return;
    }
    const { registry } = metrics();
    res.writeHead(200, { 'Content-Type': registry.contentType }).end(await registry.metrics());
  })
    .on('error', (err) => {
      log.fatal(`could not listen for metrics on 127.0.0.1:${metricsPort}: ${err.message}`);
      process.exit(1);
    })
    .listen(metricsPort, '127.0.0.1', () => say(`metrics on http://127.0.0.1:${metricsPort}/metrics`));
}
server.listen(port, host, () => {
  if (staticBrotli)
    void staticBrotli.warm().then(() => say(`static files compressed with Brotli: ${staticBrotli.size}`));
  say(
    `listening on http://${host.includes(':') ? `[${host}]` : host}:${port} (${mode}; ${hops ? `${hops} trusted proxy hop(s), compression left to the proxy` : 'no proxy declared: client address from the socket, compression on'})`,
  );
});

for (const sig of ['SIGTERM', 'SIGINT']) process.on(sig, () => process.exit(0));
