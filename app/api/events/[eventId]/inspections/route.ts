// POST|GET /api/events/:eventId/inspections: record an inspection (201, or 200 for a repeated key); the board (?class=&result=).
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { assertCan } from '@/lib/server/auth/actor';
import { recordInspection } from '@/lib/server/inspections/record-inspection';
import { listInspectionBoard } from '@/lib/server/inspections/list-inspection-board';
import { refuseChange } from '@/lib/server/inspections/refuse-change';
import { metrics } from '@/lib/server/observability';
import { AppError } from '@/lib/core/errors';
import { ZodError } from 'zod';

type P = { eventId: string };

export const POST = actorHandler<P>(async (req, { actor, params }) => {
  const { inspectionRecords } = metrics();
  const eventId = parseId(params.eventId, 'event');
  assertCan(actor, 'inspection.record', { eventId }); // before reading a body at all
  try {
    const { inspection, created } = await recordInspection(actor, eventId, await readJson(req));
    // "replayed": the same idempotency key again (a phone resending from its queue after a lost answer).
    inspectionRecords.inc({ outcome: created ? 'created' : 'replayed' });
    // Sent uncompressed (no-transform stops Next.js's gzip): a record's answer is about 4 KB, 1.3 KB gzipped,
    // a few milliseconds on a slow link, while gzip was the largest item in the record path's CPU profile.
    return Response.json(
      { data: inspection, created },
      { status: created ? 201 : 200, headers: { 'Cache-Control': 'no-store, no-transform' } },
    );
  } catch (err) {
    inspectionRecords.inc({
      outcome: err instanceof AppError || err instanceof ZodError || err instanceof SyntaxError ? 'refused' : 'failed',
    });
    throw err;
  }
});

export const GET = actorHandler<P>(async (req, { actor, params }) => {
  const q = req.nextUrl.searchParams;
  const board = await listInspectionBoard(actor, parseId(params.eventId, 'event'), {
    classFilter: q.get('class'),
    result: q.get('result'),
  });
  return Response.json({ data: board }, { headers: { 'Cache-Control': 'private, no-cache' } });
});

export const PUT = refuseChange('GET, POST');
export const PATCH = refuseChange('GET, POST');
export const DELETE = refuseChange('GET, POST');
