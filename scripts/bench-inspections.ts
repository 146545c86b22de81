// Inspection recording benchmark: npx tsx scripts/bench-inspections.ts
// Assumes the app is running at BASE_URL (default http://localhost:3000) with the demo seeded.
// 1. Sets up its own meeting through the API (records are append-only, so the demo meeting is left
//    alone): a class with published rules, the demo scrutineer on the staff, 20 boats entered.
// 2. Baseline: GET /api/health (one database round trip), CLIENTS concurrent loops, REQUESTS in all.
// 3. POST /api/events/:id/inspections, a new record each time (each loop its own boat), same counts:
//    validation, rule lookup, decision, the insert, the entry update and the entrant's e-mail.
// 4. The same POST replayed with keys already stored (the idempotent answer an offline phone gets).
// Prints figures and their ratio to the baseline; asserts nothing (exit 0 unless setup fails).
import { randomUUID } from 'node:crypto';

import { BASE, Client } from './bench-support';
const CLIENTS = Number(process.env.BENCH_CLIENTS ?? 20);
const REQUESTS = Number(process.env.BENCH_REQUESTS ?? 400);


async function setUp() {
  const organiser = await new Client().signIn('organiser@tarnwater.example');
  const event = await organiser.json('/api/events', {
    organisationId: '0b0e0000-0000-4000-8000-000000000001', name: `Bench meeting ${new Date().toISOString()}`, venue: 'Bench Reach',
    startsOn: '2027-06-01', endsOn: '2027-06-02', timeZone: 'Pacific/Auckland', status: 'entries_open', waterKind: 'fresh', waterTemperatureC: 15,
    waterDensityKgM3: null, protestWindowMinutes: 30, currency: 'NZD', entryFeeMinor: 10000, protestFeeMinor: 3000,
  });
  await organiser.json(`/api/events/${event.id}/staff`, { email: 'scrutineer@tarnwater.example', role: 'scrutineer' });
  const cls = await organiser.json(`/api/events/${event.id}/classes`, { name: 'Bench Class', code: 'BEN' });
  await organiser.json(`/api/events/${event.id}/classes/${cls.id}/rules`, {
    powerUnit: 'kW',
    rules: {
      nozzle: { maxMm: 102, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 }, power: { minKw: 180, maxKw: 260, defaultUncertaintyKw: 5 },
      weight: { minKg: 650, includesDriver: true, defaultUncertaintyKg: 1 }, decisionRule: 'iso14253', safetyItems: ['kill_switch', 'helmet'],
      parity: { pumpEfficiency: 0.9, nozzleLossCoefficient: 0.02, inletLossCoefficient: 0.2, wakeFraction: 0, referenceSpeedsMs: [10] },
    },
  }, 'PUT');
  await organiser.json(`/api/events/${event.id}/classes/${cls.id}/rules/publish`, { changeNote: 'bench', effectiveFrom: new Date(Date.now() - 3600_000).toISOString() });
  const entrant = await new Client().signIn('entrant@tarnwater.example');
  const entryIds: string[] = [];
  for (let i = 0; i < CLIENTS; i++) {
    const boat = await entrant.json('/api/boats', {
      name: `Bench boat ${i + 1}`, nozzleDiameter: 101.5, nozzleUnit: 'mm', nozzleToleranceMm: 0.1, power: 220, powerUnit: 'kW', powerEvidence: 'dyno_sheet',
    });
    const entered = await entrant.json('/api/entries', { eventId: event.id, classId: cls.id, boatId: boat.id });
    entryIds.push(entered.entry.id);
  }
  return { eventId: event.id as string, entryIds, scrutineer: await new Client().signIn('scrutineer@tarnwater.example') };
}

const body = (entryId: string, key: string = randomUUID()) => ({
  idempotencyKey: key, entryId, kind: 'pre_race', capturedAt: new Date().toISOString(), device: 'bench',
  nozzle: { readings: [{ diameterMm: 101.5, angleDeg: 0 }, { diameterMm: 101.93, angleDeg: 60 }, { diameterMm: 101.7, angleDeg: 120 }], expandedUncertaintyMm: 0.05 },
  weight: { readingsKg: [690, 691] }, power: { declaredKw: 220, evidenceSeen: true }, seals: [], safety: { kill_switch: true, helmet: true },
});

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

const pct = (xs: number[], p: number) => { const s = [...xs].sort((a, b) => a - b); return s[Math.min(s.length - 1, Math.floor((p / 100) * s.length))]; };

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
