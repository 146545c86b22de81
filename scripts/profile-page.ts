// What a page's long tasks are made of, in Chromium: bash scripts/test.sh --run scripts/profile-page.ts
// Loads one page cold (a new browser, a phone-sized window) with a trace of the main thread and V8's sampler on,
// then prints each task of at least PROFILE_MIN_TASK_MS (default 25 ms, unthrottled: Lighthouse's phone runs four
// times slower, so 12.5 ms here is already one of its long tasks): its layout, style and script events, and the
// source files its JavaScript samples fall in (a file counts once per sample however deep it appears).
// Source files need a build with browser source maps: BORELINE_BROWSER_SOURCEMAPS=1 (next.config.mjs) at build time,
// for instance `BORELINE_BROWSER_SOURCEMAPS=1 npm test -- tests/integration/health.test.ts` and then this script
// with BENCH_REUSE_BUILD=1. Without maps the chunks' own names are printed.
// PROFILE_PATH chooses the page (default: a boat card on the dock of a scratch meeting, as bench:pages opens it);
// PROFILE_CPU=4 slows Chromium's CPU down as Lighthouse's phone does. PROFILE_AS=scrutineer|entrant|organiser signs in as that demo person (default: the scrutineer for the default
// page, nobody otherwise). PROFILE_TRACE=FILE keeps the trace for Chromium's Performance panel.
import fs from 'node:fs';
import path from 'node:path';
import { chromium } from 'playwright-core';
import { SourceMapConsumer } from 'source-map-js';
import { HttpSession } from '../tests/support/http-session';
import { DEMO, DEMO_PASSWORD } from '../tests/support/env';
import { meetingWithRecordedBoat } from '../tests/support/inspection-meeting';

const BASE = process.env.BASE_URL ?? 'http://localhost:3000';
const DIST = process.env.NEXT_DIST_DIR ?? '.next-test';
const MIN_TASK_US = Number(process.env.PROFILE_MIN_TASK_MS ?? 25) * 1000;
const SHOWN_EVENTS = new Set(['ParseHTML', 'UpdateLayoutTree', 'Layout', 'Paint', 'EvaluateScript', 'FunctionCall']);
const SHOWN_EVENTS_MIN_US = 3000;

type TraceEvent = {
  name: string;
  ph: string;
  pid: number;
  tid: number;
  ts: number;
  dur?: number;
  id?: string;
  args?: { name?: string; data?: Record<string, unknown> };
};
type CallFrame = { url: string; lineNumber: number; columnNumber: number; functionName: string };
type ProfileNode = { id: number; parent?: number; callFrame: CallFrame };

async function pageToProfile(): Promise<{ path: string; cookie?: string }> {
  const as = process.env.PROFILE_AS;
  let cookie: string | undefined;
  const signIn = async (email: string) => {
    const s = new HttpSession();
    await s.signInWithPassword(email, DEMO_PASSWORD);
    return s.cookieHeader();
  };
  if (as) {
    const email = (DEMO as Record<string, string>)[as];
    if (!email) throw new Error(`PROFILE_AS=${as}: no such demo person (${Object.keys(DEMO).join(', ')})`);
    cookie = await signIn(email);
  }
  if (process.env.PROFILE_PATH) return { path: process.env.PROFILE_PATH, cookie };
  // As bench:pages opens it: the boat has a conforming record already, so its card lists it.
  const { meeting, entry } = await meetingWithRecordedBoat(`Page profile ${new Date().toISOString()}`, 'PP');
  const scrutineerCookie = cookie ?? (await signIn(DEMO.scrutineer));
  return {
    path: `/inspect/${meeting.eventId}?race=${entry.raceNumber}`,
    cookie: scrutineerCookie,
  };
}

