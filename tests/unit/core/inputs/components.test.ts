import { test } from 'node:test';
import assert from 'node:assert/strict';
import { fieldErrors } from '../../../../lib/core/errors';
import { EditComponentInput, MoveComponentInput, RegisterComponentInput } from '../../../../lib/core/inputs/components';

// The component forms' and API's one schema each (invented serials; wording and limits only).

test('a registration needs a kind and a serial as stamped; text is trimmed and defaults to empty', () => {
  const ok = RegisterComponentInput.parse({ kind: 'impeller', serialNumber: '  KF-3/0042 ' });
  assert.deepEqual(ok, { kind: 'impeller', serialNumber: 'KF-3/0042', maker: '', model: '', trimCode: '', notes: '' });
  const bad = RegisterComponentInput.safeParse({ kind: 'rudder', serialNumber: ' ' });
  assert.equal(bad.success, false);
  assert.deepEqual(Object.keys(fieldErrors(bad.error!)).sort(), ['kind', 'serialNumber']);
  assert.match(fieldErrors(bad.error!).serialNumber, /Enter the serial number/);
  // A serial is an identifier: no leading minus, no punctuation at the ends.
  assert.equal(RegisterComponentInput.safeParse({ kind: 'engine', serialNumber: '-42' }).success, false);
  assert.equal(RegisterComponentInput.safeParse({ kind: 'engine', serialNumber: 'x'.repeat(81) }).success, false);
});

test('an edit changes maker, model, trim code or notes, never kind or serial, and needs one of them', () => {
  assert.deepEqual(EditComponentInput.parse({ trimCode: ' T4 ' }), { trimCode: 'T4' });
  const identity = EditComponentInput.safeParse({ serialNumber: 'OTHER' });
  assert.equal(identity.success, false);
  assert.match(identity.error!.issues[0].message, /kind and serial number are its identity/);
  assert.equal(EditComponentInput.safeParse({}).success, false);
});

test('a move names one of the boats or null, and optionally where it was seen', () => {
  assert.deepEqual(MoveComponentInput.parse({ boatId: null }), { boatId: null });
  const id = '0b0e0000-0000-4000-8301-000000000001';
  assert.deepEqual(MoveComponentInput.parse({ boatId: id, fromBoatId: null }), { boatId: id, fromBoatId: null });
  assert.equal(MoveComponentInput.safeParse({}).success, false);
  assert.equal(MoveComponentInput.safeParse({ boatId: 'boat 1' }).success, false);
});
