import type { Actor } from '@/lib/server/auth/actor';
import { getEntryCrew } from '@/lib/server/crew/get-entry-crew';
import { CREW_ROLE_LABELS, GEAR_DATE_KIND_LABELS } from '@/lib/core/crew/crew-terms';
import { formatCalendarDate } from '@/lib/core/format/time';
import { CrewFindings } from './crew-findings';
import { CrewForm } from './crew-form';

/** The entrant's view of one entry's people and dated gear, with what is not in order and the form to change them. */
export async function CrewEntryPanel({ actor, entryId }: { actor: Actor; entryId: string }) {
  const view = await getEntryCrew(actor, entryId);
  const { assessment, requirements } = view;
  return (
    <section
      className="space-y-2 border-t border-paper-deep pt-2"
      data-testid="crew-panel"
      aria-label="Crew and safety gear"
    >
      <h3 className="text-lg">Crew and safety gear</h3>
      <CrewFindings findings={assessment.findings} day={assessment.day} />
      {view.members.length > 0 && (
        <ul className="space-y-1" data-testid="crew-list">
          {view.members.map((m) => (
            <li key={m.id}>
              <span className="font-bold">{CREW_ROLE_LABELS[m.role]}</span> {m.name}
              {m.licence
                ? ` · licence ${m.licence.grade} ${m.licence.number} (${m.licence.issuedBy}) to ${formatCalendarDate(m.licence.expiresOn)}`
                : ' · no licence'}
              {m.guardian && ` · guardian's consent: ${m.guardian.name}, ${formatCalendarDate(m.guardian.consentOn)}`}
            </li>
          ))}
        </ul>
      )}
      {assessment.gear.length > 0 && (
        <ul className="space-y-1" data-testid="gear-list">
          {assessment.gear.map((g) => (
            <li key={g.id}>
              {g.wornBy ?? 'Boat'}: {g.label} {g.serial} ({g.standard}) ·{' '}
              {GEAR_DATE_KIND_LABELS[g.dateKind].toLowerCase()} {formatCalendarDate(g.dueOn)}
              {!g.isValidOnDay && <span className="font-bold text-fail-800"> · expired</span>}
            </li>
          ))}
        </ul>
      )}
      <p className="text-sm text-ink-soft">
        {requirements.acceptedLicenceGrades.length
          ? `Licence grades accepted (${requirements.gradesFrom === 'class' ? 'class' : 'meeting'}): ${requirements.acceptedLicenceGrades.join(', ')}.`
          : 'Any licence grade is accepted unless the officials say otherwise.'}
        {requirements.navigatorRequired && ' A navigator is required.'} Dates are judged in the meeting’s time zone (
        {view.entry.timeZone}): an item is valid through the end of its date.
      </p>
      {(view.entry.status === 'awaiting_payment' || view.entry.status === 'entered') && (
        <details>
          <summary className="cursor-pointer font-bold">Change the crew and gear</summary>
          <CrewForm entryId={view.entry.id} members={view.members} boatGear={view.boatGear} />
        </details>
      )}
    </section>
  );
}
