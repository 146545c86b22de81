// Display precision of figures (lib/core/format/figures.ts). Rounding reference: ECMA-262
// Number.prototype.toFixed (ties go to the larger n, on the exact binary value) — the "larger
// multiple" rule of ISO 80000-1:2009 Annex B [memory for the annex's lettering]. Conversions
// against NIST SP 811 (2008) Appendix B.8: 1 hp (550 ft·lbf/s) = 745.69987158227022 W,
// 1 PS (metric horsepower) = 735.49875 W.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { FIGURES, figureValue, formatFigure, roundFigure } from '../../../../lib/core/format/figures';
import { convertPower } from '../../../../lib/core/engine/units';

const HP_W = 745.69987158227022; // NIST SP 811 Appendix B.8
const PS_W = 735.49875; // NIST SP 811 Appendix B.8

test('power declared in hp is shown to 0.1 kW, never with the conversion’s digits', () => {
  const kw = (530 * HP_W) / 1000; // 395.22093193860326… kW, the figure once shown raw
  assert.equal(formatFigure(kw, 'powerKw'), '395.2 kW');
  assert.equal(figureValue(kw, 'powerKw'), '395.2');
  assert.equal(roundFigure(kw, 'powerKw'), 395.2);
  // The project's converter agrees with NIST's factor, and the rounded kW goes back to the rating.
  assert.ok(Math.abs(convertPower(530, 'hp', 'kW') - kw) < 1e-9);
  assert.equal(formatFigure(convertPower(kw, 'kW', 'hp'), 'powerHp'), '530.0 hp');
  assert.equal(formatFigure((300 * PS_W) / 1000, 'powerKw'), '220.6 kW'); // 220.649625 kW
});

test('ties go away from zero (rule B), on the exact binary value (toFixed)', () => {
  assert.equal(figureValue(0.25, 'powerKw'), '0.3'); // 0.25 is exact in binary: a true tie, up (rule A would give 0.2)
  assert.equal(figureValue(-0.25, 'powerKw'), '-0.3'); // away from zero on the negative side too
  assert.equal(figureValue(0.125, 'nozzleMm'), '0.13'); // exact tie
  assert.equal(figureValue(2.5, 'forceN'), '3');
  assert.equal(figureValue(0.35, 'massKg'), '0.3'); // 0.35 is 0.34999… as a double: not a tie
  assert.equal(figureValue(1.005, 'nozzleMm'), '1.00'); // 1.00499… as a double
  assert.equal(figureValue(-0.04, 'massKg'), '0.0', 'a negative value that rounds to zero shows as zero');
});

test('each quantity keeps the precision its measurement supports', () => {
  assert.equal(formatFigure(101.5, 'nozzleMm'), '101.50 mm'); // caliper resolves 0.01 mm (common practice, no source)
  assert.equal(formatFigure(101.987, 'nozzleMm'), '101.99 mm');
  assert.equal(formatFigure(0.011547, 'uncertaintyMm'), '0.012 mm');
  assert.equal(formatFigure(642.34, 'massKg'), '642.3 kg');
  assert.equal(formatFigure(8123.6, 'forceN'), '8124 N');
  assert.equal(formatFigure(23.456, 'speedMs'), '23.5 m/s');
  assert.equal(formatFigure(84.44, 'speedKmh'), '84.4 km/h');
  assert.equal(formatFigure(45.66, 'speedKn'), '45.7 kn');
  assert.equal(formatFigure(44.6, 'angleDeg'), '45°');
  assert.equal(formatFigure(1234.4, 'lengthMm'), '1234 mm');
  assert.equal(formatFigure(18.25, 'temperatureC'), '18.3 °C');
  for (const [kind, f] of Object.entries(FIGURES))
    assert.ok(f.digits >= 0 && f.digits <= 3, `${kind} has a sensible number of digits`);
});

test('missing and non-finite values show a dash, never NaN', () => {
  assert.equal(formatFigure(null, 'powerKw'), '—');
  assert.equal(formatFigure(undefined, 'massKg'), '—');
  assert.equal(formatFigure(Number.NaN, 'massKg'), '—');
  assert.equal(formatFigure(null, 'massKg', 'not declared'), 'not declared');
  assert.equal(figureValue(Number.POSITIVE_INFINITY, 'powerKw'), '');
});
