// Issue 15, item 3: components with identity. An owner registers an engine, pump or impeller on a
// boat, edits it, moves it between their boats or takes it off; each step is an append-only event,
// and every change of a boat's set of components is the boat's next declaration version naming them.
// A change after inspection flags re-inspection; the dock finds a boat by a component's serial.
// Through the real HTTP API and database. Makers, models and serials are invented for this test.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { randomBytes } from 'node:crypto';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { query } from '../support/db';
import { waitForMail } from '../support/mail';
import { InspectionMeeting, inspectionBody, rulesWith, type TestEntry } from '../support/inspection-meeting';

const meeting = new InspectionMeeting();
const elsewhere = new InspectionMeeting();
const owner = new HttpSession();
const other = new HttpSession();
const scrutineer = new HttpSession();
const organiser = new HttpSession();
const run = randomBytes(3).toString('hex').toUpperCase();
let ownerEmail = '';
let ownerId = '';
let otherEmail = '';
let classId = '';
let boatA: TestEntry;
let boatB: TestEntry;

type EventView = { action: string; boatId: string | null; details: Record<string, unknown>; recordedBy: string };
type ComponentView = {
  id: string;
  kind: string;
  maker: string;
  model: string;
  serialNumber: string;
  trimCode: string;
  notes: string;
  boatId: string | null;
  history: EventView[];
  seals: { number: string; position: string; lastAction: string }[];
};

async function signUp(s: HttpSession, prefix: string) {
  const email = uniqueEmail(prefix);
  await s.json('/api/accounts', { name: `Components ${prefix}`, email, password: 'components-password-1' });
  assert.equal((await s.signInWithPassword(email, 'components-password-1')).status, 200);
  const [{ id }] = await query<{ id: string }>('select id from users where email = $1', [email]);
  return { email, id };
}

const register = (s: HttpSession, boatId: string, body: Record<string, unknown>) =>
  s.json(`/api/boats/${boatId}/components`, body);
const move = (s: HttpSession, componentId: string, body: Record<string, unknown>) =>
  s.json(`/api/components/${componentId}/move`, body);
const versions = (boatId: string) =>
  query<{ id: string; version: number; created_by_id: string }>(
    'select id, version, created_by_id from boat_declaration_versions where boat_id = $1 order by version',
    [boatId],
  );
/** The serials the boat's latest declaration version names, sorted. */
async function declaredSerials(boatId: string) {
  const rows = await query<{ serial_number: string }>(
    `select c.serial_number from declaration_version_components c
      where c.declaration_version_id = (select id from boat_declaration_versions where boat_id = $1 order by version desc limit 1)
      order by 1`,
    [boatId],
  );
  return rows.map((r) => r.serial_number);
}
async function latestChanges(boatId: string) {
  const res = await owner.fetch(`/api/boats/${boatId}`);
  assert.equal(res.status, 200);
  return ((await res.json()).data.declarationVersions as { version: number; changes: string }[])[0];
}
const boardRow = async (entryId: string) => {
  const res = await meeting.organiser.fetch(`/api/events/${meeting.eventId}/inspections`);
  assert.equal(res.status, 200);
  return ((await res.json()).data.rows as { entryId: string; state: string; declarationChange: string | null }[]).find(
    (r) => r.entryId === entryId,
  )!;
};

before(async () => {
  await meeting.create(`Components Meeting ${run}`, [
    { email: DEMO.scrutineer, role: 'scrutineer' },
    { email: DEMO.chief, role: 'chief_scrutineer' },
  ]);
  await elsewhere.create(`Components Elsewhere ${run}`, [{ email: DEMO.scrutineer, role: 'scrutineer' }]);
  classId = await meeting.addClass(`C${run.slice(0, 3)}`, rulesWith());
  ({ email: ownerEmail, id: ownerId } = await signUp(owner, 'comp-owner'));
  ({ email: otherEmail } = await signUp(other, 'comp-other'));
  boatA = await meeting.addEntry(classId, { ownerEmail });
  boatB = await meeting.addEntry(classId, { ownerEmail });
  assert.equal((await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD)).status, 200);
  assert.equal((await organiser.signInWithPassword(DEMO.organiser, DEMO_PASSWORD)).status, 200);
});

