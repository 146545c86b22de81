// Benchmark: the class parity report for 500 boats. Prints figures as ratios against baselines
// measured in the same run; asserts nothing. Run: npm run bench:report (it starts the test stack
// on the fresh test database, adds scratch classes there, and stops everything afterwards).
//   computation:  computeReportResults vs the engine's computeParity alone on the same numbers
//   PDF:          buildReportPdf for 200 boats (target under 2 s)
//   page render:  GET /reports/:id of a 500-boat report vs GET /not-allowed (a static page), when
//                 BASE_URL answers; skipped otherwise
//   PDF route:    20 clients GET /api/reports/:id/pdf of the 500-boat report for 5 s, with one client
//                 timing GET /api/health alongside, against /api/health alone (when BASE_URL answers)
//   queries:      SQL statements issued by gatherReportInputs for 50 and for 500 boats (constant = no N+1)
import { performance } from 'node:perf_hooks';
import { randomUUID, randomBytes } from 'node:crypto';
import pg from 'pg';
import { computeParity } from '../lib/core/engine/parity';
import { computeReportResults, type ReportInputs } from '../lib/core/reports/parity-figures';
import { buildReportPdf } from '../lib/core/reports/report-pdf';
import type { PublishedReportDto } from '../lib/core/reports/report-dto';

function syntheticInputs(n: number): ReportInputs {
  let s = 12345;
  const r = () => (s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32;
  return {
    eventName: 'Bench Meeting',
    classCode: 'BX',
    className: 'Bench Class',
    ruleVersion: { id: randomUUID(), version: 1 },
    assumptions: {
      pumpEfficiency: 0.9,
      nozzleLossCoefficient: 0.02,
      inletLossCoefficient: 0.2,
      wakeFraction: 0,
      referenceSpeedsMs: [10, 20, 30],
    },
    density: { densityKgM3: 999.1026, description: 'fresh water at 15 C' },
    boats: Array.from({ length: n }, (_, i) => ({
      entryId: `e${i}`,
      raceNumber: i + 1,
      boatName: `Boat ${i + 1}`,
      powerKw: 200 + r() * 80,
      uPowerKw: 2.5,
      powerSource: 'declared' as const,
      nozzleDiameterMm: 96 + r() * 6,
      uNozzleDiameterMm: 0.025,
      inspectionId: null,
      inspectedAt: null,
    })),
    excluded: [],
    computedAt: new Date().toISOString(),
  };
}

function timeIt(label: string, runs: number, fn: () => unknown) {
  for (let i = 0; i < 3; i++) fn();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t = performance.now();
    fn();
    times.push(performance.now() - t);
  }
  times.sort((a, b) => a - b);
  const median = times[times.length >> 1];
  console.log(`${label.padEnd(44)} median ${median.toFixed(2)} ms  (best ${times[0].toFixed(2)} ms, ${runs} runs)`);
  return median;
}

async function main() {
  const inputs = syntheticInputs(500);
  const engineMs = timeIt('engine computeParity, 500 boats (baseline)', 15, () =>
    computeParity(
      inputs.boats.map((b) => ({
        id: b.entryId,
        label: b.boatName,
        powerKw: b.powerKw,
        nozzleDiameterMm: b.nozzleDiameterMm,
        uPowerKw: b.uPowerKw,
        uNozzleDiameterMm: b.uNozzleDiameterMm,
      })),
      { densityKgM3: 999.1026, ...inputs.assumptions },
    ),
  );
  const reportMs = timeIt('report computation, 500 boats', 15, () => computeReportResults(inputs));
  console.log(`  ratio report/engine: ${(reportMs / engineMs).toFixed(2)}x (target within 2x)`);

  const small = syntheticInputs(200);
  const dto: PublishedReportDto = {
    id: randomUUID(),
    publicId: 'bench',
    eventId: randomUUID(),
    classId: randomUUID(),
    number: 1,
    note: '',
    publishedAt: new Date().toISOString(),
    inputs: small,
    results: computeReportResults(small),
  };
  let pdfBytes = 0;
  const t0 = performance.now();
  for (let i = 0; i < 3; i++) pdfBytes = (await buildReportPdf(dto)).length;
  console.log(
    `PDF, 200 boats                               ${((performance.now() - t0) / 3).toFixed(0)} ms each (${(pdfBytes / 1024).toFixed(0)} KiB; target under 2000 ms)`,
  );

  // Query count through the real data layer (needs --conditions=react-server for server-only modules).
  const url = process.env.DATABASE_URL;
  if (!url) return console.log('queries: skipped (DATABASE_URL not set)');
  const { getDb } = await import('../lib/server/db');
  const { gatherReportInputs } = await import('../lib/server/reports/gather-report-inputs');
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  const counts: Record<number, number> = {};
  for (const n of [50, 500]) {
    const { eventId, classId } = await makeScratchClass(client, n);
    const { sequelize } = getDb();
    let q = 0;
    sequelize.addHook('beforeQuery', 'bench-count', () => {
      q++;
    });
    const t = performance.now();
    const gathered = await gatherReportInputs(eventId, classId);
    const ms = performance.now() - t;
    sequelize.removeHook('beforeQuery', 'bench-count');
    counts[n] = q;
    if (n === 500) await timePageRender(client, eventId, classId, gathered);
    console.log(
      `gatherReportInputs, ${String(n).padStart(3)} boats                  ${q} queries, ${ms.toFixed(0)} ms, ${gathered.boats.length} boats used`,
    );
  }
  console.log(`  queries constant in the number of boats: ${counts[50] === counts[500] ? 'yes' : 'NO'}`);
  await client.end();
  await getDb().sequelize.close();
}

