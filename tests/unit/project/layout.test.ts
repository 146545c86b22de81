// The layout rule (DEVELOPERS.md, "Layout and where things go"), checked on the source itself:
// - no import cycles anywhere in lib/, models/, app/, components/, scripts/, tests/ or the root files (type
//   imports count: a cycle of types is still a knot a reader has to untie);
// - lib/core is pure: no value import of models/ (but models/shapes/, zod only), lib/server/, 'server-only', Next.js, React, the
//   database, mail, payments, storage or node's file, network and process modules (types are fine);
// - every file in lib/server starts with `import 'server-only'`, except the few loaded where that
//   condition is not set (listed below, each with who loads it);
// - models/ import nothing from lib/.
// Imports are read with the TypeScript compiler's own parser, not with regular expressions.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import fs from 'node:fs';
import path from 'node:path';
import ts from 'typescript';

const ROOT = path.resolve(__dirname, '../../..');
const SCANNED = ['lib', 'models', 'app', 'components'];

type Import = { specifier: string; isTypeOnly: boolean; line: number; text: string };
type SourceFile = { file: string; imports: Import[] };

function listSources(dir: string): string[] {
  const out: string[] = [];
  for (const entry of fs.readdirSync(path.join(ROOT, dir), { withFileTypes: true })) {
    const rel = path.posix.join(dir, entry.name);
    if (entry.isDirectory()) out.push(...listSources(rel));
    else if (/\.(ts|tsx)$/.test(entry.name) && !entry.name.endsWith('.d.ts')) out.push(rel);
  }
  return out;
}

/** Every import, re-export and dynamic import() of a file, with whether it is erased at compile time. */
function readImports(file: string, source: string): Import[] {
  const sf = ts.createSourceFile(
    file,
    source,
    ts.ScriptTarget.Latest,
    true,
    file.endsWith('.tsx') ? ts.ScriptKind.TSX : ts.ScriptKind.TS,
  );
  const imports: Import[] = [];
  const add = (node: ts.Node, specifier: ts.Expression, isTypeOnly: boolean) => {
    if (!ts.isStringLiteralLike(specifier)) return;
    const line = sf.getLineAndCharacterOfPosition(node.getStart(sf)).line + 1;
    imports.push({ specifier: specifier.text, isTypeOnly, line, text: node.getText(sf).split('\n')[0] });
  };
  const visit = (node: ts.Node) => {
    if (ts.isImportDeclaration(node)) {
      const clause = node.importClause;
      // `import { type A, type B } from 'x'` is erased too (no verbatimModuleSyntax in tsconfig.json).
      const named =
        clause?.namedBindings && ts.isNamedImports(clause.namedBindings) ? clause.namedBindings.elements : undefined;
      const allNamedAreTypes = !!named && named.length > 0 && named.every((e) => e.isTypeOnly);
      const isTypeOnly = !!clause && (clause.isTypeOnly || (!clause.name && allNamedAreTypes));
      add(node, node.moduleSpecifier, isTypeOnly);
    } else if (ts.isExportDeclaration(node) && node.moduleSpecifier) {
      const named = node.exportClause && ts.isNamedExports(node.exportClause) ? node.exportClause.elements : undefined;
      add(
        node,
        node.moduleSpecifier,
        node.isTypeOnly || (!!named && named.length > 0 && named.every((e) => e.isTypeOnly)),
      );
    } else if (ts.isCallExpression(node) && node.expression.kind === ts.SyntaxKind.ImportKeyword && node.arguments[0]) {
      add(node, node.arguments[0], false);
    } else if (ts.isImportTypeNode(node) && ts.isLiteralTypeNode(node.argument)) {
      add(node, node.argument.literal, true);
    }
    ts.forEachChild(node, visit);
  };
  visit(sf);
  return imports;
}

/** The project file an import names (relative or "@/"), or null for a package. */
function resolveImport(fromFile: string, specifier: string): string | null {
  let base: string;
  if (specifier.startsWith('@/')) base = specifier.slice(2);
  else if (specifier.startsWith('.'))
    base = path.posix.normalize(path.posix.join(path.posix.dirname(fromFile), specifier));
  else return null;
  for (const candidate of [
    base,
    `${base}.ts`,
    `${base}.tsx`,
    `${base}/index.ts`,
    `${base}/index.tsx`,
    `${base}.d.ts`,
  ]) {
    const full = path.join(ROOT, candidate);
    if (fs.existsSync(full) && fs.statSync(full).isFile()) return candidate;
  }
  return base; // an unresolved project path still counts as that path (and fails to build anyway)
}