let impeller: ComponentView;
let engine: ComponentView;

test('registering components: a record each, a registered event, and the boat’s next version names them', async () => {
  const r = await register(owner, boatA.boatId, {
    kind: 'impeller',
    maker: 'Kestrel Foundry',
    model: 'KF-3 stainless',
    serialNumber: `IMP-${run}`,
    trimCode: 'T3',
  });
  assert.equal(r.res.status, 201, JSON.stringify(r.body));
  impeller = r.body.data;
  assert.equal(impeller.boatId, boatA.boatId);
  assert.deepEqual(
    impeller.history.map((e) => [e.action, e.boatId]),
    [['registered', boatA.boatId]],
  );
  const e = await register(owner, boatA.boatId, {
    kind: 'engine',
    maker: 'Harrier Motors',
    serialNumber: `ENG-${run}`,
  });
  assert.equal(e.res.status, 201, JSON.stringify(e.body));
  engine = e.body.data;

  const all = await versions(boatA.boatId);
  assert.deepEqual(
    all.map((v) => v.version),
    [1, 2, 3],
  );
  assert.equal(all[2].created_by_id, ownerId, 'the version names who made it');
  assert.deepEqual(await declaredSerials(boatA.boatId), [`ENG-${run}`, `IMP-${run}`].sort());
  assert.equal((await latestChanges(boatA.boatId)).changes, `engine serial (none) → “ENG-${run}”`);
  // The version copies the declaration's fields of the one before.
  const [v1, v3] = await query<{ declared_power_kw: number; declared_nozzle_mm: number }>(
    'select declared_power_kw, declared_nozzle_mm from boat_declaration_versions where boat_id = $1 and version in (1, 3) order by version',
    [boatA.boatId],
  );
  assert.deepEqual(v3, v1);
});

test('a serial number already registered for that kind and maker is a 409 naming the problem; bad input gets field errors', async () => {
  const before = (await versions(boatB.boatId)).length;
  // The same part typed with other letter case: still one part.
  const clash = await register(owner, boatB.boatId, {
    kind: 'impeller',
    maker: 'kestrel foundry',
    serialNumber: `imp-${run}`,
  });
  assert.equal(clash.res.status, 409, JSON.stringify(clash.body));
  assert.equal(clash.body.error.code, 'serial_taken');
  assert.match(
    clash.body.error.message,
    /impeller by kestrel foundry with serial number imp-.* is already among your components/,
  );
  assert.equal(clash.body.error.details[0].field, 'serialNumber');
  assert.equal((await versions(boatB.boatId)).length, before, 'nothing stored');

  const bad = await register(owner, boatB.boatId, { kind: 'rudder', serialNumber: '  ' });
  assert.equal(bad.res.status, 400);
  const fields = (bad.body.error.details as { field: string }[]).map((d) => d.field).sort();
  assert.deepEqual(fields, ['kind', 'serialNumber']);
});

