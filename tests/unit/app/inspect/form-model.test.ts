// The dock form's model (app/(app)/inspect/[eventId]/form-model.ts): reading angles, the form's
// starting state, and the conversion to the inspection input and back (a queued record that needs a
// fix is loaded back into the form). Reading angles: spread evenly over half a turn, 180°/n apart (a
// two-point diameter at θ also covers θ + 180°; three readings at 0, 60, 120°: common practice, no source).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { randomUUID } from 'node:crypto';
import {
  draftFromForm,
  formFromDraft,
  initialFormState,
  resizeReadings,
  targetFromBoardRow,
  targetFromCard,
  type DockTarget,
  type FormState,
} from '../../../../app/(app)/inspect/[eventId]/form-model';
import { DEFAULT_CLASS_RULES, type ClassRules } from '../../../../lib/core/inputs/class-rules';
import { RecordInspectionInput } from '../../../../lib/core/inputs/inspections';
import type { BoatCard } from '../../../../lib/server/inspections/load-boat-card';
import type { BoardRow, InspectionBoard } from '../../../../lib/server/inspections/list-inspection-board';

const spread = (angles: string[]) => angles.map((angle) => ({ diameter: '', angle }));
const anglesOf = (r: { angle: string }[]) => r.map((x) => x.angle);

test('an untouched spread is spread again for the new count', () => {
  assert.deepEqual(anglesOf(resizeReadings(spread(['0', '60', '120']), 4)), ['0', '45', '90', '135']);
  assert.deepEqual(anglesOf(resizeReadings(spread(['0', '45', '90', '135']), 3)), ['0', '60', '120']);
  assert.deepEqual(anglesOf(resizeReadings(spread(['0', '60', '120']), 6)), ['0', '30', '60', '90', '120', '150']);
  assert.deepEqual(
    anglesOf(resizeReadings(spread(['0', '60', '120']), 7)),
    ['0', '26', '51', '77', '103', '129', '154'],
    '180/7 = 25.7°, rounded to whole degrees',
  );
});

test('typed angles are kept; an added reading goes halfway between the last angle and 180°', () => {
  const typed = [
    { diameter: '101.5', angle: '10' },
    { diameter: '101.6', angle: '70' },
    { diameter: '101.7', angle: '130' },
  ];
  const four = resizeReadings(typed, 4);
  assert.deepEqual(anglesOf(four), ['10', '70', '130', '155']);
  assert.equal(four[0].diameter, '101.5', 'diameters are kept');
  assert.ok(
    four.every((r) => r.angle !== ''),
    'no reading is left without an angle',
  );
});

// Invented boats and meetings (not reference values).
const RULES: ClassRules = {
  ...DEFAULT_CLASS_RULES,
  nozzle: { ...DEFAULT_CLASS_RULES.nozzle, maxMm: 102, minReadings: 4 },
  safetyItems: ['kill_switch', 'helmet'],
};
const ENTRY_ID = randomUUID();
const COMPONENT_ID = randomUUID();
const card = (over: Partial<BoatCard> = {}): BoatCard => ({
  event: { id: randomUUID(), name: 'Test meeting' },
  entry: {
    id: ENTRY_ID,
    raceNumber: 42,
    status: 'confirmed',
    isPaid: true,
    paidAt: '2026-01-01T00:00:00.000Z',
    inspectionResult: null,
  },
  boat: {
    id: randomUUID(),
    name: 'Test Boat',
    hullNumber: 'H-1',
    hullDescription: '',
    pumpDescription: '',
    impellerDescription: '',
    engineDescription: '',
    declaredNozzleMm: 101.5,
    declaredNozzleToleranceMm: 0.05,
    declaredPowerKw: 239.96,
    powerEvidence: 'dyno sheet',
    declaredWeightKg: null,
    declarationVersion: 3,
  },
  raceClass: { id: randomUUID(), code: 'TC', name: 'Test class' },
  ruleVersion: { id: randomUUID(), version: 3, effectiveFrom: null, rules: RULES },
  declaration: null,
  inspections: [],
  currentInspectionId: null,
  openReinspections: [],
  partsHeld: [],
  seals: [
    {
      sealId: randomUUID(),
      number: 'S-1',
      lastAction: 'applied',
      lastEventId: randomUUID(),
      lastAt: '2026-01-01T00:00:00.000Z',
      position: 'pump',
      componentId: COMPONENT_ID,
      component: 'engine Test Maker, serial 1',
    },
  ],
  components: [{ id: COMPONENT_ID, label: 'engine Test Maker, serial 1' }],
  documents: [],
  isOwnBoat: false,
  otherEntries: [],
  ...over,
});

