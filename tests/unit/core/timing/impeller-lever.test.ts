// The impeller change in the what-if sandbox (issue 20, item 4): lib/core/timing/balance-levers.ts with
// clockBoatThrustWithImpeller (clock-thrust.ts). The checks are identities of the models, checkable by hand:
// - momentum theory at fixed power takes the pump efficiency and the shaft power only as their product eta_p P
//   (Allison, "Marine Waterjet Propulsion", SNAME Transactions 101, 1993; jet.ts), so an efficiency factor f on a
//   fixed-power boat gives exactly the time of that boat at power f P;
// - an impeller whose curve is the same piecewise-linear characteristic (the same points with points added on its
//   segments) settles at the same operating point (pump affinity laws: Karassik et al., Pump Handbook, 2008), so
//   nothing changes;
// - a pump of the same head curve and higher efficiency absorbs less power at each rpm (P_a = rho g Q H / eta), so an
//   engine on the rising part of its curve settles faster, and the boat is quicker.
// Curves and boats are illustrative (invented), not a maker's data.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { computeClockSection, type ClockBoat } from '../../../../lib/core/timing/clock-section';
import { applyBalanceLevers, type BalanceLevers } from '../../../../lib/core/timing/balance-levers';
import { computeMatchedCurve, type PumpCurvePoint } from '../../../../lib/core/engine/jet-matched';
import { levelledCurves, type ReportBoatCurves } from '../../../../lib/core/reports/matched-figures';

// Fresh water at 15 °C, 999.1026 kg/m^3 (ITTC Recommended Procedure 7.5-02-01-03); K_n 0.02, K_i 0.2 [partly memory].
const model = {
  densityKgM3: 999.1026,
  pumpEfficiency: 0.88,
  nozzleLossCoefficient: 0.02,
  inletLossCoefficient: 0.2,
  wakeFraction: 0.05,
};
const MIXED_FLOW: PumpCurvePoint[] = [
  { flowCoefficient: 0.08, headCoefficient: 2.7, efficiency: 0.62 },
  { flowCoefficient: 0.15, headCoefficient: 2.4, efficiency: 0.8 },
  { flowCoefficient: 0.22, headCoefficient: 2.0, efficiency: 0.87 },
  { flowCoefficient: 0.3, headCoefficient: 1.5, efficiency: 0.88 },
  { flowCoefficient: 0.38, headCoefficient: 0.9, efficiency: 0.82 },
  { flowCoefficient: 0.5, headCoefficient: 0.1, efficiency: 0.6 },
];
/** An engine curve peaking at 300 kW at 5500 rpm (declared), rising below it. */
const shaped: ReportBoatCurves = {
  engine: {
    curve: [
      { rpm: 1500, powerKw: 60 },
      { rpm: 3000, powerKw: 170 },
      { rpm: 4500, powerKw: 260 },
      { rpm: 5500, powerKw: 300 },
      { rpm: 6200, powerKw: 290 },
    ],
  },
  pump: { impellerDiameterMm: 240, curve: MIXED_FLOW },
};
const boat = (id: string, raceNumber: number, powerKw: number, curves: ReportBoatCurves | null): ClockBoat => ({
  entryId: id,
  raceNumber,
  boatName: `Boat ${raceNumber}`,
  powerKw,
  nozzleDiameterMm: 100,
  measuredWeightKg: 700,
  uPowerKw: 0,
  uNozzleDiameterMm: 0,
  curves,
});
const run = (entryId: string, elapsedS: number) => ({
  entryId,
  runLabel: '1',
  courseLengthM: 400,
  elapsedS,
  trapSpeedMs: null,
  gpsTopSpeedMs: 30,
});
const section = computeClockSection({
  reportModel: 'matched',
  boats: [boat('m', 1, 280, shaped), boat('f', 2, 250, null), boat('g', 3, 230, null)],
  excluded: [],
  runs: [run('m', 17), run('f', 17.5), run('g', 18)],
  minimumWeightKg: null,
  uWeightKg: 0,
  model,
});
const NONE: BalanceLevers = { nozzleCapMm: null, minimumMassKg: null, powerCapKw: null };
const rowOf = (levers: BalanceLevers, id: string) =>
  applyBalanceLevers(section, levers).boats.find((b) => b.entryId === id)!;

test('the section puts the curve boat on the matched model and the others on fixed power', () => {
  assert.deepEqual(
    section.boats.map((b) => b.thrustModel),
    ['matched', 'fixed_power', 'fixed_power'],
  );
  // The matched boat's engine settles on the rising part of its curve at rest (not at the top of its range), so
  // a pump that absorbs less at each rpm lets it run faster.
  const levelled = levelledCurves(shaped, 280)!;
  const [rest] = computeMatchedCurve({ ...model, ...levelled, nozzleDiameterMm: 100 }, [0]);
  assert.equal(rest.limitedBy, 'engine');
  assert.ok(rest.rpm < 5500, `settles at ${rest.rpm} rpm`);
});

