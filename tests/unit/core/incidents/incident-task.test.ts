// The reason a damage incident's re-inspection task carries: the time in the meeting's zone (IANA tz
// database, "Pacific/Auckland": UTC+13:00 in March 2027) and what happened, on one line, cut short.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { incidentTaskReason } from '../../../../lib/core/incidents/incident-task';

test('names the time in the zone and what happened, on one line', () => {
  const r = incidentTaskReason('2027-03-13T01:15:00Z', 'Pacific/Auckland', 'Hit the bank\nat the hairpin.');
  assert.equal(
    r,
    'Incident with damage, Sat 13 Mar 2027, 14:15 UTC+13:00 (Pacific/Auckland): Hit the bank at the hairpin. Re-inspect before the next run.',
  );
});

test('a long description is cut to 200 characters', () => {
  const r = incidentTaskReason('2027-03-13T01:15:00Z', 'UTC', 'x'.repeat(5000));
  const what = r.split(': ')[1].replace('. Re-inspect before the next run.', '');
  assert.equal(what.length, 200);
  assert.ok(what.endsWith('…'));
});
