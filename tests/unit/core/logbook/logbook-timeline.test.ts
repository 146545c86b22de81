// The logbook's timeline in words: declaration changes, inspection rule lines read through the stored
// shape, a seal finding carried into its inspection's entry, notes dated by the day they happened,
// newest or oldest first, grouped by meeting, and filters that accept only the kinds that exist.
// The PDF is parsed back with pdf-lib. The figures are invented; rounding follows lib/core/format/figures.ts.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { PDFDocument } from 'pdf-lib';
import { extractPdfText } from '../../../support/pdf-text';
import { buildLogbookPdf } from '../../../../lib/core/logbook/logbook-pdf';
import {
  buildLogbookItems,
  listSealsOnComponents,
  groupLogbookItems,
  parseLogbookKinds,
  sortLogbookItems,
} from '../../../../lib/core/logbook/timeline';
import { LOGBOOK_KINDS, type LogbookRecord } from '../../../../lib/core/logbook/logbook-record';

const fields = {
  hullDescription: 'Aluminium V hull',
  pumpDescription: 'Single-stage axial',
  impellerDescription: 'Three-blade',
  declaredNozzleMm: 101.5,
  declaredNozzleToleranceMm: 0.05,
  engineDescription: 'V8',
  declaredPowerKw: 220,
  powerEvidence: 'dyno_sheet',
  displacementL: null,
  declaredWeightKg: 540,
};
const engine = { kind: 'engine', maker: 'Kestrelworks', model: 'KV-8', serialNumber: 'E-1' };
const M1 = '00000000-0000-4000-8000-000000000001';
const M2 = '00000000-0000-4000-8000-000000000002';

function sampleRecord(): LogbookRecord {
  return {
    boat: { id: 'b1', name: 'Tarn Skipper', hullNumber: '7' },
    meetings: [
      {
        id: M1,
        name: 'Autumn Sprint',
        startsOn: '2026-03-14',
        endsOn: '2026-03-15',
        timeZone: 'Pacific/Auckland',
        entries: [],
      },
      { id: M2, name: 'Winter Cup', startsOn: '2026-07-04', endsOn: '2026-07-04', timeZone: 'UTC', entries: [] },
    ],
    declarations: [
      {
        id: 'd2',
        version: 2,
        createdAt: '2026-05-01T08:00:00.000Z',
        createdBy: 'Owner',
        fields: { ...fields, declaredPowerKw: 230 },
        components: [engine],
      },
      { id: 'd1', version: 1, createdAt: '2026-01-10T08:00:00.000Z', createdBy: 'Owner', fields, components: [] },
    ],
    components: [{ ...engine, id: 'c1', trimCode: 'T3', notes: '' }],
    componentEvents: [],
    sealEvents: [
      {
        id: 's1',
        sealNumber: 'LB-1',
        action: 'applied',
        createdAt: '2026-03-14T01:00:00.000Z',
        eventId: M1,
        componentId: 'c1',
        component: engine,
        position: 'head bolt',
        reason: '',
        recordedBy: 'Scrutineer',
        inspectionId: 'i1',
      },
      {
        id: 's2',
        sealNumber: 'LB-1',
        action: 'broken',
        createdAt: '2026-07-04T10:00:00.000Z',
        eventId: M2,
        componentId: 'c1',
        component: engine,
        position: 'head bolt',
        reason: '',
        recordedBy: 'Scrutineer',
        inspectionId: 'i2',
      },
    ],
    inspections: [
      {
        id: 'i2',
        eventId: M2,
        kind: 'pre_race',
        capturedAt: '2026-07-04T10:00:00.000Z',
        recordedBy: 'Scrutineer',
        ruleVersion: 3,
        declarationVersion: 2,
        overallResult: 'does_not_conform',
        results: {
          rules: [
            {
              rule: 'nozzle_max',
              label: 'Nozzle exit diameter',
              decisiveValue: 102.3149,
              unit: 'mm',
              limit: 102,
              acceptanceLimit: 101.95,
              rejectionLimit: 102.05,
              expandedUncertainty: 0.05,
              verdict: 'does_not_conform',
              explanation: 'above the limit',
              measured: true,
            },
          ],
          decisionRule: 'iso14253',
          ruleVersion: 3,
          scope: null,
        },
        supersedesId: null,
        correctionReason: null,
        isCurrent: true,
        notes: '',
      },
      {
        id: 'i1',
        eventId: M1,
        kind: 'pre_race',
        capturedAt: '2026-03-14T01:00:00.000Z',
        recordedBy: 'Scrutineer',
        ruleVersion: 1,
        declarationVersion: 1,
        overallResult: 'conforms',
        results: { not: 'the stored shape' },
        supersedesId: null,
        correctionReason: null,
        isCurrent: true,
        notes: '',
      },
    ],
    reinspections: [],
    custody: [],
    protests: [],
    notes: [
      {
        id: 'n1',
        eventId: M2,
        category: 'repair',
        notedOn: '2026-07-03',
        body: 'Intake grille replaced.',
        author: 'Chief',
        createdAt: '2026-07-04T09:00:00.000Z',
      },
    ],
  };
}

