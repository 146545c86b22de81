// Instruments with calibration through the HTTP API and the database: the chief scrutineer adds a
// certificate with its file and records the day's check against a reference; an instrument past its
// certificate's due date, or out of use after a failed check on this meeting day, is refused at
// recording with an error naming it and why; a valid certificate's stated U is the U the verdict
// applies; certificates and checks are append-only. That an overdue or failed instrument is not used
// is common practice, no source. SHA-256 of the stored file: FIPS 180-4 (node:crypto computes it here).
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { createHash } from 'node:crypto';
import { HttpSession } from '../support/http-session';
import { DEMO, DEMO_PASSWORD } from '../support/env';
import { query } from '../support/db';
import { InspectionMeeting, inspectionBody, rulesWith, type TestEntry } from '../support/inspection-meeting';

let meeting: InspectionMeeting;
let entry: TestEntry;
const chief = new HttpSession();
const scrutineer = new HttpSession();

// The meeting's time zone is Pacific/Auckland (tests/support/inspection-meeting.ts): its calendar day now.
const ZONE = 'Pacific/Auckland';
const dayInZone = (offsetDays = 0) =>
  new Intl.DateTimeFormat('en-CA', { timeZone: ZONE }).format(new Date(Date.now() + offsetDays * 86_400_000));

const PDF = new TextEncoder().encode('%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << >>\n%%EOF\n');

before(async () => {
  meeting = await new InspectionMeeting().create(`Calibration ${Date.now()}`, [
    { email: DEMO.chief, role: 'chief_scrutineer' },
    { email: DEMO.scrutineer, role: 'scrutineer' },
  ]);
  const classId = await meeting.addClass('CA', rulesWith());
  entry = await meeting.addEntry(classId);
  await chief.signInWithPassword(DEMO.chief, DEMO_PASSWORD);
  await scrutineer.signInWithPassword(DEMO.scrutineer, DEMO_PASSWORD);
});

async function addCaliper(name: string): Promise<string> {
  const added = await chief.json(`/api/events/${meeting.eventId}/instruments`, {
    name: `${name} ${Date.now()}`,
    quantity: 'length',
    errorLimit: 0.02,
    resolution: 0.01,
    instrumentType: 'caliper',
    serial: `SN-${Date.now()}`,
    rangeMin: 0,
    rangeMax: 300,
    material: 'steel',
  });
  assert.equal(added.res.status, 201, JSON.stringify(added.body));
  assert.equal(added.body.data.calibration.status, 'no_certificate');
  assert.equal(added.body.data.calibration.reason, 'no certificate on file');
  return added.body.data.id as string;
}

async function addCertificate(
  session: HttpSession,
  instrumentId: string,
  fields: Record<string, string>,
  file: { bytes: Uint8Array; name: string; type: string } | null = {
    bytes: PDF,
    name: 'cert.pdf',
    type: 'application/pdf',
  },
) {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  if (file) form.set('file', new Blob([file.bytes as BlobPart], { type: file.type }), file.name);
  const res = await session.fetch(`/api/events/${meeting.eventId}/instruments/${instrumentId}/certificates`, {
    method: 'POST',
    body: form,
  });
  return { res, body: await res.json().catch(() => null) };
}

async function listed(instrumentId: string) {
  const res = await scrutineer.fetch(`/api/events/${meeting.eventId}/instruments`);
  assert.equal(res.status, 200);
  return (
    (await res.json()).data as {
      id: string;
      calibration: { status: string; usable: boolean; reason: string };
      appliedExpandedUncertainty: number;
    }[]
  ).find((i) => i.id === instrumentId)!;
}

function recordWith(instrumentId: string) {
  const base = inspectionBody(entry.id, 101.9);
  return scrutineer.json(`/api/events/${meeting.eventId}/inspections`, {
    ...base,
    nozzle: { ...base.nozzle, expandedUncertaintyMm: null, instrumentId },
  });
}

