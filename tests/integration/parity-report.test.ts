// The class parity report through the real HTTP API and database: figures equal the engine's on
// the same numbers, class statistics equal simple-statistics (a general-purpose statistics package),
// published versions are frozen, the PDF and CSV carry the same figures, and only published
// reports are public.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { randomUUID, createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import * as ss from 'simple-statistics';
import { parse } from 'csv-parse/sync';
import { PDFDocument } from 'pdf-lib';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD, BASE_URL } from '../support/env';
import { query } from '../support/db';
import { checkpointCovering, checkpointSignatureHolds } from '../support/chain-checkpoint';
import { extractPdfText } from '../support/pdf-text';
import { computeParity } from '../../lib/core/engine/parity';
import { computeAreaEquivalentDiameterFromReadingsMm } from '../../lib/core/engine/measurement';
import { interpolateDensityIttc } from '../../lib/core/engine/water';

const organiser = new HttpSession();
let eventId: string;
let classId: string;
let ruleVersionId: string;
const boats: { entryId: string; boatId: string; powerKw: number; readings: number[] }[] = [];
const RULES = {
  nozzle: { maxMm: 102, minMm: null, minReadings: 3, defaultUncertaintyMm: 0.05 },
  power: { minKw: 150, maxKw: 300, defaultUncertaintyKw: 6 },
  weight: { minKg: null, includesDriver: true, defaultUncertaintyKg: 1 },
  decisionRule: 'iso14253',
  safetyItems: [],
  parity: {
    pumpEfficiency: 0.9,
    nozzleLossCoefficient: 0.02,
    inletLossCoefficient: 0.2,
    wakeFraction: 0,
    referenceSpeedsMs: [10, 20, 30],
  },
};

async function addInspection(entryId: string, boatId: string, readings: number[], result = 'conforms', U = 0.05) {
  const organiserId = (await query<{ id: string }>('select id from users where email = $1', [DEMO.organiser]))[0].id;
  await query(
    `insert into inspections (event_id, entry_id, boat_id, class_id, rule_version_id, recorded_by_id, idempotency_key, captured_at, measurements, results, overall_result)
     values ($1, $2, $3, $4, $5, $6, $7, now(), $8, $9, $10)`,
    [
      eventId,
      entryId,
      boatId,
      classId,
      ruleVersionId,
      organiserId,
      randomUUID(),
      JSON.stringify({
        nozzle: { readings: readings.map((d, i) => ({ diameterMm: d, angleDeg: i * 60 })) },
        power: { evidenceSeen: true },
      }),
      JSON.stringify([{ rule: 'nozzle_max', expandedUncertainty: U, verdict: result }]),
      result,
    ],
  );
}

before(async () => {
  await organiser.signInWithPassword(DEMO.organiser, DEMO_PASSWORD);
  const ev = await organiser.json('/api/events', {
    organisationId: '0b0e0000-0000-4000-8000-000000000001',
    name: 'Parity Test Sprint',
    venue: 'Test Water',
    startsOn: '2027-05-01',
    endsOn: '2027-05-01',
    timeZone: 'UTC',
    status: 'racing',
    waterKind: 'fresh',
    waterTemperatureC: 20,
    waterDensityKgM3: null,
    protestWindowMinutes: 30,
    currency: 'NZD',
    entryFeeMinor: 0,
    protestFeeMinor: 0,
  });
  eventId = ev.body.data.id;
  classId = (await organiser.json(`/api/events/${eventId}/classes`, { name: 'Parity Test', code: 'PT' })).body.data.id;
  await organiser.json(`/api/events/${eventId}/classes/${classId}/rules`, { powerUnit: 'kW', rules: RULES }, 'PUT');
  ruleVersionId = (
    await organiser.json(`/api/events/${eventId}/classes/${classId}/rules/publish`, { changeNote: 'test' })
  ).body.data.id;
  const entrantId = (await query<{ id: string }>('select id from users where email = $1', [DEMO.entrant]))[0].id;
  const specs = [
    { powerKw: 240, readings: [101.2, 101.35, 101.28] },
    { powerKw: 255, readings: [99.8, 99.9, 99.85] },
    { powerKw: 230, readings: [101.9, 101.85, 101.95] },
    { powerKw: 262, readings: [98.7, 98.75, 98.72] },
    { powerKw: 248, readings: [100.4, 100.5, 100.45] },
  ];
  for (const [i, s] of specs.entries()) {
    const [{ id: boatId }] = await query<{ id: string }>(
      `insert into boats (owner_id, name, declared_nozzle_mm, declared_power_kw) values ($1, $2, 101, $3) returning id`,
      [entrantId, `Parity Boat ${i + 1}`, s.powerKw],
    );
    const [{ id: entryId }] = await query<{ id: string }>(
      `insert into entries (event_id, class_id, boat_id, entrant_id, race_number, status, fee_minor, currency) values ($1, $2, $3, $4, $5, 'entered', 0, 'NZD') returning id`,
      [eventId, classId, boatId, entrantId, 100 + i],
    );
    boats.push({ entryId, boatId, ...s });
    await addInspection(entryId, boatId, s.readings);
  }
  // Two boats that must be listed, not silently left out: one failed, one never inspected.
  for (const [i, name] of ['Failed Boat', 'Uninspected Boat'].entries()) {
    const [{ id: boatId }] = await query<{ id: string }>(
      `insert into boats (owner_id, name, declared_nozzle_mm, declared_power_kw) values ($1, $2, 103, 250) returning id`,
      [entrantId, name],
    );
    const [{ id: entryId }] = await query<{ id: string }>(
      `insert into entries (event_id, class_id, boat_id, entrant_id, race_number, status, fee_minor, currency) values ($1, $2, $3, $4, $5, 'entered', 0, 'NZD') returning id`,
      [eventId, classId, boatId, entrantId, 200 + i],
    );
    if (i === 0) await addInspection(entryId, boatId, [102.2, 102.3, 102.25], 'does_not_conform');
  }
});