test('editing the trim code writes an edited event with before and after, and a new version saying what changed', async () => {
  const before = (await versions(boatA.boatId)).length;
  const r = await owner.json(`/api/components/${impeller.id}`, { trimCode: 'T4', notes: 'Re-pitched' }, 'PATCH');
  assert.equal(r.res.status, 200, JSON.stringify(r.body));
  const last = (r.body.data as ComponentView).history.at(-1)!;
  assert.equal(last.action, 'edited');
  assert.deepEqual(last.details, {
    before: { trimCode: 'T3', notes: '' },
    after: { trimCode: 'T4', notes: 'Re-pitched' },
  });
  assert.equal((await versions(boatA.boatId)).length, before + 1);
  assert.equal((await latestChanges(boatA.boatId)).changes, 'impeller trim code “T3” → “T4”');

  // Notes are not part of the declaration: an event, no version.
  const n = await owner.json(`/api/components/${impeller.id}`, { notes: 'Re-pitched at the works' }, 'PATCH');
  assert.equal(n.res.status, 200, JSON.stringify(n.body));
  assert.equal((await versions(boatA.boatId)).length, before + 1);

  // Kind and serial are identity: refused with a reason, nothing changed.
  const id = await owner.json(`/api/components/${impeller.id}`, { serialNumber: 'OTHER-1' }, 'PATCH');
  assert.equal(id.res.status, 400);
  assert.match(id.body.error.message, /kind and serial number are its identity/);
  const [row] = await query<{ serial_number: string }>('select serial_number from boat_components where id = $1', [
    impeller.id,
  ]);
  assert.equal(row.serial_number, `IMP-${run}`);
});

test('moving a component between two boats of one owner: removed and fitted events, a new version of each boat', async () => {
  const [aBefore, bBefore] = [(await versions(boatA.boatId)).length, (await versions(boatB.boatId)).length];
  const r = await move(owner, impeller.id, { boatId: boatB.boatId, fromBoatId: boatA.boatId });
  assert.equal(r.res.status, 200, JSON.stringify(r.body));
  const moved = r.body.data as ComponentView;
  assert.equal(moved.boatId, boatB.boatId);
  assert.deepEqual(
    moved.history.map((e) => [e.action, e.boatId]),
    [
      ['registered', boatA.boatId],
      ['edited', boatA.boatId],
      ['edited', boatA.boatId],
      ['removed', boatA.boatId],
      ['fitted', boatB.boatId],
    ],
  );
  const [aAfter, bAfter] = [await versions(boatA.boatId), await versions(boatB.boatId)];
  assert.equal(aAfter.length, aBefore + 1);
  assert.equal(bAfter.length, bBefore + 1);
  assert.equal(aAfter.at(-1)!.created_by_id, ownerId);
  assert.deepEqual(await declaredSerials(boatA.boatId), [`ENG-${run}`]);
  assert.deepEqual(await declaredSerials(boatB.boatId), [`IMP-${run}`]);
  assert.equal((await latestChanges(boatA.boatId)).changes, `impeller serial “IMP-${run}” → (none)`);
  assert.equal((await latestChanges(boatB.boatId)).changes, `impeller serial (none) → “IMP-${run}”`);

  // Taken off: it keeps its identity and is listed among the owner's components on no boat.
  const off = await move(owner, engine.id, { boatId: null });
  assert.equal(off.res.status, 200, JSON.stringify(off.body));
  assert.equal(off.body.data.boatId, null);
  assert.deepEqual(await declaredSerials(boatA.boatId), []);
  const listA = await owner.fetch(`/api/boats/${boatA.boatId}/components`);
  const a = (await listA.json()).data as { fitted: ComponentView[]; loose: ComponentView[] };
  assert.deepEqual(a.fitted, []);
  assert.ok(a.loose.some((c) => c.id === engine.id && c.serialNumber === `ENG-${run}`));
  // …and fitted again by its registrant, to another of their boats.
  const on = await move(owner, engine.id, { boatId: boatB.boatId, fromBoatId: null });
  assert.equal(on.res.status, 200, JSON.stringify(on.body));
  assert.deepEqual(await declaredSerials(boatB.boatId), [`ENG-${run}`, `IMP-${run}`].sort());
  assert.deepEqual(
    (on.body.data as ComponentView).history.slice(-2).map((e) => [e.action, e.boatId]),
    [
      ['removed', boatA.boatId],
      ['fitted', boatB.boatId],
    ],
  );

  // A plain edit of the declaration carries the components over into its new version.
  const p = await owner.json(`/api/boats/${boatB.boatId}`, { power: 230, powerUnit: 'kW' }, 'PATCH');
  assert.equal(p.res.status, 200, JSON.stringify(p.body));
  assert.deepEqual(await declaredSerials(boatB.boatId), [`ENG-${run}`, `IMP-${run}`].sort());
  assert.equal((await latestChanges(boatB.boatId)).changes, 'power 220 → 230 kW');
});

