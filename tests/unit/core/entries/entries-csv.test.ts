// CSV export quoting per RFC 4180 and formula-injection neutralising per the OWASP
// "CSV Injection" guidance; parsed back with csv-parse, a general-purpose CSV parser.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { parse } from 'csv-parse/sync';
import { entriesToCsv, csvCell } from '../../../../lib/core/entries/entries-csv';
import type { EventEntryRow } from '../../../../lib/server/entries/list-event-entries';

const row = (over: Partial<EventEntryRow>): EventEntryRow => ({
  id: 'x',
  raceNumber: 7,
  boatId: 'b',
  boatName: 'Plain',
  hullNumber: 'H1',
  classId: 'c',
  classCode: 'SS',
  className: 'Sprint',
  entrantName: 'A Person',
  entrantEmail: 'a@example.org',
  status: 'entered',
  inspectionResult: null,
  declaredNozzleMm: 101.5,
  declaredPowerKw: 240,
  feeMinor: 15000,
  currency: 'NZD',
  paidAt: null,
  createdAt: '2026-11-01T00:00:00.000Z',
  ...over,
});

test('quotes commas, quotes and line breaks so a CSV parser reads the same values back', () => {
  const csv = entriesToCsv([row({ boatName: 'Comma, "Quote"\nNewline' }), row({ raceNumber: 8 })]);
  const records = parse(csv, { columns: true }) as Record<string, string>[];
  assert.equal(records.length, 2);
  assert.equal(records[0].boat, 'Comma, "Quote"\nNewline');
  assert.equal(records[1].race_number, '8');
  assert.equal(records[0].declared_nozzle_mm, '101.5');
});

test('cells that a spreadsheet would run as a formula are neutralised', () => {
  assert.equal(csvCell('=HYPERLINK("x")'), `"'=HYPERLINK(""x"")"`);
  assert.equal(csvCell('+1'), "'+1");
  assert.equal(csvCell('@SUM(A1)'), "'@SUM(A1)");
  assert.equal(csvCell(-5), '-5', 'numbers are not strings and stay as they are');
});

test('declared figures leave rounded as on the screens, still as numbers (power to 0.1 kW, nozzle to 0.01 mm)', () => {
  // 530 hp × 745.69987158227022 W/hp (NIST SP 811 Appendix B.8) = 395.22093193860326 kW, stored at full precision.
  const csv = entriesToCsv([row({ declaredPowerKw: (530 * 745.69987158227022) / 1000, declaredNozzleMm: 101.4987 })]);
  const [record] = parse(csv, { columns: true }) as Record<string, string>[];
  assert.equal(record.declared_power_kw, '395.2');
  assert.equal(record.declared_nozzle_mm, '101.5');
});
