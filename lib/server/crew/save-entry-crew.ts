import 'server-only';
import { randomUUID } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError, type FieldIssue } from '@/lib/core/errors';
import { parseId } from '@/lib/server/http/ids';
import { SaveCrewInput, type GearItemInput } from '@/lib/core/inputs/crew';
import { ageOn, isMinorOn } from '@/lib/core/crew/assess-crew';
import { ADULT_AGE_YEARS } from '@/lib/core/crew/crew-terms';
import { formatCalendarDate } from '@/lib/core/format/time';
import { buildEntryCrewView, loadEntryContext, type EntryCrewView } from './crew-data';

/**
 * The entrant replaces the people and gear of their own entry. Ownership is checked before the body is
 * read. A person under 18 on the meeting's first day without a guardian's consent is refused, naming the
 * field. Items keep their ids (sent back by the form), so the dock's confirmation of an unchanged item
 * still counts; an id this entry does not hold is refused (no borrowing another entry's confirmed item).
 */
export async function saveEntryCrew(
  actor: Actor | null,
  entryId: string,
  readInput: () => Promise<unknown>,
): Promise<EntryCrewView> {
  assertCan(actor, 'entry.submit_own');
  const id = parseId(entryId, 'entry');
  const entry = await loadEntryContext(id);
  if (!entry || entry.entrantId !== actor.id) throw new AppError('not_found', 404, 'No such entry among yours.');
  if (entry.status === 'withdrawn' || entry.status === 'cancelled')
    throw new AppError('conflict', 409, 'This entry is withdrawn or cancelled: its crew can no longer change.');
  const input = SaveCrewInput.parse(await readInput());

  const consent: FieldIssue[] = [];
  input.members.forEach((m, i) => {
    if (isMinorOn(m.bornOn, entry.startsOn) && !m.guardian)
      consent.push({
        field: `members.${i}.guardian`,
        message: `${m.name} is ${ageOn(m.bornOn, entry.startsOn)} on the meeting's first day (${formatCalendarDate(entry.startsOn)}), under ${ADULT_AGE_YEARS}: record a parent's or guardian's consent (their name and the date they signed).`,
      });
  });
  if (consent.length) throw new AppError('consent_required', 400, consent.map((c) => c.message).join(' '), consent);

  const { sequelize, models } = getDb();
  await sequelize.transaction(async (transaction) => {
    // The entry's row lock orders two saves of one entry (two tabs): the later one wins whole.
    await sequelize.query('select id from entries where id = :id for update', {
      replacements: { id },
      transaction,
      type: QueryTypes.SELECT,
    });
    const held = await sequelize.query<{ id: string; kind: 'member' | 'gear' }>(
      `select id, 'member' as kind from entry_crew_members where entry_id = :id
       union all select id, 'gear' from entry_gear_items where entry_id = :id`,
      { replacements: { id }, transaction, type: QueryTypes.SELECT },
    );
    const heldMembers = new Set(held.filter((h) => h.kind === 'member').map((h) => h.id));
    const heldGear = new Set(held.filter((h) => h.kind === 'gear').map((h) => h.id));
    const unknown: FieldIssue[] = [];
    input.members.forEach((m, i) => {
      if (m.id && !heldMembers.has(m.id))
        unknown.push({ field: `members.${i}.id`, message: 'Not a person of this entry.' });
      m.gear.forEach((g, j) => {
        if (g.id && !heldGear.has(g.id))
          unknown.push({ field: `members.${i}.gear.${j}.id`, message: 'Not an item of this entry.' });
      });
    });
    input.boatGear.forEach((g, j) => {
      if (g.id && !heldGear.has(g.id))
        unknown.push({ field: `boatGear.${j}.id`, message: 'Not an item of this entry.' });
    });
    if (unknown.length) throw new AppError('invalid_input', 400, 'Some items are not of this entry.', unknown);

    // Replace whole (the one-driver index would trip over a swap done row by row); ids are kept.
    await models.EntryGearItem.destroy({ where: { entryId: id }, transaction });
    await models.EntryCrewMember.destroy({ where: { entryId: id }, transaction });
    const gearRow = (g: GearItemInput, crewMemberId: string | null, position: number) => ({
      id: g.id ?? randomUUID(),
      entryId: id,
      crewMemberId,
      position,
      kind: g.kind,
      standard: g.standard,
      serial: g.serial,
      dateKind: g.dateKind,
      dueOn: g.dueOn,
    });
    const gearRows: ReturnType<typeof gearRow>[] = [];
    const memberRows = input.members.map((m, position) => {
      const memberId = m.id ?? randomUUID();
      m.gear.forEach((g, j) => gearRows.push(gearRow(g, memberId, position * 10 + j)));
      return {
        id: memberId,
        entryId: id,
        position,
        role: m.role,
        userId: m.isEntrant ? actor.id : null,
        name: m.name,
        bornOn: m.bornOn,
        licenceIssuedBy: m.licence?.issuedBy ?? null,
        licenceGrade: m.licence?.grade ?? null,
        licenceNumber: m.licence?.number ?? null,
        licenceExpiresOn: m.licence?.expiresOn ?? null,
        medicalExpiresOn: m.medicalExpiresOn,
        guardianName: m.guardian?.name ?? null,
        guardianConsentOn: m.guardian?.consentOn ?? null,
      };
    });
    input.boatGear.forEach((g, j) => gearRows.push(gearRow(g, null, 1000 + j)));
    await models.EntryCrewMember.bulkCreate(memberRows, { transaction });
    await models.EntryGearItem.bulkCreate(gearRows, { transaction });
  });
  return buildEntryCrewView(entry);
}
