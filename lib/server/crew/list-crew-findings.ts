import 'server-only';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { parseId } from '@/lib/server/http/ids';
import { assessCrew, meetingDayFor, type CrewFinding } from '@/lib/core/crew/assess-crew';
import { loadCrewFacts, loadEventEntryContexts, loadRequirements } from './crew-data';

export type CrewFindingRow = {
  entryId: string;
  raceNumber: number;
  boatName: string;
  classCode: string;
  findings: CrewFinding[];
};

/**
 * For the chief scrutineer's board, before the boats arrive: every active entry of the meeting whose
 * people or gear are not in order (or run out during the meeting) on today's meeting day. Three statements.
 */
export async function listCrewFindings(actor: Actor | null, eventId: string, now = new Date()) {
  const id = parseId(eventId, 'meeting');
  assertCan(actor, 'inspection.board', { eventId: id });
  const entries = await loadEventEntryContexts(id);
  const [facts, reqs] = await Promise.all([loadCrewFacts(entries.map((e) => e.id)), loadRequirements(id)]);
  const rows: CrewFindingRow[] = [];
  // Boats with nothing declared yet are one line on the board, not a list of the same findings each.
  const undeclared: { entryId: string; raceNumber: number }[] = [];
  for (const e of entries) {
    const f = facts.get(e.id) ?? { members: [], boatGear: [], checks: [], signOns: [] };
    if (f.members.length === 0 && f.boatGear.length === 0) {
      undeclared.push({ entryId: e.id, raceNumber: e.raceNumber });
      continue;
    }
    const a = assessCrew(f.members, f.boatGear, reqs.forClass(e.classId), e, now, f.checks);
    if (a.findings.length)
      rows.push({
        entryId: e.id,
        raceNumber: e.raceNumber,
        boatName: e.boatName,
        classCode: e.classCode,
        findings: a.findings,
      });
  }
  return { day: entries[0] ? meetingDayFor(entries[0], now) : null, rows, undeclared, entryCount: entries.length };
}
