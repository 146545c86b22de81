// One line of the audit trail as a sentence a steward can read aloud at a hearing: who did what to
// which protest, boat, inspection or class, money as money, times in the meeting's zone with the zone
// named. Framework-free: the page renders the segments with links; the API gets the plain sentence.
import { formatTime } from '../format/time';
import { formatMoney } from '../inputs/entries';
import { PROTEST_STATUS_LABELS, REJECTION_LABELS } from '../protests/protest-states';

export const AUDIT_KINDS = [
  'protest',
  'results',
  'inspection',
  'rules',
  'custody',
  'staff',
  'penalty',
  'technical_report',
  'appeal',
] as const;
export type AuditKind = (typeof AUDIT_KINDS)[number];
export const AUDIT_KIND_LABELS: Record<AuditKind, string> = {
  protest: 'Protests',
  results: 'Results',
  inspection: 'Inspections',
  rules: 'Class rules',
  custody: 'Parts in custody',
  staff: 'Staff',
  penalty: 'Penalties',
  technical_report: 'Reports to the stewards',
  appeal: 'Appeals',
};
const APPEAL_OUTCOME_WORDS: Record<string, string> = {
  confirmed: 'confirmed',
  amended: 'amended',
  annulled: 'annulled',
};

type EntryRef = { id: string; raceNumber: number; boatName: string; classCode?: string | null } | null;
type ProtestRef = {
  id: string;
  ruleReference: string;
  entry: EntryRef;
  resultClassCode: string | null;
  resultVersion: number | null;
  feeMinor: number;
  currency: string;
} | null;

/** What the trail reader joins to a line so its sentence can name things (all optional). */
export type AuditRefs = {
  protest?: ProtestRef;
  entry?: EntryRef;
  class?: { id: string; code: string; name?: string } | null;
  ruleVersion?: number | null;
  person?: { name: string | null; email: string } | null;
};

export type AuditLine = {
  at: string;
  kind: string;
  action: string;
  actorName: string | null;
  subjectId: string;
  details: Record<string, unknown>;
  refs: AuditRefs;
};

/** Which pages the reader may open (links are only offered where they lead somewhere for them). */
export type AuditLinkRights = {
  protests: boolean;
  entries: boolean;
  board: boolean;
  classes: boolean;
  custody: boolean;
};
export type AuditContext = { eventId: string; timeZone: string; currency: string; can: AuditLinkRights };

export type Segment = { text: string; href?: string };

const ROLE_WORDS: Record<string, string> = {
  organiser: 'organiser',
  chief_scrutineer: 'chief scrutineer',
  scrutineer: 'scrutineer',
  steward: 'steward',
};
const VERDICT_WORDS: Record<string, string> = {
  conforms: 'conforms',
  does_not_conform: 'does not conform',
  inconclusive: 'inconclusive (measure again)',
};
const str = (v: unknown) => (typeof v === 'string' ? v : v == null ? '' : String(v));
const quote = (s: string) => `“${s.trim()}”`;

