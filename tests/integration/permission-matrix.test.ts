// The permission matrix: every route handler, generated from the one permission table
// (lib/core/auth/permissions.ts). For each actor — anonymous, entrant (own and other's data), scrutineer
// assigned and not assigned to the meeting, steward, organiser of this and of another meeting, site
// administrator, a member of the governing body's appeal body (above every meeting), a series' secretary
// and steward (roles scoped to one series, no role at the meeting) — each endpoint must allow or deny as the table says. Allowed means the answer is
// not 401/403 (bodies here are empty, so a 400 is an allowed request refused for its input);
// denied means 401 for anonymous and 403 (or 404 where the resource is hidden) for the rest.
// A route file or method that is not listed below fails the test.
// Runs alone (scripts/test.sh): it adds entries (numbered after the highest), a protest, a penalty and an appeal at
// the demo meeting.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import fs from 'node:fs';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { query } from '../support/db';
import { rolesCan, type Permission, type Role } from '../../lib/core/auth/permissions';
import { ROUTES, SERVER_ACTIONS, type Access, type Ids } from './permission-routes';

const ACTORS = [
  'anonymous',
  'entrantOwn',
  'entrantOther',
  'scrutineer',
  'scrutineerElsewhere',
  'steward',
  'organiser',
  'organiserElsewhere',
  'admin',
  'appealBody',
  'seriesSecretary',
  'seriesSteward',
] as const;
type ActorKey = (typeof ACTORS)[number];

// Roles each actor holds at the demo meeting (what the permission table is asked about).
const ROLES_AT_MEETING: Record<Exclude<ActorKey, 'anonymous'>, Role[]> = {
  entrantOwn: ['entrant'],
  entrantOther: ['entrant'],
  scrutineer: ['entrant', 'scrutineer'],
  scrutineerElsewhere: ['entrant'],
  steward: ['entrant', 'steward'],
  organiser: ['entrant', 'organiser'],
  organiserElsewhere: ['entrant'],
  admin: ['entrant', 'admin'],
  appealBody: ['entrant', 'appeal_body'],
  seriesSecretary: ['entrant'],
  seriesSteward: ['entrant'],
};
// Roles each actor holds in the matrix's series (series-scoped rows ask the table about these).
const ROLES_IN_SERIES: Record<Exclude<ActorKey, 'anonymous'>, Role[]> = {
  ...ROLES_AT_MEETING,
  organiser: ['entrant'], // organises the demo meeting, holds no role in the series
  seriesSecretary: ['entrant', 'series_secretary'],
  seriesSteward: ['entrant', 'series_steward'],
};

const sessions = new Map<ActorKey, HttpSession>();
let ids: Ids;

async function signUpAndIn(prefix: string) {
  const s = new HttpSession();
  const email = uniqueEmail(prefix);
  await s.json('/api/accounts', { name: `Matrix ${prefix}`, email, password: 'matrix-password-1' });
  await s.signInWithPassword(email, 'matrix-password-1');
  const [{ id }] = await query<{ id: string }>('select id from users where email = $1', [email]);
  return { s, id };
}

