// Water density on two bases, never mixed: ITTC 7.5-02-01-03 table and UNESCO EOS-80.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import fc from 'fast-check';
import { EngineInputError } from '../../../../lib/core/engine/engine-input-error';
import {
  DEFAULT_DENSITY_KG_M3,
  computeDensityEos80,
  interpolateDensityIttc,
  resolveDensity,
} from '../../../../lib/core/engine/water';

const close = (actual: number, expected: number, tol: number, what: string) =>
  assert.ok(Math.abs(actual - expected) <= tol, `${what}: ${actual} vs ${expected} (tol ${tol})`);
const refusesField = (fn: () => unknown, field: string) =>
  assert.throws(fn, (e: unknown) => e instanceof EngineInputError && e.field === field && e.message.length > 0);

test('ITTC table points are reproduced exactly', () => {
  // ITTC Recommended Procedure 7.5-02-01-03 (Fresh Water and Seawater Properties), table values.
  const fresh: [number, number][] = [
    [10, 999.7026],
    [15, 999.1026],
    [20, 998.2071],
    [25, 997.0479],
  ];
  const sea: [number, number][] = [
    [10, 1027.0],
    [15, 1026.021],
    [20, 1024.8103],
    [25, 1023.3873],
  ];
  for (const [t, rho] of fresh) close(interpolateDensityIttc('fresh', t), rho, 1e-9, `fresh ${t} C`);
  for (const [t, rho] of sea) close(interpolateDensityIttc('sea', t), rho, 1e-9, `sea ${t} C`);
});

test('ITTC basis interpolates linearly between table points', () => {
  // Midpoint of the ITTC 7.5-02-01-03 points at 15 and 20 C (linear interpolation by design).
  close(interpolateDensityIttc('fresh', 17.5), (999.1026 + 998.2071) / 2, 1e-9, 'fresh 17.5 C');
  close(interpolateDensityIttc('sea', 12.5), (1027.0 + 1026.021) / 2, 1e-9, 'sea 12.5 C');
});

test('EOS-80 check values', () => {
  // UNESCO 1981 EOS-80 (Fofonoff & Millard 1983, UNESCO Technical Papers in Marine Science 44), check values.
  close(computeDensityEos80({ salinityPsu: 0, temperatureC: 25 }), 997.04796, 1e-5, 'S=0, 25 C');
  close(computeDensityEos80({ salinityPsu: 35, temperatureC: 25 }), 1023.34306, 1e-5, 'S=35, 25 C');
});

test('EOS-80 fresh water has its density maximum near 4 C', () => {
  // Maximum density of pure water at about 3.98 C: fact of physics [memory].
  const at = (t: number) => computeDensityEos80({ salinityPsu: 0, temperatureC: t });
  assert.ok(at(4) > at(3) && at(4) > at(5));
  assert.ok(at(3.9) > at(3.5) && at(4.0) > at(4.5));
});

test('the two bases agree for fresh water but are kept apart', () => {
  // ITTC 7.5-02-01-03 vs EOS-80 (two published sources): fresh water within 0.005 kg/m^3 at 15-25 C.
  for (const t of [15, 20, 25]) {
    close(
      computeDensityEos80({ salinityPsu: 0, temperatureC: t }),
      interpolateDensityIttc('fresh', t),
      0.005,
      `${t} C`,
    );
  }
  // Sea water: ITTC uses absolute salinity 35.16504 g/kg, EOS-80 practical salinity 35; a loose
  // 0.1 kg/m^3 consistency bound, chosen by us (no source).
  for (const t of [10, 15, 20, 25]) {
    close(
      computeDensityEos80({ salinityPsu: 35, temperatureC: t }),
      interpolateDensityIttc('sea', t),
      0.1,
      `sea ${t} C`,
    );
  }
  // resolveDensity reports the basis it used; the same request on the two bases names each.
  assert.equal(resolveDensity({ kind: 'sea', temperatureC: 20 }).basis, 'ittc');
  assert.equal(resolveDensity({ kind: 'sea', temperatureC: 20, basis: 'eos80' }).basis, 'eos80');
});

test('product default is fresh water at 15 C on the ITTC basis', () => {
  // ITTC 7.5-02-01-03: fresh water at 15 C = 999.1026 kg/m^3.
  assert.equal(DEFAULT_DENSITY_KG_M3, 999.1026);
  const r = resolveDensity();
  close(r.densityKgM3, 999.1026, 1e-9, 'default');
  assert.equal(r.basis, 'ittc');
  assert.match(r.description, /ITTC/);
});

test('manual density override wins and is labelled manual', () => {
  const r = resolveDensity({ densityKgM3: 1000 });
  assert.equal(r.densityKgM3, 1000);
  assert.equal(r.basis, 'manual');
});

test('sea water salinity on the EOS-80 basis', () => {
  // EOS-80 is defined for practical salinity 0-42 (UNESCO Tech. Paper 44).
  const brackish = resolveDensity({ kind: 'sea', temperatureC: 20, basis: 'eos80', salinityPsu: 10 });
  const fresh = resolveDensity({ kind: 'fresh', temperatureC: 20, basis: 'eos80' });
  const sea = resolveDensity({ kind: 'sea', temperatureC: 20, basis: 'eos80' });
  assert.ok(fresh.densityKgM3 < brackish.densityKgM3 && brackish.densityKgM3 < sea.densityKgM3);
});

test('density falls with temperature above 4 C and rises with salinity (property)', () => {
  // Thermal expansion of water above its density maximum; haline contraction (EOS-80 behaviour).
  fc.assert(
    fc.property(
      fc.double({ min: 5, max: 39, noNaN: true }),
      fc.double({ min: 0.1, max: 1, noNaN: true }),
      fc.double({ min: 0, max: 40, noNaN: true }),
      (t, dt, s) => {
        const a = computeDensityEos80({ salinityPsu: s, temperatureC: t });
        const b = computeDensityEos80({ salinityPsu: s, temperatureC: t + dt });
        const c = computeDensityEos80({ salinityPsu: s + 1, temperatureC: t });
        return b < a && c > a && Number.isFinite(a);
      },
    ),
    { numRuns: 200 },
  );
});

test('refuses out-of-range and meaningless water input', () => {
  refusesField(() => interpolateDensityIttc('fresh', 5), 'temperatureC'); // ITTC table held 10-25 C only
  refusesField(() => resolveDensity({ kind: 'fresh', temperatureC: 26 }), 'temperatureC');
  refusesField(() => computeDensityEos80({ salinityPsu: 0, temperatureC: 41 }), 'temperatureC');
  refusesField(() => computeDensityEos80({ salinityPsu: 0, temperatureC: -1 }), 'temperatureC');
  refusesField(() => computeDensityEos80({ salinityPsu: 43, temperatureC: 20 }), 'salinityPsu');
  refusesField(() => computeDensityEos80({ salinityPsu: Number.NaN, temperatureC: 20 }), 'salinityPsu');
  refusesField(() => resolveDensity({ kind: 'lake' as never, temperatureC: 15 }), 'kind');
  refusesField(() => resolveDensity({ kind: 'fresh', temperatureC: 15, salinityPsu: 1 }), 'salinityPsu');
  refusesField(() => resolveDensity({ kind: 'fresh', temperatureC: 15, basis: 'teos10' as never }), 'basis');
  refusesField(() => resolveDensity({ densityKgM3: 0 }), 'densityKgM3');
  refusesField(() => resolveDensity({ densityKgM3: 1.0 }), 'densityKgM3'); // g/cm^3 typed into kg/m^3
  refusesField(() => resolveDensity({ densityKgM3: Infinity }), 'densityKgM3');
});
