// How a meeting's pages open (lib/server/auth/page-access.ts), page by page: anonymous visitors go
// to sign in, a malformed id is a 404, someone without the permission at that meeting is sent to
// /not-allowed (a board-only official who opens the dock lands on the board), and the meeting's
// staff see the page with the meeting's name.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { randomUUID } from 'node:crypto';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query, closeDb } from '../support/db';

const M = DEMO.meetingId;
const sessions = new Map<string, HttpSession>();
async function as(email: string) {
  if (!sessions.has(email)) {
    const s = new HttpSession();
    const res = await s.signInWithPassword(email, DEMO_PASSWORD);
    assert.ok(res.status < 400 && s.hasCookie(/session-token/), `${email} signs in (${res.status})`);
    sessions.set(email, s);
  }
  return sessions.get(email)!;
}

// Each page with the permission it asks and one of the demo meeting's staff who holds it.
const PAGES = (eventId: string, classId: string) => [
  { path: `/organise/events/${eventId}`, allowed: DEMO.organiser },
  { path: `/organise/events/${eventId}/entries`, allowed: DEMO.organiser },
  { path: `/organise/events/${eventId}/results`, allowed: DEMO.organiser },
  { path: `/organise/events/${eventId}/penalties`, allowed: DEMO.organiser },
  { path: `/organise/events/${eventId}/classes/${classId}`, allowed: DEMO.organiser },
  { path: `/organise/events/${eventId}/classes/${classId}/report`, allowed: DEMO.organiser },
  { path: `/stewards/${eventId}`, allowed: DEMO.steward },
  { path: `/stewards/${eventId}/audit`, allowed: DEMO.steward },
  { path: `/stewards/${eventId}/penalties`, allowed: DEMO.steward },
  { path: `/stewards/${eventId}/interests`, allowed: DEMO.scrutineer },
  { path: `/inspect/${eventId}`, allowed: DEMO.scrutineer },
  { path: `/inspect/${eventId}/board`, allowed: DEMO.chief },
  { path: `/inspect/${eventId}/custody`, allowed: DEMO.steward },
  { path: `/inspect/${eventId}/instruments`, allowed: DEMO.chief },
  { path: `/inspect/${eventId}/reports`, allowed: DEMO.scrutineer },
];

const isRedirectTo = (res: Response, target: RegExp) =>
  [303, 307].includes(res.status) && target.test(new URL(res.headers.get('location') ?? '', 'http://x').pathname);

test.after(closeDb);

test('anonymous visitors are sent to sign in from every meeting page', async () => {
  for (const { path } of PAGES(M, randomUUID())) {
    const res = await new HttpSession().fetch(path);
    assert.ok(isRedirectTo(res, /^\/sign-in$/), `${path}: ${res.status} ${res.headers.get('location')}`);
  }
});

test("a malformed meeting or class id is a 404, even for the meeting's staff", async () => {
  const [cls] = await query<{ id: string }>('select id from race_classes where event_id = $1 limit 1', [M]);
  for (const { path, allowed } of [
    ...PAGES('not-a-meeting', cls.id),
    ...PAGES(M, 'not-a-class').filter((p) => p.path.includes('not-a-class')),
  ]) {
    const res = await (await as(allowed)).fetch(path);
    assert.equal(res.status, 404, path);
  }
});

test("without the permission at that meeting: /not-allowed (an entrant; staff of the meeting at another meeting's id)", async () => {
  const [cls] = await query<{ id: string }>('select id from race_classes where event_id = $1 limit 1', [M]);
  for (const { path } of PAGES(M, cls.id)) {
    const res = await (await as(DEMO.entrant)).fetch(path);
    assert.ok(isRedirectTo(res, /^\/not-allowed$/), `entrant ${path}: ${res.status} ${res.headers.get('location')}`);
  }
  for (const { path, allowed } of PAGES(randomUUID(), randomUUID())) {
    const res = await (await as(allowed)).fetch(path);
    assert.ok(isRedirectTo(res, /^\/not-allowed$/), `${allowed} at an unknown meeting ${path}: ${res.status}`);
  }
});

test('the dock sends a board-only official to the board and anyone else without it to /not-allowed', async () => {
  const organiser = await (await as(DEMO.organiser)).fetch(`/inspect/${M}`);
  assert.ok(
    isRedirectTo(organiser, new RegExp(`^/inspect/${M}/board$`)),
    `organiser: ${organiser.status} ${organiser.headers.get('location')}`,
  );
  const steward = await (await as(DEMO.steward)).fetch(`/inspect/${M}`);
  assert.ok(isRedirectTo(steward, /^\/not-allowed$/), `steward: ${steward.status}`);
});

