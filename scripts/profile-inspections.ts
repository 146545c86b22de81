// CPU profile of the record path: bash scripts/test.sh --run scripts/profile-inspections.ts
// Starts a second app server from the same build under `node --cpu-prof` (port PORT+40, a port no
// other script uses), runs bench:inspections against it (BENCH_ROUNDS, default 1), stops it so V8
// writes the profile, and prints the top self-time items (scripts/cpu-profile-top.mjs).
// PROFILE_DIR chooses where the .cpuprofile goes (default .data/profiles).
import { execFileSync, spawn } from 'node:child_process';
import { mkdirSync, openSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { waitReady } from './app-servers';

const ROOT = path.resolve(__dirname, '..');
const dir = path.resolve(process.env.PROFILE_DIR ?? path.join(ROOT, '.data', 'profiles'));

async function main() {
  mkdirSync(dir, { recursive: true });
  const port = Number(process.env.PORT ?? 3100) + 40;
  const log = openSync(path.join(ROOT, '.data', 'test-run', `app-${port}.log`), 'a');
  const started = Date.now();
  const child = spawn('node', ['--cpu-prof', `--cpu-prof-dir=${dir}`, 'scripts/server.mjs'], {
    cwd: ROOT,
    stdio: ['ignore', log, log],
    env: { ...process.env, PORT: String(port) },
  });
  const exited = new Promise((resolve) => child.on('exit', resolve));
  try {
    await waitReady(`http://127.0.0.1:${port}`);
    execFileSync('node_modules/.bin/tsx', ['--conditions=react-server', 'scripts/bench-inspections.ts'], {
      cwd: ROOT,
      stdio: 'inherit',
      env: {
        ...process.env,
        BASE_URL: `http://localhost:${port}`,
        BENCH_ROUNDS: process.env.BENCH_ROUNDS ?? '1',
        BENCH_APP_PID: String(child.pid),
      },
    });
  } finally {
    child.kill('SIGTERM'); // scripts/server.mjs exits on SIGTERM, and V8 writes the profile on exit
    await exited;
  }
  const newest = readdirSync(dir)
    .filter((f) => f.endsWith('.cpuprofile'))
    .map((f) => path.join(dir, f))
    .filter((f) => statSync(f).mtimeMs >= started)
    .sort((a, b) => statSync(b).mtimeMs - statSync(a).mtimeMs)[0];
  if (!newest) throw new Error(`no profile was written in ${dir}`);
  execFileSync('node', ['scripts/cpu-profile-top.mjs', newest, process.env.PROFILE_TOP ?? '30'], {
    cwd: ROOT,
    stdio: 'inherit',
  });
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
