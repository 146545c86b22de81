// The boat logbook through HTTP and the database: one boat entered at three meetings, with a
// second declaration version, inspections recorded through the real API, a part taken into custody,
// a component sealed at the first meeting, found intact at the second and broken at the third
// (written through the models of models/boat-record.ts, as the seal register's own screens are
// built elsewhere), protests, and officials' notes. Who may read it (owner; officials with
// entry.view_all at a meeting it is entered in), who may add a note (boat.log_note there), that bad
// input is refused beside its field with nothing kept, that notes are append-only in the database,
// and that the PDF parses back with its text.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { randomBytes, randomUUID } from 'node:crypto';
import { PDFDocument } from 'pdf-lib';
import { Sequelize } from 'sequelize';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { query, closeDb } from '../support/db';
import { extractPdfText } from '../support/pdf-text';
import { InspectionMeeting, inspectionBody, rulesWith, type TestEntry } from '../support/inspection-meeting';
import {
  BoatComponent,
  ComponentEvent,
  DeclarationVersionComponent,
  Seal,
  SealBatch,
  SealEvent,
  initBoatRecord,
} from '../../models/boat-record';
import { formatCalendarDate } from '../../lib/core/format/time';

const first = new InspectionMeeting();
const second = new InspectionMeeting();
const third = new InspectionMeeting();
const elsewhere = new InspectionMeeting();
const s = {
  anonymous: new HttpSession(),
  owner: new HttpSession(),
  other: new HttpSession(),
  scrutineer: new HttpSession(),
  chief: new HttpSession(),
  steward: new HttpSession(),
  organiser: new HttpSession(),
  stewardElsewhere: new HttpSession(),
};
let entry: TestEntry;
let sequelize: Sequelize;
const ids = { secondEntry: '', thirdEntry: '', inspections: [] as string[], otherEntrant: '' };
const sealNumber = `LB-${randomBytes(3).toString('hex').toUpperCase()}`;
const engineSerial = `ENG-${randomBytes(3).toString('hex').toUpperCase()}`;
const page = () => `/boats/${entry.boatId}/logbook`;
const pdf = () => `/api/boats/${entry.boatId}/logbook/pdf`;
const notes = () => `/api/boats/${entry.boatId}/log-notes`;
const userId = async (email: string) =>
  (await query<{ id: string }>('select id from users where email = $1', [email]))[0].id;
const yesterday = new Date(Date.now() - 86_400_000).toISOString().slice(0, 10);
const noteCount = async () =>
  Number(
    (await query<{ n: string }>('select count(*) as n from boat_log_notes where boat_id = $1', [entry.boatId]))[0].n,
  );

async function signUpAndIn(session: HttpSession, prefix: string) {
  const email = uniqueEmail(prefix);
  await session.json('/api/accounts', { name: `Logbook ${prefix}`, email, password: 'logbook-password-1' });
  const res = await session.signInWithPassword(email, 'logbook-password-1');
  assert.equal(res.status, 200, `${prefix} signs in`);
  return userId(email);
}

/** The same boat entered at another meeting (entering and paying are tested elsewhere). */
async function enterAgain(meeting: InspectionMeeting, raceNumber: number): Promise<string> {
  const classId = await meeting.addClass('LB', rulesWith());
  const [row] = await query<{ id: string }>(
    `insert into entries (event_id, class_id, boat_id, entrant_id, race_number, status, fee_minor, currency, paid_at)
     values ($1, $2, $3, $4, $5, 'entered', 10000, 'NZD', now()) returning id`,
    [meeting.eventId, classId, entry.boatId, await userId(DEMO.entrant), raceNumber],
  );
  return row.id;
}

async function recordInspection(eventId: string, entryId: string): Promise<string> {
  const { res, body } = await s.scrutineer.json(
    `/api/events/${eventId}/inspections`,
    inspectionBody(entryId, 101.9, { power: { declaredKw: 230, evidenceSeen: true } }),
  );
  assert.equal(res.status, 201, JSON.stringify(body));
  return body.data.id;
}

