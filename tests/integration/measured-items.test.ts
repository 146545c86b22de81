// A class's own measured items and the nozzle's go/no-go gauge check through the real HTTP API and
// database (issue 16, items 4 and 5): rules with items saved through the rules route, a record with item
// readings and a gauge check, its verdict read back, and the refusals (an item not in the rules, an
// instrument type the item does not allow, an instrument out of use after a failed check, the wrong people).
// Reference values, by hand:
// - engine capacity V = n·(π/4)·b²·s, the geometric cylinder volume (common practice, no source):
//   4 cylinders, bore 86 mm, stroke 86 mm: π·86³ = 1 998 228.9 mm³ = 1998.23 cm³;
// - its U with a caliper of certificate U 0.02 mm (u 0.01 mm) per reading, by the sensitivity coefficients
//   (JCGM 100:2008, 5.1.2): U = 2·1998.23·(0.01/86)·√5 = 1.039 cm³;
// - ballast 25.0, 25.2, 25.1 kg on a scale of U 0.1 kg: mean 25.1 kg, U = 2·√(0.05² + (0.1/√3)²) = 0.153 kg
//   (JCGM 100:2008, 4.2.3);
// - ISO 14253-1:2017: conformity proven when value + U is inside a maximum (value − U inside a minimum);
// - ISO 14405-1:2016: a two-point size is a local size; a plug gauge tests the inscribed size, so an oval exit
//   (narrow 101.8 mm, wide 102.3 mm) stops a 102 mm no-go plug yet fails a 102 mm two-point maximum.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { randomUUID } from 'node:crypto';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { InspectionMeeting, inspectionBody, rulesWith, type TestEntry } from '../support/inspection-meeting';

const meeting = new InspectionMeeting();
const chief = new HttpSession();
const scrutineer = new HttpSession();
let classId: string;
const ids: Record<string, string> = {};

const ENGINE = {
  key: 'engine_capacity',
  label: 'Engine capacity',
  unit: 'cm³',
  maximum: 2000,
  readings: 1,
  instrumentTypes: ['caliper', 'bore_gauge'],
  defaultUncertainty: 5,
  formula: { kind: 'engine_capacity', cylinders: 4 },
};
const BALLAST = {
  key: 'ballast',
  label: 'Ballast',
  unit: 'kg',
  minimum: 24.8,
  readings: 3,
  instrumentTypes: ['scale'],
  defaultUncertainty: 1,
  note: 'fixed ballast only',
  formula: { kind: 'direct' },
};
const RULES = rulesWith({
  nozzle: {
    maxMm: 102,
    minMm: null,
    minReadings: 3,
    defaultUncertaintyMm: 0.05,
    checkMethod: 'both',
    gaugeNoGoMm: 102,
  },
  measuredItems: [ENGINE, BALLAST],
});

async function addInstrument(name: string, quantity: string, instrumentType: string, u: number) {
  const r = await chief.json(`/api/events/${meeting.eventId}/instruments`, {
    name: `${name} ${Date.now()}`,
    quantity,
    expandedUncertainty: u,
    instrumentType,
  });
  assert.equal(r.res.status, 201, JSON.stringify(r.body));
  return r.body.data.id as string;
}

const post = (session: HttpSession, body: unknown) => session.json(`/api/events/${meeting.eventId}/inspections`, body);
const items = (over: Record<string, unknown>[] = []) => [
  { key: 'engine_capacity', instrumentId: ids.caliper, readings: [{ boreMm: 86, strokeMm: 86 }] },
  { key: 'ballast', instrumentId: ids.scale, readings: [{ value: 25.0 }, { value: 25.2 }, { value: 25.1 }] },
  ...over,
];
const countFor = async (entry: TestEntry) =>
  Number((await query<{ n: string }>('select count(*) as n from inspections where entry_id = $1', [entry.id]))[0].n);

before(async () => {
  await meeting.create(`Measured Items ${Date.now()}`, [
    { email: DEMO.chief, role: 'chief_scrutineer' },
    { email: DEMO.scrutineer, role: 'scrutineer' },
  ]);
  classId = await meeting.addClass('ITM', RULES);
  await chief.signInWithPassword(DEMO.chief, DEMO_PASSWORD);
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
  ids.caliper = await addInstrument('Item caliper', 'length', 'caliper', 0.02);
  ids.scale = await addInstrument('Ballast scale', 'mass', 'scale', 0.1);
  ids.plug = await addInstrument('No-go plug 102', 'length', 'plug_gauge', 0.002);
});