before(async () => {
  sessions.set('anonymous', new HttpSession());
  for (const [key, email] of [
    ['entrantOwn', DEMO.entrant],
    ['scrutineer', DEMO.scrutineer],
    ['steward', DEMO.steward],
    ['organiser', DEMO.organiser],
    ['admin', DEMO.admin],
    ['appealBody', DEMO.appealBody],
  ] as const) {
    const s = new HttpSession();
    assert.equal((await s.signInWithPassword(email, DEMO_PASSWORD)).status, 200, email);
    sessions.set(key, s);
  }
  const other = await signUpAndIn('other');
  sessions.set('entrantOther', other.s);
  // Staff of a different meeting of a different club.
  const [{ id: clubId }] = await query<{ id: string }>(
    `insert into organisations (name, slug) values ('Matrix Club', $1) returning id`,
    [`matrix-${randomUUID().slice(0, 8)}`],
  );
  const [{ id: otherEvent }] = await query<{ id: string }>(
    `insert into events (organisation_id, name, slug, venue, starts_on, ends_on, time_zone) values ($1, 'Matrix Meeting', $2, 'Elsewhere', '2027-06-01', '2027-06-01', 'UTC') returning id`,
    [clubId, `matrix-${randomUUID().slice(0, 8)}`],
  );
  const scr = await signUpAndIn('scr-elsewhere');
  await query(`insert into event_staff (event_id, user_id, role) values ($1, $2, 'scrutineer')`, [otherEvent, scr.id]);
  sessions.set('scrutineerElsewhere', scr.s);
  const org = await signUpAndIn('org-elsewhere');
  await query(`insert into event_staff (event_id, user_id, role) values ($1, $2, 'organiser')`, [otherEvent, org.id]);
  await query(`insert into organisation_members (organisation_id, user_id, role) values ($1, $2, 'organiser')`, [
    clubId,
    org.id,
  ]);
  sessions.set('organiserElsewhere', org.s);

  const [own] = await query<{ entry_id: string; boat_id: string; class_id: string }>(
    `select e.id as entry_id, e.boat_id, e.class_id from entries e join users u on u.id = e.entrant_id where u.email = $1 and e.event_id = $2 limit 1`,
    [DEMO.entrant, DEMO.meetingId],
  );
  const [tag] = await query<{ token: string }>(
    'select token from boat_tags where boat_id = $1 and retired_at is null',
    [own.boat_id],
  );
  const [race] = await query<{ race_number: number }>('select race_number from entries where id = $1', [own.entry_id]);
  // A document of the demo entrant's boat, uploaded through the real route.
  const form = new FormData();
  form.append('kind', 'dyno_sheet');
  form.append(
    'file',
    new Blob([Buffer.from('%PDF-1.4\n%matrix\n1 0 obj<<>>endobj\ntrailer<<>>\n%%EOF\n')], { type: 'application/pdf' }),
    'dyno.pdf',
  );
  const up = await sessions
    .get('entrantOwn')!
    .fetch(`/api/boats/${own.boat_id}/documents`, { method: 'POST', body: form });
  const upBody = await up.json();
  assert.equal(up.status, 201, JSON.stringify(upBody));
  // A scratch class and a spare unpaid entry, so that allowed calls (publish, withdraw) touch nothing other tests use.
  const [{ id: classId }] = await query<{ id: string }>(
    `insert into race_classes (event_id, name, code) values ($1, 'Matrix Scratch', $2) returning id`,
    [DEMO.meetingId, `MX${Math.floor(Math.random() * 9000 + 1000)}`],
  );
  const [{ id: entrantId }] = await query<{ id: string }>('select id from users where email = $1', [DEMO.entrant]);
  const [{ id: spareBoat }] = await query<{ id: string }>(
    `insert into boats (owner_id, name, declared_nozzle_mm, declared_power_kw) values ($1, 'Matrix Spare', 100, 200) returning id`,
    [entrantId],
  );
  const [{ id: spareEntryId }] = await query<{ id: string }>(
    `insert into entries (event_id, class_id, boat_id, entrant_id, race_number, status, fee_minor, currency)
     values ($1, $2, $3, $4, (select coalesce(max(race_number), 0) + 1 from entries where event_id = $1), 'awaiting_payment', 15000, 'NZD') returning id`,
    [DEMO.meetingId, own.class_id, spareBoat, entrantId],
  );
  // The other entrant's boat in the scratch class, and a lodged (fee paid) protest by the demo
  // entrant against it, with a file of evidence uploaded by the protester through the real route.
  const [{ id: otherBoat }] = await query<{ id: string }>(
    `insert into boats (owner_id, name, declared_nozzle_mm, declared_power_kw) values ($1, 'Matrix Other', 100, 200) returning id`,
    [other.id],
  );
  const [{ id: otherEntryId }] = await query<{ id: string }>(
    `insert into entries (event_id, class_id, boat_id, entrant_id, race_number, status, fee_minor, currency)
     values ($1, $2, $3, $4, (select coalesce(max(race_number), 0) + 1 from entries where event_id = $1), 'awaiting_payment', 15000, 'NZD') returning id`,
    [DEMO.meetingId, classId, otherBoat, other.id],
  );
  const [{ id: protestId }] = await query<{ id: string }>(
    `insert into protests (event_id, lodged_by_id, against_entry_id, matter_key, rule_reference, grounds, status, fee_minor, currency, paid_at, window_deadline)
     values ($1, $2, $3, $4, 'Matrix rule 1', 'Matrix grounds', 'lodged', 3000, 'NZD', now(), now() + interval '1 hour') returning id`,
    [DEMO.meetingId, entrantId, otherEntryId, `matrix:${randomUUID()}`],
  );
  const evidenceForm = new FormData();
  evidenceForm.append(
    'file',
    new Blob([Buffer.from('%PDF-1.4\n%matrix evidence\n1 0 obj<<>>endobj\ntrailer<<>>\n%%EOF\n')], {
      type: 'application/pdf',
    }),
    'statement.pdf',
  );
  const ev = await sessions
    .get('entrantOwn')!
    .fetch(`/api/protests/${protestId}/evidence`, { method: 'POST', body: evidenceForm });
  const evBody = await ev.json();
  assert.equal(ev.status, 201, JSON.stringify(evBody));
  // An impeller on the spare boat, for the component routes (its serial is unique per run).
  const [{ id: componentId }] = await query<{ id: string }>(
    `insert into boat_components (kind, maker, serial_number, boat_id, created_by_id) values ('impeller', 'Matrix Works', $1, $2, $3) returning id`,
    [`MX-${randomUUID().slice(0, 8)}`, spareBoat, entrantId],
  );
  // A penalty on the other entrant's boat from that protest (inserted as decided), and the demo entrant's
  // appeal against it, lodged (the fee paid), so the appeal's parties are the two entrants.
  const [{ id: itemId }] = await query<{ id: string }>(
    `insert into penalty_catalogue_items (event_id, code, kind, amount, label, created_by_id)
     values ($1, $2, 'places_deducted', 2, 'Matrix: two places', $3) returning id`,
    [DEMO.meetingId, `MX${randomUUID().slice(0, 6)}`, entrantId],
  );
  const [{ id: stewardId }] = await query<{ id: string }>('select id from users where email = $1', [DEMO.steward]);
  const [{ id: penaltyId }] = await query<{ id: string }>(
    `insert into penalties (event_id, entry_id, catalogue_item_id, code, kind, amount, label, protest_id, reason, decided_by_id)
     values ($1, $2, $3, 'MX2', 'places_deducted', 2, 'Matrix: two places', $4, 'Matrix reason', $5) returning id`,
    [DEMO.meetingId, otherEntryId, itemId, protestId, stewardId],
  );
  const [{ id: appealId }] = await query<{ id: string }>(
    `insert into appeals (event_id, penalty_id, lodged_by_id, grounds, status, fee_minor, currency, paid_at, notice_deadline)
     values ($1, $2, $3, 'Matrix grounds of appeal', 'lodged', 10000, 'NZD', now(), now() + interval '1 hour') returning id`,
    [DEMO.meetingId, penaltyId, entrantId],
  );
  // A series run by its own secretary and steward (people with no role at any meeting).
  const sec = await signUpAndIn('series-secretary');
  const stw = await signUpAndIn('series-steward');
  sessions.set('seriesSecretary', sec.s);
  sessions.set('seriesSteward', stw.s);
  const [{ id: seriesId }] = await query<{ id: string }>(
    `insert into series (name, season, created_by_id) values ($1, 2027, $2) returning id`,
    [`Matrix Series ${randomUUID().slice(0, 8)}`, sec.id],
  );
  await query(
    `insert into series_officials (series_id, user_id, role) values ($1, $2, 'series_secretary'), ($1, $3, 'series_steward')`,
    [seriesId, sec.id, stw.id],
  );
  const [{ id: seriesClassId }] = await query<{ id: string }>(
    `insert into series_classes (series_id, code, name, points_by_position) values ($1, 'MX', 'Matrix', '[10, 5]') returning id`,
    [seriesId],
  );
  ids = {
    seriesId,
    seriesClassId,
    appealId,
    eventId: DEMO.meetingId,
    classId,
    entryId: own.entry_id,
    spareEntryId,
    boatId: own.boat_id,
    tagToken: tag.token,
    raceNumber: race.race_number,
    documentId: upBody.data.id,
    missingId: randomUUID(),
    protestId,
    evidenceId: evBody.data.id,
    componentId,
  };
});