before(async () => {
  const staff = [
    { email: DEMO.scrutineer, role: 'scrutineer' },
    { email: DEMO.chief, role: 'chief_scrutineer' },
    { email: DEMO.steward, role: 'steward' },
  ];
  const stamp = Date.now();
  await first.create(`Logbook First ${stamp}`, staff);
  await second.create(`Logbook Second ${stamp}`, staff);
  await third.create(`Logbook Third ${stamp}`, staff);
  await elsewhere.create(`Logbook Elsewhere ${stamp}`, []);
  entry = await first.addEntry(await first.addClass('LB', rulesWith()));
  for (const [key, email] of [
    ['owner', DEMO.entrant],
    ['scrutineer', DEMO.scrutineer],
    ['chief', DEMO.chief],
    ['steward', DEMO.steward],
    ['organiser', DEMO.organiser],
  ] as const) {
    const res = await s[key].signInWithPassword(email, DEMO_PASSWORD);
    assert.equal(res.status, 200, email);
  }
  ids.otherEntrant = await signUpAndIn(s.other, 'other-entrant');
  const away = await signUpAndIn(s.stewardElsewhere, 'steward-elsewhere');
  await query(`insert into event_staff (event_id, user_id, role) values ($1, $2, 'steward')`, [
    elsewhere.eventId,
    away,
  ]);

  // Declaration version 2 through the owner's own edit, before any inspection.
  const patched = await s.owner.json(`/api/boats/${entry.boatId}`, { power: 230, powerUnit: 'kW' }, 'PATCH');
  assert.equal(patched.res.status, 200, JSON.stringify(patched.body));
  ids.secondEntry = await enterAgain(second, entry.raceNumber);
  ids.thirdEntry = await enterAgain(third, entry.raceNumber);
  ids.inspections = [
    await recordInspection(first.eventId, entry.id),
    await recordInspection(second.eventId, ids.secondEntry),
    await recordInspection(third.eventId, ids.thirdEntry),
  ];

  // A part taken into custody at the first meeting, through the real route.
  const taken = await s.scrutineer.json(`/api/events/${first.eventId}/custody`, {
    raceNumber: entry.raceNumber,
    description: 'Impeller with a chipped blade',
    sealNumber: 'BAG-LB-1',
  });
  assert.equal(taken.res.status, 201, JSON.stringify(taken.body));

  // The engine and its seal, through the models (the register's screens are built in parallel).
  sequelize = new Sequelize(process.env.DATABASE_URL!, { logging: false });
  initBoatRecord(sequelize);
  const [owner, scrutineer, chief] = await Promise.all([
    userId(DEMO.entrant),
    userId(DEMO.scrutineer),
    userId(DEMO.chief),
  ]);
  const engine = await BoatComponent.create({
    kind: 'engine',
    maker: 'Kestrelworks',
    model: 'KV-8 marine',
    serialNumber: engineSerial,
    boatId: entry.boatId,
    createdById: owner,
  });
  await ComponentEvent.create({
    componentId: engine.id,
    action: 'registered',
    boatId: entry.boatId,
    recordedById: owner,
  });
  const [latest] = await query<{ id: string }>(
    'select id from boat_declaration_versions where boat_id = $1 order by version desc limit 1',
    [entry.boatId],
  );
  await DeclarationVersionComponent.create({
    declarationVersionId: latest.id,
    componentId: engine.id,
    kind: 'engine',
    maker: 'Kestrelworks',
    model: 'KV-8 marine',
    serialNumber: engineSerial,
    trimCode: '',
  });
  const batch = await SealBatch.create({
    eventId: first.eventId,
    prefix: 'LB-',
    firstNumber: 1,
    lastNumber: 50,
    issuedById: chief,
  });
  const seal = await Seal.create({ batchId: batch.id, number: sealNumber });
  const steps = [
    ['applied', first.eventId, ids.inspections[0]],
    ['intact', second.eventId, ids.inspections[1]],
    ['broken', third.eventId, ids.inspections[2]],
  ] as const;
  for (const [i, [action, eventId, inspectionId]] of steps.entries())
    await SealEvent.create({
      sealId: seal.id,
      action,
      componentId: engine.id,
      boatId: entry.boatId,
      eventId,
      inspectionId,
      position: 'cylinder head bolt, port side',
      recordedById: scrutineer,
      createdAt: new Date(Date.now() + i * 1000),
    });

  // Protests against the boat's first entry by the other entrant: one decided (the owner, a party,
  // sees it), one still awaiting its fee (nothing has been lodged against the owner yet).
  const protestIds: string[] = [];
  for (const [status, rule, reasons] of [
    ['upheld', 'LB 4.2 seals', 'The seal on the engine was found broken; the entry is excluded from the final.'],
    ['awaiting_fee', 'LB 9.9 unpaid', null],
  ] as const) {
    const [row] = await query<{ id: string }>(
      `insert into protests (event_id, lodged_by_id, against_entry_id, matter_key, rule_reference, grounds, status, fee_minor, currency,
                             paid_at, window_deadline, decision_reasons, decided_at)
       values ($1, $2, $3, $4, $5, 'Grounds kept on the protest page only', $6, 3000, 'NZD', $8, now() + interval '1 hour', $7, $8)
       returning id`,
      [
        first.eventId,
        ids.otherEntrant,
        entry.id,
        `logbook:${randomUUID()}`,
        rule,
        status,
        reasons,
        reasons ? new Date() : null,
      ],
    );
    protestIds.push(row.id);
  }
  // A re-inspection the stewards ordered for the decided protest: its reason names the protest.
  await query(
    `insert into reinspections (id, event_id, entry_id, reason, requested_by_id, protest_id, created_at, updated_at)
     values (gen_random_uuid(), $1, $2, 'Protest LB 4.2: check every engine seal', $3, $4, now(), now())`,
    [first.eventId, entry.id, await userId(DEMO.steward), protestIds[0]],
  );
});

