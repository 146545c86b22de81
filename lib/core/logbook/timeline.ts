// A boat's logbook as one timeline: what the server gathered about the boat across meetings
// (declaration versions, components, seals, inspections, re-inspection tasks, parts in custody,
// protests, officials' notes) turned into dated lines in words, grouped by meeting. Pure: the page,
// the PDF and the tests read the same items.
import { StoredResults, type StoredRuleResult } from '../inspections/inspection-record';
import { describeDeclarationChanges, listDeclarationChanges } from '../boats/declaration-changes';
import { formatCalendarDate, formatTime } from '../format/time';
import { formatFigure, RULE_UNIT_KINDS, type FigureKind } from '../format/figures';
import { LOG_NOTE_CATEGORY_LABELS } from '../inputs/logbook';
import { INSPECTION_KIND_LABELS, type InspectionKind } from '../inputs/inspections';
import { POWER_EVIDENCE } from '../constants';
import {
  LOGBOOK_KINDS,
  type LogbookComponentRef,
  type LogbookGroup,
  type LogbookItem,
  type LogbookKind,
  type LogbookMeeting,
  type LogbookRecord,
} from './logbook-record';

const VERDICT_WORDS: Record<string, string> = {
  conforms: 'conforms',
  does_not_conform: 'does not conform',
  inconclusive: 'inconclusive',
};
const SEAL_WORDS: Record<string, string> = {
  applied: 'applied',
  intact: 'checked: intact',
  broken: 'found BROKEN',
  missing: 'found MISSING',
  removed: 'removed',
};
const COMPONENT_WORDS: Record<string, string> = {
  registered: 'registered',
  fitted: 'fitted',
  removed: 'taken off',
  edited: 'details edited',
};
const UNIT_KIND: Record<string, FigureKind> = RULE_UNIT_KINDS;

export const describeComponent = (c: LogbookComponentRef) =>
  `${c.kind} ${[c.maker, c.model].filter(Boolean).join(' ')} serial ${c.serialNumber}`.replace(/\s+/g, ' ').trim();

const figure = (v: number | null, unit: string | null) =>
  v == null ? '—' : unit && UNIT_KIND[unit] ? formatFigure(v, UNIT_KIND[unit]) : `${v}${unit ? ` ${unit}` : ''}`;

/** One rule's line: "Nozzle exit diameter: does not conform (102.31 mm against 102.00 mm)". */
export function describeRuleResult(r: StoredRuleResult): string {
  const value = r.decisiveValue != null ? figure(r.decisiveValue, r.unit) : null;
  const limit = r.limit != null ? figure(r.limit, r.unit) : null;
  const figures = value && limit ? ` (${value} against ${limit})` : value ? ` (${value})` : '';
  return `${r.label}: ${VERDICT_WORDS[r.verdict] ?? r.verdict}${figures}`;
}

/** The stored results through their one shape; a record that does not read gets no rule lines (never a crash). */
function readRules(results: unknown): { rules: StoredRuleResult[]; decisionRule: string | null } {
  const parsed = StoredResults.safeParse(results);
  return parsed.success
    ? { rules: parsed.data.rules, decisionRule: parsed.data.decisionRule }
    : { rules: [], decisionRule: null };
}

const asVerdict = (v: string): LogbookItem['verdict'] =>
  v === 'conforms' || v === 'does_not_conform' || v === 'inconclusive' ? v : null;