// 'hidden': 403 or 404; 'unseen': exactly 404 (the caller must not learn the thing exists).
function expectedAllowed(access: Access, actor: ActorKey): boolean | 'hidden' | 'unseen' {
  if (access === 'public' || access === 'webhook' || access === 'method-not-allowed' || access === 'skip') return true;
  if (actor === 'anonymous') return false;
  if (access === 'signed-in') return true;
  if (access === 'owner') return actor === 'entrantOwn' ? true : 'hidden';
  if (access === 'owner-or-view-all')
    return actor === 'entrantOwn' || rolesCan(ROLES_AT_MEETING[actor], 'entry.view_all') ? true : 'hidden';
  if ('series' in access) return access.series.some((p) => rolesCan(ROLES_IN_SERIES[actor], p));
  if ('custom' in access) return (access.custom as readonly string[]).includes(actor);
  if ('ownerOr' in access)
    return actor === 'entrantOwn' || access.ownerOr.some((p) => rolesCan(ROLES_AT_MEETING[actor], p)) ? true : 'hidden';
  if ('protest' in access) {
    const roles = ROLES_AT_MEETING[actor];
    const party = actor === 'entrantOwn' || actor === 'entrantOther'; // the protester and the protested entrant
    const sees = party || rolesCan(roles, 'protest.view_all');
    const may =
      access.protest === 'view'
        ? sees
        : access.protest === 'add-evidence'
          ? party || rolesCan(roles, 'protest.decide')
          : access.protest === 'decide'
            ? rolesCan(roles, 'protest.decide')
            : actor === 'entrantOwn';
    return may ? true : sees ? false : 'unseen';
  }
  if ('appeal' in access) {
    const roles = ROLES_AT_MEETING[actor];
    const party = actor === 'entrantOwn' || actor === 'entrantOther'; // the appellant and the penalised entrant
    const hears = rolesCan(roles, 'appeal.hear');
    const sees = party || hears || rolesCan(roles, 'protest.view_all');
    const may = access.appeal === 'view' ? sees : access.appeal === 'pay' ? actor === 'entrantOwn' : hears;
    return may ? true : sees ? false : 'unseen';
  }
  return access.anyOf.some((p: Permission) => rolesCan(ROLES_AT_MEETING[actor], p));
}

