// The layout rule for models/: models import nothing from lib/ (stored shapes live in
// models/shapes/), and models/shapes/ is pure: zod and its own files only, so lib/core, scripts
// and the browser can use the shapes without pulling in Sequelize.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import fs from 'node:fs';
import path from 'node:path';

const ROOT = path.resolve(__dirname, '../../..');
const MODELS = path.join(ROOT, 'models');

function sourceFiles(dir: string): string[] {
  return fs
    .readdirSync(dir, { withFileTypes: true })
    .flatMap((d) =>
      d.isDirectory()
        ? sourceFiles(path.join(dir, d.name))
        : /\.(ts|tsx|js|cjs|mjs)$/.test(d.name)
          ? [path.join(dir, d.name)]
          : [],
    );
}

/** Every module a file names: static imports and re-exports, dynamic import() and require(). */
const SPECIFIER = /(?:\bfrom\s*|\bimport\s*\(\s*|\brequire\s*\(\s*|^\s*import\s+)['"]([^'"]+)['"]/gm;
const specifiersIn = (text: string) => [...text.matchAll(SPECIFIER)].map((m) => m[1]);
const specifiers = (file: string) => specifiersIn(fs.readFileSync(file, 'utf8'));

/** Where a specifier points inside the repository (null for a package). */
function target(file: string, spec: string): string | null {
  if (spec.startsWith('@/')) return path.join(ROOT, spec.slice(2));
  if (spec.startsWith('.')) return path.resolve(path.dirname(file), spec);
  return null;
}

test('the reader of imports sees every form a model could use', () => {
  const text = `import type { A } from '@/lib/a';\nexport { B } from "../lib/b";\nconst c = await import('../lib/c');\nconst d = require('../lib/d');\nimport '../lib/e';`;
  assert.deepEqual(specifiersIn(text), ['@/lib/a', '../lib/b', '../lib/c', '../lib/d', '../lib/e']);
});

test('no file in models/ imports from lib/', () => {
  const lib = path.join(ROOT, 'lib') + path.sep;
  const offending = sourceFiles(MODELS).flatMap((f) =>
    specifiers(f)
      .filter((s) => (target(f, s) ?? '').startsWith(lib))
      .map((s) => `${path.relative(ROOT, f)} -> ${s}`),
  );
  assert.deepEqual(offending, []);
});

test('models/shapes/ imports only zod and its own files', () => {
  const shapes = path.join(MODELS, 'shapes') + path.sep;
  const offending = sourceFiles(shapes).flatMap((f) =>
    specifiers(f)
      .filter((s) => {
        const t = target(f, s);
        return t === null ? s !== 'zod' : !t.startsWith(shapes);
      })
      .map((s) => `${path.relative(ROOT, f)} -> ${s}`),
  );
  assert.deepEqual(offending, []);
});