after(async () => {
  await sequelize?.close();
  await closeDb();
});

const textOf = async (res: Response) => (await res.text()).replace(/<!-- -->/g, '');

test('who may open the logbook page and its PDF: the owner and officials with entry.view_all at a meeting the boat is entered in', async () => {
  const missing = await s.owner.fetch(`/boats/${randomUUID()}/logbook`);
  const missingBody = await textOf(missing);
  assert.match(missingBody, /No such boat among yours/);
  // No loading boundary wraps a boat's pages (the list's sits in its own route group), so the
  // not-found answer keeps its status.
  assert.equal(missing.status, 404);

  for (const key of ['owner', 'chief', 'steward', 'organiser'] as const) {
    const res = await s[key].fetch(page());
    const body = await textOf(res);
    assert.equal(res.status, 200, key);
    assert.ok(body.includes(entry.boatName), `${key} sees the boat's name`);
    assert.match(body, /data-testid="logbook-heading"/, key);
    const file = await s[key].fetch(pdf());
    assert.equal(file.status, 200, `${key}: PDF`);
    assert.equal(file.headers.get('content-type'), 'application/pdf');
    await file.arrayBuffer();
  }
  // Another entrant, a scrutineer without entry.view_all, a steward of a meeting the boat never
  // entered: the answer of a missing boat, with nothing of this one in it.
  for (const key of ['other', 'scrutineer', 'stewardElsewhere'] as const) {
    const res = await s[key].fetch(page());
    const body = await textOf(res);
    assert.equal(res.status, missing.status, `${key}: same status as a missing boat`);
    assert.match(body, /No such boat among yours/, key);
    assert.ok(!body.includes(entry.boatName), `${key} learns nothing of the boat`);
    const file = await s[key].fetch(pdf());
    assert.equal(file.status, 404, `${key}: PDF`);
    assert.equal((await file.json()).error.code, 'not_found');
  }
  const anon = await s.anonymous.fetch(page());
  assert.ok([303, 307].includes(anon.status), `anonymous: ${anon.status}`);
  assert.match(anon.headers.get('location') ?? '', /\/sign-in/);
  assert.equal((await s.anonymous.fetch(pdf())).status, 401);
});