test('another entrant can neither see, edit nor take a component; nor can officials; an owner cannot grab one off another’s boat', async () => {
  const otherBoat = await meeting.addEntry(classId, { ownerEmail: otherEmail });
  const theirs = await register(other, otherBoat.boatId, {
    kind: 'pump',
    maker: 'Wren Hydraulics',
    serialNumber: `P-${run}`,
  });
  assert.equal(theirs.res.status, 201, JSON.stringify(theirs.body));
  const pump = theirs.body.data as ComponentView;

  for (const s of [other, scrutineer, organiser]) {
    const get = await s.fetch(`/api/components/${impeller.id}`);
    assert.equal(get.status, 404);
    assert.equal((await s.json(`/api/components/${impeller.id}`, { trimCode: 'X' }, 'PATCH')).res.status, 404);
    assert.equal((await move(s, impeller.id, { boatId: null })).res.status, 404);
    assert.equal((await s.fetch(`/api/boats/${boatB.boatId}/components`)).status, 404);
    assert.equal(
      (await register(s, boatB.boatId, { kind: 'pump', serialNumber: `SNEAK-${run}-${Math.random()}` })).res.status,
      404,
    );
  }
  // The other entrant cannot move their own pump onto the owner's boat.
  const onto = await move(other, pump.id, { boatId: boatB.boatId });
  assert.equal(onto.res.status, 404);
  assert.equal(onto.body.error.details[0].field, 'boatId');
  // The owner cannot take the other entrant's pump off their boat, nor fit it to their own.
  assert.equal((await move(owner, pump.id, { boatId: boatA.boatId })).res.status, 404);
  assert.equal((await move(owner, pump.id, { boatId: null })).res.status, 404);
  // A component on no boat is its registrant's alone.
  const off = await move(other, pump.id, { boatId: null });
  assert.equal(off.res.status, 200, JSON.stringify(off.body));
  assert.equal((await move(owner, pump.id, { boatId: boatA.boatId })).res.status, 404);
  assert.equal((await owner.fetch(`/api/components/${pump.id}`)).status, 404);
  const [still] = await query<{ boat_id: string | null }>('select boat_id from boat_components where id = $1', [
    pump.id,
  ]);
  assert.equal(still.boat_id, null);
  const list = (await (await owner.fetch(`/api/boats/${boatA.boatId}/components`)).json()).data as {
    loose: ComponentView[];
  };
  assert.ok(!list.loose.some((c) => c.id === pump.id), 'another entrant’s loose component is not listed');
});

