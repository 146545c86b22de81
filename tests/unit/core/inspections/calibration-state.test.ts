// An instrument's calibration state on a meeting day: the certificate's due date and the day's checks
// against a reference, with days read in the meeting's time zone. That an instrument past its
// calibration due date is not used, and that a failed check against a reference takes it out of use,
// is common practice, no source (ISO/IEC 17025:2017, 6.4.13 asks for records of calibration and checks
// [memory for the clause number]). Time-zone offsets are from the IANA tz database (Pacific/Auckland is
// UTC+13:00 in December, daylight saving time).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  calibrationState,
  meetingDayOf,
  usableAlternatives,
  type CertificateFacts,
} from '../../../../lib/core/inspections/calibration-state';
import { toInstrumentFigures, withCertificateFigures } from '../../../../lib/core/inspections/instrument-figures';
import { instrumentUncertainty } from '../../../../lib/core/inspections/decide-inspection';

const cert = (over: Partial<CertificateFacts> = {}): CertificateFacts => ({
  id: 'c1',
  number: 'KC-1001',
  laboratory: 'Invented Lab',
  calibratedOn: '2026-06-01',
  dueOn: '2026-12-03',
  expandedUncertainty: 0.012,
  coverageFactor: 2,
  ...over,
});

test('the meeting day is the calendar day in the meeting’s time zone, not in UTC', () => {
  // 2026-12-03 11:30 UTC is 2026-12-04 00:30 in Auckland (UTC+13:00) and still the 3rd in London (UTC+0).
  assert.equal(meetingDayOf('2026-12-03T11:30:00Z', 'Pacific/Auckland'), '2026-12-04');
  assert.equal(meetingDayOf('2026-12-03T11:30:00Z', 'Europe/London'), '2026-12-03');
  assert.equal(meetingDayOf('2026-12-03T10:59:59Z', 'Pacific/Auckland'), '2026-12-03');
});

test('valid through its due date, overdue from the next day in the meeting’s zone', () => {
  const onDue = calibrationState([cert()], [], '2026-12-03T10:00:00Z', 'Pacific/Auckland');
  assert.equal(onDue.status, 'valid');
  assert.equal(onDue.usable, true);
  assert.match(onDue.reason, /valid until Thu 3 Dec 2026 \(certificate KC-1001\)/);
  // Eleven minutes past midnight on the 4th in Auckland: overdue, although it is still the 3rd in UTC.
  const after = calibrationState([cert()], [], '2026-12-03T11:11:00Z', 'Pacific/Auckland');
  assert.equal(after.status, 'overdue');
  assert.equal(after.usable, false);
  assert.match(after.reason, /overdue since Thu 3 Dec 2026/);
  // The same instant in London is still the due date.
  assert.equal(calibrationState([cert()], [], '2026-12-03T11:11:00Z', 'Europe/London').status, 'valid');
});

test('no certificate keeps today’s behaviour: usable, said so', () => {
  const s = calibrationState([], [], '2026-12-03T10:00:00Z', 'UTC');
  assert.deepEqual(
    [s.status, s.usable, s.reason, s.certificate],
    ['no_certificate', true, 'no certificate on file', null],
  );
});

test('the latest calibration on or before the day governs; a later certificate renews an overdue one', () => {
  const old = cert({ id: 'old', number: 'OLD', calibratedOn: '2025-11-01', dueOn: '2026-11-01' });
  const renewed = cert({ id: 'new', number: 'NEW', calibratedOn: '2026-11-20', dueOn: '2027-11-20' });
  const future = cert({ id: 'fut', number: 'FUT', calibratedOn: '2026-12-10', dueOn: '2027-12-10' });
  assert.equal(calibrationState([old], [], '2026-12-03T10:00:00Z', 'UTC').status, 'overdue');
  const s = calibrationState([old, renewed, future], [], '2026-12-03T10:00:00Z', 'UTC');
  assert.equal(s.status, 'valid');
  assert.equal(s.certificate?.number, 'NEW');
  // A record captured before the renewal (offline, sent later) is judged by its capture time.
  assert.equal(calibrationState([old, renewed], [], '2026-11-05T10:00:00Z', 'UTC').status, 'overdue');
});

