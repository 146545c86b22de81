// The dock as an installable phone app (issue 23): the web app manifest, its icons, the service worker built with
// Serwist's precache list, and the home-screen shortcut's address.
// References:
//   - W3C Web App Manifest: served as application/manifest+json (section "Media type registration"); members
//     name, short_name, start_url, scope, display, icons (src, sizes, type, purpose "any"/"maskable"), shortcuts.
//   - Chromium's installability criteria [memory, as web.dev's "What does it take to be installable?" lists them]:
//     a manifest with name or short_name, icons of 192 and 512 px, a start_url, display standalone, fullscreen,
//     minimal-ui or window-controls-overlay, prefer_related_applications not true; served over a secure origin
//     (localhost counts). The browser test (tests/browser/installed-app.test.ts) asks Chromium itself.
//   - PNG: the IHDR chunk's width and height (ISO/IEC 15948:2004, 11.2.2), read with pngjs.
//   - Service Workers (W3C): a worker's maximum scope is its script's folder unless Service-Worker-Allowed widens it.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { PNG } from 'pngjs';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';

type Icon = { src: string; sizes: string; type: string; purpose?: string };
type Manifest = {
  name: string;
  short_name: string;
  start_url: string;
  scope: string;
  display: string;
  theme_color: string;
  background_color: string;
  icons: Icon[];
  shortcuts: { name: string; url: string }[];
  prefer_related_applications?: boolean;
};

test('the manifest is served as application/manifest+json and meets the installability criteria', async () => {
  const anon = new HttpSession();
  const res = await anon.fetch('/manifest.webmanifest');
  assert.equal(res.status, 200);
  assert.match(res.headers.get('content-type') ?? '', /^application\/manifest\+json/);
  const m = (await res.json()) as Manifest;
  assert.ok(m.name && m.short_name.length <= 12, 'a name, and a short name that fits under a home-screen icon');
  assert.equal(m.start_url, '/home', 'opens at the signed-in home');
  assert.equal(m.scope, '/');
  assert.equal(m.display, 'standalone');
  assert.notEqual(m.prefer_related_applications, true);
  assert.match(m.theme_color, /^#[0-9a-f]{6}$/i);
  assert.match(m.background_color, /^#[0-9a-f]{6}$/i);
  for (const size of [192, 512])
    assert.ok(
      m.icons.some((i) => i.sizes === `${size}x${size}` && i.type === 'image/png' && (i.purpose ?? 'any') === 'any'),
      `an icon of ${size} px for any use`,
    );
  assert.ok(
    m.icons.some((i) => i.purpose === 'maskable'),
    'a maskable icon for launchers that mask',
  );
  assert.deepEqual(
    m.shortcuts.map((s) => s.url),
    ['/inspect/current'],
    'the shortcut opens the dock of the current meeting',
  );

  // Every icon is a PNG of the size it claims, fetched without a session.
  for (const icon of m.icons) {
    const r = await anon.fetch(icon.src);
    assert.equal(r.status, 200, icon.src);
    assert.equal(r.headers.get('content-type'), 'image/png', icon.src);
    const png = PNG.sync.read(Buffer.from(await r.arrayBuffer()));
    assert.equal(`${png.width}x${png.height}`, icon.sizes, icon.src);
  }
  // Every page links it (Next.js's metadata route puts the link in the head).
  const page = await (await anon.fetch('/')).text();
  assert.match(page, /<link rel="manifest" href="\/manifest.webmanifest"/);
});

test("the service worker is served from the root with its precache list, which holds the dock's first-load files", async () => {
  const anon = new HttpSession();
  const res = await anon.fetch('/boreline-sw.js');
  assert.equal(res.status, 200);
  assert.match(res.headers.get('content-type') ?? '', /^text\/javascript/);
  assert.equal(res.headers.get('cache-control'), 'no-cache', 'a new build is seen on the next visit');
  const script = await res.text();
  const precached = new Set([...script.matchAll(/url:"([^"]+)"/g)].map((m) => m[1]));
  assert.ok(precached.size >= 10, `${precached.size} files precached`);
  assert.ok(
    [...precached].every((u) => u.startsWith('/_next/static/') || u.startsWith('/icons/')),
    'build files only',
  );
  assert.ok(precached.has('/icons/boreline-192.png'));
  assert.ok(
    [...precached].some((u) => u.endsWith('.woff2')),
    'the fonts',
  );
  // Built with Serwist: its cache names are in the script.
  assert.match(script, /boreline/);
  assert.match(script, /precache/);

  // Everything listed exists (one missing file would fail the worker's installation).
  for (const u of precached) assert.equal((await anon.fetch(u)).status, 200, u);

  // The dock screen's own first-load scripts and styles, as its HTML names them, are all in the list.
  const scrutineer = new HttpSession();
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
  const dock = await scrutineer.fetch(`/inspect/${DEMO.meetingId}`);
  assert.equal(dock.status, 200);
  const html = await dock.text();
  // (Not the polyfills for browsers without JavaScript modules: a noModule script no phone here loads.)
  const firstLoad = [...html.matchAll(/<(?:script|link)\b[^>]*>/g)]
    .map((m) => m[0])
    .filter((tag) => !/\bnoModule\b/i.test(tag))
    .map((tag) => /(?:src|href)="(\/_next\/static\/[^"]+\.(?:js|css))"/.exec(tag)?.[1])
    .filter((u): u is string => !!u);
  assert.ok(firstLoad.length >= 3, 'the dock names its scripts');
  const missing = firstLoad.filter((u) => !precached.has(u));
  assert.deepEqual(missing, [], 'the dock loads these files that the worker does not precache');
});

test("the shortcut's address opens the dock of a meeting where the person records, else the list; signed out, sign-in", async () => {
  const scrutineer = new HttpSession();
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
  const res = await scrutineer.fetch('/inspect/current');
  assert.equal(res.status, 307);
  const to = new URL(res.headers.get('location') ?? '', 'http://x').pathname;
  const id = /^\/inspect\/([0-9a-f-]{36})$/.exec(to)?.[1];
  assert.ok(id, `a dock: ${to}`);
  const [staff] = await query<{ n: string }>(
    `select count(*) as n from event_staff s join users u on u.id = s.user_id
      where u.email = $1 and s.event_id = $2 and s.role in ('scrutineer', 'chief_scrutineer')`,
    [DEMO.scrutineer, id],
  );
  assert.equal(staff.n, '1', 'a meeting where they inspect');

  const entrant = new HttpSession();
  await entrant.signInWithPassword(DEMO.entrant, DEMO_PASSWORD);
  const e = await entrant.fetch('/inspect/current');
  assert.equal(e.status, 307);
  assert.equal(new URL(e.headers.get('location') ?? '', 'http://x').pathname, '/inspect');

  const anon = await new HttpSession().fetch('/inspect/current');
  assert.ok([302, 307].includes(anon.status), `signed out: ${anon.status}`);
  assert.match(anon.headers.get('location') ?? '', /\/sign-in/);
});
