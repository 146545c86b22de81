import 'server-only';
import { Op, UniqueConstraintError } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, can, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { CreateClassInput, DEFAULT_CLASS_RULES } from '@/lib/core/inputs/class-rules';
import { toClassDto, toRuleVersionDto, type ClassDto, type RuleVersionDto } from './class-dto';

/** Creates a class with a draft rule version 1: defaults, or a copy of another class's latest rules. */
export async function createClass(actor: Actor | null, eventId: string, raw: unknown): Promise<ClassDto> {
  assertCan(actor, 'class.edit', { eventId });
  const input = CreateClassInput.parse(raw);
  const { sequelize, models } = getDb();
  let rules = DEFAULT_CLASS_RULES;
  let description = input.description;
  if (input.copyFromClassId) {
    const source = await models.RaceClass.findByPk(input.copyFromClassId);
    // Copy only from a class whose event this person also organises.
    if (!source || !can(actor, 'class.edit', { eventId: source.eventId })) {
      throw new AppError('not_found', 404, 'No class to copy from that you organise.', [
        { field: 'copyFromClassId', message: 'Choose a class from a meeting you organise.' },
      ]);
    }
    const latest = await models.ClassRuleVersion.findOne({
      where: { classId: source.id },
      order: [['version', 'DESC']],
    });
    if (latest) rules = latest.rules;
    description ||= source.description;
  }
  try {
    return await sequelize.transaction(async (transaction) => {
      const c = await models.RaceClass.create(
        { eventId, name: input.name, code: input.code, description, copiedFromId: input.copyFromClassId ?? null },
        { transaction },
      );
      await models.ClassRuleVersion.create(
        { classId: c.id, version: 1, rules, changeNote: input.copyFromClassId ? 'Copied from an earlier class' : '' },
        { transaction },
      );
      return toClassDto(c);
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError) {
      throw new AppError('conflict', 409, 'This meeting already has a class with that code.', [
        { field: 'code', message: 'This meeting already has a class with that code.' },
      ]);
    }
    throw err;
  }
}

export type ClassSummary = ClassDto & {
  latestVersion: number;
  latestStatus: 'draft' | 'published';
  publishedVersion: number | null;
};

/** Classes of an event with their newest version's state (for the organiser). */
export async function listEventClasses(actor: Actor | null, eventId: string): Promise<ClassSummary[]> {
  assertCan(actor, 'class.edit', { eventId });
  const { models } = getDb();
  const classes = await models.RaceClass.findAll({ where: { eventId }, order: [['code', 'ASC']] });
  if (classes.length === 0) return [];
  const versions = await models.ClassRuleVersion.findAll({
    where: { classId: { [Op.in]: classes.map((c) => c.id) } },
    attributes: ['classId', 'version', 'status'],
  });
  return classes.map((c) => {
    const own = versions.filter((v) => v.classId === c.id);
    const latest = own.reduce((a, b) => (b.version > a.version ? b : a), own[0]);
    const published = own.filter((v) => v.status === 'published').map((v) => v.version);
    return {
      ...toClassDto(c),
      latestVersion: latest?.version ?? 0,
      latestStatus: latest?.status ?? 'draft',
      publishedVersion: published.length ? Math.max(...published) : null,
    };
  });
}

/** Classes the person organises at other meetings, to copy from. */
export async function listCopyableClasses(actor: Actor, exceptEventId: string) {
  const eventIds = Object.entries(actor.eventRoles)
    .filter(([id, roles]) => id !== exceptEventId && roles.includes('organiser'))
    .map(([id]) => id);
  if (eventIds.length === 0) return [];
  const { models } = getDb();
  const classes = await models.RaceClass.findAll({
    where: { eventId: { [Op.in]: eventIds } },
    include: [{ model: models.Event, attributes: ['name'] }],
  });
  return classes.map((c) => ({
    id: c.id,
    label: `${(c as unknown as { event: { name: string } }).event.name} — ${c.code} ${c.name}`,
  }));
}

/** One class with every version of its rules, newest first. */
export async function getClassWithVersions(
  actor: Actor | null,
  eventId: string,
  classId: string,
): Promise<{ raceClass: ClassDto; versions: RuleVersionDto[]; timeZone: string }> {
  assertCan(actor, 'class.edit', { eventId });
  const { models } = getDb();
  const c = await models.RaceClass.findOne({
    where: { id: classId, eventId },
    include: [{ model: models.Event, attributes: ['timeZone'] }],
  });
  if (!c) throw new AppError('not_found', 404, 'No such class at this meeting.');
  const versions = await models.ClassRuleVersion.findAll({ where: { classId }, order: [['version', 'DESC']] });
  const timeZone = (c as unknown as { event?: { timeZone: string } }).event?.timeZone ?? 'UTC';
  return { raceClass: toClassDto(c), versions: versions.map(toRuleVersionDto), timeZone };
}
