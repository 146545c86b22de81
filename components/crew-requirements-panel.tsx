import type { Actor } from '@/lib/server/auth/actor';
import { getCrewRequirements } from '@/lib/server/crew/get-crew-requirements';
import { CrewRequirementsForm } from './crew-requirements-form';

/** On the organiser's class page: which licence grades the class accepts, and whether it needs a navigator. */
export async function CrewRequirementsPanel({
  actor,
  eventId,
  classId,
}: {
  actor: Actor;
  eventId: string;
  classId: string;
}) {
  const { own, meeting, inForce } = await getCrewRequirements(actor, eventId, classId);
  return (
    <section className="card space-y-3" aria-labelledby="crew-requirements" data-testid="crew-requirements">
      <h2 id="crew-requirements">Crew licences</h2>
      <p>
        {inForce.acceptedLicenceGrades.length
          ? `Accepted now (${inForce.gradesFrom === 'class' ? 'this class' : 'the meeting'}): ${inForce.acceptedLicenceGrades.join(', ')}.`
          : 'Any licence grade is accepted now.'}{' '}
        {meeting && !own && 'The meeting’s list applies until this class has its own.'} The required safety items
        (helmet, harness, jacket, fire extinguisher, first-aid kit) come from the class rules above; each is checked
        against its date.
      </p>
      <CrewRequirementsForm
        eventId={eventId}
        classId={classId}
        grades={inForce.acceptedLicenceGrades}
        navigatorRequired={inForce.navigatorRequired}
      />
    </section>
  );
}
