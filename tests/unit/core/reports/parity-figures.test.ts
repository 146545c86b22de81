// The class figures of a parity report (lib/core/reports/parity-figures.ts), checked against values
// this file computes itself from the published relations, not from the engine:
// - momentum theory of a water jet (Allison, "Marine Waterjet Propulsion", SNAME Transactions 101,
//   1993; Faltinsen, Hydrodynamics of High-Speed Marine Vehicles, 2005, section 2.11; loss form as in
//   MIT 2.611 Ship Power and Propulsion course notes, 2006): thrust T = rho Q (v_j - V_in) with
//   Q = A v_j, and the power balance eta P = 1/2 rho Q [(1 + K_n) v_j^2 - (1 - K_i) V_in^2];
// - first-order propagation of standard uncertainties for uncorrelated inputs, JCGM 100:2008 (GUM)
//   5.1.2, eq. (10): u_c^2(y) = sum (df/dx_i)^2 u^2(x_i);
// - median and range as defined in the NIST/SEMATECH e-Handbook of Statistical Methods, 1.3.5.1
//   (measures of location) and 1.3.5.6 (measures of scale) [memory for the section numbers].
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  applyRuleWhatIf,
  applyWhatIf,
  computeReportResults,
  type ReportBoatInput,
  type ReportInputs,
} from '../../../../lib/core/reports/parity-figures';

const relClose = (actual: number, expected: number, rel: number, what: string) =>
  assert.ok(Math.abs(actual - expected) <= rel * Math.abs(expected), `${what}: ${actual} vs ${expected} (rel ${rel})`);

// Fresh water at 15 °C: 999.1026 kg/m³ (ITTC Recommended Procedure 7.5-02-01-03, fresh water and
// seawater properties). Losses: eta_p 0.9 and K_i 0.2 as used in MIT 2.611; K_n 0.02 inside the
// 0.01-0.05 range usually quoted for nozzles (common practice, no source).
const RHO = 999.1026;
const ASSUMPTIONS = {
  pumpEfficiency: 0.9,
  nozzleLossCoefficient: 0.02,
  inletLossCoefficient: 0.2,
  wakeFraction: 0,
  referenceSpeedsMs: [10, 20, 30],
};
type Model = { eta: number; kn: number; ki: number; w: number };
const MODEL: Model = { eta: 0.9, kn: 0.02, ki: 0.2, w: 0 };

/** Jet velocity from the power balance (momentum theory, Allison 1993), solved by bisection. */
function jetVelocityMs(powerKw: number, diameterMm: number, speedMs: number, m: Model = MODEL): number {
  const area = (Math.PI * (diameterMm / 1000) ** 2) / 4;
  const vin = (1 - m.w) * speedMs;
  const c = (2 * m.eta * powerKw * 1000) / (RHO * area);
  // (1 + K_n) v^3 - (1 - K_i) V_in^2 v - c = 0; negative at the lower bound, grows without limit above it.
  const f = (v: number) => (1 + m.kn) * v ** 3 - (1 - m.ki) * vin ** 2 * v - c;
  let lo = vin * Math.sqrt((1 - m.ki) / (1 + m.kn));
  let hi = Math.max(1, 2 * lo);
  while (f(hi) < 0) hi *= 2;
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    if (f(mid) < 0) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}
/** T = rho A v_j (v_j - V_in) (momentum theory). */
function thrustN(powerKw: number, diameterMm: number, speedMs: number, m: Model = MODEL): number {
  const area = (Math.PI * (diameterMm / 1000) ** 2) / 4;
  const v = jetVelocityMs(powerKw, diameterMm, speedMs, m);
  return RHO * area * v * (v - (1 - m.w) * speedMs);
}
/**
 * u(T0) by GUM 5.1.2 with sensitivities from the static closed form T0 = (2 eta P / (1 + K_n))^(2/3) (rho A)^(1/3),
 * A = pi D^2 / 4: T0 ∝ P^(2/3) D^(2/3), so dT0/dP = (2/3) T0/P and dT0/dD = (2/3) T0/D.
 */
const uStaticThrustN = (b: ReportBoatInput) =>
  thrustN(b.powerKw, b.nozzleDiameterMm, 0) *
  Math.hypot((2 / 3) * (b.uPowerKw / b.powerKw), (2 / 3) * (b.uNozzleDiameterMm / b.nozzleDiameterMm));
