// scripts/compile-hints.mjs: the build's scripts start with V8's explicit compile hint, once, and their source maps
// still point at the same original code. The magic comment `//# allFunctionsCalledOnLoad` on a script's first line:
// V8 blog, "Giving V8 a heads-up: faster JavaScript startup with explicit compile hints" (2025) [memory]. Source
// maps: ECMA-426 (Source map format), "mappings" (';' separates generated lines) and index maps ("sections", each
// with an offset); read back with source-map-js, a general-purpose source map reader from the registry.
import { test, after } from 'node:test';
import assert from 'node:assert/strict';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { spawnSync } from 'node:child_process';
import { SourceMapConsumer, SourceMapGenerator } from 'source-map-js';
import { addHint, HINT } from '../../../scripts/compile-hints.mjs';

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'compile-hints-'));
after(() => fs.rmSync(dir, { recursive: true, force: true }));

/** A two-line script whose identifier `answer` (line 2, column 4) maps to src/answer.ts line 7, column 2. */
function writeScript(name: string, map: object | null) {
  const code = `var x=1;\nvar answer=42;\n${map ? `//# sourceMappingURL=${name}.map` : ''}`;
  fs.writeFileSync(path.join(dir, name), code);
  if (map) fs.writeFileSync(path.join(dir, `${name}.map`), JSON.stringify(map));
  return path.join(dir, name);
}

function plainMap() {
  const g = new SourceMapGenerator({ file: 'a.js' });
  g.addMapping({ generated: { line: 1, column: 4 }, original: { line: 3, column: 0 }, source: 'src/x.ts', name: 'x' });
  g.addMapping({
    generated: { line: 2, column: 4 },
    original: { line: 7, column: 2 },
    source: 'src/answer.ts',
    name: 'answer',
  });
  return g.toJSON();
}

const consumerOf = (file: string) =>
  new SourceMapConsumer(JSON.parse(fs.readFileSync(`${file}.map`, 'utf8')) as never) as unknown as {
    originalPositionFor(p: { line: number; column: number }): {
      source: string | null;
      line: number | null;
      name: string | null;
    };
  };

test('the hint is the first line, the code follows unchanged, and a second run changes nothing', () => {
  const file = writeScript('plain.js', null);
  const before = fs.readFileSync(file, 'utf8');
  assert.equal(addHint(file), true);
  const after = fs.readFileSync(file, 'utf8');
  assert.equal(HINT, '//# allFunctionsCalledOnLoad\n');
  assert.equal(after, HINT + before);
  assert.equal(addHint(file), false);
  assert.equal(fs.readFileSync(file, 'utf8'), after);
});

test('a source map moves down one line: the same token maps to the same original place', () => {
  const file = writeScript('mapped.js', plainMap());
  assert.deepEqual(
    (({ source, line, name }) => ({ source, line, name }))(
      consumerOf(file).originalPositionFor({ line: 2, column: 4 }),
    ),
    { source: 'src/answer.ts', line: 7, name: 'answer' },
  );
  addHint(file);
  // The hinted file's line 3 is the old line 2.
  const moved = consumerOf(file).originalPositionFor({ line: 3, column: 4 });
  assert.deepEqual(
    { source: moved.source, line: moved.line, name: moved.name },
    { source: 'src/answer.ts', line: 7, name: 'answer' },
  );
  // Nothing maps on the hint's own line.
  assert.equal(consumerOf(file).originalPositionFor({ line: 1, column: 4 }).source, null);
  // Running again leaves the map alone too.
  const map = fs.readFileSync(`${file}.map`, 'utf8');
  addHint(file);
  assert.equal(fs.readFileSync(`${file}.map`, 'utf8'), map);
});

test('an index map (sections) moves each section down one line', () => {
  const section = plainMap();
  const file = writeScript('indexed.js', { version: 3, sections: [{ offset: { line: 0, column: 0 }, map: section }] });
  addHint(file);
  const map = JSON.parse(fs.readFileSync(`${file}.map`, 'utf8'));
  assert.deepEqual(map.sections[0].offset, { line: 1, column: 0 });
  const moved = consumerOf(file).originalPositionFor({ line: 3, column: 4 });
  assert.deepEqual(
    { source: moved.source, line: moved.line, name: moved.name },
    { source: 'src/answer.ts', line: 7, name: 'answer' },
  );
});

test('a map named but missing is reported, and a debugId line after the map comment is allowed for', () => {
  const missing = path.join(dir, 'missing.js');
  fs.writeFileSync(missing, 'var a=1;\n//# sourceMappingURL=missing.js.map');
  const unshifted: string[] = [];
  assert.equal(addHint(missing, unshifted), true);
  assert.deepEqual(unshifted, [missing]);

  const withId = writeScript('with-id.js', plainMap());
  fs.appendFileSync(withId, '\n//# debugId=0d1e2f30-0000-4000-8000-000000000000');
  const none: string[] = [];
  addHint(withId, none);
  assert.deepEqual(none, []);
  const moved = consumerOf(withId).originalPositionFor({ line: 3, column: 4 });
  assert.equal(moved.name, 'answer');
});

test('run as a script: every .js under static/chunks (subfolders too) once; no build is an error', () => {
  const dist = path.join(dir, 'dist');
  fs.mkdirSync(path.join(dist, 'static', 'chunks', 'sub'), { recursive: true });
  fs.writeFileSync(path.join(dist, 'BUILD_ID'), 'x');
  fs.writeFileSync(path.join(dist, 'static', 'chunks', 'a.js'), 'a();');
  fs.writeFileSync(path.join(dist, 'static', 'chunks', 'sub', 'b.js'), 'b();');
  fs.writeFileSync(path.join(dist, 'static', 'chunks', 'c.css'), 'p{}');
  const run = (distDir: string) =>
    spawnSync(process.execPath, ['scripts/compile-hints.mjs'], {
      env: { ...process.env, NEXT_DIST_DIR: distDir },
      encoding: 'utf8',
    });
  const first = run(dist);
  assert.equal(first.status, 0, first.stderr);
  assert.match(first.stdout, /2 scripts, 2 marked/);
  assert.equal(fs.readFileSync(path.join(dist, 'static', 'chunks', 'sub', 'b.js'), 'utf8'), `${HINT}b();`);
  assert.equal(fs.readFileSync(path.join(dist, 'static', 'chunks', 'c.css'), 'utf8'), 'p{}');
  assert.match(run(dist).stdout, /2 scripts, 0 marked/);
  const none = run(path.join(dir, 'no-build'));
  assert.equal(none.status, 1);
  assert.match(none.stderr, /no build in/);
});
