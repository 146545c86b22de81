import 'server-only';
import { checkpointQuietly } from '@/lib/server/chain/chain-service';
import { Op } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { ClassRules, ClassRulesForm, PublishRulesInput } from '@/lib/core/inputs/class-rules';
import { formatTime } from '@/lib/core/format/time';
import { toRuleVersionDto, type RuleVersionDto } from './class-dto';
import { changeNoteRequiredMessage, limitsNothing, limitsNothingMessage } from '../../core/classes/rule-limits';

async function findClass(eventId: string, classId: string) {
  const c = await getDb().models.RaceClass.findOne({ where: { id: classId, eventId } });
  if (!c) throw new AppError('not_found', 404, 'No such class at this meeting.');
  return c;
}

/**
 * Saves the class's draft rules. Published versions are frozen, so editing after publication
 * opens a new draft version (the previous number + 1) and leaves the old one untouched.
 */
export async function saveDraftRules(
  actor: Actor | null,
  eventId: string,
  classId: string,
  raw: unknown,
): Promise<RuleVersionDto> {
  assertCan(actor, 'class.edit', { eventId });
  const rules = ClassRulesForm.parse(raw);
  await findClass(eventId, classId);
  const { sequelize, models } = getDb();
  return sequelize.transaction(async (transaction) => {
    const latest = await models.ClassRuleVersion.findOne({
      where: { classId },
      order: [['version', 'DESC']],
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    if (latest && latest.status === 'draft') {
      await latest.update({ rules }, { transaction });
      return toRuleVersionDto(latest);
    }
    const draft = await models.ClassRuleVersion.create(
      { classId, version: (latest?.version ?? 0) + 1, rules },
      { transaction },
    );
    return toRuleVersionDto(draft);
  });
}

/**
 * Refuses a draft that cannot become a frozen version: rules that limit nothing (see rule-limits.ts),
 * rules the form's schema would refuse (a draft created with defaults was never through it), or a
 * version 2+ without a change note. Every problem at once, each under the field it concerns.
 */
function checkPublishable(draft: { version: number; rules: unknown; changeNote: string }, changeNote: string) {
  const details: { field: string; message: string }[] = [];
  if (limitsNothing(draft.rules as never)) {
    details.push({ field: 'rules', message: limitsNothingMessage(draft.version) });
  } else {
    const parsed = ClassRules.safeParse(draft.rules);
    if (!parsed.success)
      for (const i of parsed.error.issues)
        details.push({ field: ['rules', ...i.path.map(String)].join('.'), message: i.message });
  }
  if (draft.version >= 2 && !(changeNote || draft.changeNote).trim())
    details.push({ field: 'changeNote', message: changeNoteRequiredMessage(draft.version) });
  if (details.length === 0) return;
  const rulesIssue = details.find((d) => d.field.startsWith('rules'));
  // 422: the request is well formed but the draft it names cannot be published as it stands.
  throw new AppError('invalid_input', rulesIssue ? 422 : 400, rulesIssue?.message ?? details[0].message, details);
}

/** Publishes the draft: it becomes a frozen, numbered version in force from its effective time. */
export async function publishRules(
  actor: Actor | null,
  eventId: string,
  classId: string,
  raw: unknown,
): Promise<RuleVersionDto> {
  assertCan(actor, 'class.edit', { eventId });
  const input = PublishRulesInput.parse(raw ?? {});
  const raceClass = await findClass(eventId, classId);
  const { sequelize, models } = getDb();
  const event = await models.Event.findByPk(raceClass.eventId, { attributes: ['timeZone'] });
  const published = await sequelize.transaction(async (transaction) => {
    const draft = await models.ClassRuleVersion.findOne({
      where: { classId, status: 'draft' },
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    if (!draft) throw new AppError('conflict', 409, 'There is no draft to publish: edit the rules first.');
    checkPublishable(draft, input.changeNote);
    const now = new Date();
    const effectiveFrom = input.effectiveFrom ? new Date(input.effectiveFrom) : now;
    const previous = await models.ClassRuleVersion.findOne({
      where: { classId, status: 'published' },
      order: [['effectiveFrom', 'DESC']],
      transaction,
    });
    if (previous?.effectiveFrom && effectiveFrom < previous.effectiveFrom) {
      throw new AppError('invalid_input', 400, 'A new version cannot take effect before the version it replaces.', [
        {
          field: 'effectiveFrom',
          message: `Choose a time after ${formatTime(previous.effectiveFrom, event?.timeZone ?? 'UTC')} (version ${previous.version}).`,
        },
      ]);
    }
    await draft.update(
      {
        status: 'published',
        effectiveFrom,
        publishedAt: now,
        publishedById: actor.id,
        changeNote: input.changeNote || draft.changeNote,
      },
      { transaction },
    );
    return toRuleVersionDto(draft);
  });
  await checkpointQuietly(eventId, `rules of ${raceClass.code} version ${published.version} published`);
  return published;
}

/** The published version in force for a class at a moment (for inspections and reports). */
export async function findRulesInForce(classId: string, at: Date = new Date()): Promise<RuleVersionDto | null> {
  const v = await getDb().models.ClassRuleVersion.findOne({
    where: { classId, status: 'published', effectiveFrom: { [Op.lte]: at } },
    order: [
      ['effectiveFrom', 'DESC'],
      ['version', 'DESC'],
    ],
  });
  return v ? toRuleVersionDto(v) : null;
}
