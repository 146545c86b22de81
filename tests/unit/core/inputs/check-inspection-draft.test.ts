import { test } from 'node:test';
import assert from 'node:assert/strict';
import { RecordInspectionInput } from '../../../../lib/core/inputs/inspections';
import { checkInspectionDraft } from '../../../../lib/core/inputs/check-inspection-draft';

// The dock checks a record on the phone without zod (checkInspectionDraft); the server parses it with
// RecordInspectionInput. Both must agree on every draft: accept or refuse, the same field paths with
// the same messages in the same order, and the same parsed record. The reference here is the server's
// schema itself, run on the same input (invented ids and figures; no outside value is involved).

const NOW = Date.now();
const KEY = '5a4f0c3e-8d1b-4c2a-9e7f-0a1b2c3d4e5f';
const ENTRY = '0b0e0000-0000-4000-8401-000000000001';
const INSTRUMENT = '0b0e0000-0000-4000-8501-000000000001';
const COMPONENT = '0b0e0000-0000-4000-8601-000000000001';
const at = (msFromNow: number) => new Date(NOW + msFromNow).toISOString();

/** What the dock's form builds for a boat with measured items, a gauge, seals and a weight. */
function fullDraft(): Record<string, unknown> {
  return {
    idempotencyKey: KEY,
    entryId: ENTRY,
    declarationVersion: 2,
    kind: 'pre_race',
    capturedAt: at(-60_000),
    device: ' Dock phone 2 ',
    nozzle: {
      readings: [
        { diameterMm: 101.9, angleDeg: 0 },
        { diameterMm: 101.95, angleDeg: 60 },
        { diameterMm: 101.92, angleDeg: 120 },
      ],
      instrumentId: INSTRUMENT,
      expandedUncertaintyMm: null,
      partTemperatureC: 24,
      instrumentAtPartTemperature: true,
      instrumentTemperatureC: null,
      material: 'stainless_steel',
      instrumentMaterial: null,
    },
    weight: { readingsKg: [412.5, 412.7], instrumentId: INSTRUMENT },
    power: {
      declaredKw: 300,
      evidenceSeen: true,
      note: ' sheet seen ',
      evidenceKind: 'dyno_sheet',
      dynoDocumentId: null,
    },
    seals: {
      checks: [{ number: 'kr-001', state: 'intact' }],
      applied: [{ number: 'KR-002', componentId: COMPONENT, position: ' pump housing ' }],
      removed: [{ number: 'KR-003', reason: 'engine opened' }],
    },
    safety: { kill_switch: true, helmet: false },
    measuredItems: [
      {
        key: 'engine_capacity',
        instrumentId: null,
        readings: [
          { boreMm: 86, strokeMm: 86 },
          { boreMm: 86.1, strokeMm: 86 },
        ],
      },
    ],
    gaugeChecks: [{ rule: 'nozzle', gauge: ' GO-102 ', instrumentId: null, passed: true }],
    notes: '',
    supersedesId: null,
    correctionReason: null,
    reinspectionId: null,
  };
}

/** A smallest draft: what an older client (or a record queued before items, seals and versions) sends. */
function minimalDraft(): Record<string, unknown> {
  return {
    idempotencyKey: KEY,
    entryId: ENTRY,
    capturedAt: at(0),
    nozzle: { readings: [{ diameterMm: 100, angleDeg: 0 }] },
    power: { declaredKw: 250, evidenceSeen: false },
  };
}

type Draft = Record<string, unknown>;
/** A copy of the full draft with one change made at a dotted path (undefined deletes the key). */
function withChange(path: string, value: unknown, base: Draft = fullDraft()): Draft {
  const copy = structuredClone(base);
  const keys = path.split('.');
  let o = copy as Record<string, unknown>;
  for (const k of keys.slice(0, -1)) o = o[k] as Record<string, unknown>;
  if (value === undefined) delete o[keys.at(-1)!];
  else o[keys.at(-1)!] = value;
  return copy;
}