test("a target from the server's card carries the entry, boat, class and rules in force", () => {
  const t = targetFromCard(card(), false);
  assert.equal(t.source, 'server');
  assert.equal(targetFromCard(card(), true).source, 'server-cache', 'a card from the saved answer says so');
  assert.deepEqual(
    [
      t.entryId,
      t.raceNumber,
      t.boatName,
      t.classCode,
      t.className,
      t.status,
      t.isPaid,
      t.declaredPowerKw,
      t.powerEvidence,
      t.ruleVersion,
      t.isOwnBoat,
    ],
    [ENTRY_ID, 42, 'Test Boat', 'TC', 'Test class', 'confirmed', true, 239.96, 'dyno sheet', 3, false],
  );
  assert.equal(t.rules, RULES);
  assert.equal(t.declarationVersion, 3, 'the declaration version the card shows');
  assert.ok(t.card);
  const noRules = targetFromCard(card({ ruleVersion: null, isOwnBoat: true }), false);
  assert.equal(noRules.rules, null);
  assert.equal(noRules.ruleVersion, null);
  assert.equal(noRules.isOwnBoat, true);
});

test("a target from the phone's copy of the board takes the rules of the row's class, and no card", () => {
  const classId = randomUUID();
  const row = {
    entryId: ENTRY_ID,
    raceNumber: 7,
    status: 'confirmed',
    isPaid: false,
    boatId: randomUUID(),
    boatName: 'Row Boat',
    hullNumber: 'H-7',
    tagToken: null,
    classId,
    classCode: 'TC',
    className: 'Test class',
    declaredNozzleMm: 100,
    declaredPowerKw: 250,
    powerEvidence: 'invoice',
    declaredWeightKg: null,
    declarationVersion: 2,
    state: 'waiting',
    latest: null,
    inspectionCount: 0,
    openReinspectionCount: 0,
  } as BoardRow;
  const board = {
    eventId: randomUUID(),
    eventName: 'Test meeting',
    generatedAt: '2026-01-01T00:00:00.000Z',
    rows: [row],
    counts: { total: 1, waiting: 1, conforms: 0, doesNotConform: 0, inconclusive: 0, openReinspections: 0 },
    classes: [
      { id: classId, code: 'TC', name: 'Test class', ruleVersion: { id: randomUUID(), version: 5, rules: RULES } },
    ],
    reinspections: [],
  } as InspectionBoard;
  const t = targetFromBoardRow(row, board);
  assert.equal(t.source, 'phone-copy');
  assert.deepEqual(
    [t.entryId, t.raceNumber, t.boatName, t.isPaid, t.declaredPowerKw, t.powerEvidence, t.ruleVersion],
    [ENTRY_ID, 7, 'Row Boat', false, 250, 'invoice', 5],
  );
  assert.equal(t.rules, RULES);
  assert.equal(t.card, null);
  assert.equal(t.isOwnBoat, false);
  assert.equal(t.declarationVersion, 2, "the row's declaration version");
  const { declarationVersion: _, ...savedBefore } = row;
  assert.equal(
    targetFromBoardRow(savedBefore as BoardRow, board).declarationVersion,
    null,
    'a copy saved before rows carried the version: none sent',
  );
  const orphan = targetFromBoardRow({ ...row, classId: randomUUID() }, board);
  assert.equal(orphan.rules, null, 'a class missing from the copy: no rules');
  assert.equal(orphan.ruleVersion, null);
});