test('an efficiency factor of 1 and the same impeller change nothing', () => {
  const one = applyBalanceLevers(section, {
    ...NONE,
    impellers: { f: { efficiencyFactor: 1 }, m: { efficiencyFactor: 1 } },
  });
  for (const b of one.boats) assert.ok(Math.abs(b.deltaS) < 1e-12, `${b.boatName}: ${b.deltaS}`);
  const same = rowOf({ ...NONE, impellers: { m: { pump: { label: 'Same', ...shaped.pump } } } }, 'm');
  assert.ok(Math.abs(same.deltaS) < 1e-12, `${same.deltaS}`);
  assert.equal(same.impeller, 'Same (Ø 240 mm)');
  // The same characteristic with a point added at the middle of every segment: the same operating point.
  const refined: PumpCurvePoint[] = MIXED_FLOW.flatMap((p, i) => {
    const q = MIXED_FLOW[i + 1];
    if (!q) return [p];
    const mid = (a: number, b: number) => (a + b) / 2;
    return [
      p,
      {
        flowCoefficient: mid(p.flowCoefficient, q.flowCoefficient),
        headCoefficient: mid(p.headCoefficient, q.headCoefficient),
        efficiency: mid(p.efficiency, q.efficiency),
      },
    ];
  });
  const r = rowOf(
    { ...NONE, impellers: { m: { pump: { label: 'Refined', impellerDiameterMm: 240, curve: refined } } } },
    'm',
  );
  assert.ok(Math.abs(r.deltaS) < 1e-9, `${r.deltaS}`);
});

test('on fixed power an efficiency factor f is the boat at power f·P (eta_p P enters as a product)', () => {
  for (const f of [0.9, 0.95]) {
    const byFactor = rowOf({ ...NONE, impellers: { f: { efficiencyFactor: f } } }, 'f');
    const byPower = rowOf({ ...NONE, powerCapKw: 250 * f }, 'f');
    assert.ok(Math.abs(byFactor.afterS - byPower.afterS) < 1e-9, `${f}: ${byFactor.afterS} vs ${byPower.afterS}`);
    assert.equal(byFactor.impeller, `efficiency × ${f}`);
  }
});

test('the lever is monotone: a better impeller is never slower, a worse one never faster', () => {
  const factors = [0.85, 0.9, 0.95, 1, 1.05, 1.1];
  for (const id of ['m', 'f']) {
    const times = factors.map((f) => rowOf({ ...NONE, impellers: { [id]: { efficiencyFactor: f } } }, id).afterS);
    for (let i = 1; i < times.length; i++)
      assert.ok(times[i] < times[i - 1], `${id}: ×${factors[i]} gives ${times[i]} s after ${times[i - 1]} s`);
  }
  // A catalogue impeller of the same head curve and five points more efficiency: shorter for the matched boat.
  const stronger = MIXED_FLOW.map((p) => ({ ...p, efficiency: p.efficiency + 0.05 }));
  const s = rowOf(
    { ...NONE, impellers: { m: { pump: { label: 'Stronger', impellerDiameterMm: 240, curve: stronger } } } },
    'm',
  );
  assert.ok(s.deltaS < 0, `${s.deltaS}`);
  const weaker = MIXED_FLOW.map((p) => ({ ...p, efficiency: p.efficiency - 0.05 }));
  const w = rowOf(
    { ...NONE, impellers: { m: { pump: { label: 'Weaker', impellerDiameterMm: 240, curve: weaker } } } },
    'm',
  );
  assert.ok(w.deltaS > 0, `${w.deltaS}`);
});

test('the class spread follows the changed boat; what cannot be figured is left out with why', () => {
  const today = applyBalanceLevers(section, NONE);
  const fastest = [...today.boats].sort((a, b) => a.beforeS - b.beforeS)[0];
  const slowed = applyBalanceLevers(section, { ...NONE, impellers: { [fastest.entryId]: { efficiencyFactor: 0.97 } } });
  const after = slowed.boats.map((b) => b.afterS);
  assert.equal(slowed.spreadAfterS, Math.max(...after) - Math.min(...after));
  assert.equal(slowed.spreadBeforeS, today.spreadBeforeS);
  for (const b of slowed.boats) if (b.entryId !== fastest.entryId) assert.equal(b.deltaS, 0);

  const odd = applyBalanceLevers(section, {
    ...NONE,
    impellers: {
      f: { pump: { label: 'Any', ...shaped.pump } },
      g: { efficiencyFactor: 1.2 },
      m: { efficiencyFactor: 1.2 },
    },
  });
  const tiny = applyBalanceLevers(section, { ...NONE, impellers: { f: { efficiencyFactor: 1e-6 } } });
  assert.match(tiny.leftOut[0].reason, /from 0\.5 to 2 \(got 0\.000001\)/);
  assert.deepEqual(
    odd.boats.map((b) => b.entryId),
    [],
  );
  const why = Object.fromEntries(odd.leftOut.map((l) => [l.entryId, l.reason]));
  assert.match(why.f, /On fixed power an impeller enters only through its efficiency/);
  assert.match(why.g, /0\.88 times 1\.2 is above 1/);
  assert.match(why.m, /best efficiency times 1\.2 is 1\.056, above 1/);
  assert.equal(odd.spreadAfterS, null);
});