// One row per case: a name and the draft. Whether each is accepted is the server schema's to say; the
// `accepted` column states what the row is meant to show, so a table that stopped testing refusals fails.
const CASES: [name: string, draft: unknown, accepted: boolean][] = [
  ['a full record from the form', fullDraft(), true],
  ['a smallest record (older client)', minimalDraft(), true],
  ['seals as an empty list (queued before the register)', withChange('seals', [], minimalDraft()), true],
  [
    'the older nozzle temperature name',
    withChange('nozzle', { readings: [{ diameterMm: 100, angleDeg: 0 }], temperatureC: 18 }, minimalDraft()),
    true,
  ],
  ['the two temperature names agreeing', withChange('nozzle.temperatureC', 24), true],
  ['no weighings: weight becomes null', withChange('weight', { readingsKg: [], instrumentId: null }), true],
  [
    'a typed U instead of an instrument',
    withChange('nozzle', { readings: [{ diameterMm: 100, angleDeg: 0 }], expandedUncertaintyMm: 0.05 }),
    true,
  ],
  [
    'a correction with its reason',
    withChange('correctionReason', ' typo in reading 2 ', withChange('supersedesId', INSTRUMENT)),
    true,
  ],
  ['a mixed-case UUID', withChange('entryId', ENTRY.toUpperCase()), true],
  ['an offset capture time', withChange('capturedAt', new Date(NOW).toISOString().replace('Z', '+00:00')), true],
  ['not an object', 'a record', false],
  ['null', null, false],
  ['a list', [], false],
  ['no key', withChange('idempotencyKey', undefined), false],
  ['a key that is not a UUID', withChange('idempotencyKey', 'abc'), false],
  ['an entry id as a number', withChange('entryId', 42), false],
  ['a declaration version 0', withChange('declarationVersion', 0), false],
  ['a declaration version 1.5', withChange('declarationVersion', 1.5), false],
  ['a declaration version as text', withChange('declarationVersion', '2'), false],
  ['an unknown kind', withChange('kind', 'weekly'), false],
  ['kind null', withChange('kind', null), false],
  ['a date without a time', withChange('capturedAt', '2026-12-03'), false],
  ['a capture time in the future', withChange('capturedAt', at(10 * 60_000)), false],
  ['a capture time 15 days ago', withChange('capturedAt', at(-15 * 86_400_000)), false],
  ['the 30th of February', withChange('capturedAt', '2026-02-30T10:00:00Z'), false],
  ['a device name too long', withChange('device', 'x'.repeat(81)), false],
  ['no nozzle', withChange('nozzle', undefined), false],
  ['nozzle as text', withChange('nozzle', 'round'), false],
  ['no readings', withChange('nozzle.readings', []), false],
  [
    '25 readings',
    withChange(
      'nozzle.readings',
      Array.from({ length: 25 }, (_, i) => ({ diameterMm: 100, angleDeg: i })),
    ),
    false,
  ],
  [
    '25 readings, one of them text',
    withChange(
      'nozzle.readings',
      Array.from({ length: 25 }, (_, i) => ({ diameterMm: i ? 100 : 'x', angleDeg: i })),
    ),
    false,
  ],
  ['a reading left empty', withChange('nozzle.readings', [{ angleDeg: 0 }, { diameterMm: 100, angleDeg: 60 }]), false],
  [
    'a reading not a number (NaN from the form)',
    withChange('nozzle.readings', [{ diameterMm: NaN, angleDeg: 0 }]),
    false,
  ],
  ['a diameter of 0 and an angle of 360', withChange('nozzle.readings', [{ diameterMm: 0, angleDeg: 360 }]), false],
  ['a diameter of 1000 mm', withChange('nozzle.readings', [{ diameterMm: 1000, angleDeg: -1 }]), false],
  ['a reading that is a number', withChange('nozzle.readings', [5]), false],
  [
    'U of zero',
    withChange('nozzle', { readings: [{ diameterMm: 100, angleDeg: 0 }], expandedUncertaintyMm: 0 }),
    false,
  ],
  ['U of zero with an instrument', withChange('nozzle.expandedUncertaintyMm', 0), false],
  ['U with an instrument', withChange('nozzle.expandedUncertaintyMm', 0.05), false],
  [
    'U of 6 mm',
    withChange('nozzle', { readings: [{ diameterMm: 100, angleDeg: 0 }], expandedUncertaintyMm: 6 }),
    false,
  ],
  ['U as text', withChange('nozzle.expandedUncertaintyMm', '0.05'), false],
  ['a temperature of 80 °C', withChange('nozzle.partTemperatureC', 80), false],
  [
    'a temperature of 80 °C and U with an instrument',
    withChange('nozzle.partTemperatureC', 80, withChange('nozzle.expandedUncertaintyMm', 0.1)),
    false,
  ],
  ['two temperature names disagreeing', withChange('nozzle.temperatureC', 30), false],
  ['same as the part and its own temperature', withChange('nozzle.instrumentTemperatureC', 20), false],
  ['same as the part with no temperature', withChange('nozzle.partTemperatureC', null), false],
  ['same as the part as text', withChange('nozzle.instrumentAtPartTemperature', 'yes'), false],
  ['an unknown material', withChange('nozzle.material', 'wood'), false],
  [
    'an unknown material and a bad temperature pair',
    withChange('nozzle.material', 'wood', withChange('nozzle.temperatureC', 30)),
    false,
  ],
  ['an instrument id not a UUID', withChange('nozzle.instrumentId', 'caliper-1'), false],
  ['weight as text', withChange('weight', '412 kg'), false],
  ['weight without readings', withChange('weight', { instrumentId: null }), false],
  ['a weighing of 0 kg and one of text', withChange('weight.readingsKg', [0, 'x']), false],
  ['seven weighings', withChange('weight.readingsKg', [1, 2, 3, 4, 5, 6, 7]), false],
  ['no power', withChange('power', undefined), false],
  ['power of 0 kW', withChange('power.declaredKw', 0), false],
  ['power missing', withChange('power.declaredKw', undefined), false],
  ['evidence seen as text', withChange('power.evidenceSeen', 'yes'), false],
  ['declaration only but evidence seen', withChange('power.evidenceKind', 'declaration_only'), false],
  [
    'maker rating but evidence not seen',
    withChange('power.evidenceSeen', false, withChange('power.evidenceKind', 'maker_rating')),
    false,
  ],
  [
    'a document for a maker rating',
    withChange('power.dynoDocumentId', COMPONENT, withChange('power.evidenceKind', 'maker_rating')),
    false,
  ],
  ['an unknown evidence kind', withChange('power.evidenceKind', 'rumour'), false],
  ['a power note too long', withChange('power.note', 'n'.repeat(501)), false],
  ['seals as free text', withChange('seals', 'KR-1 intact'), false],
  ['seal checks as text', withChange('seals.checks', 'all'), false],
  ['a seal number with a space', withChange('seals.checks', [{ number: 'KR 1', state: 'intact' }]), false],
  ['an empty seal number', withChange('seals.checks', [{ number: '  ', state: 'intact' }]), false],
  ['a seal state unknown', withChange('seals.checks', [{ number: 'KR-9', state: 'loose' }]), false],
  [
    'a seal listed twice (case differs)',
    withChange('seals.checks', [
      { number: 'KR-9', state: 'intact' },
      { number: 'kr-9', state: 'broken' },
    ]),
    false,
  ],
  [
    'a seal applied and checked',
    withChange('seals.applied', [{ number: 'kr-001', componentId: COMPONENT, position: 'pump' }]),
    false,
  ],
  [
    'a seal applied with no position and no component',
    withChange('seals.applied', [{ number: 'KR-4', componentId: '', position: ' ' }]),
    false,
  ],
  ['a seal removed with a short reason', withChange('seals.removed', [{ number: 'KR-3', reason: 'no' }]), false],
  ['a seal entry that is not an object', withChange('seals.removed', ['KR-3']), false],
  [
    'a seal duplicate beside a bad state',
    withChange('seals.checks', [
      { number: 'KR-9', state: 'x' },
      { number: 'KR-9', state: 'intact' },
    ]),
    false,
  ],
  [
    '41 seal checks',
    withChange(
      'seals.checks',
      Array.from({ length: 41 }, (_, i) => ({ number: `S-${i}`, state: 'intact' })),
    ),
    false,
  ],
  ['an unknown safety item', withChange('safety', { kill_switch: true, wings: true, fins: false }), false],
  ['a safety item as text', withChange('safety', { helmet: 'yes' }), false],
  ['safety as a list', withChange('safety', ['helmet']), false],
  ['measured items as text', withChange('measuredItems', 'none'), false],
  [
    'an item key in capitals',
    withChange('measuredItems', [{ key: 'Engine', instrumentId: null, readings: [{ value: 1 }] }]),
    false,
  ],
  [
    'an item key as a number',
    withChange('measuredItems', [{ key: 7, instrumentId: null, readings: [{ value: 1 }] }]),
    false,
  ],
  [
    'an item reading with an unknown field',
    withChange('measuredItems', [{ key: 'hull_length', readings: [{ depth: 3 }] }]),
    false,
  ],
  [
    'an item reading with an unknown and a known field',
    withChange('measuredItems', [{ key: 'hull_length', readings: [{ depth: 3, value: 2 }] }]),
    false,
  ],
  ['an item reading empty', withChange('measuredItems', [{ key: 'hull_length', readings: [{}] }]), false],
  [
    'an item reading of 0 and text',
    withChange('measuredItems', [{ key: 'hull_length', readings: [{ value: 0 }, { value: 'x' }] }]),
    false,
  ],
  ['an item with no readings', withChange('measuredItems', [{ key: 'hull_length', readings: [] }]), false],
  [
    'an item given twice',
    withChange('measuredItems', [
      { key: 'hull_length', readings: [{ value: 5 }] },
      { key: 'hull_length', readings: [{ value: 5 }] },
    ]),
    false,
  ],
  [
    'an item given twice, one reading empty',
    withChange('measuredItems', [
      { key: 'hull_length', readings: [{}] },
      { key: 'hull_length', readings: [{ value: 5 }] },
    ]),
    false,
  ],
  ['a gauge on the wrong rule', withChange('gaugeChecks', [{ rule: 'weight', gauge: 'G1', passed: true }]), false],
  [
    'a gauge with no identity',
    withChange('gaugeChecks', [{ rule: 'nozzle', gauge: ' ', instrumentId: null, passed: false }]),
    false,
  ],
  ['a gauge with no result', withChange('gaugeChecks', [{ rule: 'nozzle', gauge: 'G1' }]), false],
  [
    'two gauge checks on the nozzle',
    withChange('gaugeChecks', [
      { rule: 'nozzle', gauge: 'G1', passed: true },
      { rule: 'nozzle', gauge: 'G2', passed: false },
    ]),
    false,
  ],
  ['notes too long', withChange('notes', 'n'.repeat(2001)), false],
  ['a correction without its reason', withChange('supersedesId', INSTRUMENT), false],
  [
    'a correction with a blank reason',
    withChange('correctionReason', '   ', withChange('supersedesId', INSTRUMENT)),
    false,
  ],
  ['a re-inspection id not a UUID', withChange('reinspectionId', 'task-1'), false],
  [
    'many problems at once',
    {
      ...fullDraft(),
      kind: 'x',
      device: 5,
      nozzle: { readings: 'none' },
      power: { declaredKw: -1, evidenceSeen: true, evidenceKind: 'declaration_only' },
      notes: null,
    },
    false,
  ],
  [
    'only soft problems at once (cross-checks still run)',
    {
      ...withChange('nozzle.expandedUncertaintyMm', 9),
      capturedAt: at(3_600_000),
      power: { declaredKw: 0, evidenceSeen: true, evidenceKind: 'declaration_only' },
    },
    false,
  ],
];

