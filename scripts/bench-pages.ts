// Page benchmark: npm run bench:pages (starts the test stack: the production build through
// scripts/server.mjs, no proxy declared, and sets BASE_URL).
// 1. Sets up its own scratch meeting through the API (tests/support/inspection-meeting.ts): a class
//    with published rules, the demo scrutineer on its staff, a conforming boat recorded and the
//    class's parity report published, so every page has something real to draw.
// 2. Runs Lighthouse 12 (its CLI, attached to one Chromium started by chrome-launcher; mobile profile, simulated slow 4G and 4x CPU slow-down, the
//    defaults) in Debian's Chromium against each page, RUNS times (default 3), signed in where the
//    page needs it (the session cookie sent as an extra header), and prints the median of each figure
//    beside its target with PASS or MISS. Asserts nothing: the figures are printed as measured.
// Targets (issue #18): performance >= 90 and accessibility 100 on every page, LCP < 2.5 s on the
// mobile profile, dock screen first-load JavaScript <= 170 KB compressed. Lighthouse's own thresholds
// for "good": TBT < 200 ms, CLS < 0.1 (web.dev/articles/vitals, Core Web Vitals) [memory].
// BENCH_PAGES=landing,dock narrows the pages; BENCH_RUNS=1 for a quick look; BENCH_SAVE_TRACE=1 keeps each
// run's Chromium trace (test-results/lighthouse/*-0.trace.json) for a look at its long tasks.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { spawnSync } from 'node:child_process';
import type { Result as LighthouseResult } from 'lighthouse';
import * as chromeLauncher from 'chrome-launcher';
import { HttpSession } from '../tests/support/http-session';
import { DEMO, DEMO_PASSWORD } from '../tests/support/env';
import { meetingWithRecordedBoat } from '../tests/support/inspection-meeting';

const BASE = process.env.BASE_URL ?? 'http://localhost:3000';
const RUNS = Number(process.env.BENCH_RUNS ?? 3);
const ONLY = process.env.BENCH_PAGES?.split(',').filter(Boolean);
const OUT = path.join(process.env.TEST_ARTIFACTS ?? 'test-results', 'lighthouse');

type Page = { name: string; path: string; cookie?: string; as?: string };
type Figures = {
  performance: number;
  accessibility: number;
  lcpMs: number;
  tbtMs: number;
  cls: number;
  transferredKB: number;
  scriptKB: number;
  requests: number;
};

async function signedIn(email: string) {
  const s = new HttpSession();
  await s.signInWithPassword(email, DEMO_PASSWORD);
  return s.cookieHeader();
}

async function setUp(): Promise<Page[]> {
  const { meeting, classId, entry } = await meetingWithRecordedBoat(`Page bench ${new Date().toISOString()}`, 'PB');
  const pub = await meeting.organiser.json(`/api/events/${meeting.eventId}/classes/${classId}/report/publish`, {
    note: 'page benchmark',
  });
  if (pub.res.status !== 201) throw new Error(`publishing failed: ${JSON.stringify(pub.body)}`);
  const scrutineerCookie = await signedIn(DEMO.scrutineer);
  const entrantCookie = await signedIn(DEMO.entrant);
  return [
    { name: 'landing', path: '/' },
    { name: 'sign-in', path: '/sign-in' },
    { name: 'calculator', path: '/calculator' },
    { name: 'dock', path: `/inspect/${meeting.eventId}`, cookie: scrutineerCookie, as: DEMO.scrutineer },
    {
      name: 'boat card',
      path: `/inspect/${meeting.eventId}?race=${entry.raceNumber}`,
      cookie: scrutineerCookie,
      as: DEMO.scrutineer,
    },
    { name: 'my entries', path: '/entries', cookie: entrantCookie, as: DEMO.entrant },
    { name: 'report', path: `/reports/${pub.body.data.publicId}` },
  ];
}