function listRouteMethods(): string[] {
  const out: string[] = [];
  const walk = (dir: string) => {
    for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
      const p = path.join(dir, e.name);
      if (e.isDirectory()) walk(p);
      else if (e.name === 'route.ts') {
        const src = fs.readFileSync(p, 'utf8');
        const methods = new Set(
          [
            ...src.matchAll(/export (?:const|async function|function) (GET|POST|PUT|PATCH|DELETE)\b/g),
            ...src.matchAll(/as (GET|POST|PUT|PATCH|DELETE)\b/g),
          ].map((m) => m[1]),
        );
        for (const m of methods) out.push(`${m} ${p.split(path.sep).join('/')}`);
      }
    }
  };
  walk('app');
  return out.sort();
}

test('every route handler and method is in the matrix', () => {
  const listed = new Set(ROUTES.map((r) => `${r.method} ${r.file}`));
  const missing = listRouteMethods().filter((k) => !listed.has(k));
  assert.deepEqual(missing, [], 'add these to tests/integration/permission-routes.ts');
  const stale = [...listed].filter((k) => !listRouteMethods().includes(k));
  assert.deepEqual(stale, [], 'these matrix rows name routes that no longer exist');
});

test('each endpoint allows or denies each actor as the permission table says', async () => {
  const failures: string[] = [];
  for (const r of ROUTES) {
    if (r.access === 'skip') continue;
    for (const actor of ACTORS) {
      const expected = expectedAllowed(r.access, actor);
      const init: RequestInit = { method: r.method };
      if (r.method !== 'GET') Object.assign(init, { headers: { 'content-type': 'application/json' }, body: '{}' });
      const res = await sessions.get(actor)!.fetch(r.path(ids), init);
      await res.arrayBuffer();
      const s = res.status;
      const ok =
        r.access === 'method-not-allowed'
          ? s === 405
          : s >= 500
            ? false
            : expected === true
              ? s !== 401 && s !== 403
              : actor === 'anonymous'
                ? s === 401
                : expected === 'hidden'
                  ? s === 403 || s === 404
                  : expected === 'unseen'
                    ? s === 404
                    : s === 403;
      if (!ok)
        failures.push(
          `${r.method} ${r.path(ids)} as ${actor}: got ${s}, expected ${expected === true ? 'allowed' : 'denied'}`,
        );
    }
  }
  assert.deepEqual(failures, []);
});

