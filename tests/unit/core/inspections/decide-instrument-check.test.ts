// A daily check against a reference decided by the server from the instrument's error limit (its
// maximum permissible error, JCGM 200:2012 VIM 4.26): within the limit passes, beyond it fails, and a
// person's "passed" that contradicts the figures is refused naming them (attack finding F11: the
// result used to be whatever the client said).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { decideInstrumentCheck } from '../../../../lib/core/inspections/decide-instrument-check';
import { AppError } from '../../../../lib/core/errors';

const caliper = { errorLimit: 0.02, quantity: 'length' as const };

test('within the error limit passes, on the limit passes, beyond it fails (VIM 4.26: the limit is inclusive)', () => {
  assert.equal(decideInstrumentCheck({ nominalValue: 100, reading: 100.01 }, caliper), true);
  assert.equal(decideInstrumentCheck({ nominalValue: 100, reading: 99.98 }, caliper), true, 'exactly −0.02');
  assert.equal(decideInstrumentCheck({ nominalValue: 100, reading: 100.02 }, caliper), true, 'exactly +0.02');
  assert.equal(decideInstrumentCheck({ nominalValue: 100, reading: 100.03 }, caliper), false);
  assert.equal(decideInstrumentCheck({ nominalValue: 100, reading: 57.3 }, caliper), false);
});

test('a "passed" that agrees is kept; one the figures contradict is a 400 on the field, naming both; a "failed" stands', () => {
  assert.equal(decideInstrumentCheck({ nominalValue: 100, reading: 100.01, passed: true }, caliper), true);
  assert.equal(decideInstrumentCheck({ nominalValue: 100, reading: 100.09, passed: false }, caliper), false);
  assert.throws(
    () => decideInstrumentCheck({ nominalValue: 100, reading: 57.3, passed: true }, caliper),
    (err: unknown) =>
      err instanceof AppError &&
      err.status === 400 &&
      (err.details as { field: string }[])[0].field === 'passed' &&
      /42\.7 mm off the reference, beyond the instrument’s error limit of ±0\.02 mm: the check fails/.test(err.message),
  );
  // A "failed" within the limit stands: the official may fail an instrument for what the figures do not
  // show (a damaged jaw, a sticking slide); only a "passed" the figures contradict is refused.
  assert.equal(
    decideInstrumentCheck(
      { nominalValue: 20, reading: 20.001, passed: false },
      { errorLimit: 0.005, quantity: 'mass' },
    ),
    false,
  );
});

test('with no error limit on record the person checking must say, and is taken at their word', () => {
  const noLimit = { errorLimit: null, quantity: 'length' as const };
  assert.equal(decideInstrumentCheck({ nominalValue: 100, reading: 100.5, passed: false }, noLimit), false);
  assert.equal(decideInstrumentCheck({ nominalValue: 100, reading: 100.5, passed: true }, noLimit), true);
  assert.throws(
    () => decideInstrumentCheck({ nominalValue: 100, reading: 100.5 }, noLimit),
    (err: unknown) => err instanceof AppError && (err.details as { field: string }[])[0].field === 'passed',
  );
});
