// Monte Carlo for the class (JCGM 101:2008) with boats on the matched model (lib/core/engine/jet-matched.ts):
// each trial scales the boat's engine curve by the drawn power over the confirmed power and sets the
// drawn nozzle diameter. References: the identity "flat engine curve and constant pump efficiency ⇒
// matched = fixed power" (the absorbed-power balance is then term for term the fixed-power energy
// balance; checked to 1e-9 in jet-matched.test.ts), the fixed seed, and the matched model evaluated
// directly (computeMatchedCurve) for the trials counted as having no operating point.
// Pump and engine curves are illustrative shapes (invented), not a maker's data.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  EngineOperatingPointError,
  computeMatchedCurve,
  computeParityMonteCarlo,
  copyMatchedSetup,
  createNormalGenerator,
  createWichmannHill,
  evaluateMatchedPoint,
  prepareMatchedSetup,
  retuneMatchedSetup,
  type EngineCurvePoint,
  type MatchedPoint,
  type MatchedSetupInput,
  type PumpCurvePoint,
} from '../../../../lib/core/engine/index';

const RHO = 999.1026; // fresh water at 15 °C (ITTC Recommended Procedure 7.5-02-01-03)
const LOSSES = { nozzleLossCoefficient: 0.02, inletLossCoefficient: 0.2, wakeFraction: 0.05 };
const MODEL = { densityKgM3: RHO, pumpEfficiency: 0.88, ...LOSSES };

const MIXED_FLOW: PumpCurvePoint[] = [
  { flowCoefficient: 0.08, headCoefficient: 2.7, efficiency: 0.62 },
  { flowCoefficient: 0.15, headCoefficient: 2.4, efficiency: 0.8 },
  { flowCoefficient: 0.22, headCoefficient: 2.0, efficiency: 0.87 },
  { flowCoefficient: 0.3, headCoefficient: 1.5, efficiency: 0.88 },
  { flowCoefficient: 0.38, headCoefficient: 0.9, efficiency: 0.82 },
  { flowCoefficient: 0.5, headCoefficient: 0.1, efficiency: 0.6 },
];
/** An illustrative engine curve, peak 300 kW at the pump shaft. */
const ENGINE_300: EngineCurvePoint[] = [
  { rpm: 1500, powerKw: 60 },
  { rpm: 3000, powerKw: 170 },
  { rpm: 4500, powerKw: 260 },
  { rpm: 5500, powerKw: 300 },
  { rpm: 6200, powerKw: 290 },
];
const flat = (powerKw: number): EngineCurvePoint[] => [
  { rpm: 500, powerKw },
  { rpm: 20_000, powerKw },
];
const constantEfficiency = MIXED_FLOW.map((p) => ({ ...p, efficiency: MODEL.pumpEfficiency }));

const BOATS = [
  { id: 'a', label: 'A', powerKw: 300, nozzleDiameterMm: 100, uPowerKw: 15, uNozzleDiameterMm: 0.5 },
  { id: 'b', label: 'B', powerKw: 350, nozzleDiameterMm: 92, uPowerKw: 20, uNozzleDiameterMm: 0.4 },
  { id: 'c', label: 'C', powerKw: 320, nozzleDiameterMm: 96, uPowerKw: 10, uNozzleDiameterMm: 0.3 },
];
const OPTIONS = { referenceSpeedsMs: [10, 20, 30], trials: 2000, seed: 2026 };

function matchedInput(engine: EngineCurvePoint[], pump: PumpCurvePoint[], nozzleDiameterMm: number): MatchedSetupInput {
  return {
    engine: { curve: engine },
    pump: { impellerDiameterMm: 240, curve: pump },
    nozzleDiameterMm,
    densityKgM3: RHO,
    ...LOSSES,
  };
}

const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b), 1e-300);

test('flat engine curve and constant pump efficiency: the matched Monte Carlo equals the fixed-power one', () => {
  // Reason: under those curves the matched model is the fixed-power model at any power and nozzle
  // (jet-matched.test.ts), and the draws come from the same seeded stream whatever the model, so every
  // trial's thrust agrees to rounding; the summaries agree to 1e-9 and the pair shares exactly (a tie
  // within rounding would move one trial: at most 1/M).
  const fixed = computeParityMonteCarlo(BOATS, MODEL, OPTIONS);
  const matched = computeParityMonteCarlo(BOATS, MODEL, {
    ...OPTIONS,
    matched: [
      prepareMatchedSetup(matchedInput(flat(300), constantEfficiency, 100)),
      null,
      prepareMatchedSetup(matchedInput(flat(320), constantEfficiency, 96)),
    ],
  });
  assert.equal(matched.trials, fixed.trials);
  assert.equal(matched.boats[0].model, 'matched');
  assert.equal(matched.boats[0].noOperatingPointTrials, 0);
  assert.equal(matched.boats[1].model, undefined, 'boat b stays on fixed power');
  matched.boats.forEach((b, i) =>
    b.thrust.forEach((t, j) => {
      const f = fixed.boats[i].thrust[j];
      for (const key of ['mean', 'standardUncertainty', 'low95', 'high95'] as const)
        assert.ok(rel(t[key], f[key]) < 1e-9, `${b.id} at ${t.speedMs} m/s, ${key}: ${t[key]} vs ${f[key]}`);
    }),
  );
  matched.pairs.forEach((p, k) =>
    p.probabilityAAhead.forEach((x, j) =>
      assert.ok(Math.abs(x.probability - fixed.pairs[k].probabilityAAhead[j].probability) <= 1 / fixed.trials),
    ),
  );
  assert.ok(rel(matched.spread.mean, fixed.spread.mean) < 1e-9, 'spread mean');
  assert.ok(rel(matched.spread.nominalPercent, fixed.spread.nominalPercent) < 1e-9, 'nominal spread');
});