async function measure(port: number, page: Page, run: number): Promise<Figures> {
  // Lighthouse's CLI in a plain node process: under tsx, the functions Lighthouse sends into the page
  // carry tsx's __name helper and fail there ("__name is not defined").
  fs.mkdirSync(OUT, { recursive: true });
  const file = path.join(OUT, `${page.name.replace(/\W+/g, '-')}-${run}.json`);
  const headersFile = path.join(OUT, 'extra-headers.json');
  if (page.cookie) fs.writeFileSync(headersFile, JSON.stringify({ Cookie: page.cookie }), { mode: 0o600 });
  const args = [
    'node_modules/lighthouse/cli/index.js',
    `${BASE}${page.path}`,
    `--port=${port}`,
    '--output=json',
    `--output-path=${file}`,
    '--only-categories=performance,accessibility',
    '--quiet',
    // BENCH_SAVE_TRACE=1: Lighthouse also writes the run's trace and DevTools log beside the report.
    ...(process.env.BENCH_SAVE_TRACE === '1' ? ['--save-assets'] : []),
    ...(page.cookie ? [`--extra-headers=${headersFile}`] : []),
  ];
  const done = spawnSync(process.execPath, args, { stdio: ['ignore', 'ignore', 'inherit'], timeout: 180_000 });
  if (page.cookie) fs.rmSync(headersFile);
  if (done.status !== 0) throw new Error(`lighthouse exited ${done.status} on ${page.path}`);
  const result = { lhr: JSON.parse(fs.readFileSync(file, 'utf8')) as LighthouseResult };
  const { lhr } = result;
  if (lhr.runtimeError) throw new Error(`${page.path}: ${lhr.runtimeError.code} ${lhr.runtimeError.message}`);
  if (lhr.finalDisplayedUrl && new URL(lhr.finalDisplayedUrl).pathname !== page.path.split('?')[0])
    throw new Error(`${page.path} ended on ${lhr.finalDisplayedUrl} (not signed in?)`);
  const num = (id: string) => lhr.audits[id]?.numericValue ?? NaN;
  const summary =
    (
      lhr.audits['resource-summary']?.details as {
        items?: { resourceType: string; transferSize: number; requestCount: number }[];
      }
    )?.items ?? [];
  const of = (type: string) => summary.find((i) => i.resourceType === type);
  return {
    performance: Math.round((lhr.categories.performance.score ?? 0) * 100),
    accessibility: Math.round((lhr.categories.accessibility.score ?? 0) * 100),
    lcpMs: num('largest-contentful-paint'),
    tbtMs: num('total-blocking-time'),
    cls: num('cumulative-layout-shift'),
    transferredKB: num('total-byte-weight') / 1000,
    scriptKB: (of('script')?.transferSize ?? NaN) / 1000,
    requests: of('total')?.requestCount ?? NaN,
  };
}

/** Lighthouse sometimes loses the trace on a loaded machine (NO_NAVSTART): that run is made again, twice at most. */
async function measureWithRetry(port: number, page: Page, run: number): Promise<Figures> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await measure(port, page, run);
    } catch (err) {
      if (attempt === 3) throw err;
      console.error(`${page.name} run ${run}: ${(err as Error).message}; trying again`);
      // A run cut short can leave its session signed out (seen after NO_NAVSTART): the next attempt signs in afresh.
      if (page.as) page.cookie = await signedIn(page.as);
    }
  }
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};

/**
 * With no proxy declared the server compresses its static files with Brotli in the background after it
 * starts (scripts/static-compression.mjs); measuring before that ends would measure gzip. Waits for it.
 */
async function waitForBrotli() {
  const html = await (await fetch(`${BASE}/`)).text();
  const scripts = [...new Set(html.match(/\/_next\/static\/chunks\/[\w.-]+\.js/g) ?? [])];
  // Files under 1 KiB are never compressed: any one of the page's scripts answering br will do.
  for (let i = 0; i < 120 && scripts.length; i++) {
    for (const script of scripts) {
      const res = await fetch(`${BASE}${script}`, { method: 'HEAD', headers: { 'accept-encoding': 'br' } });
      if (res.headers.get('content-encoding') === 'br') return;
    }
    await new Promise((r) => setTimeout(r, 500));
  }
  console.error('static files are not served with Brotli (a proxy declared?): measuring what is served');
}