/** The logbook's items, each dated and worded; `fallbackZone` dates what belongs to no meeting. */
export function buildLogbookItems(r: LogbookRecord, fallbackZone: string): LogbookItem[] {
  const zoneOf = new Map(r.meetings.map((m) => [m.id, m.timeZone]));
  const timeIn = (at: string, eventId: string | null) =>
    formatTime(at, (eventId && zoneOf.get(eventId)) || fallbackZone);
  const items: LogbookItem[] = [];
  const base = { verdict: null, finding: null, href: null } as const;

  const ascending = [...r.declarations].sort((a, b) => a.version - b.version);
  ascending.forEach((d, i) => {
    const before = ascending[i - 1];
    const f = d.fields;
    items.push({
      ...base,
      id: `declaration:${d.id}`,
      kind: 'declaration',
      at: d.createdAt,
      when: timeIn(d.createdAt, null),
      eventId: null,
      title: `Declaration version ${d.version} by ${d.createdBy}`,
      lines: [
        before
          ? `Changed: ${describeDeclarationChanges(listDeclarationChanges(before.fields, f)) || 'nothing'}`
          : 'First declaration',
        `Nozzle ${formatFigure(f.declaredNozzleMm, 'nozzleMm')} ± ${formatFigure(f.declaredNozzleToleranceMm, 'nozzleMm')}; power ${formatFigure(f.declaredPowerKw, 'powerKw')} (${POWER_EVIDENCE[f.powerEvidence as keyof typeof POWER_EVIDENCE] ?? f.powerEvidence}); weight ${formatFigure(f.declaredWeightKg, 'massKg')}`,
        `Pump: ${f.pumpDescription || '—'}; impeller: ${f.impellerDescription || '—'}; engine: ${f.engineDescription || '—'}; hull: ${f.hullDescription || '—'}`,
        d.components.length
          ? `Components named: ${d.components.map(describeComponent).join('; ')}`
          : 'Components named: none',
      ],
    });
  });

  for (const e of r.componentEvents) {
    const place = e.where === 'this_boat' ? 'this boat' : e.where === 'other_boat' ? 'another boat' : 'no boat';
    items.push({
      ...base,
      id: `component:${e.id}`,
      kind: 'component',
      at: e.createdAt,
      when: timeIn(e.createdAt, null),
      eventId: null,
      title: `${describeComponent(e.component)}: ${COMPONENT_WORDS[e.action] ?? e.action}`,
      lines: [e.action === 'removed' ? `Taken off ${place}` : `On ${place}`, `Recorded by ${e.recordedBy}`],
    });
  }

  for (const s of r.sealEvents) {
    const finding = s.action === 'broken' || s.action === 'missing' ? s.action : null;
    items.push({
      ...base,
      id: `seal:${s.id}`,
      kind: 'seal',
      at: s.createdAt,
      when: timeIn(s.createdAt, s.eventId),
      eventId: s.eventId,
      title: `Seal ${s.sealNumber} ${SEAL_WORDS[s.action] ?? s.action}`,
      lines: [
        s.component ? `On ${describeComponent(s.component)}${s.position ? `, ${s.position}` : ''}` : s.position,
        s.reason ? `Reason: ${s.reason}` : '',
        `Recorded by ${s.recordedBy}${s.inspectionId ? ' at an inspection' : ''}`,
      ].filter(Boolean),
      finding,
    });
  }

  // Seal findings recorded with an inspection also read in that inspection's entry.
  const sealFindings = new Map<string, { lines: string[]; finding: 'broken' | 'missing' }>();
  for (const s of r.sealEvents) {
    if (!s.inspectionId || (s.action !== 'broken' && s.action !== 'missing')) continue;
    const found = sealFindings.get(s.inspectionId) ?? { lines: [], finding: s.action };
    found.lines.push(`Finding: seal ${s.sealNumber} ${SEAL_WORDS[s.action]}`);
    sealFindings.set(s.inspectionId, found);
  }

  for (const i of r.inspections) {
    const { rules, decisionRule } = readRules(i.results);
    items.push({
      ...base,
      id: `inspection:${i.id}`,
      kind: 'inspection',
      at: i.capturedAt,
      when: timeIn(i.capturedAt, i.eventId),
      eventId: i.eventId,
      title: `${INSPECTION_KIND_LABELS[i.kind as InspectionKind] ?? i.kind} inspection: ${VERDICT_WORDS[i.overallResult] ?? i.overallResult}`,
      lines: [
        `Recorded by ${i.recordedBy}; class rules version ${i.ruleVersion}${decisionRule ? `, decision rule ${decisionRule}` : ''}${i.declarationVersion != null ? `; declaration version ${i.declarationVersion}` : ''}`,
        ...rules.map(describeRuleResult),
        ...(sealFindings.get(i.id)?.lines ?? []),
        i.supersedesId ? `Correction of an earlier record: ${i.correctionReason ?? 'no reason given'}` : '',
        i.isCurrent ? 'The current record for this entry' : 'No longer the current record for this entry',
        i.notes ? `Notes: ${i.notes}` : '',
      ].filter(Boolean),
      verdict: asVerdict(i.overallResult),
      finding: sealFindings.get(i.id)?.finding ?? null,
    });
  }

  for (const t of r.reinspections) {
    items.push({
      ...base,
      id: `reinspection:${t.id}`,
      kind: 'reinspection',
      at: t.createdAt,
      when: timeIn(t.createdAt, t.eventId),
      eventId: t.eventId,
      title: `Re-inspection asked: ${t.reason}`,
      lines: [`Asked by ${t.requestedBy}`, t.doneAt ? `Done ${timeIn(t.doneAt, t.eventId)}` : 'Not done yet'],
    });
  }

  for (const c of r.custody) {
    items.push({
      ...base,
      id: `custody:${c.id}`,
      kind: 'custody',
      at: c.takenAt,
      when: timeIn(c.takenAt, c.eventId),
      eventId: c.eventId,
      title: `Part taken into custody: ${c.description}`,
      lines: [
        `Taken by ${c.takenBy}${c.sealNumber ? `; seal or bag ${c.sealNumber}` : ''}`,
        c.release
          ? `Released to ${c.release.releasedTo} by ${c.release.releasedBy}, ${timeIn(c.release.releasedAt, c.eventId)}${c.release.note ? ` (${c.release.note})` : ''}`
          : 'Still held by the officials',
      ],
    });
  }

  for (const p of r.protests) {
    items.push({
      ...base,
      id: `protest:${p.id}`,
      kind: 'protest',
      at: p.lodgedAt,
      when: timeIn(p.lodgedAt, p.eventId),
      eventId: p.eventId,
      title: `Protest against no. ${p.raceNumber ?? '—'} (${p.ruleReference}): ${p.statusLabel}`,
      lines: [
        p.decidedAt
          ? `Decided ${timeIn(p.decidedAt, p.eventId)}${p.decidedByNames.length ? ` by ${p.decidedByNames.join(', ')}` : ''}`
          : 'Not decided yet',
        p.decisionReasons ? `Reasons: ${p.decisionReasons}` : '',
        p.penalty ? `Penalty: ${p.penalty}` : '',
      ].filter(Boolean),
      href: `/protests/${p.id}`,
    });
  }

  for (const i of r.incidents ?? []) {
    items.push({
      ...base,
      id: `incident:${i.id}`,
      kind: 'incident',
      at: i.occurredAt,
      when: timeIn(i.occurredAt, i.eventId),
      eventId: i.eventId,
      title: `Incident${i.damage ? ' with damage' : ''}: ${i.description}`,
      lines: [
        `Recorded by ${i.recordedBy}`,
        i.damage ? 'Re-inspection required before the next run (see the re-inspection task)' : 'No damage recorded',
        i.supersedesId ? `Correction of an earlier record: ${i.correctionReason ?? 'no reason given'}` : '',
        i.isCurrent ? '' : 'Replaced by a correction',
      ].filter(Boolean),
    });
  }

  for (const n of r.notes) {
    items.push({
      ...base,
      id: `note:${n.id}`,
      kind: 'note',
      at: `${n.notedOn}T12:00:00.000Z`,
      when: formatCalendarDate(n.notedOn),
      eventId: n.eventId,
      title: `${LOG_NOTE_CATEGORY_LABELS[n.category as keyof typeof LOG_NOTE_CATEGORY_LABELS] ?? n.category} noted by ${n.author}`,
      lines: [n.body, `Written ${timeIn(n.createdAt, n.eventId)}`],
    });
  }
  return items;
}