// The public report page for 500 boats against a page that reads nothing (same server, same run).
async function timePageRender(c: pg.Client, eventId: string, classId: string, inputs: ReportInputs) {
  const base = process.env.BASE_URL;
  if (
    !base ||
    !(await fetch(`${base}/api/health`)
      .then((r) => r.ok)
      .catch(() => false))
  )
    return console.log('page render: skipped (no app at BASE_URL)');
  const publicId = randomBytes(12).toString('base64url');
  const rv = (await c.query('select id from class_rule_versions where class_id = $1', [classId])).rows[0].id;
  const by = (await c.query('select entrant_id from entries where class_id = $1 limit 1', [classId])).rows[0]
    .entrant_id;
  await c.query(
    `insert into parity_reports (event_id, class_id, number, public_id, rule_version_id, inputs, results, published_by_id) values ($1, $2, 1, $3, $4, $5, $6, $7)`,
    [eventId, classId, publicId, rv, JSON.stringify(inputs), JSON.stringify(computeReportResults(inputs)), by],
  );
  const get = async (path: string) => {
    const t = performance.now();
    const r = await fetch(`${base}${path}`);
    await r.text();
    return performance.now() - t;
  };
  const median = async (path: string) => {
    for (let i = 0; i < 3; i++) await get(path);
    const xs: number[] = [];
    for (let i = 0; i < 10; i++) xs.push(await get(path));
    return xs.sort((a, b) => a - b)[5];
  };
  const empty = await median('/not-allowed');
  const report = await median(`/reports/${publicId}`);
  console.log(
    `page render: empty page ${empty.toFixed(1)} ms (baseline), 500-boat report page ${report.toFixed(1)} ms, ratio ${(report / empty).toFixed(1)}x`,
  );
  await timePdfRoute(base, publicId);
}

// The public PDF of the same report under 20 concurrent clients, and what that does to the rest of
// the site (GET /api/health timed by one more client), against /api/health on an idle server.
async function timePdfRoute(base: string, publicId: string) {
  const pct = (xs: number[], p: number) =>
    [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor(xs.length * p))] ?? NaN;
  const statuses = new Map<string, number>();
  const timed = async (path: string) => {
    const t = performance.now();
    const status = await fetch(`${base}${path}`).then(
      async (r) => {
        await r.arrayBuffer();
        return String(r.status);
      },
      (e: Error) => e.message,
    );
    if (status !== '200')
      statuses.set(
        `${path.replace(publicId, ':id')} ${status}`,
        (statuses.get(`${path.replace(publicId, ':id')} ${status}`) ?? 0) + 1,
      );
    return performance.now() - t;
  };
  const first = await timed(`/api/reports/${publicId}/pdf`);
  for (let i = 0; i < 3; i++) await timed(`/api/reports/${publicId}/pdf`);
  const idle: number[] = [];
  for (let i = 0; i < 50; i++) idle.push(await timed('/api/health'));
  const durationMs = 5000;
  const start = performance.now();
  const end = start + durationMs;
  const pdfTimes: number[] = [];
  const healthTimes: number[] = [];
  const client = async () => {
    while (performance.now() < end) pdfTimes.push(await timed(`/api/reports/${publicId}/pdf`));
  };
  const prober = async () => {
    while (performance.now() < end) {
      healthTimes.push(await timed('/api/health'));
      await new Promise((r) => setTimeout(r, 20));
    }
  };
  await Promise.all([...Array.from({ length: 20 }, client), prober()]);
  // Requests started in the window finish after it: divide by the time until the last one ended.
  const elapsedS = (performance.now() - start) / 1000;
  console.log(`PDF route, 500 boats, first request          ${first.toFixed(0)} ms`);
  console.log(
    `PDF route, 20 clients for ${durationMs / 1000} s                ${(pdfTimes.length / elapsedS).toFixed(1)} answers/s (${pdfTimes.length} in ${elapsedS.toFixed(1)} s), p50 ${pct(pdfTimes, 0.5).toFixed(0)} ms, p95 ${pct(pdfTimes, 0.95).toFixed(0)} ms`,
  );
  console.log(
    `  GET /api/health meanwhile (${healthTimes.length} requests): p50 ${pct(healthTimes, 0.5).toFixed(1)} ms, p95 ${pct(healthTimes, 0.95).toFixed(1)} ms (idle baseline p50 ${pct(idle, 0.5).toFixed(1)} ms, p95 ${pct(idle, 0.95).toFixed(1)} ms)`,
  );
  console.log(
    `  answers other than 200: ${statuses.size ? [...statuses].map(([k, n]) => `${k} x${n}`).join('; ') : 'none'}`,
  );
}