test("the meeting's staff open each page and see the meeting's name where the page shows it", async () => {
  const [event] = await query<{ name: string }>('select name from events where id = $1', [M]);
  const [cls] = await query<{ id: string }>('select id from race_classes where event_id = $1 order by code limit 1', [
    M,
  ]);
  for (const { path, allowed } of PAGES(M, cls.id)) {
    const res = await (await as(allowed)).fetch(path);
    const html = await res.text();
    assert.ok(res.status === 200, `${allowed} ${path}: ${res.status}`);
    if (/\/(entries|audit|penalties|reports|board|custody|instruments)$|\/inspect\/[^/]+$/.test(path))
      assert.ok(html.includes(event.name.replace(/&/g, '&amp;')), `${path} names the meeting`);
  }
});

// Each area's first page (issue 14, item 5: a loading.tsx must not cost a page its status). Statuses
// per RFC 9110: §15.4.8 307 Temporary Redirect, §15.3.1 200 OK.
test('the area index pages keep their statuses: sign in first, /not-allowed without the role for organise and administration', async () => {
  const INDEXES = ['/inspect', '/organise', '/stewards', '/protests', '/appeals', '/series', '/admin'];
  for (const path of INDEXES) {
    const res = await new HttpSession().fetch(path);
    assert.ok(isRedirectTo(res, /^\/sign-in$/), `anonymous ${path}: ${res.status} ${res.headers.get('location')}`);
  }
  const expected: [string, string, 200 | '/not-allowed'][] = [
    [DEMO.entrant, '/inspect', 200],
    [DEMO.entrant, '/stewards', 200],
    [DEMO.entrant, '/protests', 200],
    [DEMO.entrant, '/appeals', 200],
    [DEMO.appealBody, '/appeals', 200],
    [DEMO.entrant, '/series', 200],
    [DEMO.steward, '/series', 200],
    [DEMO.entrant, '/organise', '/not-allowed'],
    [DEMO.steward, '/organise', '/not-allowed'],
    [DEMO.organiser, '/organise', 200],
    [DEMO.entrant, '/admin', '/not-allowed'],
    [DEMO.organiser, '/admin', '/not-allowed'],
    [DEMO.admin, '/admin', 200],
  ];
  for (const [email, path, want] of expected) {
    const res = await (await as(email)).fetch(path);
    if (want === 200) assert.equal(res.status, 200, `${email} ${path}`);
    else
      assert.ok(isRedirectTo(res, /^\/not-allowed$/), `${email} ${path}: ${res.status} ${res.headers.get('location')}`);
  }
  // The series index lists the person's own series only: the demo steward is the demo series' steward.
  const mine = await (await (await as(DEMO.steward)).fetch('/series')).text();
  assert.match(mine, /Fellside Sprint Series/);
  assert.match(mine, /series steward/);
  const none = await (await (await as(DEMO.entrant)).fetch('/series')).text();
  assert.match(none, /not an official of any series/);
  assert.doesNotMatch(none, /Fellside Sprint Series/);
});

// RFC 9110 §15.5.5: 404 Not Found, for ids that are well formed but name nothing the caller may see.
test('a well-formed id that names no class or protest there is a 404', async () => {
  const paths: [string, string][] = [
    [DEMO.organiser, `/organise/events/${M}/classes/${randomUUID()}`],
    [DEMO.organiser, `/organise/events/${M}/classes/${randomUUID()}/report`],
    [DEMO.steward, `/stewards/${M}/protests/${randomUUID()}`],
    [DEMO.steward, `/stewards/${M}/protests/not-a-protest`],
    [DEMO.entrant, `/protests/${randomUUID()}`],
    [DEMO.entrant, '/protests/not-a-protest'],
    [DEMO.entrant, `/appeals/${randomUUID()}`],
    [DEMO.appealBody, `/appeals/${randomUUID()}`],
    [DEMO.appealBody, '/appeals/not-an-appeal'],
  ];
  for (const [email, path] of paths) {
    const res = await (await as(email)).fetch(path);
    assert.equal(res.status, 404, `${email} ${path}`);
  }
  const anonymous = await new HttpSession().fetch(`/protests/${randomUUID()}`);
  assert.ok(isRedirectTo(anonymous, /^\/sign-in$/), `anonymous protest: ${anonymous.status}`);
});