test("the form starts with the class's number of readings at the even spread, the declared power as shown, the open re-inspection", () => {
  const t = targetFromCard(card(), false);
  const f = initialFormState(t, 'inst-1', 'scale-1');
  assert.deepEqual(anglesOf(f.readings), ['0', '45', '90', '135'], 'four readings required: 180°/4 apart');
  assert.ok(f.readings.every((r) => r.diameter === ''));
  assert.equal(f.kind, 'pre_race');
  assert.equal(f.uncertaintySource, 'instrument');
  assert.equal(f.instrumentId, 'inst-1');
  assert.equal(f.scaleId, 'scale-1');
  assert.equal(f.powerKw, '240.0', '239.96 kW shown to 0.1 kW, as on the card');
  assert.deepEqual(f.weighings, ['', '']);
  assert.equal(f.reinspectionId, '');
  const noInstrument = initialFormState(t, null, null);
  assert.equal(noInstrument.uncertaintySource, 'class', "no caliper registered: the class's default U");
  assert.equal(noInstrument.instrumentId, '');
  assert.equal(noInstrument.scaleId, '');
  const noRules = initialFormState(targetFromCard(card({ ruleVersion: null }), false), null, null);
  assert.deepEqual(anglesOf(noRules.readings), ['0', '60', '120'], 'no rules: three readings');
  const reinspectionId = randomUUID();
  const ordered = initialFormState(
    targetFromCard(card({ openReinspections: [{ id: reinspectionId }] as BoatCard['openReinspections'] }), false),
    null,
    null,
  );
  assert.equal(ordered.kind, 'post_race', 'an open re-inspection makes it a post-race record');
  assert.equal(ordered.reinspectionId, reinspectionId);
  // A protest's re-inspection is a protest record: the protester's burden of proof (common practice, no source).
  const protested = initialFormState(
    targetFromCard(
      card({ openReinspections: [{ id: reinspectionId, protestId: randomUUID() }] as BoatCard['openReinspections'] }),
      false,
    ),
    null,
    null,
  );
  assert.equal(protested.kind, 'protest');
});

const META = { idempotencyKey: randomUUID(), capturedAt: new Date().toISOString(), device: 'test phone' };
const filled = (t: DockTarget): FormState => ({
  ...initialFormState(t, null, null),
  readings: [
    { diameter: '101,93', angle: '0' },
    { diameter: ' 101.95 ', angle: '45' },
    { diameter: '101.9', angle: '90' },
    { diameter: '101.92', angle: '135' },
  ],
  uncertaintySource: 'typed',
  typedU: '0,05',
  temperature: '',
  material: 'aluminium',
  weighings: ['512.5', '', '513'],
  powerKw: '240',
  evidenceSeen: true,
  powerNote: 'dyno sheet seen',
  seals: {
    checks: { 'S-1': 'intact' },
    applied: [
      { number: 'S-2', componentId: COMPONENT_ID, position: 'pump' },
      { number: ' ', componentId: '', position: '' },
    ],
    removed: {},
  },
  safety: { kill_switch: true, helmet: false, harness: true },
  notes: 'dry day',
});

test('the form becomes the inspection input: numbers from typed text (a comma is a decimal point), empty rows and unasked safety items dropped', () => {
  const t = targetFromCard(card(), false);
  const d = draftFromForm(filled(t), t, META);
  assert.equal(d.entryId, ENTRY_ID);
  assert.equal(d.declarationVersion, 3, 'the record says which declaration the card showed');
  assert.equal(d.idempotencyKey, META.idempotencyKey);
  assert.deepEqual(d.nozzle.readings, [
    { diameterMm: 101.93, angleDeg: 0 },
    { diameterMm: 101.95, angleDeg: 45 },
    { diameterMm: 101.9, angleDeg: 90 },
    { diameterMm: 101.92, angleDeg: 135 },
  ]);
  assert.equal(d.nozzle.expandedUncertaintyMm, 0.05);
  assert.equal(d.nozzle.instrumentId, null, 'typed U: no instrument');
  assert.equal(d.nozzle.partTemperatureC, null, 'an empty temperature is "not given"');
  assert.equal(
    d.nozzle.instrumentAtPartTemperature,
    false,
    '"same as the nozzle" says nothing without its temperature',
  );
  assert.equal(d.nozzle.instrumentTemperatureC, null);
  assert.equal(d.nozzle.material, 'aluminium');
  assert.deepEqual(d.weight, { readingsKg: [512.5, 513], instrumentId: null });
  assert.deepEqual(d.power, {
    declaredKw: 240,
    evidenceSeen: true,
    note: 'dyno sheet seen',
    evidenceKind: null,
    dynoDocumentId: null,
  });
  assert.deepEqual(d.seals, {
    checks: [{ number: 'S-1', state: 'intact' }],
    applied: [{ number: 'S-2', componentId: COMPONENT_ID, position: 'pump' }],
    removed: [],
  });
  assert.deepEqual(d.safety, { kill_switch: true, helmet: false }, "only the class's items, each ticked or not");
  assert.equal(d.supersedesId, null);
  assert.equal(d.correctionReason, null, 'no correction: no reason sent');
  assert.equal(d.reinspectionId, null);
  const parsed = RecordInspectionInput.safeParse(d);
  assert.ok(parsed.success, JSON.stringify(parsed.error?.issues));
});

