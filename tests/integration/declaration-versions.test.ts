// Issue 15, items 1 and 2: a boat's declaration is append-only versions, and a change after a
// conforming inspection flags re-inspection instead of reaching the verdict or the parity report.
// Through the real HTTP API and database. Figures are an invented boat and class; the class limits
// are chosen by this test (none from the demo data).
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD, MAIL_INBOX } from '../support/env';
import { query } from '../support/db';
import { waitForMail } from '../support/mail';
import { InspectionMeeting, inspectionBody, rulesWith, type TestEntry } from '../support/inspection-meeting';

const meeting = new InspectionMeeting();
const scrutineer = new HttpSession();
const owner = new HttpSession();
let classId = '';
let entry: TestEntry;

type BoardRow = { entryId: string; state: string; declarationChange: string | null };
const board = async () => {
  const res = await meeting.organiser.fetch(`/api/events/${meeting.eventId}/inspections`);
  assert.equal(res.status, 200);
  return (await res.json()).data as { rows: BoardRow[] };
};
const draft = async () => {
  const res = await meeting.organiser.fetch(`/api/events/${meeting.eventId}/classes/${classId}/report`);
  assert.equal(res.status, 200);
  return (await res.json()).data.draft as {
    inputs: {
      boats: {
        entryId: string;
        powerKw: number;
        powerSource: string;
        measuredWeightKg?: number | null;
        awaitingReinspection?: string | null;
      }[];
      excluded: { entryId: string; reason: string }[];
    };
  };
};
// The boat's name is unique per test run (race numbers repeat across meetings and test files).
const subjectFor = (e: TestEntry) => new RegExp(`^${e.boatName} \\(no\\. ${e.raceNumber}\\): .*re-inspection`);
const versions = (boatId: string) =>
  query<{ version: number; declared_power_kw: number; created_by_id: string }>(
    'select version, declared_power_kw, created_by_id from boat_declaration_versions where boat_id = $1 order by version',
    [boatId],
  );

before(async () => {
  await meeting.create(`Declaration Versions Meeting ${Date.now()}`, [
    { email: DEMO.scrutineer, role: 'scrutineer' },
    { email: DEMO.chief, role: 'chief_scrutineer' },
  ]);
  // A class power maximum of 300 kW and a 350 kg minimum weight: chosen for this test.
  classId = await meeting.addClass(
    'DV',
    rulesWith({
      power: { minKw: null, maxKw: 300, defaultUncertaintyKw: 5 },
      weight: { minKg: 350, includesDriver: true, defaultUncertaintyKg: 1 },
    }),
  );
  entry = await meeting.addEntry(classId, { declaredPowerKw: 250 });
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
  await owner.signInWithPassword(DEMO.entrant, DEMO_PASSWORD);
});

test('a boat gets version 1 on creation; the entry and the inspection pin the version they saw', async () => {
  const [v1] = await versions(entry.boatId);
  assert.equal(v1.version, 1);
  assert.equal(v1.declared_power_kw, 250);
  const [pinned] = await query<{ version: number }>(
    `select d.version from entries e join boat_declaration_versions d on d.id = e.declaration_version_id where e.id = $1`,
    [entry.id],
  );
  assert.equal(pinned.version, 1);
});