const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const n = s.length;
  return n % 2 ? s[(n - 1) / 2] : (s[n / 2 - 1] + s[n / 2]) / 2; // NIST/SEMATECH 1.3.5.1
};

const boat = (
  entryId: string,
  raceNumber: number,
  powerKw: number,
  nozzleDiameterMm: number,
  uPowerKw: number,
  uNozzleDiameterMm: number,
): ReportBoatInput => ({
  entryId,
  raceNumber,
  boatName: `Boat ${raceNumber}`,
  powerKw,
  uPowerKw,
  powerSource: 'declared',
  nozzleDiameterMm,
  uNozzleDiameterMm,
  inspectionId: null,
  inspectedAt: null,
});
const inputsWith = (boats: ReportBoatInput[], referenceSpeedsMs = ASSUMPTIONS.referenceSpeedsMs): ReportInputs => ({
  eventName: 'Test meeting',
  classCode: 'TC',
  className: 'Test class',
  ruleVersion: { id: 'rv-1', version: 1 },
  assumptions: { ...ASSUMPTIONS, referenceSpeedsMs },
  density: { densityKgM3: RHO, description: 'fresh water, 15 °C' },
  boats,
  excluded: [],
  computedAt: '2026-01-01T00:00:00.000Z',
});

// Invented boats (demo-style numbers, not reference values); the uncertainties are standard (k = 1).
const THREE = [boat('a', 101, 300, 100, 6, 0.03), boat('b', 102, 310, 96, 5, 0.025), boat('c', 103, 285, 104, 4, 0.02)];
const FOUR = [...THREE, boat('d', 104, 295, 99, 3, 0.05)];

test('the bisection agrees with the closed static form T0 = (2 eta P / (1 + K_n))^(2/3) (rho A)^(1/3) (momentum theory)', () => {
  // A self-check of this file's reference solver before it is used as the reference.
  const area = (Math.PI * 0.1 ** 2) / 4;
  relClose(
    thrustN(300, 100, 0),
    ((2 * 0.9 * 300_000) / 1.02) ** (2 / 3) * (RHO * area) ** (1 / 3),
    1e-12,
    'T0 at 300 kW, 100 mm',
  );
  // Lossless (eta 1, K 0): T = 2P / (v_j + V) at every speed (follows from the two relations above).
  const lossless = { eta: 1, kn: 0, ki: 0, w: 0 };
  relClose(
    thrustN(300, 100, 20, lossless),
    (2 * 300_000) / (jetVelocityMs(300, 100, 20, lossless) + 20),
    1e-12,
    'lossless identity at 20 m/s',
  );
});

test('no boats: no figures, no curves, no odds', () => {
  assert.deepEqual(computeReportResults(inputsWith([])), {
    parity: null,
    classFigures: null,
    curves: null,
    odds: null,
  });
});

test('odd count: min, max and median static thrust with their uncertainties (momentum theory; GUM 5.1.2)', () => {
  const r = computeReportResults(inputsWith(THREE));
  const f = r.classFigures!;
  const t0 = THREE.map((b) => thrustN(b.powerKw, b.nozzleDiameterMm, 0));
  const u0 = THREE.map(uStaticThrustN);
  const iMin = t0.indexOf(Math.min(...t0));
  const iMax = t0.indexOf(Math.max(...t0));
  const iMed = t0.indexOf(median(t0));
  assert.ok(iMed >= 0, 'with an odd count the median is one boat (NIST/SEMATECH 1.3.5.1)');
  relClose(f.minStaticThrustN.value, t0[iMin], 1e-9, 'min T0');
  relClose(f.maxStaticThrustN.value, t0[iMax], 1e-9, 'max T0');
  relClose(f.medianStaticThrustN.value, t0[iMed], 1e-9, 'median T0');
  relClose(f.minStaticThrustN.u, u0[iMin], 1e-9, "u(min): the extreme boat's own u(T0)");
  relClose(f.maxStaticThrustN.u, u0[iMax], 1e-9, 'u(max)');
  relClose(f.medianStaticThrustN.u, u0[iMed], 1e-9, "u(median): the median boat's own u(T0)");
});

