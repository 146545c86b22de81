// Decision rules against worked decisions made by hand from ILAC-G8:09/2019 and ISO 14253-1:2017
// and the boundary classing documented in lib/core/engine/conformity.ts.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import fc from 'fast-check';
import {
  EngineInputError,
  evaluateConformity,
  type DecisionRule,
  type Verdict,
} from '../../../../lib/core/engine/index';

const decide = (
  readingsMm: number[],
  rule: DecisionRule,
  extra: { maxMm?: number; minMm?: number; U?: number } = { maxMm: 102 },
) =>
  evaluateConformity({
    readingsMm,
    rule,
    maxMm: extra.maxMm,
    minMm: extra.minMm,
    expandedUncertaintyMm: extra.U ?? 0.05,
  });

// Worked decisions: upper limit 102.00 mm, U = 0.05 mm (limit and readings chosen for the test), each
// verdict read off the zones of ILAC-G8:09/2019 (simple w = 0, guarded w = U) and ISO 14253-1:2017.
const worked: [number, Verdict, Verdict, Verdict][] = [
  // measured, simple acceptance, guarded acceptance (limit 101.95), ISO 14253-1
  [101.93, 'conforms', 'conforms', 'conforms'], // conformity proven
  [101.97, 'conforms', 'does_not_conform', 'inconclusive'], // undecided
  [102.02, 'does_not_conform', 'does_not_conform', 'inconclusive'], // undecided
  [102.06, 'does_not_conform', 'does_not_conform', 'does_not_conform'], // non-conformity proven
];

test('the four worked decisions under each of the three rules', () => {
  // Rules per ILAC-G8:09/2019 (simple, guarded w = U) and ISO 14253-1:2017 (conformity / non-conformity proven).
  for (const [value, simple, guarded, iso] of worked) {
    assert.equal(decide([value], 'simple').verdict, simple, `simple ${value}`);
    assert.equal(decide([value], 'guarded').verdict, guarded, `guarded ${value}`);
    assert.equal(decide([value], 'iso14253').verdict, iso, `iso14253 ${value}`);
  }
});

test('acceptance limits: the limit reduced by the guard band', () => {
  // ILAC-G8:09/2019: simple w = 0; guarded w = U, so the guarded acceptance limit is 102.00 - 0.05 = 101.95.
  assert.equal(decide([101.9], 'simple').acceptanceLimitsMm.maxMm, 102);
  assert.ok(Math.abs((decide([101.9], 'guarded').acceptanceLimitsMm.maxMm as number) - 101.95) < 1e-12);
  const iso = decide([101.9], 'iso14253');
  assert.ok(Math.abs(iso.checks[0].acceptanceLimitMm - 101.95) < 1e-12);
  assert.ok(Math.abs((iso.checks[0].rejectionLimitMm as number) - 102.05) < 1e-12);
  assert.equal(iso.acceptanceLimitsMm.minMm, null);
});

test('exact boundary values are classed as documented', () => {
  // Design decision (conformity.ts header): the specification limit is inclusive.
  assert.equal(decide([102.0], 'simple').verdict, 'conforms'); // equal to limit: not exceeding
  assert.equal(decide([101.95], 'guarded').verdict, 'conforms'); // 101.95 vs 102.00 - 0.05 = 101.95000000000000284
  assert.equal(decide([101.95], 'iso14253').verdict, 'conforms'); // value == limit - U: proven
  assert.equal(decide([102.05], 'iso14253').verdict, 'inconclusive'); // value == limit + U: not proven
  assert.equal(decide([102.050001], 'iso14253').verdict, 'does_not_conform');
  assert.equal(decide([101.950001], 'guarded').verdict, 'does_not_conform');
  assert.equal(decide([102.000001], 'simple').verdict, 'does_not_conform');
  // Floating point: 90.07 - 0.03 evaluates to 90.03999999999999 < 90.04, and 90.12 - 0.05 to
  // 90.07000000000001 > 90.07; the 1e-9 mm tolerance keeps these exact boundaries on the inclusive side.
  assert.ok(90.07 - 0.03 < 90.04 && 90.12 - 0.05 > 90.07);
  assert.equal(decide([90.04], 'guarded', { maxMm: 90.07, U: 0.03 }).verdict, 'conforms');
  assert.equal(decide([90.04], 'iso14253', { maxMm: 90.07, U: 0.03 }).verdict, 'conforms');
  assert.equal(decide([90.12], 'iso14253', { maxMm: 90.07, U: 0.05 }).verdict, 'inconclusive');
});

test('minimum limit mirrors the maximum, decided on the smallest reading', () => {
  // The worked decisions above reflected about a 98.00 mm minimum (ISO 14253-1:2017 zones).
  const min = { minMm: 98, U: 0.05 };
  assert.equal(decide([98.07, 99], 'iso14253', min).verdict, 'conforms');
  assert.equal(decide([98.03, 99], 'iso14253', min).verdict, 'inconclusive');
  assert.equal(decide([97.98, 99], 'iso14253', min).verdict, 'inconclusive');
  assert.equal(decide([97.94, 99], 'iso14253', min).verdict, 'does_not_conform');
  assert.equal(decide([98.03, 99], 'guarded', min).verdict, 'does_not_conform');
  assert.equal(decide([98.03, 99], 'simple', min).verdict, 'conforms');
  assert.equal(decide([98.0, 99], 'simple', min).verdict, 'conforms');
  assert.equal(decide([98.05], 'iso14253', min).verdict, 'conforms');
  assert.equal(decide([97.95], 'iso14253', min).verdict, 'inconclusive');
  assert.equal(decide([98.03, 99], 'iso14253', min).decisiveValueMm, 98.03);
});

