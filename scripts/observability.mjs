// Structured logs and metrics, shared by the HTTP server (scripts/server.mjs) and the app's own code
// (lib/server/observability.ts). Plain JavaScript so node runs it without a build step. Both sides
// reach one logger and one metrics registry through globalThis, so a bundled copy of this module
// inside the Next.js build and the copy server.mjs loads count into the same figures.
//
// Logs: one JSON object per line on stdout (pino), each with the request's id when there is one.
// Metrics: Prometheus text format (prom-client), read at /api/metrics (site administrator) or on
// METRICS_PORT (loopback only).
import { randomUUID } from 'node:crypto';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import pino from 'pino';
import client from 'prom-client';

const KEY = Symbol.for('boreline.observability');

function create() {
  const logger = pino({
    level: process.env.LOG_LEVEL || 'info',
    base: { service: 'boreline', pid: process.pid },
    timestamp: pino.stdTimeFunctions.isoTime,
    // Never write a credential into a log line, whatever a caller passes.
    redact: {
      paths: [
        'req.headers.cookie',
        'req.headers.authorization',
        'headers.cookie',
        'headers.authorization',
        '*.password',
      ],
      censor: '[redacted]',
    },
  });
  const registry = new client.Registry();
  client.collectDefaultMetrics({ register: registry, prefix: 'boreline_process_' });
  const metrics = {
    registry,
    httpDuration: new client.Histogram({
      name: 'boreline_http_request_duration_seconds',
      help: 'Time to answer an HTTP request, by method, route (ids replaced by :id) and status class',
      labelNames: ['method', 'route', 'status'],
      buckets: [0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10],
      registers: [registry],
    }),
    inspectionRecords: new client.Counter({
      name: 'boreline_inspection_records_total',
      help: 'Inspection records sent to the server, by outcome (created, replayed: the same idempotency key again, refused, failed)',
      labelNames: ['outcome'],
      registers: [registry],
    }),
    // The record chain's self-check (lib/server/chain): alert on boreline_chain_broken > 0.
    chainBroken: new client.Gauge({
      name: 'boreline_chain_broken',
      help: 'Record chains (one per meeting, and the site chain) found broken by the last self-check on this server',
      registers: [registry],
    }),
    chainLastCheck: new client.Gauge({
      name: 'boreline_chain_last_check_timestamp_seconds',
      help: 'When this server last re-verified every record chain (Unix time)',
      registers: [registry],
    }),
    dbPool: new client.Gauge({
      name: 'boreline_db_pool_connections',
      help: 'Database pool connections by state (in use, idle, requests waiting for one)',
      labelNames: ['state'],
      registers: [registry],
      collect() {
        // The app's pool (lib/server/db), once it has been made.
        const pool = globalThis.__borelineDb?.sequelize?.connectionManager?.pool;
        const write = pool?.write ?? pool;
        if (!write || typeof write.size !== 'number') return;
        this.set({ state: 'in_use' }, write.using ?? 0);
        this.set({ state: 'idle' }, write.available ?? 0);
        this.set({ state: 'waiting' }, write.waiting ?? 0);
      },
    }),
  };
  return { logger, metrics };
}

function shared() {
  globalThis[KEY] ??= create();
  return globalThis[KEY];
}

export const logger = () => shared().logger;
export const metrics = () => shared().metrics;

const UUID = /[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/gi;

// Route labels must stay few (a label per distinct value is a series kept for ever; Prometheus,
// "Instrumentation: do not use labels with unbounded values"). A path is labelled by the route of the
// build that serves it (the build's routes-manifest.json: its page patterns, params as :id), a file of
// public/ by its name, and anything else as "unmatched": a 404 or a typed serial never becomes a label.
let routes;

function toLabel(page) {
  return page.replace(/\[\[?\.\.\.[^\]]+\]\]?/g, '*').replace(/\[[^\]]+\]/g, ':id');
}

function listPublic(dir, prefix = '') {
  const out = [];
  try {
    for (const e of readdirSync(dir, { withFileTypes: true })) {
      if (e.isDirectory()) out.push(...listPublic(join(dir, e.name), `${prefix}/${e.name}`));
      else out.push(`${prefix}/${e.name}`);
    }
  } catch {
    // No public folder: nothing to add.
  }
  return out;
}

function loadRoutes() {
  try {
    const dist = process.env.NEXT_DIST_DIR || '.next';
    const manifest = JSON.parse(readFileSync(join(dist, 'routes-manifest.json'), 'utf8'));
    return {
      statics: new Set([...manifest.staticRoutes.map((r) => r.page), ...listPublic('public')]),
      dynamics: manifest.dynamicRoutes.map((r) => ({ re: new RegExp(r.regex), label: toLabel(r.page) })),
    };
  } catch {
    return null;
  }
}

const MAX_FALLBACK_LABELS = 200;
const fallbackLabels = new Set();

// Pages and routes whose address carries a secret: an invitation's or an address proof's bearer token, a boat
// tag's token. The access log keeps the route, never the token (anyone who reads the logs could otherwise use it).
const TOKEN_PATHS = [
  /^(\/invite\/)[^/]+/,
  /^(\/confirm-address\/)[^/]+/,
  /^(\/t\/)[^/]+/,
  /^(\/api\/events\/[^/]+\/tags\/)[^/]+/,
];

/** A request's path as the access log writes it: the query left out, tokens in the path as :token. */
export function logPath(url) {
  const path = (url ?? '/').split('?')[0];
  for (const re of TOKEN_PATHS) if (re.test(path)) return path.replace(re, '$1:token');
  return path;
}

/** A path as a metric label: the route pattern that serves it (ids as :id), or "unmatched". */
export function routeLabel(path) {
  if (path.startsWith('/_next/')) return '/_next/*';
  const clean = path.split('?')[0];
  if (routes === undefined) routes = loadRoutes();
  if (routes) {
    const trimmed = clean.length > 1 && clean.endsWith('/') ? clean.slice(0, -1) : clean;
    if (routes.statics.has(trimmed)) return trimmed;
    for (const d of routes.dynamics) if (d.re.test(trimmed)) return d.label;
    return 'unmatched';
  }
  // No build manifest (a unit test, say): ids and numbers as :id, and never more than a few hundred labels.
  const label = clean
    .replace(UUID, ':id')
    .split('/')
    .map((seg) => (/^\d+$/.test(seg) || /^[A-Za-z0-9_-]{20,}$/.test(seg) ? ':id' : seg))
    .join('/')
    .slice(0, 120);
  if (fallbackLabels.has(label)) return label;
  if (fallbackLabels.size >= MAX_FALLBACK_LABELS) return 'other';
  fallbackLabels.add(label);
  return label;
}

/** A request id: the trusted proxy's when one is declared and sent a sane one, else a new one. */
export function requestIdFor(incoming, trustProxy) {
  if (trustProxy && typeof incoming === 'string' && /^[A-Za-z0-9._-]{8,80}$/.test(incoming)) return incoming;
  return randomUUID();
}
