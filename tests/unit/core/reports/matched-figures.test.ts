import { test } from 'node:test';
import assert from 'node:assert/strict';
import { computeReportResults, type ReportInputs } from '../../../../lib/core/reports/parity-figures';
import { computeMatchedCurve } from '../../../../lib/core/engine/jet-matched';

// An invented class of three boats; the reference values are the engine's own matched curve (checked
// against both balances in tests/unit/core/engine) and the median's definition (the middle value).
const pump = {
  impellerDiameterMm: 212,
  curve: [
    { flowCoefficient: 0.05, headCoefficient: 8, efficiency: 0.82 },
    { flowCoefficient: 0.3, headCoefficient: 4.5, efficiency: 0.9 },
    { flowCoefficient: 0.6, headCoefficient: 0.5, efficiency: 0.8 },
  ],
};
const engine = {
  curve: [
    { rpm: 3000, powerKw: 150 },
    { rpm: 5000, powerKw: 260 },
    { rpm: 7000, powerKw: 300 },
  ],
};
const boat = (entryId: string, raceNumber: number, powerKw: number) => ({
  entryId,
  raceNumber,
  boatName: entryId,
  powerKw,
  uPowerKw: 5,
  powerSource: 'verified' as const,
  nozzleDiameterMm: 100,
  uNozzleDiameterMm: 0.025,
  inspectionId: null,
  inspectedAt: null,
});
const inputs = (reportModel: 'fixed_power' | 'matched'): ReportInputs => ({
  eventName: 'e',
  classCode: 'C',
  className: 'c',
  ruleVersion: { id: 'r', version: 1 },
  assumptions: {
    pumpEfficiency: 0.9,
    nozzleLossCoefficient: 0.02,
    inletLossCoefficient: 0.2,
    wakeFraction: 0,
    referenceSpeedsMs: [10, 20],
    reportModel,
  },
  density: { densityKgM3: 999.1026, description: 'fresh water at 15 °C (ITTC 7.5-02-01-03)' },
  boats: [
    { ...boat('a', 1, 250), curves: { engine, pump } },
    boat('b', 2, 260),
    {
      ...boat('c', 3, 300),
      curves: {
        engine: {
          curve: [
            { rpm: 3000, powerKw: 0 },
            { rpm: 3001, powerKw: 1 },
          ],
        },
        pump,
      },
    },
  ],
  excluded: [],
  computedAt: '2026-12-03T00:00:00.000Z',
});

test('a class on fixed power: no model per boat, figures as before', () => {
  const r = computeReportResults(inputs('fixed_power'));
  assert.equal(r.modelUsed, undefined);
});

test('a matched class: the boat with working curves uses them; the median and deviations follow', () => {
  const r = computeReportResults(inputs('matched'));
  const used = r.modelUsed!;
  assert.equal(used.a.model, 'matched');
  assert.equal(used.b.model, 'fixed_power');
  assert.match(used.b.reason!, /No engine curve and pump curve/);
  // Boat c's engine (1 kW) is held below its curve by the pump at its lowest rpm: no operating point
  // (a 422 in the matched API), so it stays on fixed power and the report says why.
  assert.equal(used.c.model, 'fixed_power');
  assert.match(used.c.reason!, /^No matched operating point on the declared curves: .*held below its curve/);
  // The declared curve is scaled so that its peak (300 kW) is the confirmed power (250 kW): the curve
  // gives the shape, the inspection's evidence the level.
  assert.equal(used.a.declaredPeakKw, 300);
  assert.equal(used.a.scaledToKw, 250);
  const expected = computeMatchedCurve(
    {
      engine: { curve: engine.curve.map((p) => ({ rpm: p.rpm, powerKw: (p.powerKw * 250) / 300 })) },
      pump,
      nozzleDiameterMm: 100,
      densityKgM3: 999.1026,
      nozzleLossCoefficient: 0.02,
      inletLossCoefficient: 0.2,
    },
    [0, 10, 20],
  );
  const a = r.parity!.boats.find((b) => b.id === 'a')!;
  assert.equal(a.staticThrustN, expected[0].thrustN);
  assert.deepEqual(
    a.thrustAtReferenceSpeeds.map((t) => t.thrustN),
    [expected[1].thrustN, expected[2].thrustN],
  );
  assert.ok(a.uStaticThrustN > 0, 'a first-order uncertainty is given');
  // Its power and diameter parts combine as a root sum of squares (JCGM 100:2008, 5.1.2, uncorrelated inputs).
  assert.ok(
    Math.abs(Math.hypot(a.uStaticThrustFromPowerN!, a.uStaticThrustFromDiameterN!) - a.uStaticThrustN) <
      1e-9 * a.uStaticThrustN,
  );
  // At rest, against the engine alone: a larger nozzle with the same pump lets the engine settle at a
  // different point, so the diameter part is not zero; the power part is not zero either.
  assert.ok(a.uStaticThrustFromPowerN! > 0 && a.uStaticThrustFromDiameterN! > 0);
  const t0 = r.parity!.boats.map((b) => b.staticThrustN).sort((x, y) => x - y);
  assert.equal(r.parity!.summary.medianStaticThrustN, t0[1]);
  for (const b of r.parity!.boats) {
    assert.ok(Math.abs(b.deviationFromMedianN - (b.staticThrustN - t0[1])) < 1e-9);
    assert.equal(b.isReferenceBoat, b.staticThrustN === t0[1], 'the median boat is the middle one');
  }
  // The chart curve of a matched boat is its matched thrust.
  assert.equal(r.curves!.byEntry.a[0], expected[0].thrustN);
});

