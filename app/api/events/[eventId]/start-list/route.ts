// GET /api/events/:eventId/start-list?day=&class=&format=csv: who may start on a meeting day and why not (JSON, or CSV for the timing system).
import { actorHandler } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { loadStartList } from '@/lib/server/start-list/start-list';
import { startListCsv } from '@/lib/core/start-list/decide-start';

type P = { eventId: string };

export const GET = actorHandler<P>(async (req, { actor, params }) => {
  const q = req.nextUrl.searchParams;
  const list = await loadStartList(actor, parseId(params.eventId, 'event'), {
    day: q.get('day'),
    classFilter: q.get('class'),
  });
  if (q.get('format') === 'csv') {
    const cls = list.classes.find((c) => c.id === list.classId)?.code ?? 'all';
    return new Response(startListCsv(list.day, list.rows), {
      headers: {
        'Content-Type': 'text/csv; charset=utf-8',
        'Content-Disposition': `attachment; filename="start-list-${list.day}-${cls.replace(/[^A-Za-z0-9_-]/g, '')}.csv"`,
        'Cache-Control': 'private, no-store',
      },
    });
  }
  return Response.json({ data: list }, { headers: { 'Cache-Control': 'private, no-store' } });
});
