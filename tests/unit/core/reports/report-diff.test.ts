// What changed between two published versions of a class report (lib/core/reports/report-diff.ts).
// The versions are built with computeReportResults from invented boats (not reference values);
// the expected changes are read off the inputs: which boats were added, removed or re-measured.
// Static thrust at equal power grows with the nozzle (T0 ∝ D^(2/3), momentum theory: Allison,
// "Marine Waterjet Propulsion", SNAME Transactions 101, 1993).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { diffReports } from '../../../../lib/core/reports/report-diff';
import {
  computeReportResults,
  type ReportBoatInput,
  type ReportInputs,
} from '../../../../lib/core/reports/parity-figures';

const boat = (entryId: string, raceNumber: number, powerKw: number, nozzleDiameterMm: number): ReportBoatInput => ({
  entryId,
  raceNumber,
  boatName: `Boat ${raceNumber}`,
  powerKw,
  uPowerKw: 0,
  powerSource: 'declared',
  nozzleDiameterMm,
  uNozzleDiameterMm: 0,
  inspectionId: null,
  inspectedAt: null,
});
const inputsWith = (boats: ReportBoatInput[], ruleVersion = 1): ReportInputs => ({
  eventName: 'Test meeting',
  classCode: 'TC',
  className: 'Test class',
  ruleVersion: { id: `rv-${ruleVersion}`, version: ruleVersion },
  // Fresh water at 15 °C, 999.1026 kg/m³ (ITTC Recommended Procedure 7.5-02-01-03).
  assumptions: {
    pumpEfficiency: 0.9,
    nozzleLossCoefficient: 0.02,
    inletLossCoefficient: 0.2,
    wakeFraction: 0,
    referenceSpeedsMs: [10, 20, 30],
  },
  density: { densityKgM3: 999.1026, description: 'fresh water, 15 °C' },
  boats,
  excluded: [],
  computedAt: '2026-01-01T00:00:00.000Z',
});
const version = (boats: ReportBoatInput[], ruleVersion = 1) => {
  const inputs = inputsWith(boats, ruleVersion);
  return { inputs, results: computeReportResults(inputs) };
};

const A = boat('a', 101, 300, 100);
const B = boat('b', 102, 310, 96);
const C = boat('c', 103, 285, 104);
const D = boat('d', 104, 295, 99);

test('the same version twice: nothing changed, the same spread, the same rules', () => {
  const v = version([A, B, C]);
  const d = diffReports(v, version([A, B, C]));
  assert.deepEqual(d.boats, []);
  assert.equal(d.spreadBeforePercent, d.spreadAfterPercent);
  assert.equal(typeof d.spreadBeforePercent, 'number');
  assert.equal(d.ruleVersionChanged, false);
});

test('added, removed and re-measured boats are listed with before and after; unchanged boats are left out', () => {
  const before = version([A, B, C]);
  const after = version([{ ...A, nozzleDiameterMm: 99.5 }, B, D]);
  const d = diffReports(before, after);
  const byId = Object.fromEntries(d.boats.map((x) => [x.entryId, x]));
  assert.deepEqual(Object.keys(byId).sort(), ['a', 'c', 'd'], 'b is the same in both and is not listed');

  assert.equal(byId.a.change, 'changed');
  assert.equal(byId.a.nozzleBeforeMm, 100);
  assert.equal(byId.a.nozzleAfterMm, 99.5);
  assert.ok(
    byId.a.staticThrustAfterN! < byId.a.staticThrustBeforeN!,
    'a smaller nozzle at the same power: less static thrust',
  );
  const aBefore = before.results.parity!.boats.find((x) => x.id === 'a')!;
  const aAfter = after.results.parity!.boats.find((x) => x.id === 'a')!;
  assert.equal(byId.a.staticThrustBeforeN, aBefore.staticThrustN);
  assert.equal(byId.a.staticThrustAfterN, aAfter.staticThrustN);

  assert.equal(byId.c.change, 'removed');
  assert.equal(byId.c.nozzleBeforeMm, 104);
  assert.equal(byId.c.nozzleAfterMm, null);
  assert.equal(byId.c.staticThrustAfterN, null);
  assert.equal(byId.c.label, '#103 Boat 103', 'a removed boat keeps its label from the earlier version');

  assert.equal(byId.d.change, 'added');
  assert.equal(byId.d.nozzleBeforeMm, null);
  assert.equal(byId.d.staticThrustBeforeN, null);
  assert.equal(byId.d.nozzleAfterMm, 99);

  assert.equal(d.spreadBeforePercent, before.results.parity!.summary.spreadPercent);
  assert.equal(d.spreadAfterPercent, after.results.parity!.summary.spreadPercent);
});

test('a new power alone counts as a change (its static thrust moves)', () => {
  const d = diffReports(version([A, B, C]), version([A, { ...B, powerKw: 300 }, C]));
  assert.deepEqual(
    d.boats.map((x) => [x.entryId, x.change]),
    [['b', 'changed']],
  );
  assert.equal(d.boats[0].nozzleBeforeMm, d.boats[0].nozzleAfterMm);
  assert.ok(d.boats[0].staticThrustAfterN! < d.boats[0].staticThrustBeforeN!, 'less power, less thrust (T0 ∝ P^(2/3))');
});

test('a label follows the later version', () => {
  const d = diffReports(version([A, B]), version([{ ...A, boatName: 'Renamed', nozzleDiameterMm: 101 }, B]));
  assert.equal(d.boats[0].label, '#101 Renamed');
});

test('a new rule version is reported; an empty version has no spread and lists every boat as added or removed', () => {
  assert.equal(diffReports(version([A, B]), version([A, B], 2)).ruleVersionChanged, true);
  const fromEmpty = diffReports(version([]), version([A, B], 2));
  assert.equal(fromEmpty.spreadBeforePercent, null);
  assert.deepEqual(
    fromEmpty.boats.map((x) => x.change),
    ['added', 'added'],
  );
  const toEmpty = diffReports(version([A, B]), version([]));
  assert.equal(toEmpty.spreadAfterPercent, null);
  assert.deepEqual(
    toEmpty.boats.map((x) => x.change),
    ['removed', 'removed'],
  );
});