test('a valid certificate is stored with its file’s SHA-256 and its stated U is the U the verdict applies', async () => {
  const id = await addCaliper('Certified caliper');
  const added = await addCertificate(chief, id, {
    number: 'TW-CAL-0042',
    laboratory: 'Kelda Reach Test House',
    calibratedOn: dayInZone(-30),
    dueOn: dayInZone(335),
    expandedUncertainty: '0.012',
    coverageFactor: '2',
  });
  assert.equal(added.res.status, 201, JSON.stringify(added.body));
  assert.equal(added.body.data.sha256, createHash('sha256').update(PDF).digest('hex'));
  assert.equal(added.body.data.contentType, 'application/pdf');
  const [row] = await query<{ object_key: string; sha256: string }>(
    'select object_key, sha256 from calibration_certificates where id = $1',
    [added.body.data.id],
  );
  assert.ok(row.object_key, 'the file went to object storage under an app-made key');
  const fileUrl = `/api/events/${meeting.eventId}/instruments/${id}/certificates/${added.body.data.id}/file`;
  const download = await scrutineer.fetch(fileUrl);
  assert.equal(download.status, 200);
  assert.equal(download.headers.get('x-content-type-options'), 'nosniff');
  assert.match(
    download.headers.get('content-disposition') ?? '',
    /^attachment; filename="certificate-TW-CAL-0042\.pdf"$/,
  );
  assert.equal(
    createHash('sha256')
      .update(new Uint8Array(await download.arrayBuffer()))
      .digest('hex'),
    row.sha256,
  );
  assert.equal((await new HttpSession().fetch(fileUrl)).status, 401);

  const view = await listed(id);
  assert.equal(view.calibration.status, 'valid');
  assert.equal(view.calibration.usable, true);
  assert.match(view.calibration.reason, /^valid until .* \(certificate TW-CAL-0042\)$/);
  assert.equal(view.appliedExpandedUncertainty, 0.012);

  const rec = await recordWith(id);
  assert.equal(rec.res.status, 201, JSON.stringify(rec.body));
  const nozzle = rec.body.data.rules.find((r: { rule: string }) => r.rule === 'nozzle_max');
  // The certificate's U (0.012 mm, k = 2), not the a/δ budget's 0.0238 mm (JCGM 100:2008 4.3.7, F.2.2.1).
  assert.equal(nozzle.expandedUncertainty, 0.012);
  const [stored] = await query<{ basis: string }>(
    `select measurements->'nozzle'->>'uncertaintyBasis' as basis from inspections where id = $1`,
    [rec.body.data.id],
  );
  assert.match(stored.basis, /certificate TW-CAL-0042, Kelda Reach Test House, stated U 0\.012 with k = 2/);
});

test('only the chief scrutineer adds a certificate; bad fields and a file that is not a document are refused by field', async () => {
  const id = await addCaliper('Refusals caliper');
  const fields = { number: 'X-1', laboratory: 'Lab', calibratedOn: dayInZone(-10), dueOn: dayInZone(100) };
  const byScrutineer = await addCertificate(scrutineer, id, fields);
  assert.equal(byScrutineer.res.status, 403);
  const backwards = await addCertificate(chief, id, { ...fields, dueOn: dayInZone(-20) });
  assert.equal(backwards.res.status, 400, JSON.stringify(backwards.body));
  assert.ok(backwards.body.error.details.some((d: { field: string }) => d.field === 'dueOn'));
  const noFile = await addCertificate(chief, id, fields, null);
  assert.equal(noFile.res.status, 400);
  assert.ok(noFile.body.error.details.some((d: { field: string }) => d.field === 'file'));
  const script = await addCertificate(chief, id, fields, {
    bytes: new TextEncoder().encode('<script>alert(1)</script>'),
    name: 'cert.pdf',
    type: 'application/pdf',
  });
  assert.equal(script.res.status, 415, JSON.stringify(script.body));
  assert.ok(script.body.error.details.some((d: { field: string }) => d.field === 'file'));
  const [{ n }] = await query<{ n: string }>(
    'select count(*) as n from calibration_certificates where instrument_id = $1',
    [id],
  );
  assert.equal(Number(n), 0, 'nothing was stored');
  const [other] = await query<{ id: string }>(
    'select id from instruments where event_id = $1 and retired_at is null limit 1',
    [DEMO.meetingId],
  );
  const cross = await addCertificate(chief, other.id, fields);
  assert.equal(cross.res.status, 404, 'another meeting’s instrument is not found');
});

test('an overdue instrument is refused at recording, naming it and why; the list says so', async () => {
  const id = await addCaliper('Overdue caliper');
  const added = await addCertificate(chief, id, {
    number: 'TW-CAL-OLD',
    laboratory: 'Invented Metrology Ltd',
    calibratedOn: dayInZone(-400),
    dueOn: dayInZone(-35),
    expandedUncertainty: '0.01',
    coverageFactor: '2',
  });
  assert.equal(added.res.status, 201, JSON.stringify(added.body));
  const view = await listed(id);
  assert.equal(view.calibration.status, 'overdue');
  assert.equal(view.calibration.usable, false);
  assert.match(view.calibration.reason, /calibration overdue since .* \(certificate TW-CAL-OLD\)/);
  const before = await query('select id from inspections where entry_id = $1', [entry.id]);
  const rec = await recordWith(id);
  assert.equal(rec.res.status, 409, JSON.stringify(rec.body));
  const detail = rec.body.error.details.find((d: { field: string }) => d.field === 'nozzle.instrumentId');
  assert.ok(detail, 'the refusal names the field');
  assert.match(detail.message, /Overdue caliper .* cannot be used: calibration overdue since/);
  const after = await query('select id from inspections where entry_id = $1', [entry.id]);
  assert.equal(after.length, before.length, 'no record was stored');
});

