// The shape of a boat's logbook: what the server gathers for one viewer (LogbookRecord) and the
// dated, worded items the page and the PDF show (LogbookItem). Types and the kinds' names only.
import type { DeclarationFields } from '../boats/declaration-changes';

export const LOGBOOK_KINDS = {
  declaration: 'Declarations',
  component: 'Components',
  seal: 'Seals',
  inspection: 'Inspections',
  reinspection: 'Re-inspection tasks',
  incident: 'Incidents',
  custody: 'Parts in custody',
  protest: 'Protests',
  note: "Officials' notes",
} as const;
export type LogbookKind = keyof typeof LOGBOOK_KINDS;

export type LogbookComponentRef = { kind: string; maker: string; model: string; serialNumber: string };

export type LogbookMeeting = {
  id: string;
  name: string;
  startsOn: string;
  endsOn: string;
  timeZone: string;
  entries: { raceNumber: number; classCode: string; className: string; status: string }[];
};

/** Everything the server gathered, already cut to what this viewer may see. */
export type LogbookRecord = {
  boat: { id: string; name: string; hullNumber: string };
  meetings: LogbookMeeting[];
  declarations: {
    id: string;
    version: number;
    createdAt: string;
    createdBy: string;
    fields: DeclarationFields;
    components: LogbookComponentRef[];
  }[];
  /** Components on the boat now. */
  components: (LogbookComponentRef & { id: string; trimCode: string; notes: string })[];
  componentEvents: {
    id: string;
    component: LogbookComponentRef;
    action: string;
    /** Where the event put the component: this boat, another boat (never named here), or none. */
    where: 'this_boat' | 'other_boat' | 'no_boat';
    createdAt: string;
    recordedBy: string;
  }[];
  sealEvents: {
    id: string;
    sealNumber: string;
    action: string;
    createdAt: string;
    eventId: string | null;
    componentId: string | null;
    component: LogbookComponentRef | null;
    position: string;
    reason: string;
    recordedBy: string;
    inspectionId: string | null;
  }[];
  inspections: {
    id: string;
    eventId: string;
    kind: string;
    capturedAt: string;
    recordedBy: string;
    ruleVersion: number;
    declarationVersion: number | null;
    overallResult: string;
    /** The stored results document, read here through its one shape. */
    results: unknown;
    supersedesId: string | null;
    correctionReason: string | null;
    isCurrent: boolean;
    notes: string;
  }[];
  reinspections: {
    id: string;
    eventId: string;
    reason: string;
    requestedBy: string;
    createdAt: string;
    doneAt: string | null;
  }[];
  /** Incidents recorded by the officials (append-only; a correction supersedes); damage names its re-inspection task. */
  incidents?: {
    id: string;
    eventId: string;
    occurredAt: string;
    description: string;
    damage: boolean;
    reinspectionId: string | null;
    supersedesId: string | null;
    correctionReason: string | null;
    isCurrent: boolean;
    recordedBy: string;
  }[];
  custody: {
    id: string;
    eventId: string;
    description: string;
    sealNumber: string | null;
    takenBy: string;
    takenAt: string;
    release: { releasedTo: string; releasedBy: string; releasedAt: string; note: string } | null;
  }[];
  protests: {
    id: string;
    eventId: string;
    raceNumber: number | null;
    statusLabel: string;
    ruleReference: string;
    lodgedAt: string;
    decidedAt: string | null;
    decisionReasons: string | null;
    penalty: string | null;
    decidedByNames: string[];
  }[];
  notes: {
    id: string;
    eventId: string;
    category: string;
    notedOn: string;
    body: string;
    author: string;
    createdAt: string;
  }[];
};

export type LogbookItem = {
  id: string;
  kind: LogbookKind;
  /** The instant the item sorts by (a note: noon UTC of the day it happened). */
  at: string;
  /** How the moment reads: a time in the meeting's zone, or a calendar day for a note. */
  when: string;
  eventId: string | null;
  title: string;
  lines: string[];
  /** A verdict or a finding that needs the reader's eye (drawn with its word, never colour alone). */
  verdict: 'conforms' | 'does_not_conform' | 'inconclusive' | null;
  finding: 'broken' | 'missing' | null;
  /** A link for those who may follow it (a protest's own page applies its own rules). */
  href: string | null;
};

export type LogbookGroup = { key: string; meeting: LogbookMeeting | null; label: string; items: LogbookItem[] };
