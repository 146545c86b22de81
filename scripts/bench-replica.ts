// Reads landing on a streaming replica: npm run bench:replica (through scripts/test.sh). Starts a
// streaming replica of the test cluster (pg_basebackup -R, Debian's PostgreSQL) and an app server
// with DATABASE_REPLICA_URLS pointing at it, records inspections through that server, then reads the
// inspection board and the draft parity report through it READS times each. Prints, for the same
// load, the transactions counted on the primary and on the replica (pg_stat_database), the replica's
// replay lag, and the same load against the first app server (no replica configured) as the baseline.
// Asserts nothing; exits 0.
import pg from 'pg';
import { Client, inspectionBody, setUpScratchMeeting } from './bench-support';
import { startAppServer, startReplica, stopAll } from './app-servers';

const READS = Number(process.env.BENCH_READS ?? 200);
const RECORDS = Number(process.env.BENCH_RECORDS ?? 20);
const port = Number(process.env.PORT ?? 3100);

async function xacts(url: string): Promise<number> {
  const c = new pg.Client({ connectionString: url });
  await c.connect();
  try {
    const r = await c.query('select xact_commit::bigint as n from pg_stat_database where datname = current_database()');
    return Number(r.rows[0].n);
  } finally {
    await c.end();
  }
}
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
// pg_stat_database counters are flushed to the shared statistics at most every second (PostgreSQL 15).
const settle = () => sleep(1500);

async function load(base: string, eventId: string, classId: string) {
  const organiser = await new Client(30_000, base).signIn('organiser@tarnwater.example');
  const t = performance.now();
  for (let i = 0; i < READS; i++) {
    const board = await organiser.fetch(`/api/events/${eventId}/inspections`);
    if (!board.ok) throw new Error(`board ${board.status}`);
    await board.arrayBuffer();
    const report = await organiser.fetch(`/api/events/${eventId}/classes/${classId}/report`);
    if (!report.ok) throw new Error(`report ${report.status}`);
    await report.arrayBuffer();
  }
  return (performance.now() - t) / 1000;
}

async function main() {
  const primaryUrl = process.env.DATABASE_URL!;
  const replicaUrl = startReplica(Number(process.env.PGPORT) + 1);
  console.log(`streaming replica on ${new URL(replicaUrl).port}, following the test cluster on ${process.env.PGPORT}`);
  const app = await startAppServer(port + 30, { DATABASE_REPLICA_URLS: replicaUrl });

  const { eventId, entryIds } = await setUpScratchMeeting(RECORDS);
  const scrutineer = await new Client(30_000, app.base).signIn('scrutineer@tarnwater.example');
  for (const entryId of entryIds) {
    const res = await scrutineer.fetch(`/api/events/${eventId}/inspections`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(inspectionBody(entryId)),
    });
    if (res.status !== 201) throw new Error(`recording through the replica-configured server: ${res.status}`);
  }
  const organiser = await new Client(30_000, app.base).signIn('organiser@tarnwater.example');
  const classes = (await (await organiser.fetch(`/api/events/${eventId}/classes`)).json()) as {
    data: { id: string }[];
  };
  const classId = classes.data[0].id;
  console.log(`${RECORDS} inspections recorded through the replica-configured server (writes: primary)`);

  const lag = new pg.Client({ connectionString: replicaUrl });
  await lag.connect();
  const lagRow = await lag.query(
    'select coalesce(extract(epoch from now() - pg_last_xact_replay_timestamp()) * 1000, 0) as ms, (select count(*) from inspections where event_id = $1)::int as seen',
    [eventId],
  );
  await lag.end();
  console.log(
    `replica caught up         ${lagRow.rows[0].seen} of ${RECORDS} records visible there; ${Number(lagRow.rows[0].ms).toFixed(0)} ms since its last replayed commit`,
  );

  const measure = async (name: string, base: string) => {
    await settle();
    const [p0, r0] = [await xacts(primaryUrl), await xacts(replicaUrl)];
    const seconds = await load(base, eventId, classId);
    await settle();
    const [p1, r1] = [await xacts(primaryUrl), await xacts(replicaUrl)];
    console.log(
      `${name.padEnd(26)}${READS} boards + ${READS} draft reports in ${seconds.toFixed(1)} s; transactions on the primary ${p1 - p0}, on the replica ${r1 - r0}`,
    );
  };
  await measure('without a replica', `http://127.0.0.1:${port}`);
  await measure('with the replica', app.base);
  console.log(
    "(counts include this script's own reading of the counters, sign-in, and the session and permission reads, which stay on the primary)",
  );
}

main()
  .catch((e) => {
    console.error(e);
    process.exitCode = 1;
  })
  .finally(stopAll);
