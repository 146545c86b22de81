// Reading angles on the dock form: spread evenly over half a turn, 180°/n apart (a two-point
// diameter at θ also covers θ + 180°; three readings at 0, 60, 120°: common practice, no source).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { resizeReadings } from '../../../../app/(app)/inspect/[eventId]/form-model';

const spread = (angles: string[]) => angles.map((angle) => ({ diameter: '', angle }));
const anglesOf = (r: { angle: string }[]) => r.map((x) => x.angle);

test('an untouched spread is spread again for the new count', () => {
  assert.deepEqual(anglesOf(resizeReadings(spread(['0', '60', '120']), 4)), ['0', '45', '90', '135']);
  assert.deepEqual(anglesOf(resizeReadings(spread(['0', '45', '90', '135']), 3)), ['0', '60', '120']);
  assert.deepEqual(anglesOf(resizeReadings(spread(['0', '60', '120']), 6)), ['0', '30', '60', '90', '120', '150']);
  assert.deepEqual(anglesOf(resizeReadings(spread(['0', '60', '120']), 7)), ['0', '26', '51', '77', '103', '129', '154'], '180/7 = 25.7°, rounded to whole degrees');
});

test('typed angles are kept; an added reading goes halfway between the last angle and 180°', () => {
  const typed = [{ diameter: '101.5', angle: '10' }, { diameter: '101.6', angle: '70' }, { diameter: '101.7', angle: '130' }];
  const four = resizeReadings(typed, 4);
  assert.deepEqual(anglesOf(four), ['10', '70', '130', '155']);
  assert.equal(four[0].diameter, '101.5', 'diameters are kept');
  assert.ok(four.every((r) => r.angle !== ''), 'no reading is left without an angle');
});
