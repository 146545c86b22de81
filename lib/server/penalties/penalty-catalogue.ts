import 'server-only';
import { QueryTypes, UniqueConstraintError } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, can, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { recordAuditEvent } from '@/lib/server/audit/record-audit-event';
import { AddCatalogueItemInput } from '../../core/inputs/penalties';
import type { PenaltyKind } from '../../core/penalties/penalty-kinds';

export type CatalogueItemView = {
  id: string;
  code: string;
  kind: PenaltyKind;
  amount: number | null;
  label: string;
  ruleReference: string;
  createdAt: string;
};

const SELECT = `select id, code, kind, amount, label, rule_reference as "ruleReference", created_at as "createdAt"
                  from penalty_catalogue_items`;

/** The meeting's penalty catalogue, for its organiser and stewards (who impose from it). */
export async function listPenaltyCatalogue(actor: Actor | null, eventId: string): Promise<CatalogueItemView[]> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  if (!can(actor, 'penalty.catalogue_manage', { eventId }) && !can(actor, 'penalty.apply', { eventId }))
    throw new AppError('forbidden', 403, 'You are not allowed to do this.');
  return readCatalogue(eventId);
}

export async function readCatalogue(eventId: string): Promise<CatalogueItemView[]> {
  const rows = await getDb().sequelize.query<CatalogueItemView & { createdAt: Date }>(
    `${SELECT} where event_id = :eventId order by lower(code)`,
    { replacements: { eventId }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ ...r, createdAt: new Date(r.createdAt).toISOString() }));
}

/**
 * Adds one item to the meeting's catalogue. Items are append-only: a penalty copies the item's words and
 * amount when imposed, so a decision reads as it was made. A code is unique per meeting (any case).
 */
export async function addCatalogueItem(
  actor: Actor | null,
  eventId: string,
  readInput: () => Promise<unknown>,
): Promise<CatalogueItemView> {
  assertCan(actor, 'penalty.catalogue_manage', { eventId });
  const input = AddCatalogueItemInput.parse(await readInput());
  const { sequelize } = getDb();
  try {
    return await sequelize.transaction(async (transaction) => {
      const [row] = await sequelize.query<CatalogueItemView & { createdAt: Date }>(
        `insert into penalty_catalogue_items (event_id, code, kind, amount, label, rule_reference, created_by_id)
         values (:eventId, :code, :kind, :amount, :label, :ruleReference, :actorId)
         returning id, code, kind, amount, label, rule_reference as "ruleReference", created_at as "createdAt"`,
        {
          replacements: { eventId, ...input, actorId: actor.id },
          type: QueryTypes.SELECT,
          transaction,
        },
      );
      await recordAuditEvent(
        {
          eventId,
          actorId: actor.id,
          subjectType: 'penalty_catalogue',
          subjectId: row.id,
          action: 'penalty_catalogue.added',
          details: { ...input },
        },
        transaction,
      );
      return { ...row, createdAt: new Date(row.createdAt).toISOString() };
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError)
      throw new AppError('duplicate_code', 409, `code: ${input.code} is already in this meeting's catalogue.`, [
        { field: 'code', message: 'This code is already in the catalogue.' },
      ]);
    throw err;
  }
}
