// Inspection recording benchmark: npm run bench:inspections (starts the test stack and sets BASE_URL).
// 1. Sets up its own scratch meeting through the API (scripts/bench-support.ts; records are
//    append-only, so the demo meeting is left alone): published rules, the demo scrutineer on the
//    staff, one entered boat per client.
// 2. Baseline: GET /api/health (one database round trip), CLIENTS concurrent loops, REQUESTS in all.
// 3. POST /api/events/:id/inspections, a new record each time (each loop its own boat), same counts:
//    validation, rule lookup, decision, the insert, the entry update and the entrant's e-mail.
// 4. The same POST replayed with keys already stored (the idempotent answer an offline phone gets).
// Prints figures and their ratio to the baseline; asserts nothing (exit 0 unless setup fails).
import { randomUUID } from 'node:crypto';

import { BASE, Client, inspectionBody, percentile, setUpScratchMeeting } from './bench-support';
const CLIENTS = Number(process.env.BENCH_CLIENTS ?? 20);
const REQUESTS = Number(process.env.BENCH_REQUESTS ?? 400);


// The scratch meeting comes from bench-support (records are append-only: the demo meeting is left alone).
async function setUp() {
  const { eventId, entryIds } = await setUpScratchMeeting(CLIENTS);
  return { eventId, entryIds, scrutineer: await new Client().signIn('scrutineer@tarnwater.example') };
}

const body = inspectionBody;

type Result = { name: string; seconds: number; latenciesMs: number[]; errors: number };

/** CLIENTS loops share REQUESTS requests; each request's latency is kept. */
async function run(name: string, send: (worker: number, i: number) => Promise<Response>): Promise<Result> {
  const latenciesMs: number[] = [];
  let next = 0;
  let errors = 0;
  const started = performance.now();
  await Promise.all(Array.from({ length: CLIENTS }, async (_, worker) => {
    for (let i = next++; i < REQUESTS; i = next++) {
      const t = performance.now();
      const res = await send(worker, i);
      await res.arrayBuffer();
      latenciesMs.push(performance.now() - t);
      if (!res.ok) errors++;
    }
  }));
  return { name, seconds: (performance.now() - started) / 1000, latenciesMs, errors };
}

const pct = percentile;

async function main() {
  const { eventId, entryIds, scrutineer } = await setUp();
  const url = `/api/events/${eventId}/inspections`;
  const post = (b: unknown) => scrutineer.fetch(url, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(b) });
  // Warm-up: compile paths, fill pools.
  await run('warm-up', (w) => (w % 2 ? fetch(`${BASE}/api/health`) : post(body(entryIds[w]))));
  const health = await run('GET /api/health (baseline)', () => fetch(`${BASE}/api/health`));
  const keys: [string, string][] = [];
  const record = await run('POST inspections (new record)', (w) => { const key = randomUUID(); keys.push([entryIds[w], key]); return post(body(entryIds[w], key)); });
  const replay = await run('POST inspections (repeated key)', (_w, i) => post(body(keys[i % keys.length][0], keys[i % keys.length][1])));

  console.log(`\nInspection benchmark at ${BASE}: ${CLIENTS} concurrent clients, ${REQUESTS} requests per run (meeting ${eventId})\n`);
  console.log('run                               req/s   p50 ms   p95 ms  errors   req/s vs baseline   p50 vs baseline');
  for (const r of [health, record, replay]) {
    const rps = r.latenciesMs.length / r.seconds;
    const baseRps = health.latenciesMs.length / health.seconds;
    console.log(
      `${r.name.padEnd(32)} ${rps.toFixed(0).padStart(6)} ${pct(r.latenciesMs, 50).toFixed(1).padStart(8)} ${pct(r.latenciesMs, 95).toFixed(1).padStart(8)} ${String(r.errors).padStart(7)}` +
        `   ${(rps / baseRps).toFixed(2).padStart(17)}   ${(pct(r.latenciesMs, 50) / pct(health.latenciesMs, 50)).toFixed(2).padStart(15)}`,
    );
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
