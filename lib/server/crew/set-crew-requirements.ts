import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { fieldError } from '@/lib/core/errors';
import { parseId } from '@/lib/server/http/ids';
import { SetCrewRequirementsInput } from '@/lib/core/inputs/crew';
import { loadRequirements } from './crew-data';

/**
 * The organiser states which licence grades a class (or the whole meeting) accepts and whether a
 * navigator is required; the class's own row wins over the meeting's. Permission before the body.
 */
export async function setCrewRequirements(actor: Actor | null, eventId: string, readInput: () => Promise<unknown>) {
  const id = parseId(eventId, 'meeting');
  assertCan(actor, 'class.edit', { eventId: id });
  const input = SetCrewRequirementsInput.parse(await readInput());
  const grades = [...new Set(input.acceptedLicenceGrades.map((g) => g.trim()))];
  const { sequelize } = getDb();
  if (input.classId) {
    const [cls] = await sequelize.query('select 1 from race_classes where id = :classId and event_id = :id', {
      replacements: { classId: input.classId, id },
      type: QueryTypes.SELECT,
    });
    if (!cls) throw fieldError('classId', 'Choose a class of this meeting.');
  }
  // Each of the two partial unique indexes is its own conflict target (migration 20261203011000).
  const target = input.classId
    ? '(event_id, class_id) where class_id is not null'
    : '(event_id) where class_id is null';
  await sequelize.query(
    `insert into crew_requirements (event_id, class_id, accepted_licence_grades, navigator_required, updated_by_id)
     values (:id, :classId, cast(:grades as jsonb), :navigatorRequired, :actorId)
     on conflict ${target} do update set accepted_licence_grades = excluded.accepted_licence_grades,
        navigator_required = excluded.navigator_required, updated_by_id = excluded.updated_by_id, updated_at = now()`,
    {
      replacements: {
        id,
        classId: input.classId,
        grades: JSON.stringify(grades),
        navigatorRequired: input.navigatorRequired,
        actorId: actor.id,
      },
    },
  );
  const reqs = await loadRequirements(id);
  return { meeting: reqs.meeting, classes: reqs.classes };
}