test('the rules route stores the items and the nozzle’s gauge method, and refuses bad items by field', async () => {
  const { res, body } = await meeting.organiser
    .fetch(`/api/events/${meeting.eventId}/classes/${classId}/rules`)
    .then(async (r) => ({ res: r, body: await r.json() }));
  assert.equal(res.status, 200);
  const rules = body.data.versions[0].rules;
  assert.equal(rules.measuredItems.length, 2);
  assert.equal(rules.measuredItems[0].formula.cylinders, 4);
  assert.equal(rules.measuredItems[1].note, 'fixed ballast only');
  assert.equal(rules.nozzle.checkMethod, 'both');

  const c = await meeting.organiser.json(`/api/events/${meeting.eventId}/classes`, { name: 'Class Bad', code: 'BAD' });
  const bad = await meeting.organiser.json(
    `/api/events/${meeting.eventId}/classes/${c.body.data.id}/rules`,
    {
      powerUnit: 'kW',
      rules: rulesWith({
        measuredItems: [
          { ...ENGINE, maximum: null },
          { ...BALLAST, key: 'engine_capacity', readings: -3 },
        ],
      }),
    },
    'PUT',
  );
  assert.equal(bad.res.status, 400, JSON.stringify(bad.body));
  const fields = bad.body.error.details.map((d: { field: string }) => d.field);
  for (const f of ['rules.measuredItems.0.maximum', 'rules.measuredItems.1.readings', 'rules.measuredItems.1.key'])
    assert.ok(fields.includes(f), `${f} in ${JSON.stringify(fields)}`);
});

test('a record with engine capacity, ballast and a gauge check is decided and stored', async () => {
  const entry = await meeting.addEntry(classId);
  // The oval exit: two-point readings 101.8, 102.3 and 102.0 mm.
  const body = inspectionBody(entry.id, 102.3, {
    nozzle: {
      readings: [
        { diameterMm: 101.8, angleDeg: 0 },
        { diameterMm: 102.3, angleDeg: 60 },
        { diameterMm: 102.0, angleDeg: 120 },
      ],
      expandedUncertaintyMm: 0.05,
    },
    measuredItems: items(),
    gaugeChecks: [{ rule: 'nozzle', gauge: '', instrumentId: ids.plug, passed: true }],
  });
  const { res, body: answer } = await post(scrutineer, body);
  assert.equal(res.status, 201, JSON.stringify(answer));
  const lines = answer.data.rules as {
    rule: string;
    verdict: string;
    decisiveValue: number;
    expandedUncertainty: number;
    unit: string;
    outcome: string;
    explanation: string;
  }[];
  const engine = lines.find((r) => r.rule === 'item:engine_capacity')!;
  assert.equal(engine.unit, 'cm³');
  assert.ok(Math.abs(engine.decisiveValue - 1998.2289) < 1e-3, `${engine.decisiveValue}`);
  assert.ok(Math.abs(engine.expandedUncertainty - 1.0391) < 1e-3, `${engine.expandedUncertainty}`);
  assert.equal(engine.verdict, 'conforms');
  const ballast = lines.find((r) => r.rule === 'item:ballast')!;
  assert.ok(Math.abs(ballast.decisiveValue - 25.1) < 1e-9);
  assert.ok(Math.abs(ballast.expandedUncertainty - 0.15275) < 1e-4);
  assert.equal(ballast.verdict, 'conforms');
  const gauge = lines.find((r) => r.rule === 'gauge:nozzle')!;
  assert.equal(gauge.verdict, 'conforms');
  assert.match(gauge.explanation, /No-go plug 102 .*: passed/);
  assert.match(gauge.explanation, /two-point readings disagree/);
  // Both must pass: the two-point maximum fails (102.3 − 0.05 > 102), so the boat does not conform.
  assert.equal(lines.find((r) => r.rule === 'nozzle_max')!.verdict, 'does_not_conform');
  assert.equal(answer.data.overallResult, 'does_not_conform');

  const [row] = await query<{
    measurements: {
      measuredItems: { key: string; value: number; instrumentName: string; readings: Record<string, number>[] }[];
      gaugeChecks: { rule: string; instrumentId: string; instrumentName: string; passed: boolean }[];
    };
  }>('select measurements from inspections where id = $1', [answer.data.id]);
  const storedEngine = row.measurements.measuredItems.find((m) => m.key === 'engine_capacity')!;
  assert.deepEqual(storedEngine.readings, [{ boreMm: 86, strokeMm: 86 }]);
  assert.match(storedEngine.instrumentName, /^Item caliper/);
  assert.equal(row.measurements.gaugeChecks[0].instrumentId, ids.plug);
  assert.match(row.measurements.gaugeChecks[0].instrumentName, /^No-go plug 102/);
  assert.equal(row.measurements.gaugeChecks[0].passed, true);
});

