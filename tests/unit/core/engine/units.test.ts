// Unit conversions against NIST SP 811 (2008), appendix B, and handbook figures.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import fc from 'fast-check';
import { EngineInputError } from '../../../../lib/core/engine/engine-input-error';
import {
  FORCE_UNIT_OPTIONS,
  LENGTH_UNIT_OPTIONS,
  MASS_UNIT_OPTIONS,
  NIST_SP811,
  POWER_UNIT_OPTIONS,
  SPEED_UNIT_OPTIONS,
  TEMPERATURE_UNIT_OPTIONS,
  convert,
  convertForce,
  convertLength,
  convertMass,
  convertPower,
  convertSpeed,
  convertTemperature,
  formatQuantity,
  getQuantityOfUnit,
  type AnyUnit,
} from '../../../../lib/core/engine/units';

const close = (actual: number, expected: number, tol: number, what: string) =>
  assert.ok(Math.abs(actual - expected) <= tol, `${what}: ${actual} vs ${expected} (tol ${tol})`);

test('300 kW = 402.3066 hp = 407.8865 PS', () => {
  // NIST SP 811 (2008) appendix B: 1 hp = 745.69987158227022 W, 1 PS = 735.49875 W; 300 000 W divided by each.
  close(convertPower(300, 'kW', 'hp'), 402.3066, 5e-5, 'hp');
  close(convertPower(300, 'kW', 'PS'), 407.8865, 5e-5, 'PS');
  close(convert(402.3066, 'hp', 'kW'), 300, 1e-4, 'back to kW');
});

test('table factors are the exact NIST SP 811 values', () => {
  // NIST SP 811 (2008) appendix B.
  assert.equal(NIST_SP811.horsepowerW, 745.69987158227022);
  assert.equal(NIST_SP811.metricHorsepowerW, 735.49875);
  assert.equal(NIST_SP811.poundKg, 0.45359237);
  assert.equal(NIST_SP811.poundForceN, 4.4482216152605);
  assert.equal(NIST_SP811.kilogramForceN, 9.80665);
  assert.equal(NIST_SP811.milePerHourMs, 0.44704);
});

test('length, mass and force', () => {
  // NIST SP 811 (2008) appendix B: 1 in = 25.4 mm exactly; 1 lb = 0.45359237 kg; 1 lbf = 4.4482216152605 N.
  close(convertLength(1, 'in', 'mm'), 25.4, 1e-12, 'in');
  close(convertLength(1000, 'mm', 'm'), 1, 1e-15, 'mm');
  close(convertMass(1, 'lb', 'kg'), 0.45359237, 1e-15, 'lb');
  close(convertForce(1, 'lbf', 'N'), 4.4482216152605, 1e-12, 'lbf');
  // NIST SP 811 (2008) appendix B: 1 kgf = 9.80665 N.
  close(convertForce(1, 'kgf', 'N'), 9.80665, 1e-12, 'kgf');
  // Consistency: 1 lbf = 1 lb x standard gravity (NIST SP 811 B.8 derivation).
  close(convertForce(1, 'lbf', 'kgf'), 0.45359237, 1e-12, 'lbf in kgf');
});

test('speed', () => {
  // NIST SP 811 (2008) appendix B: 1 knot = 1852/3600 m/s, 1 mph = 0.44704 m/s; km/h by definition of the hour.
  close(convertSpeed(1, 'kn', 'km/h'), 1.852, 1e-12, 'kn');
  close(convertSpeed(1, 'mph', 'km/h'), 1.609344, 1e-12, 'mph');
  close(convertSpeed(36, 'km/h', 'm/s'), 10, 1e-12, 'km/h');
  close(convertSpeed(1, 'kn', 'm/s'), 0.514444, 1e-6, 'kn in m/s');
});

