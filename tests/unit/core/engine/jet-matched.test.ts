// The jet matched to its engine (lib/core/engine/jet-matched.ts): identities that follow from the
// affinity laws and the momentum balance, each with its reason, and the operating points checked
// against both balances by code written here, independently of the solver.
// Pump and engine curves below are illustrative shapes (invented), not a maker's data.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import fc from 'fast-check';
import {
  EngineOperatingPointError,
  EngineInputError,
  computeMatchedCurve,
  computeThrustCurve,
  type EngineCurvePoint,
  type MatchedPoint,
  type MatchedSetupInput,
  type PumpCurvePoint,
} from '../../../../lib/core/engine/index';

const RHO = 999.1026; // fresh water at 15 °C (ITTC Recommended Procedure 7.5-02-01-03)
const LOSSES = { nozzleLossCoefficient: 0.02, inletLossCoefficient: 0.2, wakeFraction: 0.05 };

/** An illustrative mixed-flow characteristic: head falling with flow, efficiency peaking mid-range. */
const MIXED_FLOW: PumpCurvePoint[] = [
  { flowCoefficient: 0.08, headCoefficient: 2.7, efficiency: 0.62 },
  { flowCoefficient: 0.15, headCoefficient: 2.4, efficiency: 0.8 },
  { flowCoefficient: 0.22, headCoefficient: 2.0, efficiency: 0.87 },
  { flowCoefficient: 0.3, headCoefficient: 1.5, efficiency: 0.88 },
  { flowCoefficient: 0.38, headCoefficient: 0.9, efficiency: 0.82 },
  { flowCoefficient: 0.5, headCoefficient: 0.1, efficiency: 0.6 },
];
/** An illustrative 300 kW engine curve (power at the pump shaft). */
const ENGINE_300: EngineCurvePoint[] = [
  { rpm: 1500, powerKw: 60 },
  { rpm: 3000, powerKw: 170 },
  { rpm: 4500, powerKw: 260 },
  { rpm: 5500, powerKw: 300 },
  { rpm: 6200, powerKw: 290 },
];

function setup(overrides: Partial<MatchedSetupInput> = {}): MatchedSetupInput {
  return {
    engine: { curve: ENGINE_300 },
    pump: { impellerDiameterMm: 240, curve: MIXED_FLOW },
    nozzleDiameterMm: 100,
    densityKgM3: RHO,
    ...LOSSES,
    ...overrides,
  };
}

const flat = (powerKw: number, from = 500, to = 20_000): EngineCurvePoint[] => [
  { rpm: from, powerKw },
  { rpm: to, powerKw },
];
const constantEfficiency = (eta: number): PumpCurvePoint[] => MIXED_FLOW.map((p) => ({ ...p, efficiency: eta }));

function relDiff(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b), 1e-300);
}

// Linear interpolation written again here (not the solver's), as the contract defines the curves.
function interpolate(xs: number[], ys: number[], x: number): number {
  for (let i = 0; i < xs.length - 1; i++) {
    if (x >= xs[i] && x <= xs[i + 1]) return ys[i] + ((ys[i + 1] - ys[i]) * (x - xs[i])) / (xs[i + 1] - xs[i]);
  }
  throw new Error(`${x} outside [${xs[0]}, ${xs[xs.length - 1]}]`);
}

