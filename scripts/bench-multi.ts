// More than one app server, for real: npm run bench:multi (through scripts/test.sh, which builds the
// app and starts the test cluster). Starts SERVERS app servers (default 2) from the same build behind
// nginx from Debian's packages, all on loopback, and prints:
//   1. which server answered each of 40 signed-in requests made through nginx with one session;
//   2. the public API's rate limit (60 a minute here) counted once across the servers: 80 requests
//      through nginx, how many were let through (60 when the count is shared, up to 60 x SERVERS if not);
//   3. 50 clients recording through nginx while one app server is killed (SIGKILL) and started again:
//      acknowledged, lost, duplicated, 502s from nginx, network errors, seconds to recover.
// Asserts nothing; exits 0.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import { Client } from './bench-support';
import { runFaultLoad } from './bench-reliability';
import { startAppServer, startNginx, stopAll, type AppServer } from './app-servers';

const SERVERS = Number(process.env.BENCH_SERVERS ?? 2);
const CLIENTS = Number(process.env.BENCH_CLIENTS ?? 50);
const PER_CLIENT = Number(process.env.BENCH_PER_CLIENT ?? 60);
const LIMIT = 60;
const base = Number(process.env.PORT ?? 3100) + 20;
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

function answeredBy(servers: AppServer[], requestIds: string[]) {
  const counts = servers.map((s) => {
    const log = readFileSync(path.join(__dirname, '..', '.data', 'test-run', `app-${s.port}.log`), 'utf8');
    return requestIds.filter((id) => log.includes(`"requestId":"${id}"`)).length;
  });
  return counts;
}

async function main() {
  const env = { TRUSTED_PROXY_HOPS: '1', PUBLIC_API_RATE_LIMIT_PER_MINUTE: String(LIMIT) };
  const servers: AppServer[] = [];
  for (let i = 1; i <= SERVERS; i++) servers.push(await startAppServer(base + i, env));
  const nginx = await startNginx(
    base,
    servers.map((s) => s.port),
  );
  console.log(`${SERVERS} app servers (${servers.map((s) => s.port).join(', ')}) behind nginx on ${base}`);

  // 1. One session, many servers.
  const person = await new Client(15_000, nginx.base).signIn('scrutineer@tarnwater.example');
  const ids: string[] = [];
  let signedIn = 0;
  for (let i = 0; i < 40; i++) {
    const res = await person.fetch('/api/auth/session');
    const session = (await res.json()) as { user?: { email?: string } };
    if (session.user?.email === 'scrutineer@tarnwater.example') signedIn++;
    ids.push(res.headers.get('x-request-id') ?? '');
  }
  await sleep(300);
  console.log(
    `session across servers    ${signedIn} of 40 requests signed in; answered by ${answeredBy(servers, ids)
      .map((n, i) => `server ${i + 1}: ${n}`)
      .join(', ')}`,
  );

  // 2. One rate limit, many servers.
  const tag = randomUUID();
  let allowed = 0;
  let limited = 0;
  for (let i = 0; i < 80; i++) {
    const res = await fetch(`${nginx.base}/api/v1/openapi.json?n=${tag}-${i}`);
    await res.arrayBuffer();
    if (res.status === 200) allowed++;
    else if (res.status === 429) limited++;
  }
  console.log(
    `shared rate limit         ${allowed} let through, ${limited} refused 429 (limit ${LIMIT} a minute per client)`,
  );

  // 3. Recording through nginx while one server dies and comes back.
  let victim = servers[0];
  const r = await runFaultLoad({
    clients: CLIENTS,
    perClient: PER_CLIENT,
    faultAfter: Math.floor((CLIENTS * PER_CLIENT) / 3),
    downS: 3,
    base: nginx.base,
    log: true,
    strike: {
      name: 'one app server killed',
      async run(downS) {
        victim.kill('SIGKILL');
        await sleep(downS * 1000);
        victim = await startAppServer(victim.port, env);
      },
    },
  });
  console.log(`records acknowledged      ${r.acknowledged} of ${r.expected}`);
  console.log(`records lost              ${r.lost}`);
  console.log(`records duplicated        ${r.duplicated}`);
  console.log(
    `5xx answers               ${r.s5xx + r.s503} (nginx answers 502 for a request cut by the kill; clients resend with their key)`,
  );
  console.log(`network errors            ${r.networkErrors}`);
  console.log(`latency p50 / p95         ${r.p50Ms.toFixed(1)} / ${r.p95Ms.toFixed(1)} ms`);
  console.log(
    `server down               ${r.secondsDown?.toFixed(1)} s, while the other server${SERVERS > 2 ? 's' : ''} accepted ${r.ackedWhileDown} records`,
  );
}

main()
  .catch((e) => {
    console.error(e);
    process.exitCode = 1;
  })
  .finally(stopAll);