test('declaration versions say what changed and which components they name', () => {
  const items = buildLogbookItems(sampleRecord(), 'UTC');
  const v2 = items.find((i) => i.id === 'declaration:d2')!;
  assert.equal(v2.title, 'Declaration version 2 by Owner');
  assert.equal(v2.lines[0], 'Changed: power 220 → 230 kW');
  assert.match(v2.lines[3], /engine Kestrelworks KV-8 serial E-1/);
  assert.equal(items.find((i) => i.id === 'declaration:d1')!.lines[0], 'First declaration');
});

test('an inspection reads its rule lines through the stored shape; a record that does not read gets none, not a crash', () => {
  const items = buildLogbookItems(sampleRecord(), 'UTC');
  const i2 = items.find((i) => i.id === 'inspection:i2')!;
  assert.equal(i2.verdict, 'does_not_conform');
  // 102.3149 mm shown to 0.01 mm, the nozzle's step (lib/core/format/figures.ts).
  assert.ok(
    i2.lines.includes('Nozzle exit diameter: does not conform (102.31 mm against 102.00 mm)'),
    i2.lines.join('|'),
  );
  assert.ok(
    i2.lines.includes('Finding: seal LB-1 found BROKEN'),
    'the seal finding shows in the verdict it belongs to',
  );
  assert.equal(i2.finding, 'broken');
  const i1 = items.find((i) => i.id === 'inspection:i1')!;
  assert.equal(i1.verdict, 'conforms');
  assert.equal(i1.finding, null);
  assert.deepEqual(i1.lines, [
    'Recorded by Scrutineer; class rules version 1; declaration version 1',
    'The current record for this entry',
  ]);
});

test("times read in the meeting's zone; a note is dated by the day it happened", () => {
  const items = buildLogbookItems(sampleRecord(), 'UTC');
  // 01:00 UTC on 14 March 2026 is 14:00 at UTC+13 (New Zealand daylight time until 5 April 2026 [memory]).
  assert.equal(items.find((i) => i.id === 'seal:s1')!.when, 'Sat 14 Mar 2026, 14:00 UTC+13:00 (Pacific/Auckland)');
  const note = items.find((i) => i.id === 'note:n1')!;
  assert.equal(note.when, 'Fri 3 Jul 2026');
  assert.equal(note.title, 'Repair noted by Chief');
});

test('sorted newest or oldest first and grouped by meeting, with what belongs to no meeting between them', () => {
  const items = buildLogbookItems(sampleRecord(), 'UTC');
  const oldest = sortLogbookItems(items, 'oldest');
  assert.equal(oldest[0].id, 'declaration:d1');
  const newest = sortLogbookItems(items, 'newest');
  for (let i = 1; i < newest.length; i++) assert.ok(newest[i - 1].at >= newest[i].at, 'newest first');
  // Items of one instant (an inspection and the seal it found) keep one order either way.
  assert.deepEqual(
    newest.slice(0, 2).map((i) => i.id),
    ['inspection:i2', 'seal:s2'],
  );
  const groups = groupLogbookItems(oldest, sampleRecord().meetings);
  assert.deepEqual(
    groups.map((g) => g.label),
    [
      'Between meetings · 2026',
      'Autumn Sprint · Sat 14 Mar 2026 to Sun 15 Mar 2026',
      'Between meetings · 2026',
      'Winter Cup · Sat 4 Jul 2026',
    ],
  );
  assert.equal(groups.flatMap((g) => g.items).length, items.length, 'nothing lost by grouping');
});

