// Equalising nozzles and Monte Carlo odds for matched boats (lib/core/engine/jet-equalising-matched.ts,
// lib/core/reports/matched-figures.ts applyMatchedEqualising, parity-monte-carlo.ts with matched set-ups).
// References: the identity "flat engine curve and constant pump efficiency ⇒ matched = fixed power"
// (the absorbed-power balance is then term for term the fixed-power energy balance; Allison, SNAME
// Transactions 101, 1993; checked to 1e-9 in tests/unit/core/engine/jet-matched.test.ts), so the
// matched answers must equal the fixed-power ones; on real curves, the matched model evaluated directly
// (computeMatchedCurve) at the diameter returned. Pump and engine curves are illustrative (invented).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  computeMatchedCurve,
  computeMatchedRangeEqualising,
  computeMatchedStaticEqualisingMm,
  computeRangeEqualising,
  evaluateThrustN,
  prepareJetSetup,
  prepareMatchedSetup,
  type MatchedSetupInput,
} from '../../../../lib/core/engine/index';
import { computeReportResults, type ReportInputs } from '../../../../lib/core/reports/parity-figures';

const RHO = 999.1026; // fresh water at 15 °C (ITTC Recommended Procedure 7.5-02-01-03)
const LOSSES = { nozzleLossCoefficient: 0.02, inletLossCoefficient: 0.2, wakeFraction: 0.05 };
const ETA = 0.88;
const MIXED_FLOW = [
  { flowCoefficient: 0.08, headCoefficient: 2.7, efficiency: 0.62 },
  { flowCoefficient: 0.15, headCoefficient: 2.4, efficiency: 0.8 },
  { flowCoefficient: 0.22, headCoefficient: 2.0, efficiency: 0.87 },
  { flowCoefficient: 0.3, headCoefficient: 1.5, efficiency: 0.88 },
  { flowCoefficient: 0.38, headCoefficient: 0.9, efficiency: 0.82 },
  { flowCoefficient: 0.5, headCoefficient: 0.1, efficiency: 0.6 },
];
const CONSTANT_ETA = MIXED_FLOW.map((p) => ({ ...p, efficiency: ETA }));
const ENGINE_300 = [
  { rpm: 1500, powerKw: 60 },
  { rpm: 3000, powerKw: 170 },
  { rpm: 4500, powerKw: 260 },
  { rpm: 5500, powerKw: 300 },
  { rpm: 6200, powerKw: 290 },
];
const flat = (powerKw: number) => [
  { rpm: 500, powerKw },
  { rpm: 20_000, powerKw },
];
const SPEEDS = [10, 20, 30];

function matchedInput(
  engine: { rpm: number; powerKw: number }[],
  pump: typeof MIXED_FLOW,
  nozzleDiameterMm: number,
): MatchedSetupInput {
  return {
    engine: { curve: engine },
    pump: { impellerDiameterMm: 240, curve: pump },
    nozzleDiameterMm,
    densityKgM3: RHO,
    ...LOSSES,
  };
}
const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b), 1e-300);

test('flat curve, constant efficiency: the matched equalising nozzles equal the fixed-power ones', () => {
  // Fixed power: T0 ∝ D^(2/3), so the static answer is D (T_target / T0)^(3/2) in closed form (parity.ts).
  const fixed = prepareJetSetup({
    powerKw: 350,
    nozzleDiameterMm: 92,
    densityKgM3: RHO,
    pumpEfficiency: ETA,
    ...LOSSES,
  });
  const source = prepareMatchedSetup(matchedInput(flat(350), CONSTANT_ETA, 92));
  const t0 = evaluateThrustN(fixed, 0);
  for (const target of [0.9 * t0, 1.07 * t0]) {
    const closedForm = 92 * (target / t0) ** 1.5;
    const searched = computeMatchedStaticEqualisingMm(source, target);
    assert.ok(searched !== null && rel(searched, closedForm) < 1e-9, `${searched} vs ${closedForm}`);
  }
  const medians = Float64Array.from(SPEEDS, (v) => 0.92 * evaluateThrustN(fixed, v));
  const staticMm = 92 * 0.92 ** 1.5;
  const a = computeRangeEqualising(fixed, SPEEDS, medians, staticMm);
  const b = computeMatchedRangeEqualising(source, SPEEDS, medians, staticMm);
  // Same objective to rounding and the same grid and golden-section steps: the minimiser agrees to the
  // search's own tolerance (1e-8 of the bracket), the residuals to far below a hundredth of a per cent.
  assert.ok(rel(a.nozzleDiameterMm, b.nozzleDiameterMm) < 1e-6, `${a.nozzleDiameterMm} vs ${b.nozzleDiameterMm}`);
  a.deviations.forEach((d, j) => {
    assert.ok(Math.abs(d.rangeEqualisedPercent - b.deviations[j].rangeEqualisedPercent) < 1e-6);
    assert.ok(Math.abs(d.staticEqualisedPercent - b.deviations[j].staticEqualisedPercent) < 1e-6);
  });
});

