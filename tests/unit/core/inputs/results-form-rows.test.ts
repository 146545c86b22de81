// Which rows the results form sends (lib/core/inputs/results.ts): a pre-filled position alone is not a
// finisher; untouched positions follow the row's place; the server's row numbers map back to the screen.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { PublishResultsInput, rowsToSend } from '../../../../lib/core/inputs/results';

const CLASS = '0b0e0000-0000-4000-8000-000000000301';

test('two finishers in a three-row form: the blank pre-filled third row is left out and the input is valid', () => {
  const { send, screenIndex } = rowsToSend([
    { key: 0, position: null, raceNumber: '7' },
    { key: 1, position: null, raceNumber: '12' },
    { key: 2, position: null, raceNumber: '' },
  ]);
  assert.deepEqual(send, [
    { position: 1, raceNumber: 7 },
    { position: 2, raceNumber: 12 },
  ]);
  assert.deepEqual(screenIndex, [0, 1]);
  assert.equal(PublishResultsInput.safeParse({ classId: CLASS, rows: send }).success, true);
});

test('an edited position is kept as typed (and a gap is still refused by the schema, named by its sent row)', () => {
  const { send, screenIndex } = rowsToSend([
    { key: 0, position: null, raceNumber: '' },
    { key: 5, position: '3', raceNumber: '9' },
    { key: 6, position: null, raceNumber: '4' },
  ]);
  assert.deepEqual(send, [
    { position: 3, raceNumber: 9 },
    { position: 3, raceNumber: 4 },
  ]);
  assert.deepEqual(screenIndex, [1, 2]);
  const parsed = PublishResultsInput.safeParse({ classId: CLASS, rows: send });
  assert.equal(parsed.success, false);
  assert.ok(
    parsed.error!.issues.some((i) => i.path.join('.') === 'rows.1.position'),
    'sent row 1 is screen row 2',
  );
});