test('a failed daily check takes the instrument out of use for that meeting day; a scrutineer cannot record checks', async () => {
  const id = await addCaliper('Checked caliper');
  const check = (session: HttpSession, body: unknown) =>
    session.json(`/api/events/${meeting.eventId}/instruments/${id}/checks`, body);
  const byScrutineer = await check(scrutineer, {
    reference: 'Gauge block 100 mm',
    nominalValue: 100,
    reading: 100.01,
    passed: true,
  });
  assert.equal(byScrutineer.res.status, 403);
  const bad = await check(chief, { reference: '', nominalValue: 'a lot', reading: 100, passed: 'maybe' });
  assert.equal(bad.res.status, 400);
  for (const f of ['reference', 'nominalValue', 'passed'])
    assert.ok(
      bad.body.error.details.some((d: { field: string }) => d.field === f),
      f,
    );

  // The server decides from the caliper's error limit (±0.02 mm; JCGM 200:2012 VIM 4.26): a "passed"
  // the figures contradict is refused on the field and nothing is stored (attack finding F11).
  const contradicted = await check(chief, {
    reference: 'Gauge block 100 mm, set B',
    nominalValue: 100,
    reading: 57.3,
    passed: true,
  });
  assert.equal(contradicted.res.status, 400, JSON.stringify(contradicted.body));
  assert.equal(contradicted.body.error.details[0].field, 'passed');
  assert.match(contradicted.body.error.details[0].message, /42\.7 mm off the reference, beyond .* ±0\.02 mm/);
  const stored = await query<{ n: number }>(
    'select count(*)::int as n from instrument_checks where instrument_id = $1',
    [id],
  );
  assert.equal(stored[0].n, 0, 'nothing stored');

  const passed = await check(chief, {
    reference: 'Gauge block 100 mm, set B',
    nominalValue: 100,
    reading: 100.01,
  });
  assert.equal(passed.body.data?.passed, true, 'decided from the figures: 0.01 mm is within ±0.02 mm');
  assert.equal(passed.res.status, 201, JSON.stringify(passed.body));
  assert.equal(passed.body.data.meetingDay, dayInZone(), 'dated in the meeting’s time zone');
  assert.equal((await recordWith(id)).res.status, 201, 'usable after a passed check');

  const failed = await check(chief, {
    reference: 'Gauge block 100 mm, set B',
    nominalValue: 100,
    reading: 100.09,
    passed: false,
  });
  assert.equal(failed.res.status, 201, JSON.stringify(failed.body));
  const view = await listed(id);
  assert.equal(view.calibration.status, 'failed_check');
  assert.equal(view.calibration.usable, false);
  const rec = await recordWith(id);
  assert.equal(rec.res.status, 409, JSON.stringify(rec.body));
  const detail = rec.body.error.details.find((d: { field: string }) => d.field === 'nozzle.instrumentId');
  assert.match(detail.message, /Checked caliper .* cannot be used: out of use: failed its check/);
});

test('certificates and checks are append-only in the database', async () => {
  const id = await addCaliper('Append-only caliper');
  const cert = await addCertificate(chief, id, {
    number: 'AO-1',
    laboratory: 'Invented Lab',
    calibratedOn: dayInZone(-5),
    dueOn: dayInZone(200),
  });
  assert.equal(cert.res.status, 201, JSON.stringify(cert.body));
  const chk = await chief.json(`/api/events/${meeting.eventId}/instruments/${id}/checks`, {
    reference: 'Gauge block 50 mm',
    nominalValue: 50,
    reading: 50,
    passed: true,
  });
  assert.equal(chk.res.status, 201);
  await assert.rejects(
    query("update calibration_certificates set due_on = '2099-01-01' where id = $1", [cert.body.data.id]),
    /append-only/,
  );
  await assert.rejects(query('delete from calibration_certificates where id = $1', [cert.body.data.id]), /append-only/);
  await assert.rejects(
    query('update instrument_checks set passed = false where id = $1', [chk.body.data.id]),
    /append-only/,
  );
  await assert.rejects(query('delete from instrument_checks where id = $1', [chk.body.data.id]), /append-only/);
  const [kept] = await query<{ due_on: string }>(
    "select to_char(due_on, 'YYYY-MM-DD') as due_on from calibration_certificates where id = $1",
    [cert.body.data.id],
  );
  assert.equal(kept.due_on, dayInZone(200));
});