test('the attack: 250 kW inspected and conforming, then declared 9000 kW: re-inspection required, the report keeps 250 kW', async () => {
  const recorded = await scrutineer.json(
    `/api/events/${meeting.eventId}/inspections`,
    inspectionBody(entry.id, 101.9, {
      power: { declaredKw: 250, evidenceSeen: true },
      weight: { readingsKg: [402, 404] },
    }),
  );
  assert.equal(recorded.res.status, 201, JSON.stringify(recorded.body));
  assert.equal(recorded.body.data.overallResult, 'conforms');
  const [checked] = await query<{ version: number }>(
    `select d.version from inspections i join boat_declaration_versions d on d.id = i.declaration_version_id where i.id = $1`,
    [recorded.body.data.id],
  );
  assert.equal(checked.version, 1);
  let row = (await board()).rows.find((r) => r.entryId === entry.id)!;
  assert.equal(row.state, 'conforms');
  assert.equal(row.declarationChange, null);
  let report = await draft();
  const boat = report.inputs.boats.find((b) => b.entryId === entry.id)!;
  assert.equal(boat.powerKw, 250);
  assert.equal(boat.powerSource, 'verified');
  // The arithmetic mean of the weighings 402 and 404 kg (JCGM 100:2008, 4.2.1).
  assert.equal(boat.measuredWeightKg, 403);

  // The owner edits the declared power after the inspection.
  const patched = await owner.json(`/api/boats/${entry.boatId}`, { power: 9000, powerUnit: 'kW' }, 'PATCH');
  assert.equal(patched.res.status, 200, JSON.stringify(patched.body));
  assert.equal(patched.body.data.declaredPowerKw, 9000);

  const all = await versions(entry.boatId);
  assert.deepEqual(
    all.map((v) => [v.version, v.declared_power_kw]),
    [
      [1, 250],
      [2, 9000],
    ],
  );
  const [me] = await query<{ id: string; name: string }>('select id, name from users where email = $1', [DEMO.entrant]);
  assert.equal(all[1].created_by_id, me.id, 'the version names who made it');
  // The owner reads the versions: who, when, what changed (newest first).
  const mineBoat = await owner.fetch(`/api/boats/${entry.boatId}`);
  assert.equal(mineBoat.status, 200);
  const listedVersions = (await mineBoat.json()).data.declarationVersions as {
    version: number;
    createdBy: string;
    createdAt: string;
    changes: string;
  }[];
  assert.deepEqual(
    listedVersions.map((v) => [v.version, v.changes]),
    [
      [2, 'power 250 → 9000 kW'],
      [1, 'first declaration'],
    ],
  );
  assert.equal(listedVersions[0].createdBy, me.name);
  assert.ok(Date.now() - Date.parse(listedVersions[0].createdAt) < 60_000);
  const boatPage = await (await owner.fetch(`/boats/${entry.boatId}`)).text();
  assert.match(boatPage, /Version 2/);
  assert.match(boatPage, /power 250 → 9000 kW/);

  // The earlier verdict stops being current: the board no longer shows the boat conforming, and says why.
  row = (await board()).rows.find((r) => r.entryId === entry.id)!;
  assert.notEqual(row.state, 'conforms');
  assert.match(row.declarationChange ?? '', /Re-inspection required/);
  assert.match(row.declarationChange ?? '', /power 250 → 9000 kW/);
  const [cached] = await query<{ inspection_result: string | null }>(
    'select inspection_result from entries where id = $1',
    [entry.id],
  );
  assert.equal(cached.inspection_result, null, 'My entries no longer reads the earlier verdict');

  // The draft report never shows 9000 kW: it keeps the figures confirmed at the inspection (250 kW,
  // 403 kg measured), marked as awaiting re-inspection, without the details of the change.
  report = await draft();
  assert.ok(!report.inputs.boats.some((b) => b.powerKw === 9000));
  const kept = report.inputs.boats.find((b) => b.entryId === entry.id)!;
  assert.equal(kept.powerKw, 250);
  assert.equal(kept.measuredWeightKg, 403);
  assert.match(
    kept.awaitingReinspection ?? '',
    /Re-inspection required.*\(version 1 → 2\); the figures are those inspected/,
  );
  // What changed stays with the officials and the owner: a report is public once published (and frozen).
  assert.doesNotMatch(kept.awaitingReinspection ?? '', /9000/);
  assert.ok(!report.inputs.excluded.some((e) => e.entryId === entry.id));

  // The meeting's chief scrutineer is told, with what changed.
  const mail = await waitForMail(DEMO.chief, { subject: subjectFor(entry) });
  assert.match(mail.text, /power 250 → 9000 kW/);
  assert.match(mail.text, /officials decide/i);

  // Editing again before the re-inspection updates the task (what changed since the inspected version)
  // without a second e-mail: shown once a later flag's e-mail, sent after this edit, has arrived.
  const again2 = await owner.json(`/api/boats/${entry.boatId}`, { power: 8000, powerUnit: 'kW' }, 'PATCH');
  assert.equal(again2.res.status, 200, JSON.stringify(again2.body));
  row = (await board()).rows.find((r) => r.entryId === entry.id)!;
  assert.match(row.declarationChange ?? '', /version 1 → 3\): power 250 → 8000 kW/);
  const later = await meeting.addEntry(classId, { declaredPowerKw: 210 });
  const laterRecord = await scrutineer.json(
    `/api/events/${meeting.eventId}/inspections`,
    inspectionBody(later.id, 101.9, {
      power: { declaredKw: 210, evidenceSeen: true },
      weight: { readingsKg: [402, 404] },
    }),
  );
  assert.equal(laterRecord.res.status, 201, JSON.stringify(laterRecord.body));
  await owner.json(`/api/boats/${later.boatId}`, { power: 215, powerUnit: 'kW' }, 'PATCH');
  await waitForMail(DEMO.chief, { subject: subjectFor(later) });
  const inbox = (await (await fetch(`${MAIL_INBOX}?to=${encodeURIComponent(DEMO.chief)}`)).json()).data as {
    subject: string;
  }[];
  assert.equal(inbox.filter((m) => subjectFor(entry).test(m.subject)).length, 1);

  // My entries shows the flag to the owner too.
  const mine = await owner.fetch('/api/entries');
  assert.equal(mine.status, 200);
  const listed = ((await mine.json()).data as { id: string; declarationChange: string | null }[]).find(
    (x) => x.id === entry.id,
  );
  assert.match(listed?.declarationChange ?? '', /power 250 → 8000 kW/);

  // Inspected again at the new version (the scrutineer confirms 250 kW on the dyno sheet): current again,
  // and the report takes the confirmed figure, not the 9000 kW the owner typed. Sent as the dock sends it,
  // with the declaration version its card showed.
  const card = await scrutineer.fetch(`/api/events/${meeting.eventId}/race-numbers/${entry.raceNumber}`);
  const shown = (await card.json()).data.boat.declarationVersion as number;
  assert.ok(shown > 1);
  const again = await scrutineer.json(
    `/api/events/${meeting.eventId}/inspections`,
    inspectionBody(entry.id, 101.9, { power: { declaredKw: 250, evidenceSeen: true }, declarationVersion: shown }),
  );
  assert.equal(again.res.status, 201, JSON.stringify(again.body));
  row = (await board()).rows.find((r) => r.entryId === entry.id)!;
  assert.equal(row.state, again.body.data.overallResult);
  assert.equal(row.declarationChange, null, 'the new inspection settles the declaration-change task');
  const back = (await draft()).inputs.boats.find((b) => b.entryId === entry.id);
  assert.equal(back?.powerKw, again.body.data.overallResult === 'conforms' ? 250 : undefined);
});

