// POST /api/events/:eventId/interests/:interestId/withdraw: an official withdraws one of their own declarations, with a reason (a second record, never an edit).
import { withPermission, readJson } from '@/lib/server/http/handler';
import { parseId } from '@/lib/server/http/ids';
import { withdrawInterest } from '@/lib/server/interests/withdraw-interest';

export const POST = withPermission<{ eventId: string; interestId: string }>(
  'interest.declare',
  async (req, { actor, params }) => {
    const eventId = parseId(params.eventId, 'meeting');
    return Response.json(
      { data: await withdrawInterest(actor, eventId, params.interestId, () => readJson(req, 16 * 1024)) },
      { status: 201 },
    );
  },
);