/** Each cycle in a graph, as a path that starts and ends at the same node (Tarjan's strongly connected components). */
function findCycles(graph: Map<string, string[]>): string[][] {
  let index = 0;
  const indexOf = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const onStack = new Set<string>();
  const components: string[][] = [];
  const connect = (v: string) => {
    indexOf.set(v, index);
    low.set(v, index++);
    stack.push(v);
    onStack.add(v);
    for (const w of graph.get(v) ?? []) {
      if (!indexOf.has(w)) {
        connect(w);
        low.set(v, Math.min(low.get(v)!, low.get(w)!));
      } else if (onStack.has(w)) low.set(v, Math.min(low.get(v)!, indexOf.get(w)!));
    }
    if (low.get(v) === indexOf.get(v)) {
      const component: string[] = [];
      let w: string;
      do {
        w = stack.pop()!;
        onStack.delete(w);
        component.push(w);
      } while (w !== v);
      if (component.length > 1 || (graph.get(v) ?? []).includes(v)) components.push(component);
    }
  };
  for (const v of [...graph.keys()].sort()) if (!indexOf.has(v)) connect(v);
  // One readable cycle per component: the shortest way from its first file back to itself.
  return components.map((component) => {
    const inside = new Set(component);
    const start = [...component].sort()[0];
    const previous = new Map<string, string>();
    const queue = [start];
    while (queue.length) {
      const v = queue.shift()!;
      for (const w of graph.get(v) ?? []) {
        if (!inside.has(w)) continue;
        if (w === start) {
          const cycle = [start];
          for (let at: string | undefined = v; at && at !== start; at = previous.get(at)) cycle.splice(1, 0, at);
          return [...cycle, start];
        }
        if (!previous.has(w)) {
          previous.set(w, v);
          queue.push(w);
        }
      }
    }
    return [...component, component[0]];
  });
}

const sources: SourceFile[] = SCANNED.flatMap(listSources).map((file) => ({
  file,
  imports: readImports(file, fs.readFileSync(path.join(ROOT, file), 'utf8')),
}));

// Packages and modules lib/core may not load at run time (a type import of any of them is fine).
const CORE_FORBIDDEN = [
  /^server-only$/,
  /^next(\/|$)/,
  /^react(-dom)?(\/|$)/,
  /^sequelize(\/|$)/,
  /^pg(\/|$)/,
  /^pg-hstore$/,
  /^nodemailer(\/|$)/,
  /^stripe(\/|$)/,
  /^@aws-sdk\//,
  /^(node:)?(fs|fs\/promises|net|http|https|http2|child_process)$/,
];

// Files in lib/server without `import 'server-only'`: each is loaded somewhere the react-server
// condition is not set, where that import would throw (plain tsx scripts and unit tests, proxy.ts,
// instrumentation.ts). The test checks that something there really imports each one, so an entry
// cannot outlive its reason.
const SERVER_ONLY_EXEMPT: Record<string, string> = {
  'lib/server/config/env.ts':
    'parsed at server start by instrumentation.ts (outside the react-server layer), read by the proxy through the CSP module, unit-tested',
  'lib/server/config/published-values.ts':
    'read by the npm run serve checks (scripts/serve-config.ts) and the secret generator (scripts/env-secrets.ts), plain tsx scripts',
  'lib/server/auth/passwords.ts':
    "hashes the first administrator's password in scripts/create-first-admin.ts, a plain tsx script; unit-tested",
  'lib/server/http/content-security-policy.ts':
    "builds each page's policy in proxy.ts, which is not bundled for the react-server layer",
  'lib/server/http/client-address.ts': 'unit-tested without the react-server condition',
  'lib/server/http/read-body.ts': 'unit-tested without the react-server condition',
  'lib/server/storage/inspect-upload.ts': 'unit-tested without the react-server condition',
  'lib/server/chain/chain-db.ts':
    'the record chain on a plain pg client: driven by tests/integration/record-chain.test.ts with its own connections',
};
const OUTSIDE_REACT_SERVER = ['proxy.ts', 'instrumentation.ts', ...['scripts', 'tests'].flatMap(listSources)];

test('the scan reads the whole source tree', () => {
  for (const dir of SCANNED)
    assert.ok(sources.filter((s) => s.file.startsWith(`${dir}/`)).length >= 5, `${dir}/ has source files`);
  assert.ok(sources.reduce((n, s) => n + s.imports.length, 0) > 500, 'imports were found');
});

test('the cycle finder finds a cycle and prints it as a path, and finds none in a tree', () => {
  const knot = new Map([
    ['a', ['b']],
    ['b', ['c']],
    ['c', ['a', 'd']],
    ['d', []],
    ['e', ['e']],
  ]);
  const printed = findCycles(knot)
    .map((c) => c.join(' -> '))
    .sort();
  assert.deepEqual(printed, ['a -> b -> c -> a', 'e -> e']);
  assert.deepEqual(
    findCycles(
      new Map([
        ['a', ['b', 'c']],
        ['b', ['c']],
        ['c', []],
      ]),
    ),
    [],
  );
});

