// Burden of proof: the four worked decisions (upper limit 102.00 mm, U 0.05 mm) resolved for whoever
// must prove. Sources: ISO 14253-1:2017, clause 5 (rules for proving conformity and non-conformity:
// the supplier proves conformity, the customer proves non-conformity; the uncertainty counts against
// whoever proves) [memory for the clause number]; ILAC-G8:09/2019 (simple and guarded acceptance,
// the zone of doubt). The race-meeting mapping (inspection: the entrant proves; protest: the
// protester proves) is common practice, no source.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import {
  BURDENS_OF_PROOF,
  EngineInputError,
  decideConformity,
  evaluateConformity,
  resolveOutcome,
  type BurdenOfProof,
  type DecisionRule,
  type Outcome,
} from '../../../../lib/core/engine/index';

type Row = { measuredMm: number; expected: Record<DecisionRule, Record<BurdenOfProof, Outcome>> };
const same = (o: Outcome) => ({ conformity: o, non_conformity: o });

// Outcomes worked by hand: a proven verdict is the same under either burden; the ISO 14253-1 zone of
// doubt is "not accepted" when the entrant proves conformity and "non-conformity not proven" when the
// protester proves non-conformity. The protester carries the uncertainty whatever acceptance rule the
// class uses (ISO 14253-1:2017, clause 5 [memory for the clause number]), so under that burden a value
// within U of the limit is "not proven" under the simple and guarded rules too.
const WORKED: Row[] = [
  // 101.93: inside 102.00 - 0.05 = 101.95, conformity proven (ISO 14253-1:2017, clause 5 [memory]).
  {
    measuredMm: 101.93,
    expected: { simple: same('conforms'), guarded: same('conforms'), iso14253: same('conforms') },
  },
  // 101.97: within U of the limit: undecided under ISO 14253-1; guarded acceptance (ILAC-G8:09/2019, w = U)
  // rejects for the entrant, but a protester has not proven non-conformity.
  {
    measuredMm: 101.97,
    expected: {
      simple: { conformity: 'conforms', non_conformity: 'non_conformity_not_proven' },
      guarded: { conformity: 'does_not_conform', non_conformity: 'non_conformity_not_proven' },
      iso14253: { conformity: 'not_accepted', non_conformity: 'non_conformity_not_proven' },
    },
  },
  // 102.02: beyond the limit but within U: still undecided under ISO 14253-1, so not proven by a protester.
  {
    measuredMm: 102.02,
    expected: {
      simple: { conformity: 'does_not_conform', non_conformity: 'non_conformity_not_proven' },
      guarded: { conformity: 'does_not_conform', non_conformity: 'non_conformity_not_proven' },
      iso14253: { conformity: 'not_accepted', non_conformity: 'non_conformity_not_proven' },
    },
  },
  // 102.06: beyond 102.00 + 0.05 = 102.05, non-conformity proven (ISO 14253-1:2017, clause 5 [memory]).
  {
    measuredMm: 102.06,
    expected: {
      simple: same('does_not_conform'),
      guarded: same('does_not_conform'),
      iso14253: same('does_not_conform'),
    },
  },
];

test('the four worked decisions under both burdens of proof and every rule', () => {
  for (const row of WORKED) {
    for (const rule of ['simple', 'guarded', 'iso14253'] as const) {
      for (const burden of BURDENS_OF_PROOF) {
        const what = `${row.measuredMm} mm, ${rule}, ${burden}`;
        const body = { readingsMm: [row.measuredMm], maxMm: 102, expandedUncertaintyMm: 0.05, rule };
        const withBurden = decideConformity({ ...body, burdenOfProof: burden });
        assert.equal(withBurden.outcome?.outcome, row.expected[rule][burden], what);
        assert.equal(withBurden.outcome?.burdenOfProof, burden, what);
        // The part stands when it conforms or when non-conformity is not proven; never otherwise.
        const stands = ['conforms', 'non_conformity_not_proven'].includes(row.expected[rule][burden]);
        assert.equal(withBurden.outcome?.partStands, stands, `${what}: part stands`);
        // The verdict is unchanged: the outcome is an extra field beside the same answer.
        const { outcome: _o, ...rest } = withBurden;
        assert.deepEqual(rest, decideConformity(body), `${what}: the old fields are unchanged`);
      }
    }
  }
});

test('the outcome says what an inconclusive result means for each burden', () => {
  const entrant = resolveOutcome('inconclusive', 'conformity');
  assert.match(entrant.explanation, /^Not accepted: the entrant must prove conformity/);
  assert.match(entrant.explanation, /measure again with a better instrument or fix the part/i);
  const protester = resolveOutcome('inconclusive', 'non_conformity');
  assert.match(protester.explanation, /^Non-conformity not proven: the protester must prove non-conformity/);
  assert.match(protester.explanation, /the part stands/);
  for (const burden of BURDENS_OF_PROOF) {
    assert.equal(resolveOutcome('conforms', burden).partStands, true);
    assert.equal(resolveOutcome('does_not_conform', burden).partStands, false);
  }
});

test('without a burden of proof the answer has no outcome key at all', () => {
  const data = decideConformity({ readingsMm: [101.97], maxMm: 102, expandedUncertaintyMm: 0.05, rule: 'iso14253' });
  assert.equal('outcome' in data, false);
  assert.deepEqual(Object.keys(data).sort(), ['acceptanceLimitsMm', 'decisiveValueMm', 'explanation', 'verdict']);
});

test('a minimum limit: the zone of doubt below it resolves the same way', () => {
  // Minimum 98.00 mm, U 0.05: 97.98 lies within U below it, undecided (ISO 14253-1:2017, clause 5 [memory]).
  const r = evaluateConformity({ readingsMm: [97.98, 99], minMm: 98, expandedUncertaintyMm: 0.05, rule: 'iso14253' });
  assert.equal(r.verdict, 'inconclusive');
  assert.equal(resolveOutcome(r.verdict, 'conformity').outcome, 'not_accepted');
  assert.equal(resolveOutcome(r.verdict, 'non_conformity').outcome, 'non_conformity_not_proven');
});

test('an unknown burden of proof is refused with the field named', () => {
  assert.throws(
    () => resolveOutcome('inconclusive', 'entrant' as BurdenOfProof),
    (e: unknown) => e instanceof EngineInputError && e.field === 'burdenOfProof',
  );
});
