// A class that reports on the matched model, run through the clock section (issue 20, items 2 and 4), through the
// real HTTP API and database: boats with declared engine and pump curves, inspected, their run times imported; the
// clock section's predicted times come from the matched thrust (engine curve levelled to the confirmed power, pump
// and engine settled at each speed of the run), not from fixed power, and they follow the order the pumps give.
// The curves and figures are invented for this test. Checks, each against something outside the clock section:
// - each matched boat's times are recomputed here from the engine's operating point (pump affinity laws: Karassik
//   et al., Pump Handbook, 4th ed., 2008, ch. 2; Brennen, Hydrodynamics of Pumps, 1994) and the drag fitted so that
//   thrust equals drag at the boat's GPS top speed, integrated by the project's RK4 (its closed-form check:
//   tests/unit/core/engine/run-integrator.test.ts); the same boats on fixed power (momentum theory at constant
//   shaft power: Allison, SNAME Transactions 101, 1993) give other times;
// - the static thrust behind each matched boat's thrust/weight is the parity report's own matched static thrust;
// - two boats of the same power, nozzle, mass and top speed are equal on fixed power, but the one whose pump is
//   more efficient at the same head curve absorbs less power at each rpm (P_a = rho g Q H / eta), so its engine
//   settles at a higher rpm and it is predicted faster;
// - in the sandbox, the meeting's catalogue impeller of the stronger curve makes the weaker boat faster, and one of
//   the boat's own curve changes nothing.
import { before, test } from 'node:test';
import assert from 'node:assert/strict';
import { HttpSession } from '../support/http-session';
import { BASE_URL, DEMO, DEMO_PASSWORD } from '../support/env';
import { InspectionMeeting, inspectionBody, rulesWith, type TestEntry } from '../support/inspection-meeting';
import { evaluateMatchedPoint, prepareMatchedSetup, type MatchedPoint } from '../../lib/core/engine/jet-matched';
import { fixedPowerThrust, predictRun, STANDARD_GRAVITY_MS2 } from '../../lib/core/engine/run-prediction';
import type { ThrustFunction } from '../../lib/core/engine/run-integrator';
import { applyBalanceLevers } from '../../lib/core/timing/balance-levers';
import type { ClockSectionView } from '../../lib/server/timing/gather-clock-section';

const meeting = new InspectionMeeting();
const owner = new HttpSession();
const scrutineer = new HttpSession();
let classId = '';
let strong: TestEntry;
let weak: TestEntry;
let plain: TestEntry;

const engine = {
  curve: [
    { rpm: 3000, powerKw: 150 },
    { rpm: 5000, powerKw: 260 },
    { rpm: 7000, powerKw: 300 },
  ],
  limiterRpm: 7200,
};
const strongCurve = [
  { flowCoefficient: 0.05, headCoefficient: 8, efficiency: 0.82 },
  { flowCoefficient: 0.3, headCoefficient: 4.5, efficiency: 0.9 },
  { flowCoefficient: 0.6, headCoefficient: 0.5, efficiency: 0.8 },
];
// The same head curve, ten points less efficient.
const weakCurve = strongCurve.map((p) => ({ ...p, efficiency: Math.round((p.efficiency - 0.1) * 100) / 100 }));
const parity = {
  pumpEfficiency: 0.9,
  nozzleLossCoefficient: 0.02,
  inletLossCoefficient: 0.2,
  wakeFraction: 0,
  referenceSpeedsMs: [10, 20],
  reportModel: 'matched',
};
const GPS_KMH = 110;
const MIN_KG = 650;
const WEIGHED_KG = 700;

type Row = ClockSectionView['boats'][number];
type Draft = {
  inputs: { density: { densityKgM3: number }; boats: { entryId: string; powerKw: number; nozzleDiameterMm: number }[] };
  results: { modelUsed: Record<string, { model: string; points?: MatchedPoint[] }> };
};

