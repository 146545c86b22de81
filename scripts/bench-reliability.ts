// Reliability under load, with a fault in the middle: npm run bench:reliability.
// CLIENTS concurrent scrutineer clients (default 50) each record PER_CLIENT inspections (default 100)
// through the HTTP API. After FAULT_AFTER acknowledged records one fault strikes, and the run is
// repeated for each fault (BENCH_FAULTS, default all three):
//   pg-stop  PostgreSQL stopped cleanly for DOWN_S seconds, then started;
//   pg-kill  PostgreSQL crashed (SIGKILL to the postmaster and every backend), then started (it replays its WAL);
//   app-kill the app server crashed (SIGKILL), then started again.
// Clients retry refused or failed requests with the same idempotency key (as the phones do).
// Afterwards every acknowledged record must be in the database exactly once. Prints for each fault:
// requests, acknowledged, lost, duplicated, 5xx other than 503, 503s, network errors, p95 latency,
// seconds down and seconds to recover. Asserts nothing; exits 0.
import { execFileSync, spawn } from 'node:child_process';
import { openSync, readFileSync, writeFileSync } from 'node:fs';
import { randomUUID } from 'node:crypto';
import pg from 'pg';
import { Client, inspectionBody, percentile, setUpScratchMeeting } from './bench-support';

const CLIENTS = Number(process.env.BENCH_CLIENTS ?? 50);
const PER_CLIENT = Number(process.env.BENCH_PER_CLIENT ?? 100);
const FAULT_AFTER = Number(process.env.BENCH_FAULT_AFTER ?? Math.floor((CLIENTS * PER_CLIENT) / 3));
const DOWN_S = Number(process.env.BENCH_DOWN_S ?? 3);

export const FAULTS = ['pg-stop', 'pg-kill', 'app-kill'] as const;
export type Fault = (typeof FAULTS)[number];

const pgCtl = (action: 'start' | 'stop' | 'kill') =>
  execFileSync('bash', ['scripts/pg.sh', 'boreline_test'], {
    env: { ...process.env, PG_ACTION: action },
    stdio: 'pipe',
  });
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** SIGKILL the app server started by scripts/test.sh (its process group), as a power cut or OOM kill would. */
function killApp() {
  const pidFile = process.env.BORELINE_APP_PIDFILE;
  if (!pidFile) throw new Error('BORELINE_APP_PIDFILE is not set: run through scripts/test.sh');
  const pid = Number(readFileSync(pidFile, 'utf8').trim());
  try {
    process.kill(-pid, 'SIGKILL');
  } catch {
    process.kill(pid, 'SIGKILL');
  }
}

/** Start the app server again as scripts/test.sh does (own session, same environment and log); keep its pid. */
function startApp() {
  const log = openSync(process.env.BORELINE_APP_LOG ?? '/dev/null', 'a');
  const child = spawn('node', ['scripts/server.mjs'], {
    detached: true,
    stdio: ['ignore', log, log],
    env: process.env,
  });
  child.unref();
  writeFileSync(process.env.BORELINE_APP_PIDFILE!, `${child.pid}\n`);
}

async function strike(fault: Fault, downS: number) {
  if (fault === 'pg-stop') {
    pgCtl('stop');
    await sleep(downS * 1000);
    pgCtl('start');
  } else if (fault === 'pg-kill') {
    pgCtl('kill');
    await sleep(downS * 1000);
    pgCtl('start');
  } else {
    killApp();
    await sleep(downS * 1000);
    startApp();
  }
}