test('finite-difference uncertainty agrees with the closed form where matched equals fixed power', () => {
  // A flat engine curve and a constant pump efficiency: the matched model is the fixed-power one, whose
  // static thrust with the nozzle loss K_n, T0 = (2 η P / (1 + K_n))^(2/3) (ρ A)^(1/3) (the momentum balance at
  // rest: Allison, SNAME Transactions 101, 1993; MIT 2.611 course notes, 2006) gives the
  // first-order parts u_P(T0) = (2/3) T0 u(P)/P and u_D(T0) = (2/3) T0 u(D)/D (JCGM 100:2008, 5.1.2).
  const eta = 0.9;
  const flatPump = {
    impellerDiameterMm: 212,
    curve: [
      { flowCoefficient: 0.05, headCoefficient: 8, efficiency: eta },
      { flowCoefficient: 0.5, headCoefficient: 0.5, efficiency: eta },
    ],
  };
  const flat = {
    curve: [
      { rpm: 2800, powerKw: 300 },
      { rpm: 7700, powerKw: 300 },
    ],
  };
  const base = inputs('matched');
  const r = computeReportResults({
    ...base,
    boats: [{ ...boat('f', 1, 300), uPowerKw: 12, uNozzleDiameterMm: 0.05, curves: { engine: flat, pump: flatPump } }],
  });
  assert.equal(r.modelUsed!.f.model, 'matched');
  const b = r.parity!.boats[0];
  const rhoA = 999.1026 * ((Math.PI * 0.1 ** 2) / 4);
  const t0 = ((2 * eta * 300_000) / 1.02) ** (2 / 3) * rhoA ** (1 / 3);
  assert.ok(Math.abs(b.staticThrustN / t0 - 1) < 1e-9, `${b.staticThrustN} vs ${t0}`);
  const fromPower = (2 / 3) * t0 * (12 / 300);
  const fromDiameter = (2 / 3) * t0 * (0.05 / 100);
  assert.ok(
    Math.abs(b.uStaticThrustFromPowerN! / fromPower - 1) < 1e-5,
    `${b.uStaticThrustFromPowerN} vs ${fromPower}`,
  );
  assert.ok(
    Math.abs(b.uStaticThrustFromDiameterN! / fromDiameter - 1) < 1e-5,
    `${b.uStaticThrustFromDiameterN} vs ${fromDiameter}`,
  );
});

test('an owner cannot set the level with the curve: a curve of the same shape at a twentieth of the power gives the same figures', () => {
  // Attack finding (session 7): a boat confirmed at 250 kW declared a curve peaking at 16 kW and
  // reported a sixth of its thrust, moving the class median and every other boat's deviation.
  const low = inputs('matched');
  low.boats[0] = {
    ...low.boats[0],
    curves: { engine: { curve: engine.curve.map((p) => ({ rpm: p.rpm, powerKw: p.powerKw / 20 })) }, pump },
  } as (typeof low.boats)[number];
  const honest = computeReportResults(inputs('matched')).parity!.boats.find((b) => b.id === 'a')!;
  const lowered = computeReportResults(low).parity!.boats.find((b) => b.id === 'a')!;
  assert.ok(Math.abs(lowered.staticThrustN / honest.staticThrustN - 1) < 1e-12);
  assert.ok(
    lowered.thrustAtReferenceSpeeds.every(
      (t, i) => Math.abs(t.thrustN / honest.thrustAtReferenceSpeeds[i].thrustN - 1) < 1e-12,
    ),
  );
});
