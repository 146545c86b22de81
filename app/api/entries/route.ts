// GET|POST /api/entries: the person's entries, or enter one of their boats into a class at an open meeting.
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { listMyEntries } from '@/lib/server/entries/list-my-entries';
import { submitEntry } from '@/lib/server/entries/submit-entry';

export const GET = actorHandler(async (_req, { actor }) => {
  return Response.json({ data: await listMyEntries(actor) });
});

export const POST = actorHandler(async (req, { actor }) => {
  return Response.json({ data: await submitEntry(actor, await readJson(req)) }, { status: 201 });
});