function viaZod(draft: unknown) {
  const parsed = RecordInspectionInput.safeParse(draft);
  if (parsed.success) return { success: true as const, data: parsed.data };
  return {
    success: false as const,
    issues: parsed.error.issues.map((i) => ({ field: i.path.map(String).join('.'), message: i.message })),
  };
}

for (const [name, draft, accepted] of CASES) {
  test(`the phone's check and the server's schema agree: ${name}`, () => {
    const server = viaZod(draft);
    const phone = checkInspectionDraft(draft, NOW);
    assert.equal(server.success, accepted, `the server's schema ${server.success ? 'accepts' : 'refuses'} this row`);
    assert.equal(phone.success, server.success);
    if (server.success && phone.success) assert.deepEqual(phone.data, server.data);
    if (!server.success && !phone.success) {
      assert.deepEqual(phone.issues, server.issues);
      const first: Record<string, string> = {};
      for (const i of server.issues) first[i.field] ??= i.message;
      assert.deepEqual(phone.fieldErrors, first);
    }
  });
}

// A wider net than the table: every field of the full draft replaced, one at a time, by values of the
// wrong kind or out of range (seeded, so a failure reproduces).
test("the phone's check and the server's schema agree on each field replaced by odd values", () => {
  const odd: unknown[] = [
    undefined,
    null,
    '',
    ' ',
    'x',
    'x'.repeat(2001),
    0,
    -1,
    1.5,
    1e9,
    NaN,
    true,
    [],
    {},
    [1],
    { a: 1 },
  ];
  let refused = 0;
  for (const base of [fullDraft(), minimalDraft()]) {
    const paths: string[] = [];
    const walk = (o: unknown, prefix: string) => {
      if (o && typeof o === 'object')
        for (const [k, v] of Object.entries(o)) {
          const p = prefix ? `${prefix}.${k}` : k;
          paths.push(p);
          walk(v, p);
        }
    };
    walk(base, '');
    for (const p of paths)
      for (const value of odd) {
        const draft = withChange(p, value, base);
        const server = viaZod(draft);
        const phone = checkInspectionDraft(draft, NOW);
        const where = `${p} = ${JSON.stringify(value) ?? 'undefined'}`;
        assert.equal(phone.success, server.success, where);
        if (server.success && phone.success) assert.deepEqual(phone.data, server.data, where);
        if (!server.success && !phone.success) {
          refused++;
          assert.deepEqual(phone.issues, server.issues, where);
        }
      }
  }
  assert.ok(refused > 500, `most odd values are refused (${refused})`);
});
