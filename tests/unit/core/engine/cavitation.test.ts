// Cavitation at the pump inlet (lib/core/engine/cavitation.ts): the vapour pressure against the
// IAPWS-IF97 check values and a handbook figure, NPSH available and required by hand, and the
// affinity scaling of the required NPSH.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  STANDARD_GRAVITY,
  checkSuction,
  computeMatchedPerformance,
  prepareSuction,
  saturationPressurePa,
} from '../../../../lib/core/engine/index';

test('vapour pressure: IAPWS-IF97 computer-program verification values and a handbook figure', () => {
  // IAPWS-IF97 (Revised Release 2007), table 35: p_s at 300, 500 and 600 K in MPa.
  const checks: [number, number][] = [
    [300, 0.353658941e-2],
    [500, 0.263889776e1],
    [600, 0.123443146e2],
  ];
  for (const [t, pMPa] of checks) {
    const p = saturationPressurePa(t) / 1e6;
    assert.ok(Math.abs(p / pMPa - 1) < 1e-8, `${t} K: ${p} MPa vs ${pMPa}`);
  }
  // CRC Handbook of Chemistry and Physics, vapour pressure of water at 20 °C: 2.3393 kPa [memory].
  assert.ok(Math.abs(saturationPressurePa(293.15) - 2339.3) < 0.5);
  assert.throws(() => saturationPressurePa(200), /temperatureK/);
});

test('NPSH available and required by hand', () => {
  const suction = prepareSuction({ inletDepthM: 0.3, waterTemperatureC: 20, suctionSpecificSpeed: 4 });
  const rho = 998.2071; // fresh water at 20 °C (ITTC 7.5-02-01-03)
  const rpm = 4000;
  const q = 0.3;
  const vin = 15;
  const c = checkSuction(suction, rho, 0.2, rpm, q, vin);
  // (101325 - 2339.21) / (998.2071 x 9.80665) + 0.3 + 0.8 x 15^2 / (2 x 9.80665)
  const available =
    (101325 - saturationPressurePa(293.15)) / (rho * STANDARD_GRAVITY) + 0.3 + (0.8 * 225) / (2 * STANDARD_GRAVITY);
  assert.ok(Math.abs(c.availableNpshM - available) < 1e-12);
  assert.ok(Math.abs(c.availableNpshM - 19.589) < 1e-3, `${c.availableNpshM}`);
  // S = omega Q^(1/2) / (g NPSH_r)^(3/4), omega = 4000 x 2 pi / 60 = 418.88 rad/s (Brennen 1994, 1.7).
  const omega = (4000 * 2 * Math.PI) / 60;
  const required = ((omega * Math.sqrt(q)) / 4) ** (4 / 3) / STANDARD_GRAVITY;
  assert.ok(Math.abs(c.requiredNpshM - required) < 1e-12);
  assert.equal(c.cavitating, c.availableNpshM < c.requiredNpshM);
});

test('a maker’s required NPSH at a rated point fixes S; at fixed phi NPSH_r scales as rpm^2 (affinity laws)', () => {
  const suction = prepareSuction({
    inletDepthM: 0,
    waterTemperatureC: 15,
    requiredNpshAtRated: { npshM: 12, rpm: 5000, flowM3s: 0.35 },
  });
  const at = (rpm: number, q: number) => checkSuction(suction, 999.1, 0.2, rpm, q, 0).requiredNpshM;
  assert.ok(Math.abs(at(5000, 0.35) - 12) < 1e-9, 'the rated point gives the maker’s figure back');
  // Q ∝ n at fixed phi, so (omega Q^(1/2))^(4/3) ∝ n^2.
  assert.ok(Math.abs(at(2500, 0.175) / 12 - 0.25) < 1e-12);
  assert.throws(
    () =>
      prepareSuction({
        inletDepthM: 0,
        waterTemperatureC: 15,
        suctionSpecificSpeed: 3,
        requiredNpshAtRated: { npshM: 1, rpm: 1, flowM3s: 1 },
      }),
    /not both/,
  );
});

test('the matched model flags a high-power jet at rest, not at speed', () => {
  const data = computeMatchedPerformance({
    engine: {
      curve: [
        { rpm: 1500, powerKw: 60 },
        { rpm: 3000, powerKw: 170 },
        { rpm: 4500, powerKw: 260 },
        { rpm: 5500, powerKw: 300 },
        { rpm: 6200, powerKw: 290 },
      ],
    },
    pump: {
      impellerDiameterMm: 240,
      curve: [
        { flowCoefficient: 0.08, headCoefficient: 2.7, efficiency: 0.62 },
        { flowCoefficient: 0.22, headCoefficient: 2.0, efficiency: 0.87 },
        { flowCoefficient: 0.38, headCoefficient: 0.9, efficiency: 0.82 },
        { flowCoefficient: 0.5, headCoefficient: 0.1, efficiency: 0.6 },
      ],
    },
    nozzleDiameterMm: 100,
    speedsMs: [0, 25],
    inletLossCoefficient: 0.2,
    cavitation: { inletDepthM: 0.2, suctionSpecificSpeed: 6 },
  });
  const [rest, fast] = data.points;
  assert.equal(rest.cavitating, true, `at rest: ${rest.availableNpshM} m available, ${rest.requiredNpshM} m required`);
  assert.equal(
    fast.cavitating,
    false,
    `at 25 m/s: ${fast.availableNpshM} m available, ${fast.requiredNpshM} m required`,
  );
  assert.ok(fast.availableNpshM! > rest.availableNpshM!, 'the inflow’s dynamic head adds to what is available');
});
