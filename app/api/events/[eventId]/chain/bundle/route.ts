// GET /api/events/:eventId/chain/bundle[?protest=<id>]: the meeting's record chain as an export bundle (JSON lines: records, files, checkpoints, public key), or one protest's case file; verify it with `npm run verify` or /verify.
import { withPermission } from '@/lib/server/http/handler';
import { exportMeetingBundle } from '@/lib/server/chain/chain-service';

type P = { eventId: string };

export const GET = withPermission<P>('chain.export', async (req, { actor, params }) => {
  const protest = req.nextUrl.searchParams.get('protest') ?? undefined;
  const stream = await exportMeetingBundle(actor, params.eventId, protest);
  const name = `boreline-chain-${params.eventId}${protest ? `-protest-${protest}` : ''}.jsonl`;
  return new Response(stream, {
    headers: {
      'Content-Type': 'application/x-ndjson; charset=utf-8',
      'Content-Disposition': `attachment; filename="${name}"`,
      'Cache-Control': 'no-store',
    },
  });
});
