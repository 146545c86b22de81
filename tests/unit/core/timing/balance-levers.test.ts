import { test } from 'node:test';
import assert from 'node:assert/strict';
import { computeClockSection } from '../../../../lib/core/timing/clock-section';
import { applyBalanceLevers } from '../../../../lib/core/timing/balance-levers';

// Made-up boats; fresh water at 15 °C, 999.1026 kg/m^3 (ITTC 7.5-02-01-03); losses eta 0.9, K_i 0.2, K_n 0.02 [partly memory].
const model = {
  densityKgM3: 999.1026,
  pumpEfficiency: 0.9,
  nozzleLossCoefficient: 0.02,
  inletLossCoefficient: 0.2,
  wakeFraction: 0,
};
const section = computeClockSection({
  boats: [
    { entryId: 'a', raceNumber: 1, boatName: 'A', powerKw: 260, nozzleDiameterMm: 101, measuredWeightKg: 680 },
    { entryId: 'b', raceNumber: 2, boatName: 'B', powerKw: 220, nozzleDiameterMm: 99, measuredWeightKg: 720 },
    { entryId: 'c', raceNumber: 3, boatName: 'C', powerKw: 240, nozzleDiameterMm: 100, measuredWeightKg: 700 },
  ],
  excluded: [],
  runs: ['a', 'b', 'c'].map((entryId, i) => ({
    entryId,
    runLabel: '1',
    courseLengthM: 400,
    elapsedS: 16 + i,
    trapSpeedMs: null,
    gpsTopSpeedMs: 31,
  })),
  minimumWeightKg: null,
  uWeightKg: 0.5,
  model,
});

test('no lever changes nothing: the same integrator gives the same times', () => {
  const o = applyBalanceLevers(section, { nozzleCapMm: null, minimumMassKg: null, powerCapKw: null });
  for (const b of o.boats) assert.ok(Math.abs(b.deltaS) < 1e-9, `${b.boatName}: ${b.deltaS}`);
  assert.ok(Math.abs(o.spreadAfterS! - o.spreadBeforeS!) < 1e-9);
});

test('a power cap slows only the boats above it and narrows the spread; ballast goes to the light boats only', () => {
  const capped = applyBalanceLevers(section, { nozzleCapMm: null, minimumMassKg: null, powerCapKw: 230 });
  const by = new Map(capped.boats.map((b) => [b.entryId, b]));
  assert.ok(by.get('a')!.deltaS > 0 && by.get('c')!.deltaS > 0);
  assert.ok(Math.abs(by.get('b')!.deltaS) < 1e-9, 'under the cap: unchanged');
  assert.ok(capped.spreadAfterS! < capped.spreadBeforeS!);
  const ballast = applyBalanceLevers(section, { nozzleCapMm: null, minimumMassKg: 720 + 185, powerCapKw: null });
  const bb = new Map(ballast.boats.map((b) => [b.entryId, b]));
  assert.equal(bb.get('a')!.ballastKg, 40);
  assert.equal(bb.get('b')!.ballastKg, 0);
  assert.ok(bb.get('a')!.deltaS > 0 && Math.abs(bb.get('b')!.deltaS) < 1e-9);
  const restricted = applyBalanceLevers(section, { nozzleCapMm: 99.5, minimumMassKg: null, powerCapKw: null });
  assert.ok(Math.abs(new Map(restricted.boats.map((b) => [b.entryId, b])).get('b')!.deltaS) < 1e-9);
});