test('a failed check takes it out of use for that meeting day only, from the check on', () => {
  const checks = [{ meetingDay: '2026-12-04', passed: false, checkedAt: '2026-12-03T20:00:00Z' }];
  const zone = 'Pacific/Auckland';
  // 09:00 on the 4th in Auckland: after the failed check.
  const s = calibrationState([cert({ dueOn: '2027-06-01' })], checks, '2026-12-03T20:00:01Z', zone);
  assert.equal(s.status, 'failed_check');
  assert.equal(s.usable, false);
  assert.match(s.reason, /failed its check against the reference on Fri 4 Dec 2026/);
  // Captured before the check (offline record sent later): still usable.
  assert.equal(calibrationState([cert({ dueOn: '2027-06-01' })], checks, '2026-12-03T19:59:59Z', zone).usable, true);
  // The next meeting day in Auckland: the failed check no longer governs.
  assert.equal(calibrationState([cert({ dueOn: '2027-06-01' })], checks, '2026-12-04T20:00:00Z', zone).usable, true);
  // A later check that day that passes puts it back in use.
  const rechecked = [...checks, { meetingDay: '2026-12-04', passed: true, checkedAt: '2026-12-03T21:00:00Z' }];
  assert.equal(calibrationState([], rechecked, '2026-12-03T21:30:00Z', zone).status, 'no_certificate');
  // Overdue outranks a passed check: a check does not renew a calibration.
  const passed = [{ meetingDay: '2026-12-05', passed: true, checkedAt: '2026-12-05T09:00:00Z' }];
  assert.equal(calibrationState([cert()], passed, '2026-12-05T10:00:00Z', 'UTC').status, 'overdue');
});

test('the dock names the usable instruments of the same quantity instead of a refused one', () => {
  const at = '2026-12-05T10:00:00Z';
  const make = (id: string, quantity: string, certs: CertificateFacts[]) => ({
    id,
    name: id,
    quantity,
    calibration: calibrationState(certs, [], at, 'UTC'),
  });
  const list = [
    make('overdue caliper', 'length', [cert()]),
    make('good caliper', 'length', [cert({ dueOn: '2027-01-01' })]),
    make('bare bore gauge', 'length', []),
    make('scale', 'mass', [cert({ dueOn: '2027-01-01' })]),
  ];
  assert.deepEqual(
    usableAlternatives(list, list[0]).map((i) => i.name),
    ['good caliper', 'bare bore gauge'],
  );
});

test('a certificate’s U is restated at k = 2 and named in the basis (JCGM 100:2008, 6.2.1: u = U/k)', () => {
  const base = toInstrumentFigures({
    id: 'i',
    name: 'Caliper',
    quantity: 'length',
    errorLimit: 0.03,
    resolution: 0.01,
  });
  // Stated U = 0.012 mm with k = 2: used as stated.
  const f2 = withCertificateFigures(base, cert());
  assert.equal(f2.expandedUncertainty, 0.012);
  const u = instrumentUncertainty(f2, 'mm');
  assert.equal(u.expandedUncertainty, 0.012);
  assert.match(u.basis, /certificate KC-1001, Invented Lab, stated U 0\.012 with k = 2/);
  // Stated U = 0.03 mm with k = 3: u = 0.01 mm, so U at k = 2 is 0.02 mm (hand computation).
  const f3 = withCertificateFigures(base, cert({ expandedUncertainty: 0.03, coverageFactor: 3 }));
  assert.ok(Math.abs((f3.expandedUncertainty ?? NaN) - 0.02) < 1e-12);
  // No stated U: the a and δ budget stays (U = 0.035119 mm from a = 0.03, δ = 0.01; JCGM 100:2008 4.3.7, F.2.2.1).
  const none = withCertificateFigures(base, cert({ expandedUncertainty: null }));
  assert.equal(none, base);
  assert.ok(Math.abs(instrumentUncertainty(none, 'mm').expandedUncertainty - 0.035119) < 1e-6);
});
