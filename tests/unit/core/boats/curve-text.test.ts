import { test } from 'node:test';
import assert from 'node:assert/strict';
import { curveToText, fieldErrorsByBox, parseCurveText } from '../../../../lib/core/boats/curve-text';

// Wording and parsing only: no reference values.

test('curve text: one point a line, spaces or commas, blank lines skipped; round trip', () => {
  const parsed = parseCurveText('5000 220\n\n6000, 280\n 7000;300 ', 2, 'rpm and power');
  assert.deepEqual(parsed, {
    ok: true,
    points: [
      [5000, 220],
      [6000, 280],
      [7000, 300],
    ],
  });
  assert.equal(
    curveToText([
      [5000, 220],
      [6000, 280],
    ]),
    '5000 220\n6000 280',
  );
});

test('curve text: a line with a word or the wrong count names the line', () => {
  assert.deepEqual(parseCurveText('5000 220\n6000 lots', 2, 'rpm and power in kW'), {
    ok: false,
    message: 'Line 2: give rpm and power in kW as 2 numbers.',
  });
  assert.equal(parseCurveText('0.1 5 0.8 9', 3, 'x').ok, false);
});

test('server field errors land beside their box, with the point numbered from 1', () => {
  const out = fieldErrorsByBox(
    {
      'engine.curve.1.rpm': 'rpm must increase from point to point',
      'pump.impellerDiameterMm': 'impellerDiameterMm must be greater than 0 mm',
      'somewhere.else': 'x',
    },
    ['engine', 'engine.curve', 'pump', 'pump.impellerDiameterMm'],
  );
  assert.deepEqual(out, {
    'engine.curve': 'Point 2: rpm must increase from point to point',
    'pump.impellerDiameterMm': 'impellerDiameterMm must be greater than 0 mm',
    form: 'x',
  });
});
