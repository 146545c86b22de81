// Brotli for the build's static files (/_next/static/: content-hashed JS and CSS) when no proxy is
// declared. Next.js itself only gzips; Brotli at quality 11 makes the same files about a fifth smaller
// again, which a phone on one bar of signal feels. Each file is compressed once, in the background (never
// while a request waits: until its copy is ready a file goes to Next.js and leaves gzipped), and kept
// in memory: the files never change while the server runs (a new build means a new server).
//
// Only files listed from the build folder when the server starts are answered here (an exact match on
// the path, so nothing outside that folder can be named); Range requests, clients that do not accept br
// and every other path go to Next.js as before. These files hold no secret and echo no request input,
// so compressing them gives a BREACH-style attacker nothing to measure.
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { promisify } from 'node:util';
import zlib from 'node:zlib';

const brotli = promisify(zlib.brotliCompress);
const TYPES = {
  '.js': 'application/javascript; charset=UTF-8',
  '.css': 'text/css; charset=UTF-8',
  '.json': 'application/json; charset=UTF-8',
  '.svg': 'image/svg+xml',
};
// Below this size the headers outweigh any saving (the same floor Next.js's gzip uses, 1 KiB).
const MIN_BYTES = 1024;

/** Whether an Accept-Encoding header accepts br (RFC 9110, section 12.5.3: a q of 0 refuses it). */
export function acceptsBrotli(header) {
  if (!header) return false;
  return String(header)
    .split(',')
    .some((part) => {
      const [coding, ...params] = part.trim().split(';');
      if (coding.trim().toLowerCase() !== 'br') return false;
      const q = params.map((p) => p.trim()).find((p) => p.startsWith('q='));
      return q === undefined || Number(q.slice(2)) > 0;
    });
}

function listFiles(dir, prefix, out) {
  let entries;
  try {
    entries = fs.readdirSync(dir, { withFileTypes: true });
  } catch {
    return out;
  }
  for (const e of entries) {
    const abs = path.join(dir, e.name);
    const url = `${prefix}/${e.name}`;
    if (e.isDirectory()) listFiles(abs, url, out);
    else if (e.isFile() && TYPES[path.extname(e.name)] && fs.statSync(abs).size >= MIN_BYTES) out.set(url, abs);
  }
  return out;
}

/**
 * headers: [key, value] pairs every static answer carries (the security headers and CSP next.config.mjs
 * gives /_next/static/). Returns { handle(req, res): boolean (true when answered), warm(): Promise, size }.
 */
export function createStaticCompression({ distDir, headers }) {
  const files = listFiles(path.join(distDir, 'static'), '/_next/static', new Map());
  /** url -> { body, etag } once compressed */
  const ready = new Map();

  async function compress(url) {
    if (ready.has(url)) return;
    const raw = await fs.promises.readFile(files.get(url));
    const body = await brotli(raw, {
      params: {
        [zlib.constants.BROTLI_PARAM_QUALITY]: zlib.constants.BROTLI_MAX_QUALITY,
        [zlib.constants.BROTLI_PARAM_SIZE_HINT]: raw.length,
      },
    });
    const etag = `"br-${createHash('sha256').update(raw).digest('base64url').slice(0, 27)}"`;
    ready.set(url, { body, etag });
  }

  /** Compresses every file, one at a time (one core at most, and only once per server start). */
  async function warm() {
    for (const url of files.keys()) {
      try {
        await compress(url);
      } catch {
        // unreadable now: Next.js keeps serving it gzipped
      }
    }
  }

  function handle(req, res) {
    if (req.method !== 'GET' && req.method !== 'HEAD') return false;
    const url = (req.url ?? '').split('?')[0];
    const hit = ready.get(url);
    if (!hit || req.headers.range || !acceptsBrotli(req.headers['accept-encoding'])) return false;
    for (const [key, value] of headers) res.setHeader(key, value);
    res.setHeader('Content-Type', TYPES[path.extname(url)]);
    // Content-hashed names: a changed file gets a new name, so a copy may be kept for a year untouched.
    res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
    res.setHeader('Vary', 'Accept-Encoding');
    res.setHeader('ETag', hit.etag);
    const match = req.headers['if-none-match'];
    if (match && match.split(',').some((t) => t.trim().replace(/^W\//, '') === hit.etag)) {
      res.statusCode = 304;
      res.end();
      return true;
    }
    res.setHeader('Content-Encoding', 'br');
    res.setHeader('Content-Length', hit.body.length);
    res.statusCode = 200;
    res.end(req.method === 'HEAD' ? undefined : hit.body);
    return true;
  }

  return { handle, warm, size: files.size };
}