test('draft figures equal the engine on the same numbers; class statistics equal simple-statistics', async () => {
  const res = await organiser.fetch(`/api/events/${eventId}/classes/${classId}/report`);
  assert.equal(res.status, 200);
  const { draft } = (await res.json()).data;
  assert.equal(draft.inputs.boats.length, 5);
  assert.deepEqual(draft.inputs.excluded.map((e: { reason: string }) => e.reason).sort(), [
    'Latest inspection does not conform',
    'Not inspected yet',
  ]);
  // ITTC Recommended Procedure 7.5-02-01-03: fresh water at 20 °C is 998.2071 kg/m³.
  assert.equal(draft.inputs.density.densityKgM3, 998.2071);

  const expected = computeParity(
    boats.map((b) => ({
      id: b.entryId,
      label: '',
      powerKw: b.powerKw,
      nozzleDiameterMm: computeAreaEquivalentDiameterFromReadingsMm(b.readings),
      // Evidence seen without its kind counts as a maker's rating: U = 8 % of the power (k = 2), above
      // the class's 6 kW here; standard u = U/2 (common practice, no source: Boreline's default).
      uPowerKw: (0.08 * b.powerKw) / 2,
      uNozzleDiameterMm: 0.025,
    })),
    {
      densityKgM3: interpolateDensityIttc('fresh', 20),
      pumpEfficiency: 0.9,
      nozzleLossCoefficient: 0.02,
      inletLossCoefficient: 0.2,
      wakeFraction: 0,
      referenceSpeedsMs: [10, 20, 30],
    },
  );
  for (const e of expected.boats) {
    const got = draft.results.parity.boats.find((b: { id: string }) => b.id === e.id);
    assert.ok(Math.abs(got.staticThrustN - e.staticThrustN) < 1e-6);
    assert.ok(Math.abs(got.uStaticThrustN - e.uStaticThrustN) < 1e-6);
    assert.ok(Math.abs(got.equalisingNozzleDiameterMm - e.equalisingNozzleDiameterMm) < 1e-9);
    assert.deepEqual(
      got.thrustAtReferenceSpeeds.map((t: { thrustN: number }) => +t.thrustN.toFixed(6)),
      e.thrustAtReferenceSpeeds.map((t) => +t.thrustN.toFixed(6)),
    );
  }
  for (const b of draft.inputs.boats) assert.equal(b.powerEvidence, 'maker_rating');
  // The Monte Carlo's pair chances agree in direction with the nominal figures when the gap is wide.
  const odds = draft.results.odds;
  assert.equal(odds.pairs.length, (5 * 4) / 2);
  for (const pair of odds.pairs) {
    const [a, b] = [pair.aId, pair.bId].map((id: string) => expected.boats.find((x) => x.id === id)!);
    const chance = pair.probabilityAAhead[0].probability;
    assert.ok(chance >= 0 && chance <= 1);
    const gap = (a.staticThrustN - b.staticThrustN) / Math.hypot(a.uStaticThrustN, b.uStaticThrustN);
    if (gap > 3) assert.ok(chance > 0.99, `${gap} standard uncertainties apart: ${chance}`);
    if (gap < -3) assert.ok(chance < 0.01, `${gap} standard uncertainties apart: ${chance}`);
  }
  assert.ok(draft.results.parity.boats.every((b: { rangeEqualising: unknown }) => b.rangeEqualising));
  const t0 = expected.boats.map((b) => b.staticThrustN);
  const s = draft.results.parity.summary;
  assert.ok(Math.abs(s.medianStaticThrustN - ss.median(t0)) < 1e-6);
  assert.ok(Math.abs(s.minStaticThrustN - ss.min(t0)) < 1e-9);
  assert.ok(Math.abs(s.maxStaticThrustN - ss.max(t0)) < 1e-9);
  assert.ok(Math.abs(s.coefficientOfVariationPercent - (ss.sampleStandardDeviation(t0) / ss.mean(t0)) * 100) < 1e-9);
  assert.ok(Math.abs(s.spreadPercent - ((ss.max(t0) - ss.min(t0)) / ss.median(t0)) * 100) < 1e-9);
  assert.ok(Math.abs(s.maxMinRatio - ss.max(t0) / ss.min(t0)) < 1e-12);
});