test('real curve: the matched static equalising nozzle brings matched static thrust to the target within 1e-6', () => {
  for (const [nozzle, factor] of [
    [100, 0.93],
    [100, 1.05],
    [120, 0.97],
  ]) {
    const input = matchedInput(ENGINE_300, MIXED_FLOW, nozzle);
    const own = computeMatchedCurve(input, [0])[0].thrustN;
    const target = factor * own;
    const d = computeMatchedStaticEqualisingMm(prepareMatchedSetup(input), target);
    assert.ok(d !== null);
    // Checked by evaluating the matched model afresh at the diameter returned (not the search's own value).
    const at = computeMatchedCurve({ ...input, nozzleDiameterMm: d }, [0])[0].thrustN;
    assert.ok(rel(at, target) < 1e-6, `${nozzle} mm × ${factor}: ${at} vs ${target}`);
  }
  // A target no nozzle can reach (far above the engine's most) is null, not a wrong diameter.
  const input = matchedInput(ENGINE_300, MIXED_FLOW, 100);
  assert.equal(computeMatchedStaticEqualisingMm(prepareMatchedSetup(input), 1e7), null);
});

test('real curve: the matched range nozzle is a local minimum of the least-squares deviation', () => {
  const input = matchedInput(ENGINE_300, MIXED_FLOW, 100);
  const medians = Float64Array.from(computeMatchedCurve(input, SPEEDS), (p) => 0.94 * p.thrustN);
  const source = prepareMatchedSetup(input);
  const staticMm = computeMatchedStaticEqualisingMm(source, 0.94 * computeMatchedCurve(input, [0])[0].thrustN)!;
  const r = computeMatchedRangeEqualising(source, SPEEDS, medians, staticMm);
  // The objective evaluated independently with computeMatchedCurve: no better value 0.1 % either side.
  const f = (d: number) =>
    computeMatchedCurve({ ...input, nozzleDiameterMm: d }, SPEEDS).reduce(
      (s, p, j) => s + ((p.thrustN - medians[j]) / medians[j]) ** 2,
      0,
    );
  const best = f(r.nozzleDiameterMm);
  assert.ok(best <= f(r.nozzleDiameterMm * 1.001) && best <= f(r.nozzleDiameterMm * 0.999));
  assert.ok(r.rmsDeviationPercent <= Math.sqrt(f(staticMm) / SPEEDS.length) * 100 + 1e-9, 'no worse than static');
});

function classInputs(
  reportModel: 'fixed_power' | 'matched',
  count: number,
  matchedCount: number,
  engine?: typeof ENGINE_300,
): ReportInputs {
  return {
    eventName: 'e',
    classCode: 'C',
    className: 'c',
    ruleVersion: { id: 'r', version: 1 },
    assumptions: { pumpEfficiency: ETA, ...LOSSES, referenceSpeedsMs: SPEEDS, reportModel },
    density: { densityKgM3: RHO, description: 'fresh water at 15 °C (ITTC 7.5-02-01-03)' },
    boats: Array.from({ length: count }, (_, i) => {
      const powerKw = 280 + ((i * 37) % 80);
      return {
        entryId: `e${i}`,
        raceNumber: i + 1,
        boatName: `B${i}`,
        powerKw,
        uPowerKw: 0.05 * powerKw,
        powerSource: 'verified' as const,
        nozzleDiameterMm: 92 + ((i * 13) % 16),
        uNozzleDiameterMm: 0.3,
        inspectionId: null,
        inspectedAt: null,
        curves:
          i < matchedCount
            ? {
                engine: { curve: engine ?? flat(powerKw) },
                pump: { impellerDiameterMm: 240, curve: engine ? MIXED_FLOW : CONSTANT_ETA },
              }
            : null,
      };
    }),
    excluded: [],
    computedAt: '2026-12-03T00:00:00.000Z',
  };
}

test('report, flat curves: a matched class has the fixed-power equalising nozzles and odds', () => {
  const f = computeReportResults(classInputs('fixed_power', 7, 4));
  const m = computeReportResults(classInputs('matched', 7, 4));
  assert.equal(m.modelUsed!.e0.model, 'matched');
  assert.equal(m.modelUsed!.e0.equalisingModel, 'matched');
  m.parity!.boats.forEach((b, i) => {
    const fb = f.parity!.boats[i];
    assert.ok(rel(b.equalisingNozzleDiameterMm, fb.equalisingNozzleDiameterMm) < 1e-9, `${b.id} static`);
    assert.ok(rel(b.uEqualisingNozzleDiameterMm, fb.uEqualisingNozzleDiameterMm) < 1e-6, `${b.id} u static`);
    assert.ok(rel(b.rangeEqualising!.nozzleDiameterMm, fb.rangeEqualising!.nozzleDiameterMm) < 1e-6, `${b.id} range`);
  });
  m.odds!.boats.forEach((b, i) =>
    b.thrust.forEach((t, j) => assert.ok(rel(t.mean, f.odds!.boats[i].thrust[j].mean) < 1e-9)),
  );
  assert.equal(m.odds!.boats[0].model, 'matched');
});

test('report timing: 30 boats, 10 matched (diagnostic only, no time asserted)', (t) => {
  const time = (fn: () => unknown) => {
    fn();
    const start = performance.now();
    fn();
    return performance.now() - start;
  };
  const fixedMs = time(() => computeReportResults(classInputs('fixed_power', 30, 10, ENGINE_300)));
  const matchedMs = time(() => computeReportResults(classInputs('matched', 30, 10, ENGINE_300)));
  const r = computeReportResults(classInputs('matched', 30, 10, ENGINE_300));
  assert.equal(Object.values(r.modelUsed!).filter((u) => u.model === 'matched').length, 10);
  assert.equal(r.odds!.boats.filter((b) => b.model === 'matched').length, 10);
  t.diagnostic(
    `30 boats: fixed-power class ${fixedMs.toFixed(0)} ms; matched class (10 matched) ${matchedMs.toFixed(0)} ms`,
  );
});