export type ComponentSeal = { sealNumber: string; state: string; at: string; position: string };

/**
 * The seals on each component now on the boat, each with its latest event ("found broken" until
 * someone records otherwise); a seal whose latest event is its removal is no longer on it.
 */
export function listSealsOnComponents(r: LogbookRecord): Map<string, ComponentSeal[]> {
  const latest = new Map<string, LogbookRecord['sealEvents'][number]>();
  for (const e of [...r.sealEvents].sort((a, b) => Date.parse(a.createdAt) - Date.parse(b.createdAt)))
    latest.set(e.sealNumber.toUpperCase(), e);
  const onBoat = new Set(r.components.map((c) => c.id));
  const out = new Map<string, ComponentSeal[]>();
  for (const e of latest.values()) {
    if (!e.componentId || !onBoat.has(e.componentId) || e.action === 'removed') continue;
    const list = out.get(e.componentId) ?? [];
    list.push({
      sealNumber: e.sealNumber,
      state: SEAL_WORDS[e.action] ?? e.action,
      at: e.createdAt,
      position: e.position,
    });
    out.set(e.componentId, list);
  }
  return out;
}

/** Newest first on screen; oldest first on paper, as a log is read. Ties keep a stable order by id. */
export function sortLogbookItems(items: LogbookItem[], order: 'newest' | 'oldest'): LogbookItem[] {
  const sign = order === 'newest' ? -1 : 1;
  return [...items].sort((a, b) => {
    const d = Date.parse(a.at) - Date.parse(b.at);
    return d !== 0 ? sign * d : a.id < b.id ? -1 : a.id > b.id ? 1 : 0;
  });
}

/**
 * Consecutive items of one meeting under that meeting's heading; what belongs to no meeting
 * (declarations, component moves) under "Between meetings", with its year.
 */
export function groupLogbookItems(sorted: LogbookItem[], meetings: LogbookMeeting[]): LogbookGroup[] {
  const byId = new Map(meetings.map((m) => [m.id, m]));
  const groups: LogbookGroup[] = [];
  for (const item of sorted) {
    const meeting = item.eventId ? (byId.get(item.eventId) ?? null) : null;
    const key = meeting ? `meeting:${meeting.id}` : `between:${item.at.slice(0, 4)}`;
    const last = groups[groups.length - 1];
    if (last && last.key === key) {
      last.items.push(item);
      continue;
    }
    const label = meeting
      ? `${meeting.name} · ${formatCalendarDate(meeting.startsOn)}${meeting.endsOn !== meeting.startsOn ? ` to ${formatCalendarDate(meeting.endsOn)}` : ''}`
      : `Between meetings · ${item.at.slice(0, 4)}`;
    groups.push({ key, meeting, label, items: [item] });
  }
  return groups;
}

/** The kinds asked for in a URL (?kind=seal&kind=note); unknown values are ignored, none means all. */
export function parseLogbookKinds(raw: string | string[] | undefined): LogbookKind[] {
  const asked = (Array.isArray(raw) ? raw : raw ? [raw] : []).filter((k): k is LogbookKind =>
    Object.hasOwn(LOGBOOK_KINDS, k),
  );
  return asked.length ? [...new Set(asked)] : (Object.keys(LOGBOOK_KINDS) as LogbookKind[]);
}
