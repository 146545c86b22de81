// Calibration certificate and daily-check inputs (lib/core/inputs/instrument-calibration.ts): dates
// must be plausible (found by an outside test: year 0 was a 500 and a certificate from 1900 due in 9999
// made an instrument usable for ever). The ten-year bound is common practice, no source.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { AddCertificateInput, RecordInstrumentCheckInput } from '../../../../lib/core/inputs/instrument-calibration';

const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);
const base = { number: 'C-1', laboratory: 'Tarnwater Metrology', expandedUncertainty: null, coverageFactor: null };
const fieldsOf = (r: ReturnType<typeof AddCertificateInput.safeParse>) =>
  r.success ? [] : r.error.issues.map((i) => i.path.join('.'));

test('a plausible certificate passes; implausible dates are refused on their field', () => {
  assert.ok(AddCertificateInput.safeParse({ ...base, calibratedOn: day(-30), dueOn: day(335) }).success);
  assert.deepEqual(
    fieldsOf(AddCertificateInput.safeParse({ ...base, calibratedOn: '0000-01-01', dueOn: '0001-01-01' })),
    ['calibratedOn'],
  );
  assert.deepEqual(
    fieldsOf(AddCertificateInput.safeParse({ ...base, calibratedOn: '1900-01-01', dueOn: '9999-12-31' })),
    ['calibratedOn', 'dueOn'],
  );
  assert.deepEqual(fieldsOf(AddCertificateInput.safeParse({ ...base, calibratedOn: day(200), dueOn: day(565) })), [
    'calibratedOn',
  ]);
  assert.deepEqual(fieldsOf(AddCertificateInput.safeParse({ ...base, calibratedOn: day(-10), dueOn: day(4000) })), [
    'dueOn',
  ]);
  assert.deepEqual(
    fieldsOf(
      AddCertificateInput.safeParse({
        ...base,
        calibratedOn: day(-10),
        dueOn: day(100),
        expandedUncertainty: '0',
        coverageFactor: '2',
      }),
    ),
    ['expandedUncertainty'],
  );
});

test('a daily check says which bound a figure broke', () => {
  const r = RecordInstrumentCheckInput.safeParse({
    reference: 'Gauge block 100 mm',
    nominalValue: -1,
    reading: 1e308,
    passed: true,
  });
  assert.ok(!r.success);
  const messages = r.error.issues.map((i) => i.message);
  assert.ok(messages.includes('The nominal value cannot be negative.'));
  assert.ok(messages.includes('Keep the reading at or below 100000.'));
});