test('text in a number field stays NaN so the schema refuses it by field; an empty one is "not given"', () => {
  const t = targetFromCard(card(), false);
  const f = filled(t);
  const d = draftFromForm(
    { ...f, readings: [{ diameter: 'abc', angle: '0' }, ...f.readings.slice(1)], weighings: ['', ''] },
    t,
    META,
  );
  assert.ok(Number.isNaN(d.nozzle.readings[0].diameterMm));
  assert.equal(d.weight, null, 'no weighings: no weight');
  const parsed = RecordInspectionInput.safeParse(d);
  assert.equal(parsed.success, false);
  assert.deepEqual(
    parsed.error!.issues.map((i) => i.path.join('.')),
    ['nozzle.readings.0.diameterMm'],
  );
  const empty = draftFromForm({ ...f, readings: [{ diameter: '', angle: '' }] }, t, META);
  assert.equal(empty.nozzle.readings[0].diameterMm, undefined);
  assert.match(RecordInspectionInput.safeParse(empty).error!.issues[0].message, /^Enter the diameter \(mm\)\.$/);
});

test('the uncertainty source decides what is sent: an instrument, a typed U, or neither (the class default)', () => {
  const t = targetFromCard(card(), false);
  const f = filled(t);
  const instrument = randomUUID();
  const byInstrument = draftFromForm({ ...f, uncertaintySource: 'instrument', instrumentId: instrument }, t, META);
  assert.deepEqual([byInstrument.nozzle.instrumentId, byInstrument.nozzle.expandedUncertaintyMm], [instrument, null]);
  const byClass = draftFromForm({ ...f, uncertaintySource: 'class', instrumentId: instrument }, t, META);
  assert.deepEqual([byClass.nozzle.instrumentId, byClass.nozzle.expandedUncertaintyMm], [null, null]);
});

test('a correction sends its reason; a queued draft loads back into the same form (fix and send again)', () => {
  const t = targetFromCard(card(), false);
  const supersedesId = randomUUID();
  const scaleId = randomUUID();
  const f: FormState = {
    ...filled(t),
    supersedesId,
    correctionReason: 'wrong boat',
    scaleId,
    temperature: '35',
    kind: 'spot_check',
  };
  const d = draftFromForm(f, t, META);
  assert.equal(d.correctionReason, 'wrong boat');
  assert.equal(d.kind, 'spot_check');
  // The form sends the nozzle's temperature as partTemperatureC (the schema keeps temperatureC as its older name).
  assert.equal(d.nozzle.partTemperatureC, 35);
  assert.equal(d.nozzle.instrumentAtPartTemperature, true, 'the instrument at the nozzle’s temperature by default');
  const apart = draftFromForm({ ...f, instrumentSameAsPart: false, instrumentTemperature: '24,5' }, t, META);
  assert.deepEqual([apart.nozzle.instrumentAtPartTemperature, apart.nozzle.instrumentTemperatureC], [false, 24.5]);
  assert.equal(formFromDraft(apart, initialFormState(t, null, null)).instrumentTemperature, '24.5');
  // A draft queued before the instrument's temperature was asked: the part's temperature only, not "same".
  const older = formFromDraft(
    { ...d, nozzle: { readings: d.nozzle.readings, temperatureC: 30 } },
    initialFormState(t, null, null),
  );
  assert.deepEqual([older.temperature, older.instrumentSameAsPart], ['30', false]);
  const back = formFromDraft(d, initialFormState(t, null, null));
  assert.deepEqual(
    back.readings,
    [
      { diameter: '101.93', angle: '0' },
      { diameter: '101.95', angle: '45' },
      { diameter: '101.9', angle: '90' },
      { diameter: '101.92', angle: '135' },
    ],
    'numbers written back plainly',
  );
  assert.equal(back.uncertaintySource, 'typed');
  assert.equal(back.typedU, '0.05');
  assert.equal(back.temperature, '35');
  assert.equal(back.material, 'aluminium');
  assert.deepEqual(back.weighings, ['512.5', '513']);
  assert.equal(back.scaleId, scaleId);
  assert.equal(back.powerKw, '240');
  assert.equal(back.evidenceSeen, true);
  assert.deepEqual(back.seals, {
    checks: { 'S-1': 'intact' },
    applied: [{ number: 'S-2', componentId: COMPONENT_ID, position: 'pump' }],
    removed: {},
  });
  assert.deepEqual(back.safety, { kill_switch: true, helmet: false });
  assert.equal(back.supersedesId, supersedesId);
  assert.equal(back.correctionReason, 'wrong boat');
  assert.equal(back.kind, 'spot_check');
  // Round trip: the reloaded form makes the same draft.
  assert.deepEqual(draftFromForm(back, t, META), d);
  // A draft with an instrument loads as "instrument"; no weight keeps the form's empty weighings.
  const instrument = randomUUID();
  const viaInstrument = formFromDraft(
    { ...d, nozzle: { ...d.nozzle, instrumentId: instrument, expandedUncertaintyMm: null }, weight: null },
    initialFormState(t, null, null),
  );
  assert.equal(viaInstrument.uncertaintySource, 'instrument');
  assert.equal(viaInstrument.instrumentId, instrument);
  assert.equal(viaInstrument.typedU, '');
  assert.deepEqual(viaInstrument.weighings, ['', '']);
  // A NaN that slipped into a queued draft comes back as an empty field, not "NaN".
  const nan = formFromDraft(
    { ...d, nozzle: { ...d.nozzle, readings: [{ diameterMm: Number.NaN, angleDeg: 0 }] } },
    initialFormState(t, null, null),
  );
  assert.deepEqual(nan.readings, [{ diameter: '', angle: '0' }]);
});