test('the import reader tells type-only imports from value imports', () => {
  const imports = readImports(
    'x.ts',
    [
      "import type { A } from './a';",
      "import { type B, type C } from './b';",
      "import { type D, e } from './d';",
      "import f from './f';",
      "import 'server-only';",
      "export type { G } from './g';",
      "export { h } from './h';",
      "const i = () => import('./i');",
      "type J = import('./j').J;",
    ].join('\n'),
  );
  assert.deepEqual(
    imports.map((i) => [i.specifier, i.isTypeOnly]),
    [
      ['./a', true],
      ['./b', true],
      ['./d', false],
      ['./f', false],
      ['server-only', false],
      ['./g', true],
      ['./h', false],
      ['./i', false],
      ['./j', true],
    ],
  );
});

test('no import cycles anywhere: lib/, models/, app/, components/, scripts/, tests/ and the root files (type imports included)', () => {
  // This is the project's one cycle check (ESLint's import/no-cycle walked the graph again from every file:
  // 95 of the 110 seconds `npm run lint` took).
  const everywhere = [
    ...sources,
    ...OUTSIDE_REACT_SERVER.map((file) => ({
      file,
      imports: readImports(file, fs.readFileSync(path.join(ROOT, file), 'utf8')),
    })),
  ];
  const known = new Set(everywhere.map((s) => s.file));
  assert.ok(known.size > sources.length + 100, 'scripts/ and tests/ were read too');
  const graph = new Map<string, string[]>();
  for (const s of everywhere) {
    graph.set(s.file, [
      ...new Set(
        s.imports.map((i) => resolveImport(s.file, i.specifier)).filter((f): f is string => !!f && known.has(f)),
      ),
    ]);
  }
  const cycles = findCycles(graph);
  assert.deepEqual(
    cycles.map((c) => c.join(' -> ')),
    [],
    `import cycles:\n${cycles.map((c) => `  ${c.join(' -> ')}`).join('\n')}`,
  );
});

test('lib/core loads nothing with I/O, a framework or server-only code (type imports allowed)', () => {
  const problems: string[] = [];
  for (const s of sources.filter((x) => x.file.startsWith('lib/core/'))) {
    for (const i of s.imports) {
      if (i.isTypeOnly) continue;
      const target = resolveImport(s.file, i.specifier);
      // models/shapes/ holds the stored documents' zod shapes, pure by its own test (zod and its own files only).
      const isForbiddenFile =
        !!target &&
        ((target.startsWith('models/') && !target.startsWith('models/shapes/')) || target.startsWith('lib/server/'));
      const isForbiddenPackage = !target && CORE_FORBIDDEN.some((re) => re.test(i.specifier));
      if (isForbiddenFile || isForbiddenPackage) problems.push(`${s.file}:${i.line}: ${i.text}`);
    }
  }
  assert.deepEqual(problems, [], `lib/core must stay pure:\n${problems.join('\n')}`);
});

test("every lib/server file imports 'server-only', except the listed few, each for its reason", () => {
  const missing: string[] = [];
  for (const s of sources.filter((x) => x.file.startsWith('lib/server/'))) {
    const hasMark = s.imports.some((i) => i.specifier === 'server-only' && !i.isTypeOnly);
    const exempt = SERVER_ONLY_EXEMPT[s.file];
    if (!hasMark && !exempt) missing.push(s.file);
    if (hasMark && exempt) missing.push(`${s.file} is marked server-only: take it off the exempt list`);
  }
  assert.deepEqual(missing, [], `add import 'server-only' (or list the file with its reason):\n${missing.join('\n')}`);
  for (const [file, reason] of Object.entries(SERVER_ONLY_EXEMPT)) {
    assert.ok(reason.length > 10, file);
    const loaders = OUTSIDE_REACT_SERVER.filter((f) =>
      readImports(f, fs.readFileSync(path.join(ROOT, f), 'utf8')).some(
        (i) => !i.isTypeOnly && resolveImport(f, i.specifier) === file,
      ),
    );
    assert.ok(
      loaders.length > 0,
      `nothing outside the react-server layer imports ${file}: mark it import 'server-only' instead`,
    );
  }
});

test('models/ import nothing from lib/', () => {
  const found: string[] = [];
  for (const s of sources.filter((x) => x.file.startsWith('models/'))) {
    for (const i of s.imports) {
      const target = resolveImport(s.file, i.specifier);
      if (target?.startsWith('lib/')) found.push(`${s.file}: ${i.text}`);
    }
  }
  assert.deepEqual(found, [], `models must not import lib/:\n${found.join('\n')}`);
});