test('an official adds a dated note; it shows with its author and day; the owner and others cannot add one', async () => {
  const today = new Date().toISOString().slice(0, 10);
  const before = await noteCount();
  for (const [key, status] of [
    ['anonymous', 401],
    ['owner', 403],
    ['other', 403],
    ['scrutineer', 403],
    ['organiser', 403],
    ['stewardElsewhere', 403],
  ] as const) {
    const { res, body } = await s[key].json(notes(), {
      eventId: first.eventId,
      category: 'damage',
      notedOn: today,
      body: 'Should never be kept',
    });
    assert.equal(res.status, status, `${key}: ${JSON.stringify(body)}`);
  }
  assert.equal(await noteCount(), before, 'nothing kept for refused requests');

  const text = `Hull cracked aft of the intake after contact with the pontoon ${randomBytes(3).toString('hex')}.`;
  const added = await s.chief.json(notes(), {
    eventId: first.eventId,
    category: 'damage',
    notedOn: yesterday,
    body: `  ${text}  `,
  });
  assert.equal(added.res.status, 201, JSON.stringify(added.body));
  assert.equal(added.body.data.body, text, 'kept trimmed');
  const bySteward = await s.steward.json(notes(), {
    eventId: third.eventId,
    category: 'repair',
    notedOn: today,
    body: 'Intake grille replaced and inspected at the dock.',
  });
  assert.equal(bySteward.res.status, 201, JSON.stringify(bySteward.body));
  assert.equal(await noteCount(), before + 2);

  const [{ name: chiefName }] = await query<{ name: string }>('select name from users where email = $1', [DEMO.chief]);
  const body = await textOf(await s.owner.fetch(page()));
  assert.ok(body.includes(text), 'the owner reads the note');
  assert.ok(body.includes(`Damage noted by ${chiefName}`), 'with its kind and author');
  assert.ok(body.includes(formatCalendarDate(yesterday)), 'and the day it happened');
  assert.ok(!/data-testid="log-note-form"/.test(body), 'the owner has no note form');
  assert.match(
    await textOf(await s.chief.fetch(page())),
    /data-testid="log-note-form"/,
    'the chief scrutineer has one',
  );
});

test('an official cannot note a boat they own or entered, nor one they declared an interest in (found by an outside test)', async () => {
  const official = new HttpSession();
  const officialId = await signUpAndIn(official, 'lbofficial');
  const [{ email }] = await query<{ email: string }>('select email from users where id = $1', [officialId]);
  const meeting = new InspectionMeeting();
  await meeting.create(`Logbook Ties ${Date.now()}`, []);
  await query(`insert into event_staff (event_id, user_id, role) values ($1, $2, 'steward')`, [
    meeting.eventId,
    officialId,
  ]);
  const classId = await meeting.addClass('LT', rulesWith());
  const own = await meeting.addEntry(classId, { ownerEmail: email });
  const body = { eventId: meeting.eventId, category: 'repair', notedOn: yesterday, body: 'Checked by the stewards.' };
  const mine = await official.json(`/api/boats/${own.boatId}/log-notes`, body);
  assert.equal(mine.res.status, 403, JSON.stringify(mine.body));
  assert.equal(mine.body.error.code, 'own_boat');

  // Another boat at the same meeting: allowed until the official declares an interest in it.
  const other = await meeting.addEntry(classId);
  const fine = await official.json(`/api/boats/${other.boatId}/log-notes`, body);
  assert.equal(fine.res.status, 201, JSON.stringify(fine.body));
  await query(
    `insert into official_interests (event_id, official_id, subject_kind, boat_id, statement) values ($1, $2, 'boat', $3, 'Crews for this boat')`,
    [meeting.eventId, officialId, other.boatId],
  );
  const tied = await official.json(`/api/boats/${other.boatId}/log-notes`, body);
  assert.equal(tied.res.status, 403, JSON.stringify(tied.body));
  assert.equal(tied.body.error.code, 'conflict_of_interest');
});