test('even count: the median is the mean of the middle two, u(median) = 1/2 sqrt(u1^2 + u2^2) (NIST/SEMATECH 1.3.5.1; GUM 5.1.2)', () => {
  const r = computeReportResults(inputsWith(FOUR));
  const f = r.classFigures!;
  const pairs = FOUR.map((b) => ({ t: thrustN(b.powerKw, b.nozzleDiameterMm, 0), u: uStaticThrustN(b) })).sort(
    (x, y) => x.t - y.t,
  );
  relClose(f.medianStaticThrustN.value, (pairs[1].t + pairs[2].t) / 2, 1e-9, 'median T0');
  // y = (x1 + x2) / 2: both sensitivities are 1/2.
  relClose(f.medianStaticThrustN.u, Math.sqrt((0.5 * pairs[1].u) ** 2 + (0.5 * pairs[2].u) ** 2), 1e-9, 'u(median)');
  relClose(f.minStaticThrustN.value, pairs[0].t, 1e-9, 'min T0');
  relClose(f.maxStaticThrustN.value, pairs[3].t, 1e-9, 'max T0');
});

test('spread in per cent of the median and its uncertainty with the median held exact (GUM 5.1.2)', () => {
  for (const boats of [THREE, FOUR]) {
    const f = computeReportResults(inputsWith(boats)).classFigures!;
    const t0 = boats.map((b) => thrustN(b.powerKw, b.nozzleDiameterMm, 0));
    const u0 = boats.map(uStaticThrustN);
    const med = median(t0);
    const lo = t0.indexOf(Math.min(...t0));
    const hi = t0.indexOf(Math.max(...t0));
    // Range (NIST/SEMATECH 1.3.5.6) over the median, in per cent: the report's own measure (common practice, no source).
    relClose(f.spreadPercent.value, ((t0[hi] - t0[lo]) / med) * 100, 1e-9, `spread % (${boats.length} boats)`);
    // s = 100 (max - min) / median: ds/dmax = 100/median, ds/dmin = -100/median.
    relClose(
      f.spreadPercent.u,
      Math.sqrt(((100 / med) * u0[hi]) ** 2 + ((100 / med) * u0[lo]) ** 2),
      1e-9,
      `u(spread %) (${boats.length} boats)`,
    );
  }
});

test('jet velocity at rest: min, median, max and spread from v_j0 = (2 eta P / (rho A (1 + K_n)))^(1/3) (momentum theory)', () => {
  const f = computeReportResults(inputsWith(FOUR)).classFigures!;
  const vj = FOUR.map((b) => {
    const area = (Math.PI * (b.nozzleDiameterMm / 1000) ** 2) / 4;
    return ((2 * 0.9 * b.powerKw * 1000) / (RHO * area * 1.02)) ** (1 / 3);
  });
  // The closed form and this file's bisection are the same relation at V = 0.
  FOUR.forEach((b, i) => relClose(jetVelocityMs(b.powerKw, b.nozzleDiameterMm, 0), vj[i], 1e-12, `v_j0 ${b.entryId}`));
  relClose(f.jetVelocityMinMs, Math.min(...vj), 1e-9, 'min v_j0');
  relClose(f.jetVelocityMaxMs, Math.max(...vj), 1e-9, 'max v_j0');
  relClose(f.jetVelocityMedianMs, median(vj), 1e-9, 'median v_j0');
  relClose(f.jetVelocitySpreadPercent, ((Math.max(...vj) - Math.min(...vj)) / median(vj)) * 100, 1e-9, 'v_j0 spread %');
  // At equal power a smaller nozzle gives a faster jet (v_j0 ∝ D^(-2/3)): boat b (96 mm, 310 kW) is fastest here.
  assert.equal(vj.indexOf(Math.max(...vj)), 1);
});