test('the seals on each component now on the boat, each in its latest state; a removed seal is gone', () => {
  const record = sampleRecord();
  assert.deepEqual(listSealsOnComponents(record).get('c1'), [
    { sealNumber: 'LB-1', state: 'found BROKEN', at: '2026-07-04T10:00:00.000Z', position: 'head bolt' },
  ]);
  record.sealEvents.push({
    ...record.sealEvents[1],
    id: 's3',
    action: 'removed',
    createdAt: '2026-07-05T10:00:00.000Z',
  });
  assert.equal(listSealsOnComponents(record).get('c1'), undefined);
  record.components = [];
  record.sealEvents.pop();
  assert.equal(listSealsOnComponents(record).size, 0, 'only components on the boat now');
});

test('kind filters take only known kinds; none or only unknown ones mean everything', () => {
  const every = Object.keys(LOGBOOK_KINDS);
  assert.deepEqual(parseLogbookKinds('seal'), ['seal']);
  assert.deepEqual(parseLogbookKinds(['seal', 'note', 'seal']), ['seal', 'note']);
  assert.deepEqual(parseLogbookKinds(undefined), every);
  assert.deepEqual(parseLogbookKinds(['toString', '__proto__', 'constructor']), every);
});

test('the PDF: title, printed time, the timeline oldest first, and both signature lines on the last page', async () => {
  const record = sampleRecord();
  record.boat.name = 'Tāne’s Skipper 🚤'; // outside WinAnsi: replaced, never a crash
  const items = sortLogbookItems(buildLogbookItems(record, 'UTC'), 'oldest');
  const bytes = await buildLogbookPdf({
    record,
    items,
    printedAt: new Date('2026-07-05T09:30:00Z'),
    timeZone: 'UTC',
    printedBy: 'Chief',
  });
  const doc = await PDFDocument.load(bytes);
  assert.equal(doc.getTitle(), 'Boat logbook: Tāne’s Skipper 🚤 #7');
  const pages = await extractPdfText(bytes);
  assert.equal(pages.length, doc.getPageCount());
  const all = pages.join('');
  assert.match(all, /Printed Sun 5 Jul 2026, 09:30 UTC\+00:00 \(UTC\) by Chief/);
  assert.ok(all.indexOf('Declaration version 1') < all.indexOf('Declaration version 2'), 'oldest first');
  assert.match(all, /Seal LB-1 found BROKEN \[SEAL BROKEN\]/);
  assert.match(all, /Safety first\./);
  assert.match(pages[pages.length - 1], /Owner: signature and name/);
  assert.match(pages[pages.length - 1], /Official \(name and role\): signature and name/);
});

test('a long logbook turns the page rather than writing past its foot', async () => {
  const record = sampleRecord();
  record.notes = Array.from({ length: 120 }, (_, i) => ({
    id: `n${i}`,
    eventId: M2,
    category: 'observation',
    notedOn: '2026-07-03',
    body: `Observation ${i}: ${'wake checked and logged. '.repeat(6)}`,
    author: 'Chief',
    createdAt: '2026-07-04T09:00:00.000Z',
  }));
  const items = sortLogbookItems(buildLogbookItems(record, 'UTC'), 'oldest');
  const bytes = await buildLogbookPdf({ record, items, printedAt: new Date(), timeZone: 'UTC', printedBy: 'Chief' });
  const pages = await extractPdfText(bytes);
  assert.ok(pages.length > 3, `${pages.length} pages`);
  for (let i = 0; i < 120; i++) assert.ok(pages.join('').includes(`Observation ${i}:`), `note ${i} printed`);
});

test("an incident is an item of its own, at the meeting's time, saying whether damage forced a re-inspection", () => {
  const record: LogbookRecord = {
    ...sampleRecord(),
    incidents: [
      {
        id: 'i1',
        eventId: M1,
        occurredAt: '2026-03-14T02:30:00.000Z',
        description: 'Rolled at the hairpin',
        damage: true,
        reinspectionId: 'r9',
        supersedesId: null,
        correctionReason: null,
        isCurrent: true,
        recordedBy: 'Chief',
      },
    ],
  };
  const item = buildLogbookItems(record, 'UTC').find((i) => i.id === 'incident:i1')!;
  assert.equal(item.kind, 'incident');
  // 02:30 UTC on 14 March 2026 is 15:30 at UTC+13 (New Zealand daylight time until 5 April 2026 [memory]).
  assert.equal(item.when, 'Sat 14 Mar 2026, 15:30 UTC+13:00 (Pacific/Auckland)');
  assert.equal(item.title, 'Incident with damage: Rolled at the hairpin');
  assert.ok(item.lines.some((l) => /Re-inspection required before the next run/.test(l)));
  assert.equal(buildLogbookItems(sampleRecord(), 'UTC').filter((i) => i.kind === 'incident').length, 0);
});
