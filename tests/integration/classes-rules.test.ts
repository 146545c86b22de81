// Events, classes and versioned class rules through the real HTTP API and database.
// Versioning behaviour follows ISO/IEC 17025:2017, 7.1.3 (decision rules fixed before measuring):
// a published version never changes, and a lookup at a time gets the version then in force.
// Runs alone (scripts/test.sh): it counts every meeting (a refused request stores none).
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD, uniqueEmail } from '../support/env';
import { query } from '../support/db';

const organiser = new HttpSession();
let eventId: string;

const rules = (over: Record<string, unknown> = {}) => ({
  nozzle: { maxMm: 102, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 },
  power: { minKw: 180, maxKw: 260, defaultUncertaintyKw: 5 },
  weight: { minKg: 650, includesDriver: true, defaultUncertaintyKg: 1 },
  decisionRule: 'iso14253',
  safetyItems: ['kill_switch', 'helmet'],
  parity: {
    pumpEfficiency: 0.9,
    nozzleLossCoefficient: 0.02,
    inletLossCoefficient: 0.2,
    wakeFraction: 0,
    referenceSpeedsMs: [10, 20],
  },
  ...over,
});

const eventBody = {
  organisationId: '0b0e0000-0000-4000-8000-000000000001',
  name: 'Test Reach Autumn Sprint',
  venue: 'Test Reach',
  startsOn: '2027-04-10',
  endsOn: '2027-04-11',
  timeZone: 'Pacific/Auckland',
  status: 'entries_open',
  waterKind: 'fresh',
  waterTemperatureC: 16,
  waterDensityKgM3: null,
  protestWindowMinutes: 30,
  currency: 'NZD',
  entryFeeMinor: 12000,
  protestFeeMinor: 4000,
};

before(async () => {
  await organiser.signInWithPassword(DEMO.organiser, DEMO_PASSWORD);
  const { res, body } = await organiser.json('/api/events', eventBody);
  assert.equal(res.status, 201, JSON.stringify(body));
  eventId = body.data.id;
});

test('an organiser creates a class, publishes v1, edits into v2; v1 never changes and lookups get the version in force', async () => {
  const created = await organiser.json(`/api/events/${eventId}/classes`, { name: 'Test Sport', code: 'ts1' });
  assert.equal(created.res.status, 201, JSON.stringify(created.body));
  const classId = created.body.data.id;
  assert.equal(created.body.data.code, 'TS1');

  const save1 = await organiser.json(
    `/api/events/${eventId}/classes/${classId}/rules`,
    { powerUnit: 'kW', rules: rules() },
    'PUT',
  );
  assert.equal(save1.res.status, 200, JSON.stringify(save1.body));
  const v1Time = new Date(Date.now() - 60_000).toISOString();
  const pub1 = await organiser.json(`/api/events/${eventId}/classes/${classId}/rules/publish`, {
    changeNote: 'first',
    effectiveFrom: v1Time,
  });
  assert.equal(pub1.res.status, 201, JSON.stringify(pub1.body));
  assert.equal(pub1.body.data.version, 1);

  // Editing after publication opens v2; v1 stays as it was.
  const save2 = await organiser.json(
    `/api/events/${eventId}/classes/${classId}/rules`,
    {
      powerUnit: 'kW',
      rules: rules({ nozzle: { maxMm: 100, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 } }),
    },
    'PUT',
  );
  assert.equal(save2.body.data.version, 2);
  assert.equal(save2.body.data.status, 'draft');
  const v2Time = new Date(Date.now() + 3600_000).toISOString();
  const pub2 = await organiser.json(`/api/events/${eventId}/classes/${classId}/rules/publish`, {
    changeNote: 'smaller nozzle',
    effectiveFrom: v2Time,
  });
  assert.equal(pub2.res.status, 201, JSON.stringify(pub2.body));

  const now = await organiser.fetch(
    `/api/events/${eventId}/classes/${classId}/rules?at=${encodeURIComponent(new Date().toISOString())}`,
  );
  assert.equal((await now.json()).data.inForce.version, 1, 'v2 is not yet in force');
  const later = await organiser.fetch(
    `/api/events/${eventId}/classes/${classId}/rules?at=${encodeURIComponent(new Date(Date.now() + 7200_000).toISOString())}`,
  );
  const laterBody = await later.json();
  assert.equal(laterBody.data.inForce.version, 2);
  assert.equal(laterBody.data.inForce.rules.nozzle.maxMm, 100);
  const before = await organiser.fetch(
    `/api/events/${eventId}/classes/${classId}/rules?at=${encodeURIComponent('2020-01-01T00:00:00Z')}`,
  );
  assert.equal(before.status, 404, 'nothing was in force before v1');

  const [v1] = await query<{ rules: { nozzle: { maxMm: number } } }>(
    'select rules from class_rule_versions where class_id = $1 and version = 1',
    [classId],
  );
  assert.equal(v1.rules.nozzle.maxMm, 102);
  // The database itself refuses to alter a published version.
  await assert.rejects(
    query(`update class_rule_versions set rules = '{}'::jsonb where class_id = $1 and version = 1`, [classId]),
    /frozen/,
  );
  await assert.rejects(
    query('delete from class_rule_versions where class_id = $1 and version = 1', [classId]),
    /frozen/,
  );
});