test('the report reads the inspected figures, not the live boat row', async () => {
  const e = await meeting.addEntry(classId, { declaredPowerKw: 240 });
  const r = await scrutineer.json(
    `/api/events/${meeting.eventId}/inspections`,
    inspectionBody(e.id, 101.9, { power: { declaredKw: 240, evidenceSeen: true }, weight: { readingsKg: [402, 404] } }),
  );
  assert.equal(r.res.status, 201, JSON.stringify(r.body));
  // A write straight to the row (no version made): the record still decides what the report reads.
  await query('update boats set declared_power_kw = 9000 where id = $1', [e.boatId]);
  const boat = (await draft()).inputs.boats.find((b) => b.entryId === e.id)!;
  assert.equal(boat.powerKw, 240);
});

test('a record captured before a change but sent after it pins the version it checked, and flags re-inspection', async () => {
  const e = await meeting.addEntry(classId, { declaredPowerKw: 240 });
  const capturedAt = new Date(Date.now() - 60_000).toISOString(); // measured a minute ago, held offline
  const p = await owner.json(`/api/boats/${e.boatId}`, { power: 295, powerUnit: 'kW' }, 'PATCH');
  assert.equal(p.res.status, 200, JSON.stringify(p.body));
  const r = await scrutineer.json(
    `/api/events/${meeting.eventId}/inspections`,
    inspectionBody(e.id, 101.9, {
      capturedAt,
      power: { declaredKw: 240, evidenceSeen: true },
      weight: { readingsKg: [402, 404] },
    }),
  );
  assert.equal(r.res.status, 201, JSON.stringify(r.body));
  assert.equal(r.body.data.overallResult, 'conforms');
  const [pinned] = await query<{ version: number }>(
    `select d.version from inspections i join boat_declaration_versions d on d.id = i.declaration_version_id where i.id = $1`,
    [r.body.data.id],
  );
  assert.equal(pinned.version, 1);
  const row = (await board()).rows.find((x) => x.entryId === e.id)!;
  assert.notEqual(row.state, 'conforms');
  assert.match(row.declarationChange ?? '', /power 240 → 295 kW/);
  const kept = (await draft()).inputs.boats.find((b) => b.entryId === e.id)!;
  assert.equal(kept.powerKw, 240, 'the report keeps the confirmed figure, not the 295 kW declared since');
  // The board says what changed; the report (public once published) only that it changed.
  assert.match(kept.awaitingReinspection ?? '', /declaration changed after inspection \(version 1 → 2\)/);
  assert.doesNotMatch(kept.awaitingReinspection ?? '', /295/);
  const mail = await waitForMail(DEMO.chief, { subject: subjectFor(e) });
  assert.match(mail.text, /power 240 → 295 kW/);
});

