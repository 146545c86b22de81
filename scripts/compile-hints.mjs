// Marks the build's scripts for eager compilation, after `next build` and before
// scripts/build-sw.mjs (which lists the same files for the service worker): npm run build, scripts/test.sh,
// start.sh and serve.sh run it.
//
// A browser compiles most of a script's functions lazily, on the main thread, the first time each is called.
// The framework's start-up calls nearly every module factory in its root files at once, so that compiling lands
// in the page's first long task. V8's explicit compile hint (the magic comment `//# allFunctionsCalledOnLoad` as
// the file's first line; V8 blog, "Giving V8 a heads-up: faster JavaScript startup with explicit compile hints",
// 2025, Chrome 136 and later, both from memory) compiles the whole file eagerly instead, on the background thread that already
// streams and parses it while it downloads. Browsers without it read an ordinary comment.
//
// Every script of the build's static/chunks folder gets the hint. Measured with Lighthouse (bench:pages,
// DEVELOPERS.md): the root files alone (framework, router, chunk runtime) lifted every page by 3 to 15 points;
// the page chunks and the libraries loaded when needed (the charts on the parity report, the calculator's
// engine) lifted the calculator and the report further. A library fetched only when the user asks (the camera)
// is compiled whole when it arrives, off the main thread. Each file is changed once (a file that already starts
// with the hint is left alone, so running this twice changes nothing); its source map, if the build wrote one,
// moves down the same line.
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const HINT = '//# allFunctionsCalledOnLoad\n';

/**
 * Adds the hint to `file` (and shifts its source map one line); false when it was already there. The two writes are
 * not one step: a run stopped between them leaves the map shifted and the script without the hint, and the next run
 * shifts that map again, so a build interrupted here is built again (maps exist only in a profiling build). A file
 * that names a map this cannot shift (inline, missing, an odd form) is hinted anyway and reported in `unshifted`.
 */
export function addHint(file, unshifted = []) {
  const text = fs.readFileSync(file, 'utf8');
  if (text.startsWith(HINT)) return false;
  const mapName = text.match(/[#@] sourceMappingURL=([^\s*]+)\s*(?:\*\/)?\s*(?:\/\/# debugId=\S+\s*)?$/)?.[1];
  if (mapName) {
    const mapFile = mapName.startsWith('data:') ? null : path.join(path.dirname(file), decodeURIComponent(mapName));
    if (mapFile && fs.existsSync(mapFile)) {
      const map = JSON.parse(fs.readFileSync(mapFile, 'utf8'));
      // A mapping's lines are separated by ';' (ECMA-426, "mappings"); an index map's sections each carry their
      // own offset.
      if (Array.isArray(map.sections)) for (const s of map.sections) s.offset.line += 1;
      else map.mappings = ';' + map.mappings;
      fs.writeFileSync(mapFile, JSON.stringify(map));
    } else unshifted.push(file);
  }
  fs.writeFileSync(file, HINT + text);
  return true;
}

function main() {
  const distDir = process.env.NEXT_DIST_DIR || '.next';
  const chunks = path.join(distDir, 'static', 'chunks');
  if (!fs.existsSync(path.join(distDir, 'BUILD_ID')) || !fs.existsSync(chunks)) {
    console.error(`compile-hints: no build in ${distDir}: run next build first`);
    process.exit(1);
  }
  const files = fs.readdirSync(chunks, { recursive: true }).filter((f) => String(f).endsWith('.js'));
  let changed = 0;
  const unshifted = [];
  for (const f of files) if (addHint(path.join(chunks, String(f)), unshifted)) changed++;
  console.log(`compile-hints: ${files.length} scripts, ${changed} marked for eager compilation`);
  if (unshifted.length) {
    console.error(`compile-hints: ${unshifted.length} source maps could not be shifted, e.g. ${unshifted[0]}`);
    // Only a build made for profiling has maps (BORELINE_BROWSER_SOURCEMAPS=1): there, a map a line off misleads.
    if (process.env.BORELINE_BROWSER_SOURCEMAPS === '1') process.exit(1);
  }
}

// Run as a script (not when imported by the unit test); both sides resolved, so symlinks and escapes compare equal.
if (process.argv[1] && fileURLToPath(import.meta.url) === fs.realpathSync(process.argv[1])) main();