/** Names a sampled frame by its original source file when the build has a source map for its chunk. */
function frameNamer() {
  const maps = new Map<string, SourceMapConsumer | null>();
  return (frame: CallFrame) => {
    const url = frame.url;
    if (!url) return frame.functionName.startsWith('(') ? frame.functionName : `(${frame.functionName || 'native'})`;
    if (!url.includes('/_next/static/')) return url.replace(/^.*\//, '') || url;
    if (!maps.has(url)) {
      let consumer: SourceMapConsumer | null = null;
      const js = path.join(DIST, 'static', url.split('/_next/static/')[1].split('?')[0]);
      const mapName = fs.existsSync(js)
        ? fs
            .readFileSync(js, 'utf8')
            .slice(-300)
            .match(/sourceMappingURL=(\S+)/)?.[1]
        : null;
      const mapFile = mapName ? path.join(path.dirname(js), mapName) : null;
      if (mapFile && fs.existsSync(mapFile))
        consumer = new SourceMapConsumer(JSON.parse(fs.readFileSync(mapFile, 'utf8')));
      maps.set(url, consumer);
    }
    const consumer = maps.get(url);
    if (!consumer) return url.replace(/^.*\//, '');
    const p = consumer.originalPositionFor({ line: frame.lineNumber + 1, column: frame.columnNumber });
    return (p.source ?? '?').replace(/^.*node_modules\//, '').replace(/^.*\[project\]\//, '');
  };
}

async function main() {
  const page = await pageToProfile();
  const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium' });
  const context = await browser.newContext({
    viewport: { width: 412, height: 823 },
    extraHTTPHeaders: page.cookie ? { Cookie: page.cookie } : {},
  });
  const tab = await context.newPage();
  // PROFILE_CPU=4: Chromium's own CPU slow-down, as Lighthouse's mobile profile assumes (its runs are simulated).
  if (process.env.PROFILE_CPU) {
    const cdp = await context.newCDPSession(tab);
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: Number(process.env.PROFILE_CPU) });
  }
  await browser.startTracing(tab, {
    categories: [
      '-*',
      'devtools.timeline',
      'disabled-by-default-devtools.timeline',
      'disabled-by-default-v8.cpu_profiler',
    ],
  });
  await tab.goto(`${BASE}${page.path}`, { waitUntil: 'networkidle' });
  await tab.waitForTimeout(1500);
  const raw = await browser.stopTracing();
  await browser.close();
  if (process.env.PROFILE_TRACE) fs.writeFileSync(process.env.PROFILE_TRACE, raw);
  const events = (JSON.parse(raw.toString()) as { traceEvents: TraceEvent[] }).traceEvents;

  // The page's main thread: the renderer main thread with the most task time.
  const key = (e: TraceEvent) => `${e.pid}:${e.tid}`;
  const busy = new Map<string, number>();
  const mains = new Set(events.filter((e) => e.name === 'thread_name' && e.args?.name === 'CrRendererMain').map(key));
  for (const e of events)
    if (e.name === 'RunTask' && mains.has(key(e))) busy.set(key(e), (busy.get(key(e)) ?? 0) + (e.dur ?? 0));
  const main = [...busy].sort((a, b) => b[1] - a[1])[0]?.[0];
  if (!main) throw new Error('no renderer main thread in the trace');
  const onMain = events.filter((e) => key(e) === main);

  // V8's samples for that thread, each with its time.
  const nodes = new Map<number, ProfileNode>();
  const samples: [number, number][] = [];
  const start = onMain.find((e) => e.name === 'Profile');
  let t = (start?.args?.data?.startTime as number | undefined) ?? 0;
  for (const e of events) {
    if (e.name !== 'ProfileChunk' || e.pid !== Number(main.split(':')[0]) || (start && e.id !== start.id)) continue;
    const data = e.args?.data as { cpuProfile?: { nodes?: ProfileNode[]; samples?: number[] }; timeDeltas?: number[] };
    for (const n of data.cpuProfile?.nodes ?? []) nodes.set(n.id, n);
    (data.cpuProfile?.samples ?? []).forEach((id, i) => {
      t += data.timeDeltas?.[i] ?? 0;
      samples.push([t, id]);
    });
  }
  const name = frameNamer();
  const t0 = onMain.reduce((min, e) => (e.ts > 0 && e.ts < min ? e.ts : min), Infinity);
  const tasks = onMain.filter((e) => e.name === 'RunTask' && (e.dur ?? 0) >= MIN_TASK_US).sort((a, b) => a.ts - b.ts);
  console.log(`${BASE}${page.path}: ${tasks.length} tasks of ${MIN_TASK_US / 1000} ms or more (unthrottled)`);
  for (const task of tasks) {
    const end = task.ts + (task.dur ?? 0);
    const inside = onMain
      .filter((e) => e !== task && e.ph === 'X' && e.ts >= task.ts && e.ts + (e.dur ?? 0) <= end)
      .filter((e) => SHOWN_EVENTS.has(e.name) && (e.dur ?? 0) >= SHOWN_EVENTS_MIN_US)
      .map((e) => `${e.name} ${((e.dur ?? 0) / 1000).toFixed(0)} ms`);
    const files = new Map<string, number>();
    const taskSamples = samples.filter(([ts]) => ts >= task.ts && ts <= end);
    for (const [, id] of taskSamples) {
      const seen = new Set<string>();
      for (let n = nodes.get(id); n; n = n.parent === undefined ? undefined : nodes.get(n.parent)) {
        const f = name(n.callFrame);
        if (['(root)', '(program)', '(idle)'].includes(n.callFrame.functionName) && !n.callFrame.url) continue;
        if (!seen.has(f)) files.set(f, (files.get(f) ?? 0) + 1);
        seen.add(f);
      }
    }
    console.log(
      `\n@${((task.ts - t0) / 1000).toFixed(0)} ms: ${((task.dur ?? 0) / 1000).toFixed(0)} ms${inside.length ? ` (${inside.slice(0, 6).join(', ')})` : ''}`,
    );
    for (const [f, n] of [...files].sort((a, b) => b[1] - a[1]).slice(0, 10))
      console.log(`  ${String(Math.round((100 * n) / Math.max(1, taskSamples.length))).padStart(3)}% ${f}`);
  }
}

main().then(
  () => process.exit(0),
  (err) => {
    console.error(err);
    process.exit(1);
  },
);