async function makeScratchClass(c: pg.Client, n: number) {
  const org = (
    await c.query(`insert into organisations (name, slug) values ('Bench Club', $1) returning id`, [
      `bench-${randomBytes(4).toString('hex')}`,
    ])
  ).rows[0].id;
  const user = (
    await c.query(`insert into users (name, email) values ('Bench', $1) returning id`, [
      `bench-${randomBytes(4).toString('hex')}@example.org`,
    ])
  ).rows[0].id;
  const ev = (
    await c.query(
      `insert into events (organisation_id, name, slug, venue, starts_on, ends_on, time_zone) values ($1, 'Bench', $2, 'Bench', '2027-01-01', '2027-01-01', 'UTC') returning id`,
      [org, `bench-${randomBytes(4).toString('hex')}`],
    )
  ).rows[0].id;
  const cls = (
    await c.query(`insert into race_classes (event_id, name, code) values ($1, 'Bench', 'BX') returning id`, [ev])
  ).rows[0].id;
  const rules = {
    nozzle: { maxMm: 110, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 },
    power: { minKw: null, maxKw: 400, defaultUncertaintyKw: 5 },
    weight: { minKg: null, includesDriver: true, defaultUncertaintyKg: 1 },
    decisionRule: 'simple',
    safetyItems: [],
    parity: {
      pumpEfficiency: 0.9,
      nozzleLossCoefficient: 0.02,
      inletLossCoefficient: 0.2,
      wakeFraction: 0,
      referenceSpeedsMs: [10, 20, 30],
    },
  };
  const rv = (
    await c.query(
      `insert into class_rule_versions (class_id, version, status, rules, effective_from, published_at) values ($1, 1, 'published', $2, now() - interval '1 day', now()) returning id`,
      [cls, JSON.stringify(rules)],
    )
  ).rows[0].id;
  for (let i = 0; i < n; i++) {
    const boat = (
      await c.query(
        `insert into boats (owner_id, name, declared_nozzle_mm, declared_power_kw) values ($1, $2, 100, $3) returning id`,
        [user, `Bench ${i}`, 220 + (i % 40)],
      )
    ).rows[0].id;
    const entry = (
      await c.query(
        `insert into entries (event_id, class_id, boat_id, entrant_id, race_number, status, fee_minor, currency) values ($1, $2, $3, $4, $5, 'entered', 0, 'NZD') returning id`,
        [ev, cls, boat, user, i + 1],
      )
    ).rows[0].id;
    await c.query(
      `insert into inspections (event_id, entry_id, boat_id, class_id, rule_version_id, recorded_by_id, idempotency_key, captured_at, measurements, results, overall_result) values ($1, $2, $3, $4, $5, $6, $7, now(), $8, '{"rules":[]}', 'conforms')`,
      [
        ev,
        entry,
        boat,
        cls,
        rv,
        user,
        randomUUID(),
        JSON.stringify({
          nozzle: {
            readings: [
              { diameterMm: 99 + (i % 7) * 0.3, angleDeg: 0 },
              { diameterMm: 99.1 + (i % 7) * 0.3, angleDeg: 60 },
            ],
          },
        }),
      ],
    );
  }
  return { eventId: ev, classId: cls };
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
