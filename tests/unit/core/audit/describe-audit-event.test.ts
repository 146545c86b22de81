// The audit trail's sentences (lib/core/audit/describe-audit-event.ts): money as money, times in the meeting's
// zone with the zone named (Pacific/Auckland is UTC+13 in December: IANA time zone database), links
// only where the reader may follow them, and no codes or minor units in the sentence.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  describeAuditEvent,
  sentenceText,
  type AuditContext,
  type AuditLine,
} from '../../../../lib/core/audit/describe-audit-event';

const EVENT = '0b0e0000-0000-4000-8000-0000000000aa';
const PROTEST = '0b0e0000-0000-4000-8000-0000000000bb';
const steward: AuditContext = {
  eventId: EVENT,
  timeZone: 'Pacific/Auckland',
  currency: 'NZD',
  can: { protests: true, entries: true, board: false, classes: false, custody: true },
};
const entry = { id: 'e1', raceNumber: 13, boatName: 'Shingle Arrow', classCode: 'SS' };
const submitted: AuditLine = {
  at: '2026-12-05T01:00:00.000Z',
  kind: 'protest',
  action: 'protest.submitted',
  actorName: 'Ada Entrant',
  subjectId: PROTEST,
  details: { matterKey: 'x', ruleReference: 'TP 2.1', windowDeadline: '2026-12-05T01:30:00.000Z', feeMinor: 4000 },
  refs: {
    protest: {
      id: PROTEST,
      ruleReference: 'TP 2.1',
      entry,
      resultClassCode: null,
      resultVersion: null,
      feeMinor: 4000,
      currency: 'NZD',
    },
  },
};

test("a protest submitted: who, which boat, which rule, the fee as money and the deadline in the meeting's zone", () => {
  const segments = describeAuditEvent(submitted, steward);
  assert.equal(
    sentenceText(segments),
    'Ada Entrant submitted the protest against boat #13 Shingle Arrow (SS) under TP 2.1; it is lodged once the fee of 40.00 NZD is paid. The protest window closes Sat 5 Dec 2026, 14:30 UTC+13:00 (Pacific/Auckland).',
  );
  assert.deepEqual(
    segments.filter((s) => s.href).map((s) => s.href),
    [`/stewards/${EVENT}/protests/${PROTEST}`, `/organise/events/${EVENT}/entries?q=13`],
  );
  assert.doesNotMatch(sentenceText(segments), /feeMinor|matterKey|protest\.submitted|4000/);
});

test('links are offered only where the reader may follow them', () => {
  const none = describeAuditEvent(submitted, {
    ...steward,
    can: { protests: false, entries: false, board: false, classes: false, custody: false },
  });
  assert.equal(none.filter((s) => s.href).length, 0);
});

test('the payment provider\'s webhook lodging a protest reads as the provider, not as "null"', () => {
  const text = sentenceText(
    describeAuditEvent(
      { ...submitted, action: 'protest.lodged', actorName: null, details: { paidAfterWindow: true } },
      steward,
    ),
  );
  assert.equal(
    text,
    'The payment provider confirmed the fee of 40.00 NZD, so the protest against boat #13 Shingle Arrow (SS) under TP 2.1 is lodged. The fee was paid after the protest window closed.',
  );
});

test('an inspection, a custody release and a staff change each read as one sentence', () => {
  const inspection = sentenceText(
    describeAuditEvent(
      {
        at: '2026-12-05T01:00:00.000Z',
        kind: 'inspection',
        action: 'inspection.corrected',
        actorName: 'Tove Aldana',
        subjectId: 'i1',
        details: {
          overallResult: 'inconclusive',
          capturedAt: '2026-12-05T00:58:00.000Z',
          correctionReason: 'wrong boat',
        },
        refs: { entry, class: { id: 'c1', code: 'SS' }, ruleVersion: 2 },
      },
      steward,
    ),
  );
  assert.equal(
    inspection,
    'Tove Aldana recorded a correction of an inspection of boat #13 Shingle Arrow (SS) under the SS rules version 2: inconclusive (measure again). Measured Sat 5 Dec 2026, 13:58 UTC+13:00 (Pacific/Auckland); reason for the correction: “wrong boat”.',
  );
  const release = sentenceText(
    describeAuditEvent(
      {
        at: '2026-12-05T01:00:00.000Z',
        kind: 'custody',
        action: 'custody.released',
        actorName: 'Rufus Steward',
        subjectId: 'c1',
        details: { description: 'Impeller', sealNumber: 'BAG-1', releasedTo: 'the entrant', note: '' },
        refs: { entry },
      },
      steward,
    ),
  );
  assert.equal(
    release,
    'Rufus Steward released Impeller (seal or bag BAG-1) of boat #13 Shingle Arrow (SS) to the entrant.',
  );
  const removed = sentenceText(
    describeAuditEvent(
      {
        at: '2026-12-05T01:00:00.000Z',
        kind: 'staff',
        action: 'staff.removed',
        actorName: 'Maren Holt',
        subjectId: 'u1',
        details: { role: 'chief_scrutineer' },
        refs: { person: { name: null, email: 'dock@example.org' } },
      },
      steward,
    ),
  );
  assert.equal(removed, "Maren Holt removed dock@example.org from the meeting's staff as chief scrutineer.");
});

test('penalties and appeals: the boat, the penalty and its reason, the appeal body decision and the refund, no codes', () => {
  const APPEAL = '0b0e0000-0000-4000-8000-0000000000cc';
  const imposed = sentenceText(
    describeAuditEvent(
      {
        at: '2026-12-05T02:00:00.000Z',
        kind: 'penalty',
        action: 'penalty.imposed',
        actorName: 'Rufus Steward',
        subjectId: PROTEST,
        details: { code: 'P2', kind: 'places_deducted', amount: 2, protestId: null, reason: 'Nozzle over the maximum' },
        refs: { entry },
      },
      steward,
    ),
  );
  assert.equal(
    imposed,
    'Rufus Steward imposed penalty P2 on boat #13 Shingle Arrow (SS), from a technical report: “Nozzle over the maximum”.',
  );
  const decided = describeAuditEvent(
    {
      at: '2026-12-05T03:00:00.000Z',
      kind: 'appeal',
      action: 'appeal.annulled',
      actorName: 'Ilse Appeals',
      subjectId: APPEAL,
      details: { reasons: 'Caliper out of calibration', refundId: 're_1' },
      refs: { entry },
    },
    steward,
  );
  assert.equal(
    sentenceText(decided),
    "Ilse Appeals, for the appeal body, decided the appeal on boat #13 Shingle Arrow (SS): the stewards' penalty is annulled. “Caliper out of calibration” The fee is refunded.",
  );
  assert.ok(decided.some((s) => s.href === `/appeals/${APPEAL}`));
  assert.doesNotMatch(sentenceText(decided), /re_1|appeal\.annulled/);
  const closed = describeAuditEvent(
    {
      at: '2026-12-05T04:00:00.000Z',
      kind: 'appeal',
      action: 'appeal.superseded',
      actorName: 'Ilse Appeals',
      subjectId: APPEAL,
      details: { reasons: 'Already annulled on the other appeal', refundId: 're_2' },
      refs: { entry },
    },
    steward,
  );
  assert.equal(
    sentenceText(closed),
    "Ilse Appeals, for the appeal body, closed the appeal on boat #13 Shingle Arrow (SS): another appeal's decision had already ended the penalty. “Already annulled on the other appeal” The fee is refunded.",
  );
  assert.doesNotMatch(sentenceText(closed), /re_2|superseded/);
});
