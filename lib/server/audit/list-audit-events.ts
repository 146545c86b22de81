import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, can, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { AUDIT_CURSOR as CURSOR, AuditQuery } from '@/lib/core/inputs/audit';
import {
  describeAuditEvent,
  sentenceText,
  type AuditContext,
  type AuditRefs,
  type Segment,
} from '../../core/audit/describe-audit-event';

export type AuditEventView = {
  id: string; // a cursor key: 'a:<audit id>' for lines of audit_events, '<letter>:<uuid>' for lines read from their own tables
  at: string;
  actorName: string | null; // null: the payment provider's verified webhook
  kind: string;
  subjectType: string; // the same as kind (kept for older readers of the API)
  subjectId: string;
  action: string;
  details: Record<string, unknown>;
  sentence: string;
  segments: Segment[];
};

// The query's schema lives with every other input; re-exported for the readers that import it from here.
export { AuditQuery };

/*
 * The trail is one ordered list read from several append-only sources:
 * - audit_events: protests, results, staff changes, penalties (their catalogue and technical reports) and
 *   appeals, written with the change they record;
 * - inspections, published class_rule_versions, custody_items and custody_releases: each is itself an
 *   append-only (or frozen once published) record, so it is read here rather than copied;
 * - staff_invitations: the invitation and its acceptance (both set once).
 */
const TRAIL_SQL = `
with person as (select id, coalesce(name, email) as label, name, email from users),
entry_ref as (
  select e.id, jsonb_build_object('id', e.id, 'raceNumber', e.race_number, 'boatName', b.name, 'classCode', c.code) as ref
    from entries e join boats b on b.id = e.boat_id join race_classes c on c.id = e.class_id where e.event_id = :eventId
),
trail as (
  select a.at, 'a:' || a.id as key, a.subject_type as kind, a.action, u.label as actor_name, a.subject_id, a.details,
         jsonb_strip_nulls(jsonb_build_object(
           'protest', case when p.id is not null then jsonb_build_object('id', p.id, 'ruleReference', p.rule_reference, 'entry', er.ref,
             'resultClassCode', rc.code, 'resultVersion', pr.version, 'feeMinor', p.fee_minor, 'currency', p.currency) end,
           'class', case when a.subject_type = 'results' then jsonb_build_object('id', a.details->>'classId', 'code', a.details->>'classCode') end,
           'person', case when sp.id is not null then jsonb_build_object('name', sp.name, 'email', sp.email) end,
           'entry', pe.ref)) as refs
    from audit_events a
    left join person u on u.id = a.actor_id
    left join penalties pen on a.subject_type = 'penalty' and pen.id = a.subject_id
    left join appeals ap on a.subject_type = 'appeal' and ap.id = a.subject_id
    left join penalties apen on apen.id = ap.penalty_id
    left join technical_reports tr on a.subject_type = 'technical_report' and tr.id = a.subject_id
    left join entry_ref pe on pe.id = coalesce(pen.entry_id, apen.entry_id, tr.entry_id)
    left join protests p on a.subject_type = 'protest' and p.id = a.subject_id
    left join entry_ref er on er.id = p.against_entry_id
    left join provisional_results pr on pr.id = p.against_result_id
    left join race_classes rc on rc.id = pr.class_id
    left join person sp on a.subject_type = 'staff' and sp.id = a.subject_id
   where a.event_id = :eventId
  union all
  select i.received_at, 'i:' || i.id, 'inspection',
         case when i.supersedes_id is not null then 'inspection.corrected' when i.reinspection_id is not null then 'inspection.reinspected' else 'inspection.recorded' end,
         u.label, i.id,
         jsonb_strip_nulls(jsonb_build_object('overallResult', i.overall_result, 'kind', i.kind, 'capturedAt', i.captured_at, 'device', i.device,
           'supersedesId', i.supersedes_id, 'correctionReason', i.correction_reason, 'reinspectionId', i.reinspection_id, 'protestId', ri.protest_id,
           'ruleVersionId', i.rule_version_id)),
         jsonb_build_object('entry', er.ref, 'class', jsonb_build_object('id', c.id, 'code', c.code), 'ruleVersion', v.version)
    from inspections i
    join race_classes c on c.id = i.class_id
    left join entry_ref er on er.id = i.entry_id
    left join class_rule_versions v on v.id = i.rule_version_id
    left join reinspections ri on ri.id = i.reinspection_id
    left join person u on u.id = i.recorded_by_id
   where i.event_id = :eventId
  union all
  select v.published_at, 'r:' || v.id, 'rules', 'rules.published', u.label, v.id,
         jsonb_build_object('version', v.version, 'changeNote', v.change_note, 'effectiveFrom', v.effective_from),
         jsonb_build_object('class', jsonb_build_object('id', c.id, 'code', c.code, 'name', c.name))
    from class_rule_versions v join race_classes c on c.id = v.class_id left join person u on u.id = v.published_by_id
   where c.event_id = :eventId and v.status = 'published' and v.published_at is not null
  union all
  select ci.taken_at, 'c:' || ci.id, 'custody', 'custody.taken', u.label, ci.id,
         jsonb_strip_nulls(jsonb_build_object('description', ci.description, 'sealNumber', ci.seal_number, 'protestId', ci.protest_id)),
         jsonb_build_object('entry', er.ref)
    from custody_items ci left join entry_ref er on er.id = ci.entry_id left join person u on u.id = ci.taken_by_id
   where ci.event_id = :eventId
  union all
  select cr.released_at, 'x:' || cr.id, 'custody', 'custody.released', u.label, ci.id,
         jsonb_strip_nulls(jsonb_build_object('description', ci.description, 'sealNumber', ci.seal_number, 'releasedTo', cr.released_to, 'note', cr.note)),
         jsonb_build_object('entry', er.ref)
    from custody_releases cr join custody_items ci on ci.id = cr.item_id left join entry_ref er on er.id = ci.entry_id left join person u on u.id = cr.released_by_id
   where ci.event_id = :eventId
  union all
  select si.created_at, 'n:' || si.id, 'staff', 'staff.invited', u.label, si.id,
         jsonb_build_object('email', si.email, 'role', si.role), '{}'::jsonb
    from staff_invitations si left join person u on u.id = si.invited_by_id
   where si.event_id = :eventId
  union all
  select si.accepted_at, 's:' || si.id, 'staff', 'staff.invitation_accepted', u.label, si.id,
         jsonb_build_object('email', si.email, 'role', si.role),
         case when u.id is not null then jsonb_build_object('person', jsonb_build_object('name', u.name, 'email', u.email)) else '{}'::jsonb end
    from staff_invitations si left join person u on lower(u.email) = lower(si.email)
   where si.event_id = :eventId and si.accepted_at is not null
)
select at, key, kind, action, actor_name as "actorName", subject_id as "subjectId", details, refs,
       floor(extract(epoch from at) * 1000000)::bigint::text as "atMicros"
  from trail
 where (:kind::text is null or kind = :kind)
   and (:subjectId::uuid is null or subject_id = :subjectId::uuid)
   and (:beforeMicros::bigint is null or (floor(extract(epoch from at) * 1000000)::bigint, key) < (:beforeMicros::bigint, :beforeKey::text))
 order by floor(extract(epoch from at) * 1000000)::bigint desc, key desc
 limit :limit`;