test('bad note input is refused beside each field and nothing is kept', async () => {
  const before = await noteCount();
  const bad = await s.chief.json(notes(), {
    eventId: 'first',
    category: 'scratch',
    notedOn: '2027-02-30',
    body: '   ',
  });
  assert.equal(bad.res.status, 400);
  assert.equal(bad.body.error.code, 'invalid_input');
  const fields = new Set((bad.body.error.details as { field: string }[]).map((d) => d.field));
  assert.deepEqual([...fields].sort(), ['body', 'category', 'eventId', 'notedOn']);

  const long = await s.chief.json(notes(), {
    eventId: first.eventId,
    category: 'observation',
    notedOn: yesterday,
    body: 'x'.repeat(4001),
  });
  assert.equal(long.res.status, 400);
  assert.equal(long.body.error.details[0].field, 'body');
  const future = await s.chief.json(notes(), {
    eventId: first.eventId,
    category: 'observation',
    notedOn: '2999-01-01',
    body: 'From the future',
  });
  assert.equal(future.body.error.details[0].field, 'notedOn');
  // A meeting the boat is not entered in (the chief scrutineer is not staff there either).
  const wrongMeeting = await s.chief.json(notes(), {
    eventId: elsewhere.eventId,
    category: 'observation',
    notedOn: yesterday,
    body: 'At the wrong meeting',
  });
  assert.equal(wrongMeeting.res.status, 400);
  assert.equal(wrongMeeting.body.error.details[0].field, 'eventId');
  const extra = await s.chief.json(notes(), {
    eventId: first.eventId,
    category: 'observation',
    notedOn: yesterday,
    body: 'An unknown field',
    authorId: randomUUID(),
  });
  assert.equal(extra.res.status, 400, 'unknown fields (an author chosen by the caller) are refused');
  const notJson = await s.chief.fetch(notes(), {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: '{"eventId":',
  });
  assert.equal(notJson.status, 400);
  assert.equal(await noteCount(), before);
});

test('logbook notes are append-only in the database', async () => {
  const [note] = await query<{ id: string }>('select id from boat_log_notes where boat_id = $1 limit 1', [
    entry.boatId,
  ]);
  assert.ok(note, 'a note exists');
  await assert.rejects(query("update boat_log_notes set body = 'rewritten' where id = $1", [note.id]));
  await assert.rejects(query('delete from boat_log_notes where id = $1', [note.id]));
  const [kept] = await query<{ body: string }>('select body from boat_log_notes where id = $1', [note.id]);
  assert.notEqual(kept.body, 'rewritten');
});

