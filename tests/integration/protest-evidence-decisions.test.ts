// Protest evidence, decisions and the audit trail through the real HTTP API, the database and the
// fakes: the stored SHA-256 equals node:crypto's hash of the bytes read back from storage with the
// S3 SDK, an object overwritten in storage is reported 'altered', forbidden types and oversized
// uploads store nothing; upheld refunds the fee exactly once, dismissed refunds nothing; the
// audit trail is read-only through every route and in the database. Refund on upheld and fee kept
// on dismissal are common practice, no single source.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { PDFDocument } from 'pdf-lib';
import { GetObjectCommand, PutObjectCommand } from '@aws-sdk/client-s3';
import type { HttpSession } from '../support/http-session';
import { EVIDENCE_MAX_BYTES } from '../../lib/core/protests/protest-states';
import { query } from '../support/db';
import { extractPdfText } from '../support/pdf-text';
import {
  EVENT,
  DECISION_CLASS,
  BUCKET,
  FAKE,
  s3,
  sha256,
  competitor,
  waitFor,
  protestRow,
  lodgedProtest,
  refundEventsFor,
  png,
  upload,
  setUpMeeting,
  publishResults,
  type Competitor,
} from './protest-fixtures';

let steward: HttpSession;
let organiser: HttpSession;
let L: Competitor;
let T: Competitor;
let O: Competitor;

before(async () => {
  ({ steward, organiser } = await setUpMeeting());
  [L, T, O] = [
    await competitor('lodger', DECISION_CLASS),
    await competitor('target', DECISION_CLASS),
    await competitor('other', DECISION_CLASS),
  ];
  await publishResults(organiser, DECISION_CLASS, [T, L, O]);
});

test('evidence: the stored SHA-256 is node:crypto’s hash of the bytes in storage; a tampered object is reported altered; a forbidden type is refused; the DB refuses edits', async () => {
  const { id } = await lodgedProtest(L, T, 'TP 6.1 seals');
  const bytes = png();
  const res = await upload(L.s, id, bytes, 'nozzle.png', 'image/png');
  const body = await res.json();
  assert.equal(res.status, 201, JSON.stringify(body));
  assert.equal(
    body.data.sha256,
    sha256(bytes),
    'SHA-256 of the uploaded bytes, computed independently with node:crypto',
  );
  const [row] = await query<{ id: string; object_key: string; sha256: string }>(
    'select id, object_key, sha256 from protest_evidence where protest_id = $1 and kind = $2',
    [id, 'file'],
  );
  const stored = await s3.send(new GetObjectCommand({ Bucket: BUCKET, Key: row.object_key }));
  const readBack = Buffer.from(await stored.Body!.transformToByteArray());
  assert.equal(row.sha256, sha256(readBack), 'the stored hash equals the hash of the bytes read back from storage');

  const download = await T.s.fetch(`/api/evidence/${row.id}`);
  assert.equal(download.status, 200);
  assert.equal(download.headers.get('x-boreline-integrity'), 'intact');
  assert.match(download.headers.get('content-disposition') ?? '', /^attachment; filename="nozzle\.png"/);
  assert.equal(sha256(new Uint8Array(await download.arrayBuffer())), row.sha256);
  assert.equal((await O.s.fetch(`/api/evidence/${row.id}`)).status, 404);

  await s3.send(
    new PutObjectCommand({
      Bucket: BUCKET,
      Key: row.object_key,
      Body: Buffer.concat([readBack, Buffer.from('tampered')]),
      ContentType: 'image/png',
    }),
  );
  const opened = await steward.fetch(`/api/evidence/${row.id}`);
  assert.equal(opened.headers.get('x-boreline-integrity'), 'altered');
  await opened.arrayBuffer();
  const listed = (await (await L.s.fetch(`/api/protests/${id}/evidence`)).json()).data as {
    id: string;
    integrity: string;
  }[];
  assert.equal(listed.find((e) => e.id === row.id)?.integrity, 'altered');
  assert.ok(
    (
      await query(`select 1 from audit_events where subject_id = $1 and action = 'protest.evidence_altered_detected'`, [
        id,
      ])
    ).length >= 1,
  );

  const count = async () =>
    (await query<{ n: number }>('select count(*)::int as n from protest_evidence where protest_id = $1', [id]))[0].n;
  const n = await count();
  const textAsPng = await upload(L.s, id, Buffer.from('just some words, not a picture\n'), 'photo.png', 'image/png');
  assert.equal(textAsPng.status, 415);
  const refusal = await textAsPng.json();
  assert.equal(refusal.error.details[0].field, 'file');
  assert.match(refusal.error.message, /plain text/);
  // Just over the limit (40 MB plus the multipart allowance): refused with 413, nothing stored. The
  // route refuses by the declared Content-Length before reading; the whole body is sent here because
  // the proxy in front of the routes may read a body before the handler sees it.
  const big = new FormData();
  big.append('file', new Blob([Buffer.alloc(EVIDENCE_MAX_BYTES + 65 * 1024, 0x89)], { type: 'image/png' }), 'huge.png');
  const tooLarge = await L.s.fetch(`/api/protests/${id}/evidence`, { method: 'POST', body: big });
  assert.equal(tooLarge.status, 413);
  assert.equal((await tooLarge.json()).error.details[0].field, 'file');
  assert.equal(await count(), n, 'nothing stored for the refused files');
  assert.equal(
    (
      await T.s.json(`/api/protests/${id}/evidence`, {
        kind: 'note',
        note: 'The seal was intact when the scrutineer fitted it.',
      })
    ).res.status,
    201,
    'the protested party adds evidence too',
  );
  assert.equal((await O.s.json(`/api/protests/${id}/evidence`, { kind: 'note', note: 'not a party' })).res.status, 404);
  await assert.rejects(
    query('update protest_evidence set sha256 = $1 where id = $2', ['0'.repeat(64), row.id]),
    /append-only/,
  );
  await assert.rejects(query('delete from protest_evidence where id = $1', [row.id]), /append-only/);
});