export function describeAuditEvent(line: AuditLine, ctx: AuditContext): Segment[] {
  const d = line.details ?? {};
  const r = line.refs ?? {};
  const out: Segment[] = [];
  const t = (text: string) => out.push({ text });
  const link = (text: string, href: string | null) => out.push(href ? { text, href } : { text });
  const when = (v: unknown) => formatTime(str(v), ctx.timeZone);
  const money = (minor: unknown, currency?: string) => formatMoney(Number(minor), currency || ctx.currency);

  const entryHref = (e: EntryRef) =>
    e && ctx.can.entries ? `/organise/events/${ctx.eventId}/entries?q=${e.raceNumber}` : null;
  const boat = (e: EntryRef) =>
    e
      ? link(`boat #${e.raceNumber} ${e.boatName}${e.classCode ? ` (${e.classCode})` : ''}`, entryHref(e))
      : t('a boat no longer listed');
  const protestHref = (id: string) => (ctx.can.protests ? `/stewards/${ctx.eventId}/protests/${id}` : null);
  const protest = (p: ProtestRef | undefined, id = line.subjectId) => {
    link('the protest', protestHref(p?.id ?? id));
    if (!p) return;
    if (p.entry) {
      t(' against ');
      boat(p.entry);
    } else if (p.resultClassCode)
      t(` against the ${p.resultClassCode} provisional results, version ${p.resultVersion}`);
    t(` under ${p.ruleReference}`);
  };
  const classLink = (c: AuditRefs['class']) =>
    c
      ? link(`the ${c.code} class`, ctx.can.classes ? `/organise/events/${ctx.eventId}/classes/${c.id}` : null)
      : t('a class');
  const actor =
    line.actorName ??
    (line.action === 'protest.lodged' || line.action === 'appeal.lodged'
      ? 'The payment provider'
      : 'Someone no longer listed');
  const penaltiesHref = ctx.can.protests ? `/stewards/${ctx.eventId}/penalties` : null;
  const appealHref = ctx.can.protests ? `/appeals/${line.subjectId}` : null;
  const person = r.person
    ? r.person.name
      ? `${r.person.name} (${r.person.email})`
      : r.person.email
    : str(d.email) || 'a person';
  const role = ROLE_WORDS[str(d.role)] ?? str(d.role).replace(/_/g, ' ');

  switch (line.action) {
    case 'protest.submitted':
      t(`${actor} submitted `);
      protest(r.protest);
      t(
        `; it is lodged once the fee of ${money(d.feeMinor, r.protest?.currency)} is paid. The protest window closes ${when(d.windowDeadline)}.`,
      );
      break;
    case 'protest.checkout_opened':
      t(`${actor} opened the card payment of the fee for `);
      protest(r.protest);
      t('.');
      break;
    case 'protest.lodged':
      if (line.actorName === null) {
        t('The payment provider confirmed the fee');
        if (r.protest) t(` of ${money(r.protest.feeMinor, r.protest.currency)}`);
        t(', so ');
        protest(r.protest);
        t(' is lodged');
        t(d.paidAfterWindow === true ? '. The fee was paid after the protest window closed.' : '.');
      } else {
        t(`${actor} lodged `);
        protest(r.protest);
        t(d.windowDeadline ? `; the protest window closes ${when(d.windowDeadline)}.` : '.');
      }
      break;
    case 'protest.accepted':
      t(`${actor} accepted `);
      protest(r.protest);
      t(' for a hearing');
      t(str(d.note).trim() ? `: ${quote(str(d.note))}.` : '.');
      break;
    case 'protest.rejected': {
      const why = REJECTION_LABELS[str(d.code) as keyof typeof REJECTION_LABELS] ?? str(d.code);
      t(`${actor} rejected `);
      protest(r.protest);
      t(` as invalid (${why.toLowerCase()})`);
      t(str(d.reasons).trim() ? `: ${quote(str(d.reasons))}.` : '.');
      break;
    }
    case 'protest.reinspection_ordered':
      t(`${actor} ordered a re-inspection`);
      if (r.protest?.entry) {
        t(' of ');
        boat(r.protest.entry);
      }
      t(' for ');
      link('the protest', protestHref(r.protest?.id ?? line.subjectId));
      t(str(d.reason).trim() ? `: ${quote(str(d.reason))}.` : '.');
      break;
    case 'protest.hearing_scheduled':
    case 'protest.hearing_moved':
      t(`${actor} ${line.action === 'protest.hearing_moved' ? 'moved' : 'scheduled'} the hearing of `);
      protest(r.protest);
      t(` ${line.action === 'protest.hearing_moved' ? 'to' : 'for'} ${when(d.hearingAt)}, at ${str(d.place)}.`);
      break;
    case 'protest.upheld':
    case 'protest.dismissed': {
      const names = Array.isArray(d.decidedByNames) ? (d.decidedByNames as string[]).join(', ') : '';
      t(`${actor} recorded the decision: `);
      protest(r.protest);
      t(` is ${PROTEST_STATUS_LABELS[line.action === 'protest.upheld' ? 'upheld' : 'dismissed'].toLowerCase()}`);
      if (str(d.reasons).trim()) t(`. Reasons: ${quote(str(d.reasons))}`);
      if (str(d.penalty).trim()) t(`. Penalty: ${quote(str(d.penalty))}`);
      if (r.protest && r.protest.feeMinor > 0)
        t(`. The fee of ${money(r.protest.feeMinor, r.protest.currency)} is ${d.refundId ? 'refunded' : 'kept'}`);
      t(names ? `. Stewards deciding: ${names}.` : '.');
      break;
    }
    case 'protest.evidence_added': {
      t(`${actor} added `);
      if (d.kind === 'file')
        t(
          `a file${d.fileName ? ` ${quote(str(d.fileName))}` : ''}${d.sha256 ? ` (SHA-256 ${str(d.sha256).slice(0, 12)}…)` : ''}`,
        );
      else if (d.kind === 'inspection_link')
        link('an inspection record', ctx.can.board ? `/inspect/${ctx.eventId}/board` : null);
      else t('a written note');
      t(' as evidence to ');
      protest(r.protest);
      t('.');
      break;
    }
    case 'protest.evidence_altered_detected':
      t(`${actor} opened a file of evidence of `);
      protest(r.protest);
      t(' and it no longer matches the SHA-256 recorded when it was added: the stored file may have been altered.');
      break;
    case 'results.published': {
      const changed = Array.isArray(d.changedEntryIds) ? d.changedEntryIds.length : 0;
      t(`${actor} published version ${str(d.version)} of the provisional results of `);
      classLink(r.class ?? (d.classId ? { id: str(d.classId), code: str(d.classCode) } : null));
      t(
        ` (${str(d.finishers)} finisher${Number(d.finishers) === 1 ? '' : 's'}, ${d.source === 'csv' ? 'from a CSV file' : 'typed in'}); the protest window opened for ${changed} boat${changed === 1 ? '' : 's'} whose place changed.`,
      );
      break;
    }
    case 'results.run_times_recorded': {
      t(`${actor} stored run times of `);
      classLink(r.class ?? (d.classId ? { id: str(d.classId), code: str(d.classCode) } : null));
      t(
        ` (${str(d.stored)} new, ${str(d.corrected)} corrected, ${str(d.unchanged)} already stored; ${d.source === 'csv' ? 'from a CSV file' : 'typed in'}).`,
      );
      break;
    }
    case 'inspection.recorded':
    case 'inspection.corrected':
    case 'inspection.reinspected': {
      const verdict = VERDICT_WORDS[str(d.overallResult)] ?? str(d.overallResult);
      const rec = ctx.can.board ? `/inspect/${ctx.eventId}/board${r.class ? `?class=${r.class.id}` : ''}` : null;
      t(`${actor} recorded `);
      link(
        line.action === 'inspection.corrected'
          ? 'a correction of an inspection'
          : line.action === 'inspection.reinspected'
            ? 'a re-inspection'
            : 'an inspection',
        rec,
      );
      t(' of ');
      boat(r.entry ?? null);
      if (d.protestId) {
        t(', ordered for ');
        link('a protest', protestHref(str(d.protestId)));
      }
      t(r.ruleVersion ? ` under the ${r.class?.code ?? ''} rules version ${r.ruleVersion}` : '');
      t(`: ${verdict}. Measured ${when(d.capturedAt)}`);
      t(
        line.action === 'inspection.corrected' && str(d.correctionReason).trim()
          ? `; reason for the correction: ${quote(str(d.correctionReason))}.`
          : '.',
      );
      break;
    }
    case 'rules.published':
      t(`${actor} published version ${str(d.version)} of the rules of `);
      classLink(r.class ?? null);
      t(`, in force from ${when(d.effectiveFrom)}`);
      t(str(d.changeNote).trim() ? `: ${quote(str(d.changeNote))}.` : '.');
      break;
    case 'custody.taken':
      t(
        `${actor} took into custody ${str(d.description)}${d.sealNumber ? ` (seal or bag ${str(d.sealNumber)})` : ''} from `,
      );
      boat(r.entry ?? null);
      if (d.protestId) {
        t(' for ');
        link('a protest', protestHref(str(d.protestId)));
      }
      t('.');
      if (ctx.can.custody) {
        t(' ');
        link('Parts in custody', `/inspect/${ctx.eventId}/custody`);
        t('.');
      }
      break;
    case 'custody.released':
      t(`${actor} released ${str(d.description)}${d.sealNumber ? ` (seal or bag ${str(d.sealNumber)})` : ''} of `);
      boat(r.entry ?? null);
      t(` to ${str(d.releasedTo)}`);
      t(str(d.note).trim() ? `: ${quote(str(d.note))}.` : '.');
      break;
    case 'staff.invited':
      t(`${actor} invited ${str(d.email)} to the meeting's staff as ${role}.`);
      break;
    case 'staff.invitation_accepted':
      t(`${person} accepted the invitation and joined the meeting's staff as ${role}.`);
      break;
    case 'staff.added':
      t(`${actor} added ${person} to the meeting's staff as ${role}.`);
      break;
    case 'staff.removed':
      t(`${actor} removed ${person} from the meeting's staff as ${role}.`);
      break;
    case 'penalty_catalogue.added':
      t(`${actor} added ${str(d.code)} ${quote(str(d.label))} to the meeting's penalty catalogue.`);
      break;
    case 'technical_report.filed':
      t(`${actor} reported `);
      boat(r.entry ?? null);
      t(` to the stewards under ${str(d.ruleReference)} (no protest).`);
      break;
    case 'penalty.imposed':
      t(`${actor} imposed `);
      link(`penalty ${str(d.code)}`, penaltiesHref);
      t(' on ');
      boat(r.entry ?? null);
      t(
        `${d.runLabel ? ` (run ${str(d.runLabel)})` : ''}, from ${d.protestId ? 'an upheld protest' : 'a technical report'}: `,
      );
      t(`${quote(str(d.reason))}.`);
      break;
    case 'results.amended':
      t(`${actor} wrote version ${str(d.version)} of the provisional results of `);
      classLink(r.class ?? null);
      t(
        ` from the organiser's version ${str(d.baseVersion)} with the penalties in force (${d.source === 'appeal' ? "the appeal body's decision" : "the stewards' penalty"}).`,
      );
      break;
    case 'appeal.submitted':
      t(`${actor} gave `);
      link('notice of appeal', appealHref);
      t(' against a penalty on ');
      boat(r.entry ?? null);
      t(
        Number(d.feeMinor) > 0
          ? `; it is lodged once the fee of ${money(d.feeMinor)} is paid. Notice was due ${when(d.noticeDeadline)}.`
          : '.',
      );
      break;
    case 'appeal.checkout_opened':
      t(`${actor} opened the card payment of the fee for `);
      link('the appeal', appealHref);
      t(' on ');
      boat(r.entry ?? null);
      t('.');
      break;
    case 'appeal.lodged':
      t(`${actor} confirmed `);
      link('the appeal', appealHref);
      t(' on ');
      boat(r.entry ?? null);
      t(': it is lodged with the appeal body.');
      break;
    case 'appeal.hearing_scheduled':
      t(`${actor} set the hearing of `);
      link('the appeal', appealHref);
      t(' on ');
      boat(r.entry ?? null);
      t(` for ${when(d.hearingAt)}, ${str(d.place)}.`);
      break;
    case 'appeal.confirmed':
    case 'appeal.amended':
    case 'appeal.annulled':
      t(`${actor}, for the appeal body, decided `);
      link('the appeal', appealHref);
      t(' on ');
      boat(r.entry ?? null);
      t(
        `: the stewards' penalty is ${APPEAL_OUTCOME_WORDS[line.action.slice(7)]}. ${quote(str(d.reasons))}${d.refundId ? ' The fee is refunded.' : ''}`,
      );
      break;
    case 'appeal.superseded':
      t(`${actor}, for the appeal body, closed `);
      link('the appeal', appealHref);
      t(' on ');
      boat(r.entry ?? null);
      t(
        `: another appeal's decision had already ended the penalty. ${quote(str(d.reasons))}${d.refundId ? ' The fee is refunded.' : ''}`,
      );
      break;
    default:
      t(`${actor}: ${line.action.replace(/[._]/g, ' ')}.`);
  }
  return out;
}

export const sentenceText = (segments: Segment[]) => segments.map((s) => s.text).join('');
