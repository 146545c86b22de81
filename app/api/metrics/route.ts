// GET /api/metrics: the server's metrics in Prometheus text format, for the site administrator
// (a scraper on the same machine can read METRICS_PORT instead, on loopback, without a session).
import { actorHandler } from '@/lib/server/http/handler';
import { assertCan } from '@/lib/server/auth/actor';
import { metrics } from '@/lib/server/observability';

export const dynamic = 'force-dynamic';

export const GET = actorHandler(async (_req, { actor }) => {
  assertCan(actor, 'admin.view_metrics');
  const { registry } = metrics();
  return new Response(await registry.metrics(), {
    headers: { 'Content-Type': registry.contentType, 'Cache-Control': 'no-store' },
  });
});
