// GET /api/events/:eventId/entries/export: the entries as CSV, for officials.
import { actorHandler } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { listEventEntries } from '@/lib/server/entries/list-event-entries';
import { entriesToCsv } from '@/lib/core/entries/entries-csv';

export const GET = actorHandler<{ eventId: string }>(async (_req, { actor, params }) => {
  const rows = await listEventEntries(actor, parseId(params.eventId, 'event'));
  return new Response(entriesToCsv(rows), {
    headers: {
      'content-type': 'text/csv; charset=utf-8',
      'content-disposition': 'attachment; filename="entries.csv"',
      'x-content-type-options': 'nosniff',
    },
  });
});
