import { csvCell } from '../entries/entries-csv';

// Whether a boat may start, from the current state of its entry ("no pass, no start"): every reason that
// holds it back is listed, so the start line, the entrant and the timing system read the same words.
// An organiser's recorded decision can let a held boat start, or hold a clear one, and always says why.
// The governing body's rules, local regulations and licensed officials decide; this list carries their
// decisions and the record behind them.

export type StartFacts = {
  /** The entry's status: only live entries ('awaiting_payment', 'entered') are on a start list. */
  status: string;
  isPaid: boolean;
  /** The current inspection's overall result, or 'waiting' when there is none that counts. */
  inspection: 'waiting' | 'conforms' | 'does_not_conform' | 'inconclusive';
  openReinspections: number;
  /** The reason of the newest open re-inspection task (what changed, or what happened), if any. */
  reinspectionReason: string | null;
  /** Other holds on the day from the meeting's other checks (people, gear, incidents), in words. */
  otherHolds: string[];
};

export type StartDecisionRecord = {
  mayStart: boolean;
  reason: string;
  /** What held the boat when the decision was made: a "may start" covers these holds only. */
  holdsSeen: string[];
  decidedBy: string;
  decidedAt: string;
};

export type StartVerdict = {
  mayStart: boolean;
  /** Why the list holds the boat back (empty when clear), before any organiser's decision. */
  holds: string[];
  /** 'clear': nothing holds it; 'held': something does; 'organiser': a recorded decision settles it. */
  basis: 'clear' | 'held' | 'organiser';
  decision: StartDecisionRecord | null;
  /** Holds that arose after the organiser's "may start" (so it no longer covers the boat). */
  newSinceDecision: string[];
};

export function holdsFor(f: StartFacts): string[] {
  const holds: string[] = [];
  if (!f.isPaid || f.status === 'awaiting_payment') holds.push('Entry fee not paid.');
  if (f.inspection === 'waiting') holds.push('Not inspected (or its declaration changed since the inspection).');
  if (f.inspection === 'does_not_conform') holds.push('Inspection: does not conform.');
  if (f.inspection === 'inconclusive')
    holds.push('Inspection: inconclusive, so conformity is not proven (not accepted before a race).');
  if (f.openReinspections > 0) {
    // A task's reason may already begin with the words ("Re-inspection required: …").
    const reason = f.reinspectionReason?.replace(/^re-inspection required[:.]?\s*/i, '').trim();
    holds.push(`Re-inspection required${reason ? `: ${reason.replace(/\.?$/, '.')}` : '.'}`);
  }
  holds.push(...f.otherHolds);
  return holds;
}

export function decideStart(f: StartFacts, decision: StartDecisionRecord | null): StartVerdict {
  const holds = holdsFor(f);
  if (decision) {
    // A "may start" lets the boat start over what the organiser saw; anything new holds it again until
    // the organiser decides again. A "held" stands whatever else changes.
    const newSinceDecision = decision.mayStart ? holds.filter((h) => !decision.holdsSeen.includes(h)) : [];
    if (newSinceDecision.length) return { mayStart: false, holds, basis: 'held', decision, newSinceDecision };
    return { mayStart: decision.mayStart, holds, basis: 'organiser', decision, newSinceDecision };
  }
  return {
    mayStart: holds.length === 0,
    holds,
    basis: holds.length ? 'held' : 'clear',
    decision: null,
    newSinceDecision: [],
  };
}

/** The meeting's days (YYYY-MM-DD, inclusive), at most 31. */
export function meetingDays(startsOn: string, endsOn: string): string[] {
  const days: string[] = [];
  const d = new Date(`${startsOn}T00:00:00Z`);
  const end = new Date(`${endsOn}T00:00:00Z`);
  while (d <= end && days.length < 31) {
    days.push(d.toISOString().slice(0, 10));
    d.setUTCDate(d.getUTCDate() + 1);
  }
  return days;
}

export type StartListCsvRow = {
  raceNumber: number;
  boatName: string;
  classCode: string;
  entrant: string;
  verdict: StartVerdict;
};

/** The start list for the timing system (RFC 4180, formula-like cells neutralised): one line per boat, may start yes/no and why. */
export function startListCsv(day: string, rows: StartListCsvRow[]): string {
  const head = ['day', 'race_number', 'boat', 'class', 'entrant', 'may_start', 'held_for', 'organiser_decision'];
  const lines = rows.map((r) =>
    [
      day,
      r.raceNumber,
      r.boatName,
      r.classCode,
      r.entrant,
      r.verdict.mayStart ? 'yes' : 'no',
      r.verdict.holds.join(' '),
      r.verdict.decision
        ? `${r.verdict.decision.mayStart ? 'allowed' : 'held'} by ${r.verdict.decision.decidedBy}: ${r.verdict.decision.reason}` +
          (r.verdict.newSinceDecision.length ? ` (no longer covers: ${r.verdict.newSinceDecision.join(' ')})` : '')
        : '',
    ]
      .map(csvCell)
      .join(','),
  );
  return [head.join(','), ...lines].join('\r\n') + '\r\n';
}
