// More than one app server on this machine, for the benchmarks and tests that prove it: extra
// `node scripts/server.mjs` processes on their own ports (the same build), nginx from Debian's
// packages in front of them, and a streaming replica of the test cluster. Everything runs on
// loopback as project-local processes and is stopped by stopAll(). Used by scripts/bench-multi.ts,
// scripts/bench-replica.ts and tests/integration/app-servers.test.ts (through scripts/test.sh,
// which builds the app and starts the first server and the test cluster).
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { chmodSync, chownSync, existsSync, mkdirSync, openSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';

const ROOT = path.resolve(__dirname, '..');
const RUN = path.join(ROOT, '.data', 'test-run');
const children: ChildProcess[] = [];
const cleanups: (() => void)[] = [];
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export async function waitReady(base: string, seconds = 90) {
  for (let i = 0; i < seconds * 5; i++) {
    try {
      const res = await fetch(`${base}/api/health/ready`, { signal: AbortSignal.timeout(2000) });
      if (res.ok) return;
    } catch {
      // not up yet
    }
    await sleep(200);
  }
  throw new Error(`${base} did not become ready`);
}

export type AppServer = { port: number; base: string; child: ChildProcess; kill(signal?: NodeJS.Signals): void };

/** Another app server from the same build, with extra environment (a proxy hop, a replica). */
export async function startAppServer(port: number, env: Record<string, string> = {}): Promise<AppServer> {
  mkdirSync(RUN, { recursive: true });
  // Something else answering there would be mistaken for the new server: refuse instead.
  const taken = await fetch(`http://127.0.0.1:${port}/`, { signal: AbortSignal.timeout(1000) }).then(
    () => true,
    () => false,
  );
  if (taken) throw new Error(`port ${port} is already taken: choose another PORT for this run`);
  const log = openSync(path.join(RUN, `app-${port}.log`), 'a');
  const child = spawn('node', ['scripts/server.mjs'], {
    cwd: ROOT,
    detached: true,
    stdio: ['ignore', log, log],
    env: { ...process.env, PORT: String(port), ...env },
  });
  children.push(child);
  const base = `http://127.0.0.1:${port}`;
  let exited: number | null = null;
  child.on('exit', (code) => (exited = code ?? -1));
  await waitReady(base);
  if (exited !== null) throw new Error(`the app server on ${port} stopped (exit ${exited}); see app-${port}.log`);
  return {
    port,
    base,
    child,
    kill(signal = 'SIGKILL') {
      try {
        process.kill(-child.pid!, signal);
      } catch {
        // already gone
      }
    },
  };
}

function nginxBinary(): string {
  for (const p of ['/usr/sbin/nginx', '/usr/bin/nginx']) if (existsSync(p)) return p;
  if (process.getuid?.() === 0) {
    console.log("  installing nginx from Debian's packages");
    try {
      execFileSync('apt-get', ['install', '-y', '-qq', 'nginx-light'], {
        stdio: 'ignore',
        env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
      });
    } catch {
      execFileSync('apt-get', ['update', '-qq'], { stdio: 'ignore' });
      execFileSync('apt-get', ['install', '-y', '-qq', 'nginx-light'], {
        stdio: 'ignore',
        env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
      });
    }
    for (const p of ['/usr/sbin/nginx', '/usr/bin/nginx']) if (existsSync(p)) return p;
  }
  throw new Error("nginx is missing: install Debian's nginx-light package (sudo apt-get install nginx-light)");
}

/**
 * nginx on 127.0.0.1:listenPort spreading requests over the app servers (round robin). It retries
 * another server only for requests that are safe to repeat: nginx's default proxy_next_upstream
 * (error, timeout) never resends a POST whose body it already sent; a client's recording is made safe
 * to resend by its idempotency key instead.
 */
export async function startNginx(listenPort: number, upstreamPorts: number[]) {
  const bin = nginxBinary();
  const prefix = path.join(RUN, `nginx-${listenPort}`);
  rmSync(prefix, { recursive: true, force: true });
  mkdirSync(path.join(prefix, 'logs'), { recursive: true });
  const conf = `
worker_processes 1;
pid ${prefix}/nginx.pid;
error_log ${prefix}/logs/error.log warn;
${process.getuid?.() === 0 ? 'user root;' : ''}
events { worker_connections 1024; }
http {
  access_log off;
  client_body_temp_path ${prefix}/body;
  proxy_temp_path ${prefix}/proxy;
  fastcgi_temp_path ${prefix}/fastcgi;
  uwsgi_temp_path ${prefix}/uwsgi;
  scgi_temp_path ${prefix}/scgi;
  client_max_body_size 30m;
  upstream boreline { ${upstreamPorts.map((p) => `server 127.0.0.1:${p} max_fails=1 fail_timeout=5s;`).join(' ')} keepalive 32; }
  server {
    listen 127.0.0.1:${listenPort};
    location / {
      proxy_pass http://boreline;
      proxy_http_version 1.1;
      proxy_set_header Connection "";
      proxy_set_header Host $http_host;
      proxy_set_header X-Forwarded-For $proxy_add_x_forwarded_for;
      proxy_set_header X-Forwarded-Proto $scheme;
      proxy_set_header X-Forwarded-Host $http_host;
      proxy_set_header X-Request-Id $request_id;
      proxy_connect_timeout 2s;
      proxy_read_timeout 30s;
    }
  }
}
`;
  const file = path.join(prefix, 'nginx.conf');
  writeFileSync(file, conf);
  const child = spawn(bin, ['-p', prefix, '-c', file, '-g', 'daemon off;'], { detached: true, stdio: 'ignore' });
  children.push(child);
  const base = `http://127.0.0.1:${listenPort}`;
  await waitReady(base, 30);
  return { base, child };
}

/** Runs scripts/pg.sh's server binaries as the postgres system user when we are root (initdb refuses root). */
function asPg(cmd: string, args: string[]) {
  const bin = execFileSync('bash', ['-c', 'ls -d /usr/lib/postgresql/*/bin | sort -V | tail -n 1'], {
    encoding: 'utf8',
  }).trim();
  const full = path.join(bin, cmd);
  if (process.getuid?.() === 0)
    return execFileSync('runuser', ['-u', 'postgres', '--', full, ...args], { encoding: 'utf8', stdio: 'pipe' });
  return execFileSync(full, args, { encoding: 'utf8', stdio: 'pipe' });
}

/**
 * A streaming replica of the test cluster (PostgreSQL's pg_basebackup -R: a standby that follows the
 * primary's WAL), on its own port and data folder. Returns the address of the test database on it.
 */
export function startReplica(replicaPort: number): string {
  const primaryPort = process.env.PGPORT!;
  const data = `/var/tmp/boreline-replica-${replicaPort}`;
  rmSync(data, { recursive: true, force: true });
  mkdirSync(data, { recursive: true });
  if (process.getuid?.() === 0) {
    const uid = Number(execFileSync('id', ['-u', 'postgres'], { encoding: 'utf8' }));
    const gid = Number(execFileSync('id', ['-g', 'postgres'], { encoding: 'utf8' }));
    chownSync(data, uid, gid);
  }
  chmodSync(data, 0o700);
  asPg('pg_basebackup', [
    '-h',
    '127.0.0.1',
    '-p',
    primaryPort,
    '-U',
    'postgres',
    '-D',
    data,
    '-R',
    '-X',
    'stream',
    '-c',
    'fast',
  ]);
  asPg('pg_ctl', [
    '-D',
    data,
    '-w',
    '-t',
    '60',
    '-l',
    `${data}/server.log`,
    '-o',
    `-c listen_addresses=127.0.0.1 -p ${replicaPort} -k ${data} -c hot_standby=on -c fsync=off -c max_connections=200`,
    'start',
  ]);
  cleanups.push(() => {
    try {
      asPg('pg_ctl', ['-D', data, '-w', '-m', 'immediate', 'stop']);
    } catch {
      // already stopped
    }
    rmSync(data, { recursive: true, force: true });
  });
  const url = new URL(process.env.DATABASE_URL!);
  url.port = String(replicaPort);
  return url.toString();
}

export function stopAll() {
  for (const c of children.reverse()) {
    try {
      process.kill(-c.pid!, 'SIGTERM');
    } catch {
      // already gone
    }
  }
  for (const f of cleanups.reverse()) f();
}
