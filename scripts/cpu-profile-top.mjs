// Text summary of a V8 .cpuprofile (what `node --cpu-prof` writes): self time by function and by
// package or project folder, top N. The content of a flame graph without a viewer.
// Usage: node scripts/cpu-profile-top.mjs FILE.cpuprofile [N]
import { readFileSync } from 'node:fs';

const [file, nArg] = process.argv.slice(2);
if (!file) {
  console.error('usage: node scripts/cpu-profile-top.mjs FILE.cpuprofile [N]');
  process.exit(1);
}
const N = Number(nArg ?? 25);
const profile = JSON.parse(readFileSync(file, 'utf8'));
const nodes = new Map(profile.nodes.map((n) => [n.id, n]));
const parentOf = new Map();
for (const n of profile.nodes) for (const c of n.children ?? []) parentOf.set(c, n.id);

// Each sample is one tick of the profiler; timeDeltas[i] is the time before sample i.
const selfUs = new Map();
profile.samples.forEach((id, i) => selfUs.set(id, (selfUs.get(id) ?? 0) + (profile.timeDeltas[i] ?? 0)));
const totalUs = [...selfUs.values()].reduce((a, b) => a + b, 0);

/** Where a frame's code lives: a package under node_modules, a project folder, node's own, or V8's. */
function area(url) {
  if (!url) return '(native / V8)';
  if (url.startsWith('node:')) return 'node:' + url.slice(5).split('/')[0];
  const nm = url.lastIndexOf('node_modules/');
  if (nm >= 0) {
    const rest = url.slice(nm + 13).split('/');
    const pkg = rest[0].startsWith('@') ? `${rest[0]}/${rest[1]}` : rest[0];
    // Next.js bundles its dependencies under next/dist/compiled: name the bundled package.
    if (pkg === 'next' && rest[2] === 'compiled') return `next/compiled/${rest[3]}`;
    if (pkg === 'next' && rest[1] === 'dist') return `next/dist/${rest[2]}`;
    return pkg;
  }
  const chunk = url.match(/\.next[^/]*\/server\/(.*)$/);
  if (chunk) return `app build: ${chunk[1].split('/').slice(0, 2).join('/')}`;
  const project = url.match(/\/(scripts|lib|app|models)\/.*$/);
  return project ? project[0].slice(1) : url;
}

const label = (f) => `${f.functionName || '(anonymous)'}  ${area(f.url)}${f.url ? `:${f.lineNumber + 1}` : ''}`;
/** The nearest callers of a node that are named functions, as a short chain (what the flame graph shows above it). */
function callers(id, depth = 4) {
  const chain = [];
  for (let p = parentOf.get(id); p !== undefined && chain.length < depth; p = parentOf.get(p)) {
    const f = nodes.get(p).callFrame;
    if (f.functionName && f.functionName !== '(root)') chain.push(label(f));
  }
  return chain.join(' < ');
}
const byFunction = new Map();
const byArea = new Map();
const callersOf = new Map(); // function -> caller chain -> self time
for (const [id, us] of selfUs) {
  const { callFrame: f } = nodes.get(id);
  const where = area(f.url);
  const name = label(f);
  byFunction.set(name, (byFunction.get(name) ?? 0) + us);
  byArea.set(where, (byArea.get(where) ?? 0) + us);
  const chains = callersOf.get(name) ?? new Map();
  const chain = callers(id);
  chains.set(chain, (chains.get(chain) ?? 0) + us);
  callersOf.set(name, chains);
}

const top = (m) => [...m].sort((a, b) => b[1] - a[1]).slice(0, N);
const pc = (us) => `${((100 * us) / totalUs).toFixed(1).padStart(5)}%`;
console.log(`${file}: ${(totalUs / 1e6).toFixed(1)} s sampled\n\nself time by package or folder:`);
for (const [k, us] of top(byArea)) console.log(`${pc(us)}  ${(us / 1000).toFixed(0).padStart(7)} ms  ${k}`);
console.log('\nself time by function:');
for (const [k, us] of top(byFunction)) {
  console.log(`${pc(us)}  ${(us / 1000).toFixed(0).padStart(7)} ms  ${k}`);
  const [chain, cus] = [...callersOf.get(k)].sort((a, b) => b[1] - a[1])[0];
  if (chain) console.log(`${' '.repeat(20)}mostly from (${((100 * cus) / us).toFixed(0)}%): ${chain}`);
}
