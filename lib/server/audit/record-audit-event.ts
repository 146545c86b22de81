import 'server-only';
import type { Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import type { AuditSubjectType } from '@/models/audit-event';

export type AuditInput = {
  eventId: string;
  actorId: string | null; // null when the payment provider's verified webhook made the change
  subjectType: AuditSubjectType;
  subjectId: string;
  action: string; // dotted verb, e.g. 'protest.lodged', 'results.published'
  details?: Record<string, unknown>;
};

/**
 * Adds one line to the meeting's audit trail, inside the caller's transaction so the line exists
 * exactly when the change it describes does. Never called from a route: the trail is written only
 * as a side effect of a state change, and the database refuses updates and deletes.
 */
export async function recordAuditEvent(input: AuditInput, transaction?: Transaction): Promise<void> {
  await getDb().models.AuditEvent.create(
    {
      eventId: input.eventId,
      actorId: input.actorId,
      subjectType: input.subjectType,
      subjectId: input.subjectId,
      action: input.action,
      details: input.details ?? {},
    },
    { transaction },
  );
}