async function main() {
  const loadAtStart = os.loadavg()[0];
  let pages = await setUp();
  await waitForBrotli();
  if (ONLY) pages = pages.filter((p) => ONLY.includes(p.name.replace(/ /g, '-')) || ONLY.includes(p.name));
  const rows: { page: Page; f: Figures }[] = [];
  // One warm-up load per page: the server's first render of a route compiles and caches it; a phone
  // that meets a running server never sees that.
  for (const page of pages) await fetch(`${BASE}${page.path}`, { headers: page.cookie ? { cookie: page.cookie } : {} });
  for (const page of pages) {
    const runs: Figures[] = [];
    for (let i = 1; i <= RUNS; i++) {
      // A new browser profile for every run: Lighthouse's reset between runs keeps cookies, and a cookie a
      // signed-in page set in one run (the session, renewed) stood beside the given one in the next.
      const chrome = await chromeLauncher.launch({
        chromePath: process.env.CHROME_PATH ?? '/usr/bin/chromium',
        chromeFlags: ['--headless=new', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-sync'],
      });
      try {
        runs.push(await measureWithRetry(chrome.port, page, i));
      } finally {
        chrome.kill();
      }
      console.error(`${page.name} run ${i}: ${JSON.stringify(runs.at(-1))}`);
    }
    const keys = Object.keys(runs[0]) as (keyof Figures)[];
    rows.push({ page, f: Object.fromEntries(keys.map((k) => [k, median(runs.map((r) => r[k]))])) as Figures });
  }

  const mark = (ok: boolean) => (ok ? 'PASS' : 'MISS');
  console.log(
    `\nLighthouse ${lighthouseVersion()} in Debian's Chromium, mobile profile (simulated slow 4G, 4x CPU), median of ${RUNS} run(s) per page, ${BASE}`,
  );
  console.log(
    '| page | performance (>= 90) | accessibility (100) | LCP (< 2.5 s) | TBT (< 200 ms) | CLS (< 0.1) | transferred | JS transferred | requests |',
  );
  console.log('|---|---|---|---|---|---|---|---|---|');
  for (const { page, f } of rows) {
    const js =
      page.name === 'dock'
        ? `${f.scriptKB.toFixed(1)} KB (<= 170 KB) ${mark(f.scriptKB <= 170)}`
        : `${f.scriptKB.toFixed(0)} KB`;
    console.log(
      `| ${page.name} | ${f.performance} ${mark(f.performance >= 90)} | ${f.accessibility} ${mark(f.accessibility >= 100)} | ${(f.lcpMs / 1000).toFixed(1)} s ${mark(f.lcpMs < 2500)} | ${Math.round(f.tbtMs)} ms ${mark(f.tbtMs < 200)} | ${f.cls.toFixed(3)} ${mark(f.cls < 0.1)} | ${f.transferredKB.toFixed(0)} KB | ${js} | ${f.requests} |`,
    );
  }
  // Lighthouse simulates the phone's network and CPU from a trace of this machine: on a busy machine TBT
  // and the performance score swing from run to run; bytes and requests do not.
  console.log(
    `\nLoad average (1 min): ${loadAtStart.toFixed(1)} at the start, ${os.loadavg()[0].toFixed(1)} at the end, on ${os.cpus().length} cores`,
  );
  console.log(`Reports (JSON, one per run): ${OUT}`);
}

function lighthouseVersion() {
  return (JSON.parse(fs.readFileSync('node_modules/lighthouse/package.json', 'utf8')) as { version: string }).version;
}

main().then(
  () => process.exit(0),
  (err) => {
    console.error(err);
    process.exit(1);
  },
);