test('a change of name only is no new version and flags nothing', async () => {
  const e = await meeting.addEntry(classId);
  const r = await scrutineer.json(
    `/api/events/${meeting.eventId}/inspections`,
    inspectionBody(e.id, 101.9, { weight: { readingsKg: [402, 404] } }),
  );
  assert.equal(r.res.status, 201, JSON.stringify(r.body));
  const p = await owner.json(`/api/boats/${e.boatId}`, { name: `Renamed ${e.raceNumber}` }, 'PATCH');
  assert.equal(p.res.status, 200, JSON.stringify(p.body));
  assert.equal((await versions(e.boatId)).length, 1);
  const row = (await board()).rows.find((x) => x.entryId === e.id)!;
  assert.equal(row.state, 'conforms');
  assert.equal(row.declarationChange, null);
});

test('declaration versions are append-only in the database', async () => {
  await assert.rejects(
    query('update boat_declaration_versions set declared_power_kw = 1 where boat_id = $1', [entry.boatId]),
    /append-only/,
  );
  await assert.rejects(
    query('delete from boat_declaration_versions where boat_id = $1', [entry.boatId]),
    /append-only/,
  );
});

test('another entrant, an official and a huge or malformed body cannot change the declaration', async () => {
  const e = await meeting.addEntry(classId);
  const before = await versions(e.boatId);
  const other = new HttpSession();
  await other.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
  assert.equal((await other.json(`/api/boats/${e.boatId}`, { power: 1, powerUnit: 'kW' }, 'PATCH')).res.status, 404);
  const anon = new HttpSession();
  assert.equal((await anon.json(`/api/boats/${e.boatId}`, { power: 1, powerUnit: 'kW' }, 'PATCH')).res.status, 401);
  // Not the owner: refused before the body is read, so a huge body gets the same 404 (not 413).
  const huge = await other.fetch(`/api/boats/${e.boatId}`, {
    method: 'PATCH',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ name: 'x'.repeat(2_000_000) }),
  });
  assert.equal(huge.status, 404);
  const bad = await owner.fetch(`/api/boats/${e.boatId}`, {
    method: 'PATCH',
    headers: { 'content-type': 'application/json' },
    body: '{"power":',
  });
  assert.equal(bad.status, 400);
  assert.ok((await bad.json()).error.code);
  assert.deepEqual(await versions(e.boatId), before);
});
