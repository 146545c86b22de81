import 'server-only';
import { QueryTypes } from 'sequelize';
import { z } from 'zod';
import { getDb } from '@/lib/db';
import { assertCan, type Actor } from '@/lib/auth/actor';

export type AuditEventView = {
  id: string;
  at: string;
  actorName: string | null; // null: the payment provider's verified webhook
  subjectType: string;
  subjectId: string;
  action: string;
  details: Record<string, unknown>;
};

export const AuditQuery = z.object({
  subjectType: z.enum(['protest', 'inspection', 'rules', 'results', 'entry']).optional(),
  subjectId: z.uuid({ error: 'subjectId must be an id.' }).optional(),
  before: z.coerce.number().int().positive().optional(), // id to page back from
  limit: z.coerce.number().int().min(1).max(500).default(100),
});

/** A meeting's audit trail, newest first, for those with 'audit.read' at that meeting. Read-only. */
export async function listAuditEvents(actor: Actor | null, eventId: string, raw: unknown = {}): Promise<{ items: AuditEventView[]; nextBefore: string | null }> {
  assertCan(actor, 'audit.read', { eventId });
  const q = AuditQuery.parse(raw);
  const rows = await getDb().sequelize.query<{ id: string; at: Date; actorName: string | null; subjectType: string; subjectId: string; action: string; details: Record<string, unknown> }>(
    `select a.id::text as id, a.at, coalesce(u.name, u.email) as "actorName", a.subject_type as "subjectType", a.subject_id as "subjectId", a.action, a.details
       from audit_events a left join users u on u.id = a.actor_id
      where a.event_id = :eventId
        ${q.subjectType ? 'and a.subject_type = :subjectType' : ''}
        ${q.subjectId ? 'and a.subject_id = :subjectId' : ''}
        ${q.before ? 'and a.id < :before' : ''}
      order by a.id desc
      limit :limit`,
    { replacements: { eventId, subjectType: q.subjectType ?? null, subjectId: q.subjectId ?? null, before: q.before ?? null, limit: q.limit + 1 }, type: QueryTypes.SELECT },
  );
  const items = rows.slice(0, q.limit).map((r) => ({ ...r, at: new Date(r.at).toISOString() }));
  return { items, nextBefore: rows.length > q.limit ? items[items.length - 1].id : null };
}
