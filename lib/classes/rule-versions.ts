import 'server-only';
import { Op } from 'sequelize';
import { getDb } from '@/lib/db';
import { assertCan, type Actor } from '@/lib/auth/actor';
import { AppError } from '@/lib/http/errors';
import { ClassRulesForm, PublishRulesInput } from '@/lib/validations/class-rules';
import { toRuleVersionDto, type RuleVersionDto } from './class-dto';

async function findClass(eventId: string, classId: string) {
  const c = await getDb().models.RaceClass.findOne({ where: { id: classId, eventId } });
  if (!c) throw new AppError('not_found', 404, 'No such class at this meeting.');
  return c;
}

/**
 * Saves the class's draft rules. Published versions are frozen, so editing after publication
 * opens a new draft version (the previous number + 1) and leaves the old one untouched.
 */
export async function saveDraftRules(actor: Actor | null, eventId: string, classId: string, raw: unknown): Promise<RuleVersionDto> {
  assertCan(actor, 'class.edit', { eventId });
  const rules = ClassRulesForm.parse(raw);
  await findClass(eventId, classId);
  const { sequelize, models } = getDb();
  return sequelize.transaction(async (transaction) => {
    const latest = await models.ClassRuleVersion.findOne({ where: { classId }, order: [['version', 'DESC']], lock: transaction.LOCK.UPDATE, transaction });
    if (latest && latest.status === 'draft') {
      await latest.update({ rules }, { transaction });
      return toRuleVersionDto(latest);
    }
    const draft = await models.ClassRuleVersion.create({ classId, version: (latest?.version ?? 0) + 1, rules }, { transaction });
    return toRuleVersionDto(draft);
  });
}

/** Publishes the draft: it becomes a frozen, numbered version in force from its effective time. */
export async function publishRules(actor: Actor | null, eventId: string, classId: string, raw: unknown): Promise<RuleVersionDto> {
  assertCan(actor, 'class.edit', { eventId });
  const input = PublishRulesInput.parse(raw ?? {});
  await findClass(eventId, classId);
  const { sequelize, models } = getDb();
  return sequelize.transaction(async (transaction) => {
    const draft = await models.ClassRuleVersion.findOne({ where: { classId, status: 'draft' }, lock: transaction.LOCK.UPDATE, transaction });
    if (!draft) throw new AppError('conflict', 409, 'There is no draft to publish: edit the rules first.');
    const now = new Date();
    const effectiveFrom = input.effectiveFrom ? new Date(input.effectiveFrom) : now;
    const previous = await models.ClassRuleVersion.findOne({
      where: { classId, status: 'published' },
      order: [['effectiveFrom', 'DESC']],
      transaction,
    });
    if (previous?.effectiveFrom && effectiveFrom < previous.effectiveFrom) {
      throw new AppError('invalid_input', 400, 'A new version cannot take effect before the version it replaces.', [
        { field: 'effectiveFrom', message: `Choose a time after ${previous.effectiveFrom.toISOString()} (version ${previous.version}).` },
      ]);
    }
    await draft.update(
      { status: 'published', effectiveFrom, publishedAt: now, publishedById: actor.id, changeNote: input.changeNote || draft.changeNote },
      { transaction },
    );
    return toRuleVersionDto(draft);
  });
}

/** The published version in force for a class at a moment (for inspections and reports). */
export async function findRulesInForce(classId: string, at: Date = new Date()): Promise<RuleVersionDto | null> {
  const v = await getDb().models.ClassRuleVersion.findOne({
    where: { classId, status: 'published', effectiveFrom: { [Op.lte]: at } },
    order: [['effectiveFrom', 'DESC'], ['version', 'DESC']],
  });
  return v ? toRuleVersionDto(v) : null;
}