/** Both balances at a returned point, from the contract's definitions: relative residuals. */
function residuals(s: MatchedSetupInput, p: MatchedPoint) {
  const d = s.pump.impellerDiameterMm / 1000;
  const n = p.rpm / 60;
  const area = (Math.PI * (s.nozzleDiameterMm / 1000) ** 2) / 4;
  const vin = (1 - (s.wakeFraction ?? 0)) * p.speedMs;
  const phi = p.flowM3s / (n * d ** 3);
  const curve = s.pump.curve;
  const psi = interpolate(
    curve.map((c) => c.flowCoefficient),
    curve.map((c) => c.headCoefficient),
    phi,
  );
  const eta = interpolate(
    curve.map((c) => c.flowCoefficient),
    curve.map((c) => c.efficiency),
    phi,
  );
  const pumpHead = psi * n * n * d * d;
  const systemHead =
    0.5 * (1 + (s.nozzleLossCoefficient ?? 0)) * (p.flowM3s / area) ** 2 -
    0.5 * (1 - (s.inletLossCoefficient ?? 0)) * vin * vin;
  const absorbedW = (s.densityKgM3 * p.flowM3s * pumpHead) / eta;
  const engineW =
    1000 *
    interpolate(
      s.engine.curve.map((c) => c.rpm),
      s.engine.curve.map((c) => c.powerKw),
      p.rpm,
    );
  return {
    head: Math.abs(pumpHead - systemHead) / Math.max(Math.abs(pumpHead), 0.5 * (p.flowM3s / area) ** 2),
    power: Math.abs(absorbedW - engineW) / engineW,
    absorbedW,
    engineW,
    phi,
    thrust: relDiff(p.thrustN, s.densityKgM3 * p.flowM3s * (p.flowM3s / area - vin)),
    reported: relDiff(p.shaftPowerKw * 1000, absorbedW),
  };
}

test('flat engine curve and constant pump efficiency: the matched model equals the fixed-power model at every speed', () => {
  // Reason: with eta constant the absorbed-power balance rho Q gH_sys / eta = P is, term for term, the
  // fixed-power energy balance eta P = 1/2 m_dot [(1 + K_n) v_j^2 - (1 - K_i) V_in^2] with m_dot = rho Q
  // and v_j = Q/A_n (Allison 1993); a flat engine curve gives the same P at whatever rpm the pump settles.
  const speeds = [0, 5, 10, 20, 30, 40];
  for (const [powerKw, nozzle] of [
    [300, 100],
    [350, 90],
    [120, 75],
  ]) {
    const s = setup({
      engine: { curve: flat(powerKw) },
      pump: { impellerDiameterMm: 240, curve: constantEfficiency(0.88) },
      nozzleDiameterMm: nozzle,
    });
    const matched = computeMatchedCurve(s, speeds);
    const fixed = computeThrustCurve(
      { powerKw, nozzleDiameterMm: nozzle, densityKgM3: RHO, pumpEfficiency: 0.88, ...LOSSES },
      speeds,
    );
    for (let i = 0; i < speeds.length; i++) {
      assert.equal(matched[i].limitedBy, 'engine');
      assert.ok(
        relDiff(matched[i].thrustN, fixed[i].thrustN) < 1e-9,
        `${powerKw} kW, ${nozzle} mm at ${speeds[i]} m/s: ${matched[i].thrustN} vs ${fixed[i].thrustN}`,
      );
      assert.ok(relDiff(matched[i].jetVelocityMs, fixed[i].jetVelocityMs) < 1e-9, 'jet velocity');
      assert.ok(relDiff(matched[i].shaftPowerKw, powerKw) < 1e-9, 'the pump absorbs the whole power');
    }
  }
});

test('at rest the operating flow coefficient does not depend on rpm and absorbed power scales as rpm^3', () => {
  // Reason: at V = 0 the system head gH = 1/2 (1 + K_n)(phi n D^3 / A_n)^2 and the pump head psi n^2 D^2
  // both scale with n^2, so phi solves an equation free of n; then P = rho n^3 D^5 phi psi / eta (affinity laws).
  const powers = [50, 100, 400, 800];
  const points = powers.map((kw) => computeMatchedCurve(setup({ engine: { curve: flat(kw) } }), [0])[0]);
  for (const p of points) assert.ok(relDiff(p.flowCoefficient, points[0].flowCoefficient) < 1e-12, 'same phi');
  for (let i = 1; i < points.length; i++) {
    const ratio = points[i].shaftPowerKw / points[0].shaftPowerKw;
    const rpmCubed = (points[i].rpm / points[0].rpm) ** 3;
    assert.ok(relDiff(ratio, rpmCubed) < 1e-9, `P ratio ${ratio} vs rpm^3 ratio ${rpmCubed}`);
    assert.ok(relDiff(ratio, powers[i] / powers[0]) < 1e-9);
  }
});