test('measured items and the gauge check: rows per the class, only typed items sent, and back again from a queued draft', () => {
  const rules: ClassRules = {
    ...RULES,
    nozzle: { ...RULES.nozzle, checkMethod: 'both', gaugeNoGoMm: 102 },
    measuredItems: [
      {
        key: 'engine_capacity',
        label: 'Engine capacity',
        unit: 'cm³',
        minimum: null,
        maximum: 2000,
        readings: 2,
        instrumentTypes: ['caliper'],
        decisionRule: null,
        defaultUncertainty: 5,
        note: '',
        formula: { kind: 'engine_capacity', cylinders: 4 },
      },
      {
        key: 'ballast',
        label: 'Ballast',
        unit: 'kg',
        minimum: 20,
        maximum: null,
        readings: 1,
        instrumentTypes: ['scale'],
        decisionRule: null,
        defaultUncertainty: 0.5,
        note: '',
        formula: { kind: 'direct' },
      },
    ],
  };
  const t = targetFromCard(card({ ruleVersion: { id: randomUUID(), version: 4, effectiveFrom: null, rules } }), false);
  const start = initialFormState(t, null, null);
  assert.deepEqual(start.items?.engine_capacity.readings, [
    { boreMm: '', strokeMm: '' },
    { boreMm: '', strokeMm: '' },
  ]);
  assert.deepEqual(start.items?.ballast.readings, [{ value: '' }]);
  const f: FormState = {
    ...filled(t),
    items: {
      ...start.items,
      engine_capacity: {
        instrumentId: 'cal-1',
        readings: [
          { boreMm: '86', strokeMm: '86,0' },
          { boreMm: '', strokeMm: '' },
        ],
      },
    },
    gauge: { identity: 'NG-102', instrumentId: '', result: 'passed' },
  };
  const d = draftFromForm(f, t, META);
  // Ballast has nothing typed: not sent (the verdict says "not measured"); the empty second row is not a reading.
  assert.deepEqual(d.measuredItems, [
    { key: 'engine_capacity', instrumentId: 'cal-1', readings: [{ boreMm: 86, strokeMm: 86 }] },
  ]);
  assert.deepEqual(d.gaugeChecks, [{ rule: 'nozzle', gauge: 'NG-102', instrumentId: null, passed: true }]);
  const back = formFromDraft(d, initialFormState(t, null, null));
  assert.deepEqual(back.items?.engine_capacity.readings, [
    { boreMm: '86', strokeMm: '86' },
    { boreMm: '', strokeMm: '' },
  ]);
  assert.deepEqual(back.items?.ballast, start.items?.ballast);
  assert.deepEqual(back.gauge, { identity: 'NG-102', instrumentId: '', result: 'passed' });
  // A draft queued on a phone before measured items existed loads with the blank rows and no gauge result.
  const { measuredItems: _m, gaugeChecks: _g, ...older } = d;
  void _m;
  void _g;
  const olderBack = formFromDraft(older, initialFormState(t, null, null));
  assert.deepEqual(olderBack.items, start.items);
  assert.equal(olderBack.gauge?.result, '');
  assert.ok(RecordInspectionInput.safeParse(older).success, 'and it still parses');
});