test('upheld refunds the fee exactly once and the decision PDF says so; dismissed refunds nothing', async () => {
  const up = await lodgedProtest(L, T, 'TP 7.1 nozzle minimum readings');
  assert.equal((await steward.json(`/api/protests/${up.id}/accept`, {})).res.status, 200);
  const order = await steward.json(`/api/protests/${up.id}/reinspection`, {
    reason: 'Measure the nozzle exit at four points.',
  });
  assert.equal(order.res.status, 201);
  assert.equal(
    (
      await query('select 1 from reinspections where protest_id = $1 and entry_id = $2 and done_at is null', [
        up.id,
        T.entryId,
      ])
    ).length,
    1,
  );
  const hearing = await steward.json(`/api/protests/${up.id}/hearing`, {
    hearingAt: '2099-03-10T16:30',
    place: 'Race office',
  });
  assert.equal(hearing.res.status, 200);
  assert.match(hearing.body.data.hearingAtLabel, /16:30 UTC\+13:00 \(Pacific\/Auckland\)/); // March is NZDT in Auckland (NZ Daylight Time Order 2007) [memory; the unit test checks the offsets with Intl]
  const badDecision = await steward.json(`/api/protests/${up.id}/decision`, {
    outcome: 'dismissed',
    reasons: 'Short',
    penalty: 'x',
  });
  assert.equal(badDecision.res.status, 400);
  const decided = await steward.json(`/api/protests/${up.id}/decision`, {
    outcome: 'upheld',
    reasons: 'Re-inspection found 102.41 mm, above the 102.00 mm maximum.',
    penalty: 'Excluded from heat 2.',
  });
  assert.equal(decided.res.status, 200, JSON.stringify(decided.body));
  const row = await protestRow(up.id);
  assert.equal(row.status, 'upheld');
  assert.match(String(row.refund_id), /^re_/);
  assert.ok(row.appeal_deadline && row.decided_at);
  assert.equal(
    (new Date(row.appeal_deadline as string).getTime() - new Date(row.decided_at as string).getTime()) / 60_000,
    60,
    'one hour to give notice of appeal (the documented default)',
  );
  const again = await steward.json(`/api/protests/${up.id}/decision`, {
    outcome: 'upheld',
    reasons: 'Deciding a second time must not refund again.',
  });
  assert.equal(again.res.status, 409);
  const refunds = await waitFor('the refund event', async () => {
    const r = await refundEventsFor(up.paymentIntentId);
    return r.length ? r : null;
  });
  // Instead of a pause: wait until the fake has delivered that refund's webhook and the app has answered it, so
  // anything the app does on hearing of the refund has been done; then there is still exactly one.
  await waitFor('the refund webhook to be answered', async () => {
    const events = (await (await fetch(`${FAKE}/_fake/events?type=charge.refunded`)).json()).data as {
      payload: string;
      delivered: boolean;
    }[];
    return events.some((e) => e.delivered && JSON.parse(e.payload).data.object.payment_intent === up.paymentIntentId);
  });
  assert.equal((await refundEventsFor(up.paymentIntentId)).length, 1, 'one refund for the protest');
  assert.equal(refunds[0].amount_refunded, 5000);

  const pdf = await T.s.fetch(`/api/protests/${up.id}/decision.pdf`);
  assert.equal(pdf.status, 200);
  assert.equal(pdf.headers.get('content-type'), 'application/pdf');
  const bytes = new Uint8Array(await pdf.arrayBuffer());
  const doc = await PDFDocument.load(bytes);
  assert.ok(doc.getPageCount() >= 1);
  const text = (await extractPdfText(bytes)).join('\n');
  assert.match(text, /UPHELD/);
  assert.match(text, /Excluded from heat 2\./);
  assert.match(text, /refunded/);
  assert.match(text, /Notice of appeal is due by/);
  assert.match(text, /licensed officials/);

  // The meeting's organiser sets the appeal notice as the governing body's rules give it: 30 minutes here.
  const {
    id: _id,
    organisationId: _org,
    slug: _slug,
    ...meeting
  } = (await (await organiser.fetch(`/api/events/${EVENT}`)).json()).data;
  assert.equal(meeting.appealNoticeMinutes, 60);
  const tooLong = await organiser.json(`/api/events/${EVENT}`, { ...meeting, appealNoticeMinutes: 20_000 }, 'PATCH');
  assert.equal(tooLong.res.status, 400);
  assert.equal(tooLong.body.error.details[0].field, 'appealNoticeMinutes');
  assert.equal(
    (await organiser.json(`/api/events/${EVENT}`, { ...meeting, appealNoticeMinutes: 30 }, 'PATCH')).res.status,
    200,
  );
  const down = await lodgedProtest(L, T, 'TP 7.2 hull markings');
  assert.equal((await steward.json(`/api/protests/${down.id}/accept`, {})).res.status, 200);
  const dismissed = await steward.json(`/api/protests/${down.id}/decision`, {
    outcome: 'dismissed',
    reasons: 'The hull markings meet the rule as written.',
  });
  assert.equal(dismissed.res.status, 200);
  const downRow = await protestRow(down.id);
  assert.equal(
    (new Date(downRow.appeal_deadline as string).getTime() - new Date(downRow.decided_at as string).getTime()) / 60_000,
    30,
    "the meeting's own appeal notice",
  );
  assert.equal(
    (await organiser.json(`/api/events/${EVENT}`, { ...meeting, appealNoticeMinutes: 60 }, 'PATCH')).res.status,
    200,
  );
  assert.equal(downRow.refund_id, null);
  // No pause needed: a refund is asked for inside the deciding request (the upheld protest above had its
  // refund id on its row when its answer came), and the fake records a refund before it answers.
  assert.equal((await refundEventsFor(down.paymentIntentId)).length, 0, 'a dismissed protest keeps its fee');
  assert.equal((await O.s.fetch(`/api/protests/${down.id}/decision.pdf`)).status, 404);
});

