// GET|POST /api/events/:eventId/slots/entries/:entryId: an entry's scrutineering slot and the slots it may book; book or move it (its entrant, or the chief scrutineer).
import { actorHandler, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { bookSlot, getEntrySlot, openEntryBooking } from '@/lib/server/schedule/book-slot';

type P = { eventId: string; entryId: string };

const open = (actor: Parameters<typeof openEntryBooking>[0], params: P) =>
  openEntryBooking(actor, parseId(params.eventId, 'event'), parseId(params.entryId, 'entry'));

export const GET = actorHandler<P>(async (_req, { actor, params }) => {
  return Response.json({ data: await getEntrySlot(await open(actor, params)) });
});

// Who may book for the entry is decided before the body is read.
export const POST = actorHandler<P>(async (req, { actor, params }) => {
  const access = await open(actor, params);
  return Response.json({ data: await bookSlot(access, await readJson(req)) }, { status: 201 });
});
