// The audit trail's query (page, filters), shared by the stewards' page and the route handler.
import { z } from 'zod';
import { AUDIT_KINDS } from '../audit/describe-audit-event';

/** Cursor of the last line shown: its instant in microseconds since 1970 and its key. */
export const AUDIT_CURSOR = /^(\d{1,19})~([a-z]:[0-9a-f-]{1,40})$/;

export const AuditQuery = z.object({
  kind: z.enum(AUDIT_KINDS, { error: `kind is one of ${AUDIT_KINDS.join(', ')}.` }).optional(),
  subjectType: z.enum([...AUDIT_KINDS, 'entry'] as [string, ...string[]], { error: 'Unknown subjectType.' }).optional(),
  subjectId: z.uuid({ error: 'subjectId must be an id.' }).optional(),
  before: z.string().regex(AUDIT_CURSOR, 'before must be a cursor from an earlier page (nextBefore).').optional(), // page back from
  limit: z.coerce.number().int().min(1).max(500).default(100),
});