test('a component swapped after inspection flags re-inspection with what changed, and tells the chief scrutineer', async () => {
  const c = await meeting.addEntry(classId, { ownerEmail });
  const old = await register(owner, c.boatId, {
    kind: 'impeller',
    maker: 'Kestrel Foundry',
    serialNumber: `OLD-${run}`,
  });
  assert.equal(old.res.status, 201, JSON.stringify(old.body));
  const recorded = await scrutineer.json(`/api/events/${meeting.eventId}/inspections`, inspectionBody(c.id, 101.9));
  assert.equal(recorded.res.status, 201, JSON.stringify(recorded.body));
  assert.equal(recorded.body.data.overallResult, 'conforms');
  assert.equal((await boardRow(c.id)).state, 'conforms');

  // The inspected impeller comes off; a replacement from another boat goes on.
  const spare = await register(owner, boatA.boatId, {
    kind: 'impeller',
    maker: 'Kestrel Foundry',
    serialNumber: `NEW-${run}`,
  });
  assert.equal(spare.res.status, 201, JSON.stringify(spare.body));
  assert.equal((await move(owner, old.body.data.id, { boatId: null })).res.status, 200);
  const mail = await waitForMail(DEMO.chief, {
    subject: new RegExp(`^${c.boatName} \\(no\\. ${c.raceNumber}\\): .*re-inspection`),
  });
  assert.match(mail.text, new RegExp(`impeller serial “OLD-${run}” → \\(none\\)`));
  assert.equal((await move(owner, spare.body.data.id, { boatId: c.boatId })).res.status, 200);

  const row = await boardRow(c.id);
  assert.notEqual(row.state, 'conforms', 'the earlier verdict no longer counts');
  assert.match(row.declarationChange ?? '', /Re-inspection required/);
  assert.match(row.declarationChange ?? '', new RegExp(`impeller serial “OLD-${run}” → “NEW-${run}”`));
  const [cached] = await query<{ inspection_result: string | null }>(
    'select inspection_result from entries where id = $1',
    [c.id],
  );
  assert.equal(cached.inspection_result, null);

  // The class's report (public once published) says the declaration changed, never the serials.
  const report = await meeting.organiser.fetch(`/api/events/${meeting.eventId}/classes/${classId}/report`);
  assert.equal(report.status, 200);
  const text = await report.text();
  const kept = (JSON.parse(text).data.draft.inputs.boats as { entryId: string; awaitingReinspection?: string }[]).find(
    (b) => b.entryId === c.id,
  );
  assert.match(kept?.awaitingReinspection ?? '', /the declaration changed after inspection/);
  assert.ok(!text.includes(`OLD-${run}`) && !text.includes(`NEW-${run}`), 'no component serial in the report');
});

test('a component moved from one boat to another keeps its seals and history', async () => {
  const [{ id: scrutineerId }] = await query<{ id: string }>('select id from users where email = $1', [
    DEMO.scrutineer,
  ]);
  // Seals written straight to the register's tables (the register's screens are tested with it).
  const seal = async (number: string, actions: string[]) => {
    const [{ id }] = await query<{ id: string }>('insert into seals (number) values ($1) returning id', [number]);
    for (const action of actions)
      await query(
        `insert into seal_events (seal_id, action, component_id, boat_id, event_id, position, recorded_by_id, created_at)
         values ($1, $2, $3, $4, $5, 'impeller housing bolt', $6, now() + (select count(*) from seal_events where seal_id = $1) * interval '1 second')`,
        [id, action, impeller.id, boatB.boatId, meeting.eventId, scrutineerId],
      );
  };
  await seal(`CS-${run}-1`, ['applied', 'intact']);
  await seal(`CS-${run}-2`, ['applied', 'broken']);

  const r = await move(owner, impeller.id, { boatId: boatA.boatId, fromBoatId: boatB.boatId });
  assert.equal(r.res.status, 200, JSON.stringify(r.body));
  const onA = (
    (await (await owner.fetch(`/api/boats/${boatA.boatId}/components`)).json()).data.fitted as ComponentView[]
  ).find((x) => x.id === impeller.id)!;
  assert.deepEqual(
    onA.seals.map((s) => [s.number, s.lastAction, s.position]),
    [[`CS-${run}-1`, 'intact', 'impeller housing bolt']],
    'the intact seal travels with it; the broken one is history',
  );
  assert.deepEqual(
    onA.history.map((e) => e.action),
    ['registered', 'edited', 'edited', 'removed', 'fitted', 'removed', 'fitted'],
  );
  assert.equal(onA.trimCode, 'T4');
  // The boat page shows it with its seal and history.
  const page = await (await owner.fetch(`/boats/${boatA.boatId}`)).text();
  assert.match(page, new RegExp(`data-serial="IMP-${run}"`));
  assert.match(page, new RegExp(`CS-${run}-1`));
  assert.ok(!page.includes(`CS-${run}-2`), 'the broken seal is not shown as on the part');
  assert.match(page, /Taken off/);
  const onB = (await (await owner.fetch(`/api/boats/${boatB.boatId}/components`)).json()).data
    .fitted as ComponentView[];
  assert.ok(!onB.some((x) => x.id === impeller.id));
});

