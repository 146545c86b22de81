import { test } from 'node:test';
import assert from 'node:assert/strict';
import { DeclarePerformanceInput, PumpCatalogueEntryInput } from '../../../../lib/core/inputs/boat-performance';
import { matchedInputSchema } from '../../../../lib/core/inputs/calculation';
import { fieldIssues } from '../../../../lib/core/errors';

// The declared curves use the matched calculator's own rules: a curve one refuses, the other refuses
// with the same field and message. Invented curves; no reference values.
const pump = {
  impellerDiameterMm: 212,
  curve: [
    { flowCoefficient: 0.08, headCoefficient: 6, efficiency: 0.8 },
    { flowCoefficient: 0.12, headCoefficient: 5.9, efficiency: 0.9 },
  ],
};

test('a whole declaration parses; parts left out are cleared (null)', () => {
  const parsed = DeclarePerformanceInput.parse({
    engine: { kind: 'rated', ratedPowerKw: 300, ratedRpm: 7000, shape: 'diesel' },
  });
  assert.deepEqual(parsed, {
    engine: { kind: 'rated', ratedPowerKw: 300, ratedRpm: 7000, shape: 'diesel' },
    pump: null,
    suction: null,
  });
});

test('the same curve is refused with the same field and message as POST /api/v1/jet-performance/matched', () => {
  const badPump = { ...pump, curve: [pump.curve[1], pump.curve[0]] };
  const declared = DeclarePerformanceInput.safeParse({ pump: { kind: 'points', ...badPump } });
  const api = matchedInputSchema.safeParse({
    engine: {
      curve: [
        { rpm: 1, powerKw: 1 },
        { rpm: 2, powerKw: 1 },
      ],
    },
    pump: badPump,
    nozzleDiameterMm: 100,
    speedsMs: [0],
  });
  assert.equal(declared.success, false);
  assert.equal(api.success, false);
  assert.deepEqual(fieldIssues(declared.error!), fieldIssues(api.error!));
  assert.deepEqual(
    fieldIssues(declared.error!).map((i) => i.field),
    ['pump.curve.1.flowCoefficient'],
  );
});

test('unknown keys and a missing kind are refused; suction needs one of S or a rated NPSH', () => {
  assert.equal(DeclarePerformanceInput.safeParse({ engine: { curve: [] } }).success, false);
  assert.equal(DeclarePerformanceInput.safeParse({ engines: null }).success, false);
  assert.equal(DeclarePerformanceInput.safeParse({ suction: { inletDepthM: 0.3 } }).success, false);
  assert.equal(
    DeclarePerformanceInput.safeParse({ suction: { inletDepthM: 0.3, suctionSpecificSpeed: 3 } }).success,
    true,
  );
});

test('a catalogue entry names its maker and model on one line', () => {
  const ok = PumpCatalogueEntryInput.safeParse({ maker: ' Invented ', model: 'M1', ...pump });
  assert.equal(ok.success, true);
  assert.equal(ok.data!.maker, 'Invented');
  assert.equal(ok.data!.trimCode, '');
  const bad = PumpCatalogueEntryInput.safeParse({ maker: 'A\nB', model: '', ...pump });
  assert.deepEqual(
    fieldIssues(bad.error!)
      .map((i) => i.field)
      .sort(),
    ['maker', 'model'],
  );
});
