// GET|PUT /api/events/:eventId/classes/:classId/rules: versions (or the one in force ?at=ISO time); save the draft.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { AppError } from '@/lib/core/errors';
import { getClassWithVersions } from '@/lib/server/classes/manage-classes';
import { findRulesInForce, saveDraftRules } from '@/lib/server/classes/rule-versions';

type P = { eventId: string; classId: string };

export const GET = actorHandler<P>(async (req, { actor, params }) => {
  const eventId = parseId(params.eventId, 'event');
  const classId = parseId(params.classId, 'class');
  const { raceClass, versions } = await getClassWithVersions(actor, eventId, classId);
  const at = req.nextUrl.searchParams.get('at');
  if (at === null) return Response.json({ data: { raceClass, versions } });
  const when = new Date(at);
  if (Number.isNaN(when.getTime()))
    throw new AppError('invalid_input', 400, 'at: give an ISO 8601 date and time.', [
      { field: 'at', message: 'Give an ISO 8601 date and time.' },
    ]);
  const inForce = await findRulesInForce(classId, when);
  if (!inForce) throw new AppError('not_found', 404, 'No published rules were in force for this class at that time.');
  return Response.json({ data: { raceClass, inForce } });
});

export const PUT = actorHandler<P>(async (req, { actor, params }) => {
  const draft = await saveDraftRules(
    actor,
    parseId(params.eventId, 'event'),
    parseId(params.classId, 'class'),
    await readJson(req),
  );
  return Response.json({ data: draft });
});