test('the dock finds a boat by a component serial only at a meeting it is entered in, and only for those at the dock', async () => {
  const url = (eventId: string, serial: string) =>
    `/api/events/${eventId}/component-serials/${encodeURIComponent(serial)}`;
  // Typed in another letter case, as read off a dirty part.
  const found = await scrutineer.fetch(url(meeting.eventId, `imp-${run}`));
  const body = await found.json();
  assert.equal(found.status, 200, JSON.stringify(body));
  assert.deepEqual(
    (body.data.matches as { raceNumber: number; kind: string; serialNumber: string; componentId: string }[]).map(
      (m) => [m.raceNumber, m.kind, m.serialNumber, m.componentId],
    ),
    [[boatA.raceNumber, 'impeller', `IMP-${run}`, impeller.id]],
  );
  // The scrutineer also works a meeting where the boat is not entered: nothing found there.
  const there = await scrutineer.fetch(url(elsewhere.eventId, `IMP-${run}`));
  assert.equal(there.status, 404);
  assert.equal((await there.json()).error.code, 'unknown_serial');
  // A boat of this owner that is not entered at the meeting is not found either.
  const [{ id: loneBoat }] = await query<{ id: string }>(
    `insert into boats (owner_id, name, declared_nozzle_mm, declared_power_kw) values ($1, $2, 100, 200) returning id`,
    [ownerId, `Lone ${run}`],
  );
  assert.equal((await register(owner, loneBoat, { kind: 'pump', serialNumber: `LONE-${run}` })).res.status, 201);
  assert.equal((await scrutineer.fetch(url(meeting.eventId, `LONE-${run}`))).status, 404);
  // Not for the owner, the organiser (no dock permission) or anyone signed out.
  assert.equal((await owner.fetch(url(meeting.eventId, `IMP-${run}`))).status, 403);
  assert.equal((await organiser.fetch(url(meeting.eventId, `IMP-${run}`))).status, 403);
  assert.equal((await new HttpSession().fetch(url(meeting.eventId, `IMP-${run}`))).status, 401);
});

