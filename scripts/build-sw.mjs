// Builds Boreline's service worker after `next build` (npm run build, scripts/test.sh, start.sh and serve.sh run it):
// Next.js 16 builds with Turbopack, which has no service-worker plugin of its own, so this runs over the build's
// output instead. It
//   1. lists the app shell to precache: the build files (scripts, styles) that the scrutineer's screens load
//      first — the signed-in home, the inspect list, the dock and its queue and board — read from each page's
//      client reference manifest, the build's root files, the parts those screens load later (up to a size),
//      the fonts, and the installed app's icons;
//   2. asks @serwist/build (getManifest) for their precache entries (content-hashed build files need no revision;
//      the icons get one from their bytes);
//   3. bundles components/offline/boreline-sw.ts (Serwist's runtime and the dock's outbox sender) with esbuild
//      into <distDir>/boreline-sw.js, the list written in as BORELINE_PRECACHE. GET /boreline-sw.js serves it.
// Every build gives a new file when any listed file changed, so phones see a new version (the update prompt).
import fs from 'node:fs';
import path from 'node:path';
import { build } from 'esbuild';
import { getManifest } from '@serwist/build';

const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), '..');
const distDir = path.join(root, process.env.NEXT_DIST_DIR || '.next');
const out = path.join(distDir, 'boreline-sw.js');

/** The pages whose first-load files make the shell (their folders under <distDir>/server/app). */
export const SHELL_PAGES = [
  '(app)/home',
  '(app)/inspect/(index)',
  '(app)/inspect/[eventId]/(dock)',
  '(app)/inspect/[eventId]/queue',
  '(app)/inspect/[eventId]/board',
];

function fail(message) {
  console.error(`build-sw: ${message}`);
  process.exit(1);
}

if (!fs.existsSync(path.join(distDir, 'BUILD_ID'))) fail(`no build in ${distDir}: run next build first`);

const shell = new Set();
const staticFile = /static\/[\w@%+=.\-/[\]()]+?\.(?:js|css|woff2)(?=["'\\])/g;
for (const page of SHELL_PAGES) {
  const manifest = path.join(distDir, 'server', 'app', page, 'page_client-reference-manifest.js');
  if (!fs.existsSync(manifest)) fail(`${manifest} is missing: has the page moved? Update SHELL_PAGES.`);
  const text = fs.readFileSync(manifest, 'utf8');
  const found = text.match(staticFile) ?? [];
  if (!found.length) fail(`no build files named in ${manifest}`);
  for (const f of found) shell.add(f);
}
const buildManifest = JSON.parse(fs.readFileSync(path.join(distDir, 'build-manifest.json'), 'utf8'));
// Not polyfillFiles: loaded only by browsers without JavaScript modules (nomodule), which no phone here runs.
for (const f of buildManifest.rootMainFiles ?? []) if (/\.(js|css)$/.test(f)) shell.add(f);
for (const f of buildManifest.polyfillFiles ?? []) shell.delete(f);
// Only files that exist (a manifest may name a chunk the build left out); paths relative to distDir.
const shellFiles = [...shell]
  .map((f) => f.replace(/^\/?_next\//, ''))
  .filter((f) => fs.existsSync(path.join(distDir, f)));
if (shellFiles.length < SHELL_PAGES.length) fail(`only ${shellFiles.length} shell files found`);

// The parts these screens load later (next/dynamic, import()): the boat card, the record form, the verdict and
// what they load in turn, found by the chunk names the shell's scripts hold. They are what a scrutineer needs to
// record with no signal, so they are precached too, except a large library (over PART_LIMIT: the camera scanner
// and the photo decoders), which is kept when first used, or when the dock warms its parts at idle.
const PART_LIMIT = 64 * 1024;
const chunkName = /static\/chunks\/[\w.-]+\.js/g;
const leftOut = new Map();
const queue = shellFiles.filter((f) => f.endsWith('.js'));
while (queue.length) {
  for (const [name] of fs.readFileSync(path.join(distDir, queue.pop()), 'utf8').matchAll(chunkName)) {
    if (shellFiles.includes(name) || leftOut.has(name) || !fs.existsSync(path.join(distDir, name))) continue;
    const size = fs.statSync(path.join(distDir, name)).size;
    if (size > PART_LIMIT) leftOut.set(name, size);
    else {
      shellFiles.push(name);
      queue.push(name);
    }
  }
}
for (const [name, size] of leftOut) console.log(`build-sw: not precached (${Math.round(size / 1024)} KiB): ${name}`);

const fromBuild = await getManifest({
  globDirectory: distDir,
  globPatterns: [...shellFiles.map((f) => f.replace(/[[\]()]/g, '\\$&')), 'static/media/*.woff2'],
  // Content-hashed names: the name is the revision.
  dontCacheBustURLsMatching: /^static\//,
  modifyURLPrefix: { 'static/': '/_next/static/' },
  maximumFileSizeToCacheInBytes: 3 * 1024 * 1024,
});
const fromPublic = await getManifest({
  globDirectory: path.join(root, 'public'),
  globPatterns: ['icons/*.png'],
  modifyURLPrefix: { 'icons/': '/icons/' },
});
for (const w of [...fromBuild.warnings, ...fromPublic.warnings]) console.warn(`build-sw: ${w}`);
const entries = [...fromBuild.manifestEntries, ...fromPublic.manifestEntries].map((e) =>
  e.revision ? { url: e.url, revision: e.revision } : { url: e.url, revision: null },
);
const missing = shellFiles.length - fromBuild.manifestEntries.filter((e) => !e.url.endsWith('.woff2')).length;
if (missing !== 0) fail(`${missing} shell file(s) did not make it into the precache list`);

await build({
  entryPoints: [path.join(root, 'components/offline/boreline-sw.ts')],
  outfile: out,
  bundle: true,
  format: 'iife',
  platform: 'browser',
  target: ['chrome100', 'safari15', 'firefox100'],
  minify: true,
  sourcemap: false,
  legalComments: 'none',
  define: { BORELINE_PRECACHE: JSON.stringify(entries), 'process.env.NODE_ENV': '"production"' },
  logLevel: 'warning',
});
const kib = (n) => `${(n / 1024).toFixed(1)} KiB`;
console.log(
  `build-sw: ${path.relative(root, out)} (${kib(fs.statSync(out).size)}), precaching ${entries.length} files, ${kib(
    fromBuild.size + fromPublic.size,
  )}`,
);
