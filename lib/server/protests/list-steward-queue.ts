import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { queryProtestSummaries, type ProtestSummary } from './protest-view';
import { PROTEST_STATUS_LABELS, QUEUE_ORDER, type ProtestStatus } from '../../core/protests/protest-states';

export type StewardQueue = {
  event: {
    id: string;
    name: string;
    timeZone: string;
    protestWindowMinutes: number;
    appealNoticeMinutes: number;
    protestFeeMinor: number;
    currency: string;
  };
  groups: { status: ProtestStatus; label: string; items: ProtestSummary[] }[];
  total: number;
};

/** The stewards' queue for one meeting, grouped by state in the order that needs attention first. */
export async function listStewardQueue(actor: Actor | null, eventId: string): Promise<StewardQueue> {
  assertCan(actor, 'protest.view_all', { eventId });
  const event = await getDb().models.Event.findByPk(eventId);
  if (!event) throw new AppError('not_found', 404, 'No such meeting.');
  const items = await queryProtestSummaries('p.event_id = :eventId', { eventId });
  // Oldest first within a state: the first lodged is the first heard.
  const groups = QUEUE_ORDER.map((status) => ({
    status,
    label: PROTEST_STATUS_LABELS[status],
    items: items.filter((p) => p.status === status).sort((a, b) => a.lodgedAt.localeCompare(b.lodgedAt)),
  })).filter((g) => g.items.length > 0);
  return {
    event: {
      id: event.id,
      name: event.name,
      timeZone: event.timeZone,
      protestWindowMinutes: event.protestWindowMinutes,
      appealNoticeMinutes: event.appealNoticeMinutes,
      protestFeeMinor: event.protestFeeMinor,
      currency: event.currency,
    },
    groups,
    total: items.length,
  };
}