test('a serial someone else registered tells nothing and locks nobody out: both are kept, and the dock shows the part as disputed', async () => {
  // Attack finding F5: with one identity across every owner, a rival could register a serial read off
  // an engine plate first (the real owner then refused) and probe whether other people's parts exist.
  const rivalBoat = await meeting.addEntry(classId, { ownerEmail: otherEmail });
  const serial = `TM-${run}`;
  const squat = await register(other, rivalBoat.boatId, {
    kind: 'engine',
    maker: 'Tarnmoor Engines',
    serialNumber: serial,
  });
  assert.equal(squat.res.status, 201, JSON.stringify(squat.body));
  // The real owner registers the part on their own boat: accepted, no word about the rival's record.
  const mine = await register(owner, boatB.boatId, { kind: 'engine', maker: 'Tarnmoor Engines', serialNumber: serial });
  assert.equal(mine.res.status, 201, JSON.stringify(mine.body));
  // The same maker with two spaces, a zero-width space or full-width letters is the same maker (NFKC,
  // Unicode category Cf removed, white space collapsed): one owner's second record of the part is refused.
  for (const maker of ['Tarnmoor  Engines', 'Tarn\u200Bmoor Engines', '\uFF34arnmoor Engines']) {
    const again = await register(owner, boatA.boatId, { kind: 'engine', maker, serialNumber: serial.toLowerCase() });
    assert.equal(again.res.status, 409, `${JSON.stringify(maker)}: ${JSON.stringify(again.body)}`);
    assert.equal(again.body.error.code, 'serial_taken');
  }
  // The serial in full-width digits is the same serial (NFKC); a Cyrillic look-alike is refused (attack s7, F3).
  const wide = await register(owner, boatA.boatId, {
    kind: 'engine',
    maker: 'Tarnmoor Engines',
    serialNumber: serial.replace(/[0-9A-F]/g, (c) => String.fromCharCode(c.charCodeAt(0) + 0xfee0)),
  });
  assert.equal(wide.res.status, 409, JSON.stringify(wide.body));
  const cyrillic = await register(owner, boatA.boatId, {
    kind: 'engine',
    maker: 'Tarnmoor Engines',
    serialNumber: `\u0422M-${run}`,
  });
  assert.equal(cyrillic.res.status, 400, JSON.stringify(cyrillic.body));
  assert.equal(cyrillic.body.error.details[0].field, 'serialNumber');
  assert.match(cyrillic.body.error.details[0].message, /Latin letters A–Z and digits 0–9/);
  const [{ n }] = await query<{ n: number }>(
    'select count(*)::int as n from boat_components where lower(serial_number) = lower($1)',
    [serial],
  );
  assert.equal(n, 2, 'one record per owner');
  // At the dock both boats come back, each marked disputed, for an official to decide.
  const found = await scrutineer.fetch(`/api/events/${meeting.eventId}/component-serials/${serial}`);
  const body = await found.json();
  assert.equal(found.status, 200, JSON.stringify(body));
  const matches = body.data.matches as { boatId: string; isDisputed: boolean; maker: string }[];
  assert.deepEqual(matches.map((m) => m.boatId).sort(), [boatB.boatId, rivalBoat.boatId].sort());
  assert.ok(matches.every((m) => m.isDisputed && m.maker === 'Tarnmoor Engines'));
  // A part only one boat declares is not disputed.
  const single = await (await scrutineer.fetch(`/api/events/${meeting.eventId}/component-serials/IMP-${run}`)).json();
  assert.deepEqual(
    (single.data.matches as { isDisputed: boolean }[]).map((m) => m.isDisputed),
    [false],
  );
});

test('two moves made from the same view: only one succeeds', async () => {
  const x = await register(owner, boatA.boatId, {
    kind: 'pump',
    maker: 'Wren Hydraulics',
    serialNumber: `RACE-${run}`,
  });
  assert.equal(x.res.status, 201, JSON.stringify(x.body));
  const id = x.body.data.id as string;
  const [b1, b2] = await Promise.all([
    move(owner, id, { boatId: boatB.boatId, fromBoatId: boatA.boatId }),
    move(owner, id, { boatId: null, fromBoatId: boatA.boatId }),
  ]);
  assert.deepEqual([b1.res.status, b2.res.status].sort(), [200, 409], JSON.stringify([b1.body, b2.body]));
  const loser = b1.res.status === 409 ? b1 : b2;
  assert.equal(loser.body.error.code, 'component_moved');
  const events = await query<{ action: string }>(
    'select action from component_events where component_id = $1 order by created_at',
    [id],
  );
  assert.deepEqual(
    events.map((e) => e.action),
    b1.res.status === 200 ? ['registered', 'removed', 'fitted'] : ['registered', 'removed'],
  );
});

test('component history and declared components are append-only; a component is never deleted and keeps its identity', async () => {
  const refused = async (sql: string, params: unknown[]) =>
    assert.rejects(query(sql, params), /append-only|never deleted|fixed/, sql);
  await refused(`update component_events set action = 'edited' where component_id = $1`, [impeller.id]);
  await refused('delete from component_events where component_id = $1', [impeller.id]);
  await refused(`update declaration_version_components set serial_number = 'X' where component_id = $1`, [impeller.id]);
  await refused('delete from declaration_version_components where component_id = $1', [impeller.id]);
  await refused('delete from boat_components where id = $1', [impeller.id]);
  await refused(`update boat_components set serial_number = 'X' where id = $1`, [impeller.id]);
  await refused(`update boat_components set kind = 'pump' where id = $1`, [impeller.id]);
  // Its current state (trim code, notes, where it is) may change: that is what the events record.
  await query(`update boat_components set notes = notes where id = $1`, [impeller.id]);
});