test('doubling the impeller diameter at fixed phi scales flow by 8 and power by 32 at the same rpm', () => {
  // Reason: affinity laws Q = phi n D^3 and P = rho n^3 D^5 phi psi / eta. Doubling the nozzle too keeps
  // D^4 / A_n^2 and so phi at rest unchanged; an engine 32 times stronger then settles at the same rpm.
  const small = computeMatchedCurve(setup({ engine: { curve: flat(20) } }), [0])[0];
  const large = computeMatchedCurve(
    setup({
      engine: { curve: flat(20 * 32) },
      pump: { impellerDiameterMm: 480, curve: MIXED_FLOW },
      nozzleDiameterMm: 200,
    }),
    [0],
  )[0];
  assert.ok(relDiff(large.flowCoefficient, small.flowCoefficient) < 1e-12, 'same phi');
  assert.ok(relDiff(large.rpm, small.rpm) < 1e-9, `same rpm: ${large.rpm} vs ${small.rpm}`);
  assert.ok(relDiff(large.flowM3s / small.flowM3s, 8) < 1e-9, 'Q x 8');
  assert.ok(relDiff(large.shaftPowerKw / small.shaftPowerKw, 32) < 1e-9, 'P x 32');
});

test('matched points solve both balances to 1e-9 relative (checked here, independently of the solver)', () => {
  let solved = 0;
  fc.assert(
    fc.property(
      fc.double({ min: 85, max: 130, noNaN: true }),
      fc.double({ min: 0, max: 35, noNaN: true }),
      (nozzle, speed) => {
        const s = setup({ nozzleDiameterMm: nozzle });
        let p: MatchedPoint;
        try {
          p = computeMatchedCurve(s, [speed])[0];
        } catch (err) {
          assert.ok(err instanceof EngineOperatingPointError, String(err));
          return;
        }
        const r = residuals(s, p);
        assert.ok(r.head < 1e-9, `head residual ${r.head} (${nozzle} mm, ${speed} m/s)`);
        assert.ok(r.thrust < 1e-12, 'T = rho Q (Q/A_n - V_in)');
        assert.ok(r.reported < 1e-12, 'shaftPowerKw is the absorbed power');
        if (p.limitedBy === 'engine') assert.ok(r.power < 1e-9, `power residual ${r.power}`);
        else assert.ok(r.absorbedW < r.engineW, 'below the engine curve at the limiter');
        solved++;
      },
    ),
    { numRuns: 300, seed: 20261203 },
  );
  assert.ok(solved >= 250, `most of the range has an operating point (${solved} of 300)`);
});

test('the realistic curve at rest and at speed: rpm inside the range, power from the engine curve', () => {
  const s = setup();
  const points = computeMatchedCurve(s, [0, 10, 20, 30]);
  for (const p of points) {
    assert.equal(p.limitedBy, 'engine');
    assert.ok(p.rpm > 1500 && p.rpm < 6200, `rpm ${p.rpm}`);
    const r = residuals(s, p);
    assert.ok(r.head < 1e-9 && r.power < 1e-9);
    assert.ok(p.pumpEfficiency > 0.6 && p.pumpEfficiency <= 0.88);
  }
  // Thrust falls with speed (the inflow's momentum is subtracted).
  for (let i = 1; i < points.length; i++) assert.ok(points[i].thrustN < points[i - 1].thrustN);
});

