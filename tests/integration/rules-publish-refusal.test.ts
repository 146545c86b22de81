// Publishing class rules through the real HTTP API: a version that limits nothing is refused (422),
// a version 2+ without a change note is refused (400), each problem under its field, and nothing is
// stored on refusal. Why rules must exist before measuring: ISO/IEC 17025:2017, 7.1.3 (decision rules
// agreed before the work); that a change to published rules carries its reason is common practice, no source.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';

const organiser = new HttpSession();
let eventId: string;

const rules = (over: Record<string, unknown> = {}) => ({
  nozzle: { maxMm: 102, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 },
  power: { minKw: null, maxKw: null, defaultUncertaintyKw: 5 },
  weight: { minKg: null, includesDriver: true, defaultUncertaintyKg: 1 },
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

const stored = async (classId: string) =>
  query<{ version: number; status: string; change_note: string }>(
    'select version, status, change_note from class_rule_versions where class_id = $1 order by version',
    [classId],
  );

before(async () => {
  await organiser.signInWithPassword(DEMO.organiser, DEMO_PASSWORD);
  const { res, body } = await organiser.json('/api/events', {
    organisationId: '0b0e0000-0000-4000-8000-000000000001',
    name: 'Refusal Reach Sprint',
    venue: 'Refusal Reach',
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
  });
  assert.equal(res.status, 201, JSON.stringify(body));
  eventId = body.data.id;
});

test("a new class's untouched draft (blank nozzle, power and weight; safety items ticked) is refused with 422 and stays a draft", async () => {
  const { body } = await organiser.json(`/api/events/${eventId}/classes`, { name: 'Empty Rules', code: 'EMPTY' });
  const classId = body.data.id;
  const before = await stored(classId);
  const pub = await organiser.json(`/api/events/${eventId}/classes/${classId}/rules/publish`, { changeNote: '' });
  assert.equal(pub.res.status, 422, JSON.stringify(pub.body));
  assert.equal(pub.body.error.code, 'invalid_input');
  assert.match(pub.body.error.message, /Version 1 limits nothing/);
  assert.match(pub.body.error.message, /no nozzle exit diameter limit.*no power limit.*no minimum weight/);
  assert.match(pub.body.error.message, /Safety items alone do not limit a boat/);
  assert.deepEqual(
    pub.body.error.details.map((d: { field: string }) => d.field),
    ['rules'],
  );
  assert.deepEqual(await stored(classId), before, 'nothing stored on refusal');
  assert.equal((await stored(classId))[0].status, 'draft');
  const inForce = await organiser.fetch(
    `/api/events/${eventId}/classes/${classId}/rules?at=${encodeURIComponent(new Date(Date.now() + 60_000).toISOString())}`,
  );
  assert.equal(inForce.status, 404, 'no rules in force');
});

test('version 1 with a nozzle limit publishes without a note; version 2 without a note is refused (400, field changeNote), with one it publishes', async () => {
  const { body } = await organiser.json(`/api/events/${eventId}/classes`, { name: 'Nozzle Only', code: 'NOZ' });
  const classId = body.data.id;
  assert.equal(
    (
      await organiser.json(
        `/api/events/${eventId}/classes/${classId}/rules`,
        { powerUnit: 'kW', rules: rules() },
        'PUT',
      )
    ).res.status,
    200,
  );
  const v1 = await organiser.json(`/api/events/${eventId}/classes/${classId}/rules/publish`, {
    effectiveFrom: new Date(Date.now() - 60_000).toISOString(),
  });
  assert.equal(v1.res.status, 201, JSON.stringify(v1.body));

  const save2 = await organiser.json(
    `/api/events/${eventId}/classes/${classId}/rules`,
    { powerUnit: 'kW', rules: rules({ weight: { minKg: 640, includesDriver: true, defaultUncertaintyKg: 1 } }) },
    'PUT',
  );
  assert.equal(save2.body.data.version, 2);
  for (const changeNote of ['', '   ', undefined]) {
    const refused = await organiser.json(
      `/api/events/${eventId}/classes/${classId}/rules/publish`,
      changeNote === undefined ? {} : { changeNote },
    );
    assert.equal(refused.res.status, 400, JSON.stringify(refused.body));
    assert.deepEqual(refused.body.error.details, [
      {
        field: 'changeNote',
        message:
          'Say what changed from version 1 and why: from version 2 on, every published version carries a change note.',
      },
    ]);
  }
  assert.deepEqual(
    (await stored(classId)).map((v) => [v.version, v.status]),
    [
      [1, 'published'],
      [2, 'draft'],
    ],
    'nothing stored on refusal',
  );

  const v2 = await organiser.json(`/api/events/${eventId}/classes/${classId}/rules/publish`, {
    changeNote: 'Minimum weight 640 kg added',
  });
  assert.equal(v2.res.status, 201, JSON.stringify(v2.body));
  assert.equal(v2.body.data.changeNote, 'Minimum weight 640 kg added');
});

test('a draft edited down to no limits at all (bypassing the form) is refused at publish, and both problems are named together', async () => {
  const { body } = await organiser.json(`/api/events/${eventId}/classes`, { name: 'Emptied Later', code: 'EMPT2' });
  const classId = body.data.id;
  await organiser.json(`/api/events/${eventId}/classes/${classId}/rules`, { powerUnit: 'kW', rules: rules() }, 'PUT');
  assert.equal(
    (await organiser.json(`/api/events/${eventId}/classes/${classId}/rules/publish`, { changeNote: 'first' })).res
      .status,
    201,
  );
  await organiser.json(`/api/events/${eventId}/classes/${classId}/rules`, { powerUnit: 'kW', rules: rules() }, 'PUT');
  // The form's schema requires a nozzle limit; a draft row can still hold empty rules (e.g. written by
  // an older version of the app), and publishing must not trust it.
  await query(
    `update class_rule_versions set rules = jsonb_set(rules, '{nozzle,maxMm}', 'null') where class_id = $1 and version = 2`,
    [classId],
  );
  const pub = await organiser.json(`/api/events/${eventId}/classes/${classId}/rules/publish`, { changeNote: '' });
  assert.equal(pub.res.status, 422);
  assert.deepEqual(pub.body.error.details.map((d: { field: string }) => d.field).sort(), ['changeNote', 'rules']);
  assert.match(pub.body.error.message, /Version 2 limits nothing/);
  assert.deepEqual(
    (await stored(classId)).map((v) => v.status),
    ['published', 'draft'],
  );
});

test('the refusal comes after the permission check: a scrutineer gets 403, not the rules problem', async () => {
  const { body } = await organiser.json(`/api/events/${eventId}/classes`, { name: 'Not Yours', code: 'NY1' });
  const other = new HttpSession();
  await other.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
  const res = await other.json(`/api/events/${eventId}/classes/${body.data.id}/rules/publish`, {});
  assert.equal(res.res.status, 403);
});

test('reference speeds typed as text (sent as null by the form) get a message that says what to type, and nothing is saved', async () => {
  const { body } = await organiser.json(`/api/events/${eventId}/classes`, { name: 'Speed Text', code: 'SPDTXT' });
  const classId = body.data.id;
  const put = await organiser.json(
    `/api/events/${eventId}/classes/${classId}/rules`,
    { powerUnit: 'kW', rules: rules({ parity: { ...rules().parity, referenceSpeedsMs: [10, null] } }) },
    'PUT',
  );
  assert.equal(put.res.status, 400, JSON.stringify(put.body));
  const detail = put.body.error.details.find((d: { field: string }) =>
    d.field.startsWith('rules.parity.referenceSpeedsMs'),
  );
  assert.ok(detail, JSON.stringify(put.body));
  assert.match(detail.message, /reference speed as a number in m\/s/);
  assert.doesNotMatch(detail.message, /received null/);
});
