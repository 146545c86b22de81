// GET|POST /api/events/:eventId/incidents: the meeting's incidents; record one (or a correction), damage opening a re-inspection.
import { withPermission, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { listIncidents } from '@/lib/server/incidents/list-incidents';
import { recordIncident } from '@/lib/server/incidents/record-incident';
import { AppError, toErrorResponse } from '@/lib/core/errors';

type P = { eventId: string };

export const GET = withPermission<P>('incident.view', async (_req, { actor, params }) => {
  return Response.json({ data: await listIncidents(actor, parseId(params.eventId, 'event')) });
});

export const POST = withPermission<P>('incident.record', async (req, { actor, params }) => {
  const eventId = parseId(params.eventId, 'event');
  return Response.json({ data: await recordIncident(actor, eventId, await readJson(req)) }, { status: 201 });
});

// Incidents are append-only (the database refuses changes too): a correction is a new record.
async function refuseChange() {
  const res = toErrorResponse(
    new AppError(
      'method_not_allowed',
      405,
      'Incidents are never edited or deleted: record a correction that supersedes the record instead.',
    ),
  );
  res.headers.set('Allow', 'GET, POST');
  return res;
}
export { refuseChange as PUT, refuseChange as PATCH, refuseChange as DELETE };