test('the lowest rpm where the pump absorbs the engine power is the one chosen', () => {
  // An engine curve with a jump: the pump meets it near 3000 rpm, falls short again after the jump and
  // would meet it a second time higher up. The contract asks for the lowest.
  const curve: EngineCurvePoint[] = [
    { rpm: 1500, powerKw: 10 },
    { rpm: 3000, powerKw: 40 },
    { rpm: 3100, powerKw: 600 },
    { rpm: 9000, powerKw: 600 },
  ];
  const s = setup({ engine: { curve } });
  const [p] = computeMatchedCurve(s, [0]);
  assert.ok(p.rpm > 1500 && p.rpm < 3000, `lowest crossing, got ${p.rpm} rpm`);
  assert.ok(residuals(s, p).power < 1e-9);
});

test('limiter: the pump never absorbs the engine power below the limiter, so it runs at the limiter', () => {
  const s = setup({ engine: { curve: ENGINE_300, limiterRpm: 3000 } });
  const points = computeMatchedCurve(s, [0, 20]);
  for (const p of points) {
    assert.equal(p.limitedBy, 'limiter');
    assert.equal(p.rpm, 3000);
    const r = residuals(s, p);
    assert.ok(r.head < 1e-9, 'the head balance still holds');
    assert.ok(r.absorbedW < r.engineW, 'absorbed power below the engine curve');
  }
  // Without a limiter the top of the curve plays the same part (a small pump that never loads the engine).
  const small = setup({ pump: { impellerDiameterMm: 120, curve: MIXED_FLOW }, nozzleDiameterMm: 50 });
  const [top] = computeMatchedCurve(small, [0]);
  assert.equal(top.limitedBy, 'limiter');
  assert.equal(top.rpm, 6200);
});

test('no operating point: each case is an EngineOperatingPointError naming the curve', () => {
  const cases: [string, MatchedSetupInput, number, 'engine' | 'pump', RegExp][] = [
    ['nozzle too small for the pump curve', setup({ nozzleDiameterMm: 40 }), 0, 'pump', /smallest flow coefficient/],
    ['nozzle too large for the pump curve', setup({ nozzleDiameterMm: 400 }), 0, 'pump', /largest flow coefficient/],
    [
      'pump absorbs more than the engine gives at its lowest rpm',
      setup({ pump: { impellerDiameterMm: 420, curve: MIXED_FLOW }, nozzleDiameterMm: 175 }),
      0,
      'engine',
      /held below its curve/,
    ],
    [
      'limiter below the engine curve',
      setup({ engine: { curve: ENGINE_300, limiterRpm: 1000 } }),
      0,
      'engine',
      /limiter/,
    ],
  ];
  for (const [what, s, speed, curve, message] of cases) {
    assert.throws(
      () => computeMatchedCurve(s, [speed]),
      (err: unknown) => err instanceof EngineOperatingPointError && err.curve === curve && message.test(err.message),
      what,
    );
  }
});

test('malformed curves are EngineInputError naming the field', () => {
  const cases: [MatchedSetupInput, string][] = [
    [setup({ engine: { curve: [ENGINE_300[0]] } }), 'engine.curve'],
    [setup({ engine: { curve: [ENGINE_300[1], ENGINE_300[0]] } }), 'engine.curve[1].rpm'],
    [
      setup({ pump: { impellerDiameterMm: 240, curve: [MIXED_FLOW[2], MIXED_FLOW[1]] } }),
      'pump.curve[1].flowCoefficient',
    ],
    [
      setup({ pump: { impellerDiameterMm: 240, curve: [MIXED_FLOW[0], { ...MIXED_FLOW[1], efficiency: 1.2 }] } }),
      'pump.curve[1].efficiency',
    ],
    [setup({ pump: { impellerDiameterMm: Number.NaN, curve: MIXED_FLOW } }), 'pump.impellerDiameterMm'],
  ];
  for (const [s, field] of cases) {
    assert.throws(
      () => computeMatchedCurve(s, [0]),
      (err: unknown) => err instanceof EngineInputError && err.field === field,
      field,
    );
  }
});