test('the logbook lists declaration versions, inspections with verdicts, custody, seals and visible protests', async () => {
  const body = await textOf(await s.owner.fetch(page()));
  assert.match(body, /Declaration version 1 by /);
  assert.match(body, /Declaration version 2 by /);
  assert.match(body, /Changed: power 220 → 230 kW/);
  assert.ok(body.includes(`engine Kestrelworks KV-8 marine serial ${engineSerial}`), 'the component it names');
  // Counted by the items' own attributes (the page's text also travels in the React payload).
  assert.equal((body.match(/data-kind="inspection"/g) ?? []).length, 3, 'one inspection per meeting');
  assert.match(body, /Pre-race inspection: conforms/);
  assert.match(body, /class rules version 1/);
  assert.match(body, /data-verdict="conforms"/);
  assert.match(body, /Part taken into custody: Impeller with a chipped blade/);
  assert.match(body, /seal or bag BAG-LB-1/);
  assert.ok(body.includes(`Seal ${sealNumber} applied`));
  assert.ok(body.includes(`Seal ${sealNumber} checked: intact`));
  assert.ok(body.includes(`Seal ${sealNumber} found BROKEN`));
  assert.ok(body.includes(`Finding: seal ${sealNumber} found BROKEN`), "in the third inspection's entry too");
  assert.match(body, /data-finding="broken"/);
  assert.ok(
    body.includes(`Seal ${sealNumber} (cylinder head bolt, port side): found BROKEN`),
    'the engine on the boat now shows its seal in its latest state',
  );
  assert.match(body, /Safety first\./, 'the caution where verdicts and safety appear');
  // Protests: the owner (the protested party) sees the decided one, not the one still awaiting its fee.
  assert.match(body, /LB 4\.2 seals/);
  assert.match(body, /Reasons: The seal on the engine was found broken/);
  assert.doesNotMatch(body, /LB 9\.9 unpaid/);
  assert.doesNotMatch(body, /Grounds kept on the protest page only/, 'grounds stay on the protest page');
  // The chief scrutineer reads the record but not the protests (no protest.view_all, not a party); a steward does.
  assert.match(body, /Re-inspection asked: Protest LB 4\.2: check every engine seal/);
  const chief = await textOf(await s.chief.fetch(page()));
  assert.ok(chief.includes(`Seal ${sealNumber} found BROKEN`));
  assert.doesNotMatch(chief, /LB 4\.2/, 'neither the protest nor the reason of the task ordered for it');
  assert.match(chief, /Re-inspection asked: ordered by the stewards/);
  const steward = await textOf(await s.steward.fetch(page()));
  assert.match(steward, /LB 4\.2 seals/);
  assert.match(steward, /LB 9\.9 unpaid/, "stewards see the meeting's protests, as they do today");
  // A filter by kind keeps only that kind.
  const sealsOnly = await textOf(await s.owner.fetch(`${page()}?kind=seal`));
  assert.ok(sealsOnly.includes(`Seal ${sealNumber} found BROKEN`));
  assert.doesNotMatch(sealsOnly, /Part taken into custody/);
});

test('the PDF parses back: title, pages, the timeline and both signature lines', async () => {
  const res = await s.owner.fetch(pdf());
  assert.equal(res.status, 200);
  assert.match(
    res.headers.get('content-disposition') ?? '',
    /^attachment; filename="logbook-[a-z0-9-]+-\d{4}-\d{2}-\d{2}\.pdf"$/,
  );
  assert.equal(res.headers.get('x-content-type-options'), 'nosniff');
  const bytes = new Uint8Array(await res.arrayBuffer());
  const doc = await PDFDocument.load(bytes);
  assert.equal(doc.getTitle(), `Boat logbook: ${entry.boatName} #T-${entry.raceNumber}`);
  const pages = await extractPdfText(bytes);
  assert.equal(pages.length, doc.getPageCount());
  assert.ok(pages.length >= 1);
  assert.match(pages[0], /Boat logbook/);
  const all = pages.join('\n');
  assert.ok(all.includes(entry.boatName));
  assert.match(all, /Printed .* by /);
  assert.ok(all.includes(`Seal ${sealNumber} found BROKEN`));
  assert.ok(all.includes(`Seal ${sealNumber} (cylinder head bolt, port side): found BROKEN`));
  assert.match(all, /Declaration version 2 by /);
  assert.match(all, /Part taken into custody: Impeller with a chipped blade/);
  assert.match(all, /Safety first\./);
  const last = pages[pages.length - 1];
  assert.match(last, /Owner: signature and name/);
  assert.match(last, /Official \(name and role\): signature and name/);
  // The chief scrutineer's copy leaves the protests out, as the page does.
  const chiefText = (await extractPdfText(new Uint8Array(await (await s.chief.fetch(pdf())).arrayBuffer()))).join('\n');
  assert.ok(chiefText.includes(`Seal ${sealNumber} found BROKEN`));
  assert.doesNotMatch(chiefText, /LB 4\.2 seals/);
});