test('a published version never changes after later inspections; a new version shows the change', async () => {
  const pub1 = await organiser.json(`/api/events/${eventId}/classes/${classId}/report/publish`, { note: 'first look' });
  assert.equal(pub1.res.status, 201, JSON.stringify(pub1.body));
  const v1 = await (await fetch(`${BASE_URL}/api/reports/${pub1.body.data.publicId}`)).json();
  await addInspection(boats[0].entryId, boats[0].boatId, [100.1, 100.2, 100.15]);
  const v1Again = await (await fetch(`${BASE_URL}/api/reports/${pub1.body.data.publicId}`)).json();
  assert.deepEqual(v1Again.data.results, v1.data.results);
  await assert.rejects(
    query(`update parity_reports set note = 'x' where public_id = $1`, [pub1.body.data.publicId]),
    /append-only/,
  );

  const pub2 = await organiser.json(`/api/events/${eventId}/classes/${classId}/report/publish`, {
    note: 'after re-inspection',
  });
  assert.equal(pub2.body.data.number, 2);
  const v2 = await (await fetch(`${BASE_URL}/api/reports/${pub2.body.data.publicId}`)).json();
  const before = v1.data.results.parity.boats.find((b: { id: string }) => b.id === boats[0].entryId);
  const after = v2.data.results.parity.boats.find((b: { id: string }) => b.id === boats[0].entryId);
  assert.ok(after.nozzleDiameterMm < before.nozzleDiameterMm);
  const page = await (await fetch(`${BASE_URL}/reports/${pub2.body.data.publicId}`)).text();
  assert.match(page, /Since version (<!-- -->)?1</);
  assert.match(page, /static thrust \d+ → \d+ N/);
});