test('a protest, appeal or evidence id that does not exist is 404 for everyone signed in, 401 for anyone else', async () => {
  for (const actor of ACTORS) {
    for (const p of [
      `/api/appeals/${ids.missingId}`,
      `/api/appeals/not-an-id`,
      `/api/protests/${ids.missingId}`,
      `/api/protests/${ids.missingId}/evidence`,
      `/api/evidence/${ids.missingId}`,
    ]) {
      const res = await sessions.get(actor)!.fetch(p);
      await res.arrayBuffer();
      assert.equal(res.status, actor === 'anonymous' ? 401 : 404, `${p} as ${actor}`);
    }
  }
});

// Server actions: found in the source ('use server' files) and in the build's manifest, which gives
// each its id. Posted as React's client would (Next-Action header, the arguments [previous state,
// form] encoded as multipart). Anonymous callers are sent to sign-in by the proxy; a session whose
// account no longer exists gets past the proxy and must be refused by the action itself.
function listServerActions(): string[] {
  const out: string[] = [];
  const walk = (dir: string) => {
    for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
      const p = path.join(dir, e.name);
      if (e.isDirectory()) walk(p);
      else if (/\.tsx?$/.test(e.name)) {
        const src = fs.readFileSync(p, 'utf8');
        if (!/^\s*['"]use server['"]/.test(src)) continue;
        for (const m of src.matchAll(/export (?:async function|const) (\w+)/g))
          out.push(`${p.split(path.sep).join('/')}#${m[1]}`);
      }
    }
  };
  walk('app');
  return out.sort();
}

function actionId(file: string, exportedName: string): string {
  const manifest = JSON.parse(
    fs.readFileSync(
      path.join(process.env.NEXT_DIST_DIR ?? '.next', 'server', 'server-reference-manifest.json'),
      'utf8',
    ),
  );
  const found = Object.entries(manifest.node as Record<string, { filename: string; exportedName: string }>).find(
    ([, v]) => v.filename === file && v.exportedName === exportedName,
  );
  assert.ok(found, `${file}#${exportedName} is not in the build's server action manifest`);
  return found[0];
}

async function postAction(s: HttpSession, a: (typeof SERVER_ACTIONS)[number]) {
  const form = new FormData();
  for (const [k, v] of Object.entries(a.fields)) form.append(`1_${k}`, v);
  form.append('0', JSON.stringify([null, '$K1']));
  const res = await s.fetch(a.page, {
    method: 'POST',
    headers: { 'next-action': actionId(a.file, a.exportedName), accept: 'text/x-component' },
    body: form,
  });
  return { res, text: await res.text() };
}

test('every server action is in the matrix', () => {
  const listed = SERVER_ACTIONS.map((a) => `${a.file}#${a.exportedName}`).sort();
  assert.deepEqual(
    listServerActions(),
    listed,
    'add server actions to SERVER_ACTIONS in tests/integration/permission-routes.ts',
  );
});

test('each server action runs for those allowed and refuses everyone else, in the action itself', async () => {
  // A signed-in session for an account that is then removed: the proxy lets it through, the action must not.
  const gone = await signUpAndIn('gone');
  await query('delete from users where id = $1', [gone.id]);
  for (const a of SERVER_ACTIONS) {
    for (const actor of ACTORS) {
      const { res, text } = await postAction(sessions.get(actor)!, a);
      if (actor === 'anonymous') {
        assert.equal(res.status, 307, `${a.exportedName} as anonymous`);
        assert.match(res.headers.get('location') ?? '', /^\/sign-in/);
        continue;
      }
      // Allowed: the action ran and answered about the input ("ok":false with field errors), not about who is asking.
      assert.equal(res.status, 200, `${a.exportedName} as ${actor}: ${text.slice(0, 200)}`);
      assert.match(text, /"ok":false/, `${a.exportedName} as ${actor}`);
      assert.match(text, /"fieldErrors"/, `${a.exportedName} as ${actor}: refused for its input`);
    }
    const { res, text } = await postAction(gone.s, a);
    assert.equal(res.status, 200, text.slice(0, 200));
    assert.match(
      text,
      /"ok":false,"message":"Sign in to do this\."/,
      `${a.exportedName} with the session of a removed account`,
    );
  }
});