test("chart curves: whole metres per second from 0 to 10 past the highest reference speed, each boat's thrust from momentum theory", () => {
  const r = computeReportResults(inputsWith(THREE));
  const c = r.curves!;
  assert.deepEqual(
    c.speedsMs,
    Array.from({ length: 41 }, (_, i) => i),
    '0..40 m/s for reference speeds up to 30 m/s',
  );
  for (const b of THREE) {
    const curve = c.byEntry[b.entryId];
    assert.equal(curve.length, 41);
    for (const v of [0, 5, 20, 33, 40])
      relClose(curve[v], thrustN(b.powerKw, b.nozzleDiameterMm, v), 1e-9, `T(${v} m/s) for ${b.entryId}`);
    // At fixed power the jet's thrust falls as the boat speeds up (momentum theory).
    for (let i = 1; i < curve.length; i++) assert.ok(curve[i] < curve[i - 1], `falling at ${i} m/s for ${b.entryId}`);
  }
  // The reference curve starts at the class median static thrust (for an odd count it is the median boat's curve).
  const t0 = THREE.map((b) => thrustN(b.powerKw, b.nozzleDiameterMm, 0));
  relClose(c.reference[0], median(t0), 1e-9, 'reference T(0)');
  const medianBoat = THREE[t0.indexOf(median(t0))];
  relClose(c.reference[20], thrustN(medianBoat.powerKw, medianBoat.nozzleDiameterMm, 20), 1e-9, 'reference T(20 m/s)');
  // An even count has no median boat; its reference curve still starts at the median static thrust.
  const even = computeReportResults(inputsWith(FOUR)).curves!;
  relClose(
    even.reference[0],
    median(FOUR.map((b) => thrustN(b.powerKw, b.nozzleDiameterMm, 0))),
    1e-9,
    'even-count reference T(0)',
  );
});

test('chart range: at least 0 to 30 m/s, never past 60 m/s', () => {
  const low = computeReportResults(inputsWith(THREE, [5])).curves!;
  assert.equal(low.speedsMs.at(-1), 30, 'a reference speed under 20 m/s still draws to 30');
  const high = computeReportResults(inputsWith(THREE, [10, 55])).curves!;
  assert.equal(high.speedsMs.at(-1), 60, 'capped at 60 m/s');
  assert.equal(high.speedsMs.length, 61);
});

test("one boat: every class figure is that boat's own, spread 0", () => {
  const only = [boat('solo', 7, 250, 98, 5, 0.03)];
  const f = computeReportResults(inputsWith(only)).classFigures!;
  const t0 = thrustN(250, 98, 0);
  for (const x of [f.minStaticThrustN, f.maxStaticThrustN, f.medianStaticThrustN]) {
    relClose(x.value, t0, 1e-9, 'T0');
    relClose(x.u, uStaticThrustN(only[0]), 1e-9, 'u(T0)');
  }
  assert.equal(f.spreadPercent.value, 0);
  assert.equal(f.jetVelocitySpreadPercent, 0);
});

test('what-if: replaced nozzles and powers change only those boats; the stored inputs are untouched', () => {
  const inputs = inputsWith(THREE);
  const snapshot = structuredClone(inputs);
  const changed = applyWhatIf(inputs, { nozzleByEntry: { a: 98 }, powerByEntry: { c: 270 } });
  assert.deepEqual(inputs, snapshot, 'nothing is saved or mutated');
  assert.deepEqual(
    changed.boats.map((b) => [b.entryId, b.nozzleDiameterMm, b.powerKw]),
    [
      ['a', 98, 300],
      ['b', 96, 310],
      ['c', 104, 270],
    ],
  );
  const curves = computeReportResults(changed).curves!;
  relClose(curves.byEntry.a[0], thrustN(300, 98, 0), 1e-9, 'a with a 98 mm nozzle');
  relClose(curves.byEntry.c[0], thrustN(270, 104, 0), 1e-9, 'c at 270 kW');
  assert.deepEqual(applyWhatIf(inputs, {}).boats, inputs.boats, 'no changes: the same boats');
});

test('rule what-if: each boat is brought inside the new limits, nulls leave a side open', () => {
  const inputs = inputsWith(THREE); // nozzles 100, 96, 104 mm; powers 300, 310, 285 kW
  const tighter = applyRuleWhatIf(inputs, { nozzleMaxMm: 99, nozzleMinMm: 97, powerMaxKw: 300, powerMinKw: 290 });
  assert.deepEqual(
    tighter.boats.map((b) => [b.nozzleDiameterMm, b.powerKw]),
    [
      [99, 300],
      [97, 300],
      [99, 290],
    ],
  );
  const open = applyRuleWhatIf(inputs, { nozzleMaxMm: null, powerMaxKw: undefined });
  assert.deepEqual(
    open.boats.map((b) => [b.nozzleDiameterMm, b.powerKw]),
    [
      [100, 300],
      [96, 310],
      [104, 285],
    ],
  );
  assert.equal(inputs.boats[2].nozzleDiameterMm, 104, 'the stored inputs are untouched');
});