before(async () => {
  await meeting.create(`Matched Clock ${Date.now()}`, [{ email: DEMO.scrutineer, role: 'scrutineer' }]);
  classId = await meeting.addClass(
    'MC',
    rulesWith({ parity, weight: { minKg: MIN_KG, includesDriver: false, defaultUncertaintyKg: 1 } }),
  );
  strong = await meeting.addEntry(classId);
  weak = await meeting.addEntry(classId);
  plain = await meeting.addEntry(classId);
  await owner.signInWithPassword(DEMO.entrant, DEMO_PASSWORD);
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
  // The curves are declared before the inspection, so the inspected version holds them.
  for (const [e, curve] of [
    [strong, strongCurve],
    [weak, weakCurve],
  ] as const) {
    const put = await owner.json(
      `/api/boats/${e.boatId}/performance`,
      {
        engine: { kind: 'points', ...engine },
        pump: { kind: 'points', impellerDiameterMm: 212, curve },
        suction: null,
      },
      'PUT',
    );
    assert.equal(put.res.status, 200, JSON.stringify(put.body));
  }
  for (const e of [strong, weak, plain]) {
    const r = await scrutineer.json(
      `/api/events/${meeting.eventId}/inspections`,
      inspectionBody(e.id, 101.9, { weight: { readingsKg: [WEIGHED_KG] } }),
    );
    assert.equal(r.res.status, 201, JSON.stringify(r.body));
    assert.equal(r.body.data.overallResult, 'conforms');
  }
  const form = new FormData();
  form.append('classId', classId);
  form.append('courseLengthM', '400');
  const csv = [
    'race_number,run,elapsed_s,gps_top_speed_kmh',
    `${strong.raceNumber},1,16.40,${GPS_KMH}`,
    `${strong.raceNumber},2,16.52,`,
    `${weak.raceNumber},1,16.95,${GPS_KMH}`,
    `${weak.raceNumber},2,16.88,`,
    `${plain.raceNumber},1,15.70,${GPS_KMH}`,
    `${plain.raceNumber},2,15.81,`,
  ].join('\n');
  form.append('file', new Blob([csv], { type: 'text/csv' }), 'timing.csv');
  const imp = await meeting.organiser.fetch(`/api/events/${meeting.eventId}/run-times`, { method: 'POST', body: form });
  assert.equal(imp.status, 201, await imp.text());
});

const readClock = async (): Promise<ClockSectionView> => {
  const res = await meeting.organiser.fetch(`/api/events/${meeting.eventId}/classes/${classId}/clock`);
  assert.equal(res.status, 200);
  return (await res.json()).data;
};
const readDraft = async (): Promise<Draft> => {
  const res = await meeting.organiser.fetch(`/api/events/${meeting.eventId}/classes/${classId}/report`);
  assert.equal(res.status, 200);
  return (await res.json()).data.draft;
};
const close = (a: number, b: number, rel = 1e-9) => Math.abs(a - b) <= rel * Math.max(Math.abs(a), Math.abs(b));

test('the clock section of a matched class runs the curve boats on matched thrust, not fixed power', async () => {
  const clock = await readClock();
  const draft = await readDraft();
  assert.equal(clock.thrustModel, 'matched');
  assert.equal(clock.courseLengthM, 400);
  const row = (e: TestEntry) => clock.boats.find((b) => b.entryId === e.id) as Row;
  assert.equal(row(strong).thrustModel, 'matched');
  assert.equal(row(weak).thrustModel, 'matched');
  assert.equal(row(plain).thrustModel, 'fixed_power');
  assert.match(row(plain).thrustModelReason!, /No engine curve and pump curve both declared/);

  const rho = draft.inputs.density.densityKgM3;
  const vTop = GPS_KMH / 3.6;
  const massKg = WEIGHED_KG + 160 + 25; // weighed, plus the stated assumptions (nothing declared for these entries)
  const distances = [100, 200, 400];
  const timesWith = (thrust: ThrustFunction, powerKw: number) =>
    predictRun({ thrustN: thrust, powerKw, massKg, dragK: thrust(vTop) / (vTop * vTop), distancesM: distances })
      .timesS as number[];
  const fixed = new Map<string, number[]>();
  const matched = new Map<string, number[]>();
  for (const e of [strong, weak, plain]) {
    const input = draft.inputs.boats.find((b) => b.entryId === e.id)!;
    const r = row(e);
    assert.equal(r.massKg, massKg);
    assert.equal(r.dragBasis, 'gps_top_speed');
    fixed.set(
      e.id,
      timesWith(
        fixedPowerThrust({
          densityKgM3: rho,
          pumpEfficiency: parity.pumpEfficiency,
          nozzleLossCoefficient: parity.nozzleLossCoefficient,
          inletLossCoefficient: parity.inletLossCoefficient,
          wakeFraction: parity.wakeFraction,
          powerKw: input.powerKw,
          nozzleDiameterMm: input.nozzleDiameterMm,
        }),
        input.powerKw,
      ),
    );
    if (e === plain) continue;
    // The declared curve's shape at the confirmed power: its 300 kW peak scaled to the boat's, by hand.
    const setup = prepareMatchedSetup({
      engine: {
        curve: engine.curve.map((c) => ({ rpm: c.rpm, powerKw: (c.powerKw * input.powerKw) / 300 })),
        limiterRpm: engine.limiterRpm,
      },
      pump: { impellerDiameterMm: 212, curve: e === strong ? strongCurve : weakCurve },
      nozzleDiameterMm: input.nozzleDiameterMm,
      densityKgM3: rho,
      nozzleLossCoefficient: parity.nozzleLossCoefficient,
      inletLossCoefficient: parity.inletLossCoefficient,
      wakeFraction: parity.wakeFraction,
    });
    const point = {} as MatchedPoint;
    const thrust: ThrustFunction = (v) => evaluateMatchedPoint(setup, v, point).thrustN;
    matched.set(e.id, timesWith(thrust, input.powerKw));
    // The static thrust behind thrust/weight is the parity report's matched static thrust.
    const reportStatic = draft.results.modelUsed[e.id].points![0].thrustN;
    assert.equal(draft.results.modelUsed[e.id].model, 'matched');
    assert.ok(close(r.thrustToWeight! * massKg * STANDARD_GRAVITY_MS2, reportStatic), `${r.thrustToWeight}`);
    assert.ok(close(thrust(0), reportStatic));
  }
  for (const e of [strong, weak]) {
    const r = row(e);
    const got = [...r.referenceTimesS, r.courseTimeS] as number[];
    const want = matched.get(e.id)!;
    got.forEach((t, i) => assert.ok(close(t, want[i], 1e-6), `${e.boatName} at ${distances[i]} m: ${t} vs ${want[i]}`));
    // Not the fixed-power prediction: the matched engine gives less than its peak power at low rpm.
    assert.ok(Math.abs(r.courseTimeS! - fixed.get(e.id)![2]) > 0.05, `${r.courseTimeS} vs ${fixed.get(e.id)![2]}`);
  }
  // The boat without curves is the fixed-power prediction itself.
  const p = row(plain);
  [...p.referenceTimesS, p.courseTimeS].forEach((t, i) => assert.ok(close(t!, fixed.get(plain.id)![i], 1e-6)));
  // Equal on fixed power (same power, nozzle, mass and top speed), apart on the matched model: the more efficient
  // pump is faster at every distance.
  assert.ok(close(fixed.get(strong.id)![2], fixed.get(weak.id)![2]));
  for (let i = 0; i < 2; i++) assert.ok(row(strong).referenceTimesS[i]! < row(weak).referenceTimesS[i]!);
  assert.ok(row(strong).courseTimeS! + 0.05 < row(weak).courseTimeS!, 'strong pump faster over the course');
  assert.equal(clock.comparison.points.length, 3);
});