test('matched Monte Carlo on a real curve: reproducible with the fixed seed, centred on the matched figure', () => {
  const options = {
    ...OPTIONS,
    matched: [prepareMatchedSetup(matchedInput(ENGINE_300, MIXED_FLOW, 100)), null, null],
  };
  const one = computeParityMonteCarlo(BOATS, MODEL, options);
  const two = computeParityMonteCarlo(BOATS, MODEL, options);
  assert.deepEqual(one, two, 'same seed, same figures (JCGM 101:2008 reproducibility through the seed)');
  assert.notDeepEqual(computeParityMonteCarlo(BOATS, MODEL, { ...options, seed: 2027 }).boats[0], one.boats[0]);
  // With u(P)/P = 5 % and u(D)/D = 0.5 % the model is nearly linear over the draws, so the trials'
  // mean sits within 1 % of the matched figure at the confirmed set-up (first-order reasoning, JCGM 100:2008, 5.1.2),
  // and it is not the fixed-power figure (the real curve and pump take the boat off it).
  const nominal = computeMatchedCurve(matchedInput(ENGINE_300, MIXED_FLOW, 100), [0, ...OPTIONS.referenceSpeedsMs]);
  const fixed = computeParityMonteCarlo(BOATS, MODEL, OPTIONS);
  one.boats[0].thrust.forEach((t, j) => {
    assert.ok(rel(t.mean, nominal[j].thrustN) < 0.01, `at ${t.speedMs} m/s: ${t.mean} vs ${nominal[j].thrustN}`);
    assert.ok(rel(t.mean, fixed.boats[0].thrust[j].mean) > 0.01, 'differs from fixed power');
  });
  assert.equal(one.boats[0].noOperatingPointTrials, 0);
});

test('a trial with no operating point is counted and uses fixed power; the count matches a direct check', () => {
  // Nozzle 214 mm on this pump: at 20 m/s some drawn diameters put the operating point past the pump
  // curve's largest flow coefficient. The count is checked by redrawing the same seeded stream (power then
  // diameter per boat per trial, as the Monte Carlo draws) and evaluating the matched model directly.
  const boat = { id: 'x', label: 'X', powerKw: 300, nozzleDiameterMm: 214, uPowerKw: 15, uNozzleDiameterMm: 4 };
  const input = matchedInput(ENGINE_300, MIXED_FLOW, 214);
  const options = { referenceSpeedsMs: [20], trials: 500, seed: 7 };
  const mc = computeParityMonteCarlo([boat], MODEL, { ...options, matched: [prepareMatchedSetup(input)] });
  const normal = createNormalGenerator(createWichmannHill(options.seed));
  const draw = (m: number, u: number) => {
    for (;;) {
      const x = m + u * normal();
      if (x > 0) return x;
    }
  };
  let expected = 0;
  for (let t = 0; t < options.trials; t++) {
    const p = draw(boat.powerKw, boat.uPowerKw);
    const d = draw(boat.nozzleDiameterMm, boat.uNozzleDiameterMm);
    const scaled = ENGINE_300.map((e) => ({ rpm: e.rpm, powerKw: (e.powerKw * p) / boat.powerKw }));
    try {
      computeMatchedCurve({ ...input, engine: { curve: scaled }, nozzleDiameterMm: d }, [0, 20]);
    } catch (err) {
      assert.ok(err instanceof EngineOperatingPointError);
      expected++;
    }
  }
  assert.ok(expected > 0 && expected < options.trials, `the case has some of each (${expected})`);
  assert.equal(mc.boats[0].noOperatingPointTrials, expected);
});

test('retuneMatchedSetup equals a set-up prepared afresh at the scaled curve and new nozzle, and leaves the source alone', () => {
  // Reference: prepareMatchedSetup on the curve scaled point by point (the definition of the scaling).
  const source = prepareMatchedSetup(matchedInput(ENGINE_300, MIXED_FLOW, 100));
  const work = copyMatchedSetup(source);
  const out = (): MatchedPoint => ({
    speedMs: 0,
    rpm: 0,
    shaftPowerKw: 0,
    flowM3s: 0,
    flowCoefficient: 0,
    pumpEfficiency: 0,
    jetVelocityMs: 0,
    thrustN: 0,
    limitedBy: 'engine',
  });
  for (const [factor, nozzle] of [
    [1.07, 96],
    [0.93, 104],
    [1, 100],
  ]) {
    retuneMatchedSetup(work, source, factor, nozzle);
    const fresh = prepareMatchedSetup(
      matchedInput(
        ENGINE_300.map((e) => ({ rpm: e.rpm, powerKw: e.powerKw * factor })),
        MIXED_FLOW,
        nozzle,
      ),
    );
    for (const v of [0, 15, 30]) {
      const a = evaluateMatchedPoint(work, v, out()).thrustN;
      const b = evaluateMatchedPoint(fresh, v, out()).thrustN;
      assert.ok(rel(a, b) < 1e-12, `factor ${factor}, ${nozzle} mm, ${v} m/s: ${a} vs ${b}`);
    }
  }
  assert.equal(source.nozzleDiameterMm, 100);
  assert.equal(source.enginePowerW[3], 300_000);
  assert.throws(() => retuneMatchedSetup(source, source, 1, 100), /working copy/);
});
