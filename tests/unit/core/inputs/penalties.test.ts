// The penalty and appeal inputs: what each refuses, beside which field. The kinds and whether each carries an
// amount (time in seconds, places, points, a fine in minor units) are common practice in motorsport codes,
// no single source.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  AddCatalogueItemInput,
  ApplyPenaltyInput,
  DecideAppealInput,
  LodgeAppealInput,
  ScheduleAppealHearingInput,
} from '../../../../lib/core/inputs/penalties';

const ID = '0b0e0000-0000-4000-8000-000000000101';
const fieldsOf = (r: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) =>
  r.success ? [] : r.error!.issues.map((i) => i.path.join('.'));

test('catalogue item: a kind with an amount needs one, a kind without refuses one; codes are short and plain', () => {
  assert.ok(
    AddCatalogueItemInput.safeParse({ code: 'T5', kind: 'time_added', amount: 5, label: 'Five seconds' }).success,
  );
  assert.ok(AddCatalogueItemInput.safeParse({ code: 'W', kind: 'warning', label: 'Warning' }).success);
  assert.deepEqual(fieldsOf(AddCatalogueItemInput.safeParse({ code: 'T5', kind: 'time_added', label: 'No amount' })), [
    'amount',
  ]);
  assert.deepEqual(
    fieldsOf(AddCatalogueItemInput.safeParse({ code: 'X', kind: 'exclusion', amount: 3, label: 'Excluded' })),
    ['amount'],
  );
  assert.deepEqual(fieldsOf(AddCatalogueItemInput.safeParse({ code: 'T 5', kind: 'warning', label: 'Bad code' })), [
    'code',
  ]);
  assert.deepEqual(fieldsOf(AddCatalogueItemInput.safeParse({ code: 'T5', kind: 'warning', label: 'Two\nlines' })), [
    'label',
  ]);
  assert.deepEqual(fieldsOf(AddCatalogueItemInput.safeParse({ code: 'T5', kind: 'points', label: 'Unknown kind' })), [
    'kind',
  ]);
  assert.deepEqual(
    fieldsOf(AddCatalogueItemInput.safeParse({ code: 'F', kind: 'fine', amount: 2.5, label: 'Half a unit' })),
    ['amount'],
  );
});

test('a penalty names exactly one decision it comes from: an upheld protest or a technical report', () => {
  const base = { entryId: ID, catalogueItemId: ID, reason: 'Over the maximum.' };
  assert.ok(ApplyPenaltyInput.safeParse({ ...base, protestId: ID }).success);
  assert.ok(ApplyPenaltyInput.safeParse({ ...base, technicalReportId: ID }).success);
  assert.deepEqual(fieldsOf(ApplyPenaltyInput.safeParse(base)), ['protestId']);
  assert.deepEqual(fieldsOf(ApplyPenaltyInput.safeParse({ ...base, protestId: ID, technicalReportId: ID })), [
    'protestId',
  ]);
  assert.deepEqual(fieldsOf(ApplyPenaltyInput.safeParse({ ...base, protestId: ID, reason: '  ' })), ['reason']);
  assert.deepEqual(fieldsOf(ApplyPenaltyInput.safeParse({ ...base, protestId: ID, extra: 1 })), ['']);
});

test('appeal: grounds of at least 10 characters; an amended decision (and only that) names its replacing penalty', () => {
  assert.deepEqual(fieldsOf(LodgeAppealInput.safeParse({ penaltyId: ID, grounds: 'too short' })), ['grounds']);
  assert.deepEqual(fieldsOf(LodgeAppealInput.safeParse({ penaltyId: 'x', grounds: 'Long enough grounds' })), [
    'penaltyId',
  ]);
  const reasons = 'Reasons long enough.';
  assert.ok(DecideAppealInput.safeParse({ outcome: 'annulled', reasons }).success);
  assert.ok(DecideAppealInput.safeParse({ outcome: 'amended', reasons, catalogueItemId: ID }).success);
  assert.deepEqual(fieldsOf(DecideAppealInput.safeParse({ outcome: 'amended', reasons })), ['catalogueItemId']);
  assert.deepEqual(fieldsOf(DecideAppealInput.safeParse({ outcome: 'confirmed', reasons, catalogueItemId: ID })), [
    'catalogueItemId',
  ]);
  assert.deepEqual(fieldsOf(DecideAppealInput.safeParse({ outcome: 'upheld', reasons })), ['outcome']);
});

test('hearing: an instant with its offset (the appeal body sits above any one meeting), a one-line place', () => {
  assert.ok(ScheduleAppealHearingInput.safeParse({ hearingAt: '2027-05-10T18:00:00+12:00', place: 'Room 2' }).success);
  assert.ok(ScheduleAppealHearingInput.safeParse({ hearingAt: '2027-05-10T06:00:00.000Z', place: 'Room 2' }).success);
  assert.deepEqual(fieldsOf(ScheduleAppealHearingInput.safeParse({ hearingAt: '2027-05-10 18:00', place: 'Room 2' })), [
    'hearingAt',
  ]);
  assert.deepEqual(
    fieldsOf(ScheduleAppealHearingInput.safeParse({ hearingAt: '2027-05-10T18:00:00Z', place: 'Room\n2' })),
    ['place'],
  );
});

test("the meeting's appeal fee: whole cents, not negative, and optional for older clients", async () => {
  const { EventInput } = await import('../../../../lib/core/inputs/events');
  const meeting = {
    name: 'Test meeting',
    venue: 'Test Reach',
    startsOn: '2027-05-01',
    endsOn: '2027-05-02',
    timeZone: 'Pacific/Auckland',
    status: 'draft',
    waterKind: 'fresh',
    waterTemperatureC: 15,
    waterDensityKgM3: null,
    protestWindowMinutes: 30,
    currency: 'NZD',
    entryFeeMinor: 0,
    protestFeeMinor: 0,
  };
  const without = EventInput.safeParse(meeting);
  assert.ok(without.success, JSON.stringify(without.error?.issues));
  assert.equal(without.data.appealFeeMinor, undefined);
  assert.equal(EventInput.safeParse({ ...meeting, appealFeeMinor: 7500 }).data?.appealFeeMinor, 7500);
  assert.deepEqual(fieldsOf(EventInput.safeParse({ ...meeting, appealFeeMinor: -1 })), ['appealFeeMinor']);
  assert.deepEqual(fieldsOf(EventInput.safeParse({ ...meeting, appealFeeMinor: 12.5 })), ['appealFeeMinor']);
});