test('the published report keeps each boat’s model; the sandbox moves a boat with a catalogue impeller', async () => {
  const pub = await meeting.organiser.json(`/api/events/${meeting.eventId}/classes/${classId}/report/publish`, {
    note: 'matched clock',
  });
  assert.equal(pub.res.status, 201, JSON.stringify(pub.body));
  const publicId = pub.body.data.publicId as string;
  const published = (await (await fetch(`${BASE_URL}/api/reports/${publicId}`)).json()).data.results.clock;
  const model = (e: TestEntry) => published.boats.find((b: Row) => b.entryId === e.id).thrustModel;
  assert.deepEqual([model(strong), model(weak), model(plain)], ['matched', 'matched', 'fixed_power']);
  const csv = (await (await fetch(`${BASE_URL}/api/reports/${publicId}/csv`)).text()).split('\r\n');
  const header = csv[0].split(',');
  const cell = (e: TestEntry) =>
    csv.find((l) => l.startsWith(`${e.raceNumber},`))!.split(',')[header.indexOf('predicted_time_thrust_model')];
  assert.deepEqual([cell(strong), cell(weak), cell(plain)], ['matched', 'matched', 'fixed_power']);

  // The meeting's catalogue: the strong curve, and the weak boat's own curve.
  for (const [name, curve] of [
    ['Strong 212', strongCurve],
    ['Weak 212', weakCurve],
  ] as const) {
    const added = await meeting.organiser.json(`/api/events/${meeting.eventId}/pump-catalogue`, {
      maker: 'Invented Jets',
      model: name,
      trimCode: '',
      impellerDiameterMm: 212,
      curve,
    });
    assert.equal(added.res.status, 201, JSON.stringify(added.body));
  }
  const clock = await readClock();
  const pick = (label: string) => clock.pumpCatalogue.find((c) => c.label === label)!;
  assert.ok(pick('Invented Jets Strong 212') && pick('Invented Jets Weak 212'));
  const none = { nozzleCapMm: null, minimumMassKg: null, powerCapKw: null };
  const withPump = (label: string) =>
    applyBalanceLevers(clock, { ...none, impellers: { [weak.id]: { pump: { ...pick(label), label } } } });
  const better = withPump('Invented Jets Strong 212');
  const w = better.boats.find((b) => b.entryId === weak.id)!;
  assert.ok(w.deltaS < -0.05, `${w.deltaS}`);
  // Unchanged boats: the same run integrated again, to the integrator's step-halving tolerance (1e-9 of ~16 s).
  for (const b of better.boats.filter((x) => x.entryId !== weak.id)) assert.ok(Math.abs(b.deltaS) < 1e-6, b.boatName);
  // The weak boat was the slowest: faster now, the class spread narrows.
  assert.ok(better.spreadAfterS! < better.spreadBeforeS!, `${better.spreadAfterS} vs ${better.spreadBeforeS}`);
  const same = withPump('Invented Jets Weak 212').boats.find((b) => b.entryId === weak.id)!;
  assert.ok(Math.abs(same.deltaS) < 1e-6, `${same.deltaS}`);
});