test('temperature', () => {
  // NIST SP 811 (2008) appendix B.9: t/°F = 1.8 t/°C + 32.
  close(convertTemperature(100, 'C', 'F'), 212, 1e-12, 'boiling');
  close(convertTemperature(-40, 'F', 'C'), -40, 1e-12, '-40');
  close(convertTemperature(68, 'F', 'C'), 20, 1e-12, 'ISO 1 reference temperature');
  assert.throws(() => convertTemperature(-300, 'C', 'F'), EngineInputError);
});

test('handbook: fresh water about 62.4 lb/ft^3 and 8.34 lb per US gallon', () => {
  // Handbook conversions (common practice, no source); 1 ft = 12 in, 1 US gal = 231 in^3 [memory].
  const rho = 999.1026; // ITTC 7.5-02-01-03, fresh water 15 C
  const m3PerIn3 = convertLength(1, 'in', 'm') ** 3;
  const lbPerFt3 = convertMass(rho * m3PerIn3 * 12 ** 3, 'kg', 'lb');
  const lbPerGal = convertMass(rho * m3PerIn3 * 231, 'kg', 'lb');
  close(lbPerFt3, 62.4, 0.05, 'lb/ft^3');
  close(lbPerGal, 8.34, 0.005, 'lb/gal');
  close(12 ** 3 / 231, 7.48, 0.005, 'US gallons per ft^3');
});

test('round trip within every quantity (property)', () => {
  const groups: AnyUnit[][] = [
    ['W', 'kW', 'hp', 'PS'],
    ['mm', 'm', 'in'],
    ['kg', 'lb'],
    ['N', 'lbf', 'kgf'],
    ['m/s', 'km/h', 'kn', 'mph'],
    ['C', 'F'],
  ];
  fc.assert(
    fc.property(
      fc.integer({ min: 0, max: groups.length - 1 }),
      fc.nat(),
      fc.nat(),
      fc.double({ min: -1e6, max: 1e6, noNaN: true }),
      (g, i, j, x) => {
        const units = groups[g];
        const a = units[i % units.length];
        const b = units[j % units.length];
        const value = g === 5 ? Math.max(x, -200) : x;
        const back = convert(convert(value, a, b as never), b, a as never);
        return Math.abs(back - value) <= 1e-9 * Math.max(1, Math.abs(value));
      },
    ),
    { numRuns: 300 },
  );
});

test('refuses cross-quantity and non-finite conversions', () => {
  assert.throws(
    () => convert(1, 'kW', 'mm' as never),
    (e: unknown) => e instanceof EngineInputError && e.field === 'to',
  );
  assert.throws(
    () => convert(Number.NaN, 'kW', 'hp'),
    (e: unknown) => e instanceof EngineInputError && e.field === 'value',
  );
  assert.throws(() => convert(Infinity, 'm', 'mm'), EngineInputError);
  assert.throws(() => getQuantityOfUnit('furlong' as never), EngineInputError);
});

test('formatQuantity prints labels and never NaN', () => {
  assert.equal(formatQuantity(convertPower(300, 'kW', 'hp'), 'hp'), '402.31 hp');
  assert.equal(formatQuantity(15, 'C', { fractionDigits: 1 }), '15.0 °C');
  assert.equal(formatQuantity(Number.NaN, 'N'), '— N');
  assert.ok(!formatQuantity(Infinity, 'kn').includes('Infinity'));
});

test('picker option lists hold units of their own quantity, product default first', () => {
  const lists = [
    [POWER_UNIT_OPTIONS, 'power', 'kW'],
    [LENGTH_UNIT_OPTIONS, 'length', 'mm'],
    [MASS_UNIT_OPTIONS, 'mass', 'kg'],
    [FORCE_UNIT_OPTIONS, 'force', 'N'],
    [SPEED_UNIT_OPTIONS, 'speed', 'km/h'],
    [TEMPERATURE_UNIT_OPTIONS, 'temperature', 'C'],
  ] as const;
  for (const [options, quantity, first] of lists) {
    assert.equal(options[0].value, first);
    for (const o of options) {
      assert.equal(getQuantityOfUnit(o.value), quantity);
      assert.ok(o.label.length > 0);
    }
  }
});