test('decisive value: largest reading against a maximum (ISO 14405-1:2016 two-point sizes)', () => {
  const r = decide([101.9, 101.97, 101.93], 'guarded');
  assert.equal(r.decisiveValueMm, 101.97);
  assert.equal(r.verdict, 'does_not_conform');
  assert.match(r.explanation, /101\.97 mm/);
  assert.match(r.explanation, /101\.95 mm/);
});

test('both limits: the worst verdict wins', () => {
  const both = { maxMm: 102, minMm: 98, U: 0.05 };
  assert.equal(decide([98.1, 101.9], 'iso14253', both).verdict, 'conforms');
  const a = decide([97.98, 101.93], 'iso14253', both); // min inconclusive, max conforms
  assert.equal(a.verdict, 'inconclusive');
  assert.equal(a.decisiveValueMm, 97.98);
  const b = decide([98.03, 102.06], 'iso14253', both); // min inconclusive, max does not conform
  assert.equal(b.verdict, 'does_not_conform');
  assert.equal(b.decisiveValueMm, 102.06);
  assert.equal(b.checks.length, 2);
  const c = decide([98.1, 101.9], 'guarded', both);
  assert.match(c.explanation, /98\.05–101\.95 mm/);
});

test('every verdict has a one-line explanation naming the rule', () => {
  for (const rule of ['simple', 'guarded', 'iso14253'] as const) {
    for (const [value] of worked) {
      const e = decide([value], rule).explanation;
      assert.ok(e.length > 20 && !e.includes('\n'));
      assert.match(e, rule === 'iso14253' ? /ISO 14253-1/ : new RegExp(`${rule} acceptance`));
    }
  }
});

test('zero uncertainty: the three rules agree (property)', () => {
  // With U = 0 the guard band and the zone of doubt vanish (ILAC-G8:09/2019; ISO 14253-1:2017).
  fc.assert(
    fc.property(fc.array(fc.double({ min: 95, max: 105, noNaN: true }), { minLength: 1, maxLength: 8 }), (readings) => {
      const verdicts = (['simple', 'guarded', 'iso14253'] as const).map(
        (rule) => decide(readings, rule, { maxMm: 102, U: 0 }).verdict,
      );
      return verdicts.every((v) => v === verdicts[0]);
    }),
    { numRuns: 200 },
  );
});

test('guarded is never more lenient than simple; iso conformity implies guarded conformity (property)', () => {
  const rank = { conforms: 0, inconclusive: 1, does_not_conform: 2 };
  fc.assert(
    fc.property(
      fc.double({ min: 101, max: 103, noNaN: true }),
      fc.double({ min: 0, max: 0.5, noNaN: true }),
      (x, U) => {
        const s = decide([x], 'simple', { maxMm: 102, U }).verdict;
        const g = decide([x], 'guarded', { maxMm: 102, U }).verdict;
        const i = decide([x], 'iso14253', { maxMm: 102, U }).verdict;
        return (
          rank[g] >= rank[s] &&
          (i !== 'conforms' || g === 'conforms') &&
          (i !== 'does_not_conform' || s === 'does_not_conform')
        );
      },
    ),
    { numRuns: 300 },
  );
});

test('an instrument budget can stand in for U', () => {
  // JCGM 100:2008 4.3.7 (a/sqrt(3)) and F.2.2.1 (delta/sqrt(12)), k = 2 (6.2.1, 6.3.3);
  // digital caliper ±0.02 mm, resolution 0.01 mm (typical values, common practice, no source [memory]).
  const r = evaluateConformity({
    readingsMm: [101.97],
    maxMm: 102,
    rule: 'guarded',
    instrument: { errorLimitMm: 0.02, resolutionMm: 0.01 },
  });
  const expectedU = 2 * Math.hypot(0.02 / Math.sqrt(3), 0.01 / Math.sqrt(12));
  assert.ok(Math.abs(r.expandedUncertaintyMm - expectedU) < 1e-12);
  assert.equal(r.verdict, 'conforms'); // 101.97 <= 102 - 0.0238
  const worse = evaluateConformity({
    readingsMm: [101.98],
    maxMm: 102,
    rule: 'guarded',
    instrument: { errorLimitMm: 0.02, resolutionMm: 0.01 },
  });
  assert.equal(worse.verdict, 'does_not_conform'); // 101.98 > 101.976
});

test('refuses meaningless conformity input by field', () => {
  const refuses = (input: object, field: string) =>
    assert.throws(
      () => evaluateConformity(input as never),
      (e: unknown) => e instanceof EngineInputError && e.field === field,
    );
  const base = { readingsMm: [101.9], maxMm: 102, expandedUncertaintyMm: 0.05, rule: 'simple' };
  refuses({ ...base, readingsMm: [] }, 'readingsMm');
  refuses({ ...base, readingsMm: [101.9, Number.NaN] }, 'readingsMm[1]');
  refuses({ ...base, readingsMm: [-1] }, 'readingsMm[0]');
  refuses({ ...base, maxMm: undefined }, 'maxMm');
  refuses({ ...base, minMm: 103 }, 'minMm');
  refuses({ ...base, expandedUncertaintyMm: -0.01 }, 'expandedUncertaintyMm');
  refuses({ ...base, expandedUncertaintyMm: undefined }, 'expandedUncertaintyMm');
  refuses({ ...base, instrument: { errorLimitMm: 0.02 } }, 'expandedUncertaintyMm');
  refuses({ ...base, rule: 'lenient' }, 'rule');
  refuses({ ...base, maxMm: Infinity }, 'maxMm');
});