test('power entered in hp is stored in kW (NIST SP 811: 1 hp = 745.69987158227022 W)', async () => {
  const { body } = await organiser.json(`/api/events/${eventId}/classes`, { name: 'Horsepower Class', code: 'HP1' });
  const classId = body.data.id;
  const save = await organiser.json(
    `/api/events/${eventId}/classes/${classId}/rules`,
    {
      powerUnit: 'hp',
      rules: rules({ power: { minKw: 300, maxKw: 402.3066, defaultUncertaintyKw: 0 } }),
    },
    'PUT',
  );
  assert.equal(save.res.status, 200, JSON.stringify(save.body));
  assert.ok(
    Math.abs(save.body.data.rules.power.maxKw - 300) < 1e-3,
    `402.3066 hp is 300 kW (1 hp = 745.69987158227022 W, NIST SP 811 appendix B), got ${save.body.data.rules.power.maxKw}`,
  );
  assert.ok(Math.abs(save.body.data.rules.power.minKw - 223.71) < 0.01);
});

test('bad rules: power minimum above maximum, negative diameter, string for a number — 400 naming the field, nothing stored', async () => {
  const { body } = await organiser.json(`/api/events/${eventId}/classes`, { name: 'Bad Input Class', code: 'BAD' });
  const classId = body.data.id;
  const [{ rules: original }] = await query<{ rules: unknown }>(
    'select rules from class_rule_versions where class_id = $1',
    [classId],
  );
  const cases: [Record<string, unknown>, string][] = [
    [rules({ power: { minKw: 300, maxKw: 200, defaultUncertaintyKw: 5 } }), 'rules.power.minKw'],
    [rules({ nozzle: { maxMm: -5, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 } }), 'rules.nozzle.maxMm'],
    [
      rules({ nozzle: { maxMm: '102', minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 } }),
      'rules.nozzle.maxMm',
    ],
    [
      rules({
        parity: {
          pumpEfficiency: 1.5,
          nozzleLossCoefficient: 0,
          inletLossCoefficient: 0,
          wakeFraction: 0,
          referenceSpeedsMs: [10],
        },
      }),
      'rules.parity.pumpEfficiency',
    ],
  ];
  for (const [r, field] of cases) {
    const res = await organiser.json(
      `/api/events/${eventId}/classes/${classId}/rules`,
      { powerUnit: 'kW', rules: r },
      'PUT',
    );
    assert.equal(res.res.status, 400, JSON.stringify(res.body));
    assert.ok(
      res.body.error.details.some((d: { field: string }) => d.field === field),
      `${field} in ${JSON.stringify(res.body.error.details)}`,
    );
  }
  const rows = await query<{ rules: unknown; n: string }>('select rules from class_rule_versions where class_id = $1', [
    classId,
  ]);
  assert.equal(rows.length, 1);
  assert.deepEqual(rows[0].rules, original);
});

test('bad event input: last day before the first, unknown time zone — 400 with the field; nothing created', async () => {
  const before = await query<{ n: string }>('select count(*) as n from events');
  const r1 = await organiser.json('/api/events', { ...eventBody, endsOn: '2027-04-01' });
  assert.equal(r1.res.status, 400);
  assert.ok(r1.body.error.details.some((d: { field: string }) => d.field === 'endsOn'));
  const r2 = await organiser.json('/api/events', { ...eventBody, timeZone: 'Mars/Olympus' });
  assert.ok(r2.body.error.details.some((d: { field: string }) => d.field === 'timeZone'));
  const after = await query<{ n: string }>('select count(*) as n from events');
  assert.equal(after[0].n, before[0].n);
});