test('the PDF opens with pdf-lib and carries the class, the rule version and one row per boat; the CSV parses to the page figures', async () => {
  // Its own published version (not one left by an earlier test), read back from the class's list of versions.
  const pub = await organiser.json(`/api/events/${eventId}/classes/${classId}/report/publish`, { note: 'PDF and CSV' });
  assert.equal(pub.res.status, 201, JSON.stringify(pub.body));
  const versions = (await (await organiser.fetch(`/api/events/${eventId}/classes/${classId}/report`)).json()).data
    .versions;
  const latest = versions[0];
  assert.equal(latest.publicId, pub.body.data.publicId, 'the newest version is the one just published');
  const pdfRes = await fetch(`${BASE_URL}/api/reports/${latest.publicId}/pdf`);
  assert.equal(pdfRes.headers.get('content-type'), 'application/pdf');
  const bytes = new Uint8Array(await pdfRes.arrayBuffer());
  const doc = await PDFDocument.load(bytes);
  assert.ok(doc.getPageCount() >= 1);
  const textAll = (await extractPdfText(bytes)).join('\n');
  assert.match(textAll, /Parity Test \(PT\)/);
  assert.match(textAll, /class rules version 1/);
  for (let i = 0; i < 5; i++)
    assert.match(textAll, new RegExp(`\\n${100 + i}\\nParity Boat ${i + 1}\\n`), `row for boat ${i + 1}`);
  assert.match(textAll, /Failed Boat: Latest inspection does not conform/);
  assert.match(textAll, /licensed officials/);

  const report = (await (await fetch(`${BASE_URL}/api/reports/${latest.publicId}`)).json()).data;
  const csv = await (await fetch(`${BASE_URL}/api/reports/${latest.publicId}/csv`)).text();
  const rows = parse(csv, { columns: true }) as Record<string, string>[];
  assert.equal(rows.length, 5);
  for (const row of rows) {
    const input = report.inputs.boats.find((b: { raceNumber: number }) => b.raceNumber === Number(row.race_number));
    const figures = report.results.parity.boats.find((b: { id: string }) => b.id === input.entryId);
    assert.equal(Number(row.static_thrust_n), figures.staticThrustN);
    assert.equal(Number(row.deviation_from_median_percent), figures.deviationFromMedianPercent);
    assert.equal(Number(row.thrust_at_20_ms_n), figures.thrustAtReferenceSpeeds[1].thrustN);
  }
});

// Where the storage fake keeps an object: <bucket>/<sha256 of the key> (scripts/fakes/storage.ts).
const storedObject = (key: string) =>
  path.join(
    process.env.FAKES_DIR ?? '.data/test-fakes',
    'storage',
    process.env.S3_BUCKET ?? 'boreline-test',
    createHash('sha256').update(key).digest('hex'),
  );
const sha256 = (b: Uint8Array) => createHash('sha256').update(b).digest('hex');

test("a version's PDF is rendered once, stored with its SHA-256, served from storage with a strong ETag and a year-long immutable lifetime, and 304 to If-None-Match", async () => {
  const pub = await organiser.json(`/api/events/${eventId}/classes/${classId}/report/publish`, { note: 'PDF caching' });
  assert.equal(pub.res.status, 201, JSON.stringify(pub.body));
  const url = `${BASE_URL}/api/reports/${pub.body.data.publicId}/pdf`;
  // Five first requests at once: one rendering is stored (the unique index on report and kind), and all five get it.
  const first = await Promise.all(
    Array.from({ length: 5 }, async () => {
      const res = await fetch(url);
      return { res, bytes: new Uint8Array(await res.arrayBuffer()) };
    }),
  );
  const rows = await query<{ object_key: string; sha256: string; size_bytes: number }>(
    `select object_key, sha256, size_bytes from parity_report_files where report_id = $1 and kind = 'pdf'`,
    [pub.body.data.id],
  );
  assert.equal(rows.length, 1, 'one stored PDF per version');
  const [row] = rows;
  for (const { res, bytes } of first) {
    assert.equal(res.status, 200);
    assert.equal(res.headers.get('content-type'), 'application/pdf');
    // RFC 9110 section 8.8.3: a strong entity tag is a quoted opaque string without W/.
    assert.equal(res.headers.get('etag'), `"${row.sha256}"`);
    // RFC 9111 section 5.2.2.1 (max-age) and RFC 8246 (immutable).
    assert.equal(res.headers.get('cache-control'), 'public, max-age=31536000, immutable');
    assert.equal(sha256(bytes), row.sha256, 'the bytes are the stored ones (node:crypto SHA-256)');
    assert.equal(bytes.byteLength, row.size_bytes);
  }
  // The object is in storage, byte for byte.
  assert.equal(sha256(fs.readFileSync(storedObject(row.object_key))), row.sha256);
  assert.match(row.object_key, /^reports\/pdf\/\d{4}\/\d{2}\/[0-9a-f-]{36}$/);
  await assert.rejects(
    query(`update parity_report_files set sha256 = repeat('0', 64) where report_id = $1`, [pub.body.data.id]),
    /append-only/,
  );

  // Later requests are not rendered again: pdf-lib stamps each rendering with its creation time to the
  // second, so after a pause a new rendering would differ; the stored one is served unchanged.
  await new Promise((r) => setTimeout(r, 1100));
  const again = await fetch(url);
  assert.equal(sha256(new Uint8Array(await again.arrayBuffer())), row.sha256);
  assert.equal((await query(`select 1 from parity_report_files where report_id = $1`, [pub.body.data.id])).length, 1);

  // RFC 9110 section 13.1.2: If-None-Match compares weakly, "*" matches any, and a hit is 304 with no body.
  for (const inm of [`"${row.sha256}"`, `W/"${row.sha256}"`, `"nope", "${row.sha256}"`, '*']) {
    const res = await fetch(url, { headers: { 'if-none-match': inm } });
    assert.equal(res.status, 304, inm);
    assert.equal(res.headers.get('etag'), `"${row.sha256}"`);
    assert.equal((await res.arrayBuffer()).byteLength, 0);
  }
  assert.equal((await fetch(url, { headers: { 'if-none-match': '"0000"' } })).status, 200);

  // The CSV is cheap and made per request, but carries a strong ETag of its bytes and answers 304 too.
  const csvUrl = `${BASE_URL}/api/reports/${pub.body.data.publicId}/csv`;
  const csv = await fetch(csvUrl);
  const csvText = await csv.text();
  assert.equal(csv.headers.get('etag'), `"${sha256(new TextEncoder().encode(csvText))}"`);
  assert.equal((await fetch(csvUrl, { headers: { 'if-none-match': csv.headers.get('etag')! } })).status, 304);
});

