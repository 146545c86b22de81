import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  describeDeclarationChanges,
  listComponentChanges,
  type DeclaredComponent,
} from '../../../../lib/core/boats/declaration-changes';

// Invented components (no reference values: this is wording and pairing only).
const impeller: DeclaredComponent = {
  componentId: 'c-imp-1',
  kind: 'impeller',
  maker: 'Kestrel Foundry',
  model: 'KF-3',
  serialNumber: 'IMP-100',
  trimCode: 'T3',
};
const engine: DeclaredComponent = {
  componentId: 'c-eng-1',
  kind: 'engine',
  maker: 'Harrier Motors',
  model: 'H8',
  serialNumber: 'ENG-7',
  trimCode: '',
};
const text = (a: DeclaredComponent[], b: DeclaredComponent[]) => describeDeclarationChanges(listComponentChanges(a, b));

test('the same components unchanged: no change', () => {
  assert.deepEqual(listComponentChanges([impeller, engine], [{ ...engine }, { ...impeller }]), []);
});

test('an edit of the same component names the field', () => {
  assert.equal(text([impeller], [{ ...impeller, trimCode: 'T4' }]), 'impeller trim code “T3” → “T4”');
  assert.equal(
    text([impeller], [{ ...impeller, maker: 'Kestrel Works', model: 'KF-4' }]),
    'impeller maker “Kestrel Foundry” → “Kestrel Works”; impeller model “KF-3” → “KF-4”',
  );
});

test('one impeller replaced by another reads as a serial change (and whatever else differs)', () => {
  const other = { ...impeller, componentId: 'c-imp-2', serialNumber: 'IMP-200', trimCode: 'T5' };
  assert.equal(
    text([impeller, engine], [engine, other]),
    'impeller serial “IMP-100” → “IMP-200”; impeller trim code “T3” → “T5”',
  );
});

test('fitted and taken off, engine first, then pump, then impeller', () => {
  const pump: DeclaredComponent = { ...impeller, componentId: 'c-p', kind: 'pump', serialNumber: 'P-1', trimCode: '' };
  assert.equal(
    text([impeller], [impeller, pump, engine]),
    'engine serial (none) → “ENG-7”; pump serial (none) → “P-1”',
  );
  assert.equal(text([impeller, engine], []), 'engine serial “ENG-7” → (none); impeller serial “IMP-100” → (none)');
});

test('two of a kind: the one that stayed pairs with itself, the newcomer with the one that left', () => {
  const a = { ...engine, componentId: 'e-a', serialNumber: 'E-A' };
  const b = { ...engine, componentId: 'e-b', serialNumber: 'E-B' };
  const c = { ...engine, componentId: 'e-c', serialNumber: 'E-0' };
  assert.equal(text([a, b], [c, b]), 'engine serial “E-A” → “E-0”');
});