test('the audit trail: read by stewards and the organiser only, never written through any route (405), refused by the database', async () => {
  const trail = await steward.fetch(`/api/events/${EVENT}/audit?limit=500`);
  assert.equal(trail.status, 200);
  const actions = new Set(((await trail.json()).data.items as { action: string }[]).map((a) => a.action));
  for (const a of [
    'results.published',
    'protest.submitted',
    'protest.lodged',
    'protest.accepted',
    'protest.reinspection_ordered',
    'protest.hearing_scheduled',
    'protest.upheld',
    'protest.dismissed',
    'protest.evidence_added',
  ]) {
    assert.ok(actions.has(a), `the trail records ${a}`);
  }
  assert.equal((await organiser.fetch(`/api/events/${EVENT}/audit`)).status, 200);
  assert.equal((await L.s.fetch(`/api/events/${EVENT}/audit`)).status, 403);
  for (const method of ['POST', 'PUT', 'PATCH', 'DELETE']) {
    const res = await steward.fetch(`/api/events/${EVENT}/audit`, {
      method,
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ action: 'forged' }),
    });
    assert.equal(res.status, 405, method);
  }
  assert.equal((await query(`select 1 from audit_events where action = 'forged'`)).length, 0);
  const [one] = await query<{ id: string }>('select id from audit_events where event_id = $1 limit 1', [EVENT]);
  await assert.rejects(query(`update audit_events set action = 'forged' where id = $1`, [one.id]), /append-only/);
  await assert.rejects(query('delete from audit_events where id = $1', [one.id]), /append-only/);
});