test('only organisers of the event edit its classes and rules', async () => {
  const classes = await organiser.fetch(`/api/events/${DEMO.meetingId}/classes`);
  const [ss] = (await classes.json()).data;
  const entrant = new HttpSession();
  await entrant.signInWithPassword(DEMO.entrant, DEMO_PASSWORD);
  const steward = new HttpSession();
  await steward.signInWithPassword(DEMO.steward, DEMO_PASSWORD);
  for (const s of [entrant, steward]) {
    assert.equal(
      (await s.json(`/api/events/${DEMO.meetingId}/classes/${ss.id}/rules`, { powerUnit: 'kW', rules: rules() }, 'PUT'))
        .res.status,
      403,
    );
    assert.equal(
      (await s.json(`/api/events/${DEMO.meetingId}/classes`, { name: 'Sneaky', code: 'SNK' })).res.status,
      403,
    );
    assert.equal((await s.json(`/api/events/${DEMO.meetingId}`, eventBody, 'PATCH')).res.status, 403);
  }
  // An organiser of a different meeting has no say here.
  const other = new HttpSession();
  const email = uniqueEmail('org');
  await other.json('/api/accounts', { name: 'Other Organiser', email, password: 'long-enough-pw' });
  await query(
    `insert into organisation_members (organisation_id, user_id, role) select '0b0e0000-0000-4000-8000-000000000001', id, 'organiser' from users where email = $1`,
    [email],
  );
  await other.signInWithPassword(email, 'long-enough-pw');
  const own = await other.json('/api/events', { ...eventBody, name: 'Other Meeting' });
  assert.equal(own.res.status, 201);
  assert.equal(
    (
      await other.json(
        `/api/events/${DEMO.meetingId}/classes/${ss.id}/rules`,
        { powerUnit: 'kW', rules: rules() },
        'PUT',
      )
    ).res.status,
    403,
  );
  // …and cannot copy a class from a meeting it does not organise.
  const copy = await other.json(`/api/events/${own.body.data.id}/classes`, {
    name: 'Copy',
    code: 'CP',
    copyFromClassId: ss.id,
  });
  assert.equal(copy.res.status, 404);
  assert.equal(
    (await new HttpSession().json(`/api/events/${DEMO.meetingId}/classes`, { name: 'x', code: 'X' })).res.status,
    401,
  );
  assert.equal((await organiser.fetch('/api/events/not-a-uuid/classes')).status, 404);
});

test('copying a class from an earlier meeting starts its draft from that class’s latest rules', async () => {
  const classes = await (await organiser.fetch(`/api/events/${DEMO.meetingId}/classes`)).json();
  const gp = classes.data.find((c: { code: string }) => c.code === 'GP');
  const copy = await organiser.json(`/api/events/${eventId}/classes`, {
    name: 'Group Pro',
    code: 'GP',
    copyFromClassId: gp.id,
  });
  assert.equal(copy.res.status, 201, JSON.stringify(copy.body));
  const versions = await (await organiser.fetch(`/api/events/${eventId}/classes/${copy.body.data.id}/rules`)).json();
  assert.equal(versions.data.versions[0].status, 'draft');
  assert.equal(versions.data.versions[0].rules.nozzle.maxMm, 108, 'the seeded GP class is at v2 with a 108 mm cap');
});

test('the entries table exports CSV for officials only; entrants get 403', async () => {
  const res = await organiser.fetch(`/api/events/${DEMO.meetingId}/entries/export`);
  assert.equal(res.status, 200);
  assert.match(res.headers.get('content-type') ?? '', /text\/csv/);
  const lines = (await res.text()).trim().split('\r\n');
  assert.equal(lines[0].split(',')[0], 'race_number');
  const [{ n }] = await query<{ n: string }>('select count(*) as n from entries where event_id = $1', [DEMO.meetingId]);
  assert.equal(lines.length - 1, Number(n));
  const entrant = new HttpSession();
  await entrant.signInWithPassword(DEMO.entrant, DEMO_PASSWORD);
  assert.equal((await entrant.fetch(`/api/events/${DEMO.meetingId}/entries/export`)).status, 403);
  assert.equal((await entrant.fetch(`/api/events/${DEMO.meetingId}/entries`)).status, 403);
});