test('an item not in the rules, a wrong instrument type and an instrument out of use are refused; nothing is stored', async () => {
  const entry = await meeting.addEntry(classId);
  const send = (measuredItems: unknown[], gaugeChecks: unknown[] = []) =>
    post(scrutineer, { ...inspectionBody(entry.id, 101.9), idempotencyKey: randomUUID(), measuredItems, gaugeChecks });
  const detail = (body: { error: { details?: { field: string; message: string }[] } }, field: string) =>
    body.error.details?.find((d) => d.field === field);

  const noise = await send(items([{ key: 'noise_level', instrumentId: null, readings: [{ value: 92 }] }]));
  assert.equal(noise.res.status, 400, JSON.stringify(noise.body));
  assert.match(detail(noise.body, 'measuredItems.2.key')!.message, /no measured item “noise_level”/);

  const wrongType = await send([
    { key: 'engine_capacity', instrumentId: ids.scale, readings: [{ boreMm: 86, strokeMm: 86 }] },
  ]);
  assert.equal(wrongType.res.status, 400, JSON.stringify(wrongType.body));
  assert.match(
    detail(wrongType.body, 'measuredItems.0.instrumentId')!.message,
    /Ballast scale .* is a scale; the class rules allow only caliper, bore gauge for Engine capacity/,
  );

  const caliperAsGauge = await send(items(), [{ rule: 'nozzle', gauge: '', instrumentId: ids.caliper, passed: true }]);
  assert.equal(caliperAsGauge.res.status, 400);
  assert.match(detail(caliperAsGauge.body, 'gaugeChecks.0.instrumentId')!.message, /allow only plug gauge/);

  const tooFew = await send([{ key: 'ballast', instrumentId: null, readings: [{ value: 25 }] }]);
  assert.equal(tooFew.res.status, 400, JSON.stringify(tooFew.body));
  assert.match(tooFew.body.error.message + JSON.stringify(tooFew.body.error.details), /ask for 3 readings of Ballast/);

  // A failed check today takes the caliper out of use for items too (issue 16, item 1).
  const outOfUse = await addInstrument('Failed caliper', 'length', 'caliper', 0.02);
  const chk = await chief.json(`/api/events/${meeting.eventId}/instruments/${outOfUse}/checks`, {
    reference: 'Gauge block 50 mm',
    nominalValue: 50,
    reading: 50.09,
    passed: false,
  });
  assert.equal(chk.res.status, 201, JSON.stringify(chk.body));
  const failed = await send([
    { key: 'engine_capacity', instrumentId: outOfUse, readings: [{ boreMm: 86, strokeMm: 86 }] },
  ]);
  assert.equal(failed.res.status, 409, JSON.stringify(failed.body));
  assert.match(
    detail(failed.body, 'measuredItems.0.instrumentId')!.message,
    /Failed caliper .* cannot be used: out of use/,
  );

  assert.equal(await countFor(entry), 0, 'no record was stored');
});

test('anonymous callers and entrants cannot record items', async () => {
  const entry = await meeting.addEntry(classId);
  const body = { ...inspectionBody(entry.id, 101.9), measuredItems: items() };
  const anonymous = await post(new HttpSession(), body);
  assert.equal(anonymous.res.status, 401);
  const entrant = new HttpSession();
  await entrant.signInWithPassword(DEMO.entrant, DEMO_PASSWORD);
  const asEntrant = await post(entrant, { ...body, idempotencyKey: randomUUID() });
  assert.equal(asEntrant.res.status, 403);
  assert.equal(await countFor(entry), 0);
});