test('only published reports are public: drafts need the organiser, unknown ids are 404', async () => {
  assert.equal((await fetch(`${BASE_URL}/api/events/${eventId}/classes/${classId}/report`)).status, 401);
  const entrant = new HttpSession();
  await entrant.signInWithPassword(DEMO.entrant, DEMO_PASSWORD);
  assert.equal((await entrant.fetch(`/api/events/${eventId}/classes/${classId}/report`)).status, 403);
  assert.equal((await entrant.json(`/api/events/${eventId}/classes/${classId}/report/publish`, {})).res.status, 403);
  assert.equal((await fetch(`${BASE_URL}/api/reports/notarealreportid123`)).status, 404);
  assert.equal((await fetch(`${BASE_URL}/reports/notarealreportid123`)).status, 404);
});

test("a published report's page and PDF print the checkpoint signed at its publication, which the meeting's key verifies (RFC 8032)", async () => {
  const pub = await organiser.json(`/api/events/${eventId}/classes/${classId}/report/publish`, { note: 'checkpoint' });
  assert.equal(pub.res.status, 201, JSON.stringify(pub.body));
  const [report] = await query<{ id: string }>('select id from parity_reports where public_id = $1', [
    pub.body.data.publicId,
  ]);
  const [link] = await query<{ seq: string }>(
    `select seq from chain_links where chain_key = $1 and table_name = 'parity_reports' and row_id = $2`,
    [eventId, report.id],
  );
  assert.ok(link, 'the report is chained by the time its publication answers');
  const cp = await checkpointCovering(eventId, 'parity_reports', report.id);
  assert.ok(cp, 'a checkpoint covers the report');
  assert.match(cp.reason, /parity report PT version \d+ published/);
  const [head] = await query<{ link_hash: string }>(
    'select link_hash from chain_links where chain_key = $1 and seq = $2',
    [eventId, cp.count],
  );
  assert.equal(cp.head, head.link_hash, 'the checkpoint signs the chain head');
  // The signature is Ed25519 (RFC 8032) over the RFC 8785 canonical JSON of the checkpoint's fields.
  assert.ok(checkpointSignatureHolds(eventId, cp));
  assert.equal(
    createHash('sha256').update(cp.spki).digest('hex'),
    cp.key_fingerprint,
    'fingerprint = SHA-256 of the SPKI',
  );

  const page = await (await fetch(`${BASE_URL}/reports/${pub.body.data.publicId}`)).text();
  for (const printed of [cp.head, cp.key_fingerprint, cp.signature])
    assert.ok(page.includes(printed), `page prints ${printed}`);
  const pdfText = (
    await extractPdfText(
      new Uint8Array(await (await fetch(`${BASE_URL}/api/reports/${pub.body.data.publicId}/pdf`)).arrayBuffer()),
    )
  ).join('\n');
  for (const printed of [cp.head, cp.key_fingerprint, cp.signature])
    assert.ok(pdfText.includes(printed), `PDF prints ${printed}`);
  assert.match(pdfText, new RegExp(`held ${cp.count} records`));
});