type TrailRow = {
  at: Date;
  key: string;
  kind: string;
  action: string;
  actorName: string | null;
  subjectId: string;
  details: Record<string, unknown>;
  refs: AuditRefs;
  atMicros: string;
};

/** A meeting's audit trail, newest first, for those with 'audit.read' at that meeting. Read-only. */
export async function listAuditEvents(
  actor: Actor | null,
  eventId: string,
  raw: unknown = {},
): Promise<{ items: AuditEventView[]; nextBefore: string | null; timeZone: string; currency: string }> {
  assertCan(actor, 'audit.read', { eventId });
  const q = AuditQuery.parse(raw);
  const { sequelize, models } = getDb();
  const event = await models.Event.findByPk(eventId, { attributes: ['timeZone', 'currency'] });
  if (!event) throw new AppError('not_found', 404, 'No such meeting.');
  const kind = q.kind ?? (q.subjectType === 'entry' ? 'entry' : q.subjectType) ?? null;
  const cursor = q.before ? CURSOR.exec(q.before) : null;
  const rows = await sequelize.query<TrailRow>(TRAIL_SQL, {
    replacements: {
      eventId,
      kind,
      subjectId: q.subjectId ?? null,
      beforeMicros: cursor?.[1] ?? null,
      beforeKey: cursor?.[2] ?? null,
      limit: q.limit + 1,
    },
    type: QueryTypes.SELECT,
  });
  const ctx: AuditContext = {
    eventId,
    timeZone: event.timeZone,
    currency: event.currency,
    can: {
      protests: can(actor, 'protest.view_all', { eventId }),
      entries: can(actor, 'entry.view_all', { eventId }),
      board: can(actor, 'inspection.board', { eventId }),
      classes: can(actor, 'class.edit', { eventId }),
      custody: can(actor, 'custody.view', { eventId }),
    },
  };
  const shown = rows.slice(0, q.limit);
  const items = shown.map((r) => {
    const at = new Date(r.at).toISOString();
    const segments = describeAuditEvent(
      {
        at,
        kind: r.kind,
        action: r.action,
        actorName: r.actorName,
        subjectId: r.subjectId,
        details: r.details ?? {},
        refs: r.refs ?? {},
      },
      ctx,
    );
    return {
      id: r.key,
      at,
      actorName: r.actorName,
      kind: r.kind,
      subjectType: r.kind,
      subjectId: r.subjectId,
      action: r.action,
      details: r.details ?? {},
      sentence: sentenceText(segments),
      segments,
    };
  });
  const last = shown[shown.length - 1];
  return {
    items,
    nextBefore: rows.length > q.limit && last ? `${last.atMicros}~${last.key}` : null,
    timeZone: event.timeZone,
    currency: event.currency,
  };
}