export async function runFaultLoad(opts: {
  clients: number;
  perClient: number;
  faultAfter: number;
  downS: number;
  fault?: Fault;
  /** Another fault than the three above (bench:multi kills one of several app servers), with its name. */
  strike?: { name: string; run: (downS: number) => Promise<void> };
  /** Where the clients send their records (default: the app server scripts/test.sh started). */
  base?: string;
  log?: boolean;
}) {
  const fault = opts.strike?.name ?? opts.fault ?? 'pg-stop';
  const { eventId, entryIds } = await setUpScratchMeeting(Math.min(opts.clients, 25));
  // Sign in a few at a time: a burst of simultaneous sign-ins for one address is exactly what the
  // sign-in throttle refuses, and the load is about recording inspections, not signing in.
  const clients: Client[] = [];
  for (let i = 0; i < opts.clients; i += 5) {
    const batch = Math.min(5, opts.clients - i);
    clients.push(
      ...(await Promise.all(
        Array.from({ length: batch }, () => new Client(15_000, opts.base).signIn('scrutineer@tarnwater.example')),
      )),
    );
  }
  if (opts.log) console.log(`  ${clients.length} clients signed in`);
  const acked = new Set<string>();
  const latencies: number[] = [];
  const stats = { requests: 0, s503: 0, s5xx: 0, networkErrors: 0 };
  let faultStarted = 0;
  let dbBackAt = 0;
  let firstAckAfterBack = 0;
  let ackedWhileDown = 0;

  const struck = (async () => {
    while (acked.size < opts.faultAfter) await sleep(20);
    faultStarted = Date.now();
    if (opts.log) console.log(`  ${fault} after ${acked.size} acknowledged records`);
    if (opts.strike) await opts.strike.run(opts.downS);
    else await strike(fault as Fault, opts.downS);
    dbBackAt = Date.now();
    if (opts.log) console.log(`  ${fault.startsWith('pg') ? 'PostgreSQL' : 'the app server'} started again`);
  })();

  // Progress every 5 s; the timer also keeps Node alive if every request were ever stalled at once.
  const progress = setInterval(() => {
    if (opts.log) console.log(`  ${acked.size} acknowledged, ${stats.requests} requests, ${stats.s503} answered 503`);
  }, 5000);
  try {
    await Promise.all(
      clients.map(async (c, w) => {
        for (let i = 0; i < opts.perClient; i++) {
          const key = randomUUID();
          const body = JSON.stringify(inspectionBody(entryIds[(w + i) % entryIds.length], key));
          for (let attempt = 0; attempt < 200; attempt++) {
            const t = performance.now();
            stats.requests++;
            try {
              const res = await c.fetch(`/api/events/${eventId}/inspections`, {
                method: 'POST',
                headers: { 'content-type': 'application/json' },
                body,
              });
              await res.arrayBuffer();
              latencies.push(performance.now() - t);
              if (res.ok) {
                acked.add(key);
                if (faultStarted && !dbBackAt) ackedWhileDown++;
                if (dbBackAt && !firstAckAfterBack) firstAckAfterBack = Date.now();
                break;
              }
              if (res.status === 503) stats.s503++;
              else if (res.status >= 500) stats.s5xx++;
              else throw new Error(`refused ${res.status}: ${await res.text()}`);
            } catch (err) {
              if (String(err).startsWith('Error: refused')) throw err;
              stats.networkErrors++;
            }
            await sleep(Math.min(2000, 50 * 2 ** Math.min(attempt, 5)));
          }
        }
      }),
    );
    await struck;
  } finally {
    clearInterval(progress);
  }

  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  const rows = (
    await db.query('select idempotency_key, count(*)::int as n from inspections where event_id = $1 group by 1', [
      eventId,
    ])
  ).rows as { idempotency_key: string; n: number }[];
  await db.end();
  const stored = new Map(rows.map((r) => [r.idempotency_key, r.n]));
  const lost = [...acked].filter((k) => !stored.has(k)).length;
  const duplicated = rows.filter((r) => r.n > 1).length;
  return {
    fault,
    ...stats,
    acknowledged: acked.size,
    expected: opts.clients * opts.perClient,
    lost,
    duplicated,
    storedRows: rows.length,
    ackedWhileDown,
    p50Ms: percentile(latencies, 50),
    p95Ms: percentile(latencies, 95),
    secondsToRecover: firstAckAfterBack && dbBackAt ? (firstAckAfterBack - dbBackAt) / 1000 : null,
    secondsDown: dbBackAt && faultStarted ? (dbBackAt - faultStarted) / 1000 : null,
  };
}

async function main() {
  const faults = (process.env.BENCH_FAULTS?.split(',') ?? [...FAULTS]) as Fault[];
  for (const f of faults)
    if (!FAULTS.includes(f)) throw new Error(`BENCH_FAULTS: unknown fault ${f} (${FAULTS.join(', ')})`);
  for (const fault of faults) {
    console.log(
      `\nreliability, ${fault}: ${CLIENTS} clients x ${PER_CLIENT} inspections, fault for ${DOWN_S} s after ${FAULT_AFTER} acknowledged`,
    );
    const started = Date.now();
    const r = await runFaultLoad({
      clients: CLIENTS,
      perClient: PER_CLIENT,
      faultAfter: FAULT_AFTER,
      downS: DOWN_S,
      fault,
      log: true,
    });
    const seconds = (Date.now() - started) / 1000;
    console.log(
      `requests sent            ${r.requests} (${(r.requests / seconds).toFixed(0)}/s over ${seconds.toFixed(1)} s)`,
    );
    console.log(`records acknowledged     ${r.acknowledged} of ${r.expected}`);
    console.log(`records lost             ${r.lost}`);
    console.log(`records duplicated       ${r.duplicated}`);
    console.log(`rows stored              ${r.storedRows}`);
    console.log(`503 answers (db down)    ${r.s503}`);
    console.log(`other 5xx answers        ${r.s5xx}`);
    console.log(`network errors           ${r.networkErrors}`);
    console.log(`latency p50 / p95        ${r.p50Ms.toFixed(1)} / ${r.p95Ms.toFixed(1)} ms`);
    console.log(
      `down                     ${r.secondsDown?.toFixed(1)} s; first record accepted ${r.secondsToRecover?.toFixed(2)} s after the restart`,
    );
  }
}

if (process.argv[1]?.endsWith('bench-reliability.ts'))
  main().catch((e) => {
    console.error(e);
    process.exit(1);
  });
