import 'server-only';
import { QueryTypes, UniqueConstraintError, type Transaction } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { IssueSealBatchInput, batchSealNumbers, sealNumberKey } from '@/lib/core/inputs/seals';
import { sealKeySql } from './seal-key';
import type { SealBatchView } from './list-seal-batches';

const clash = (numbers: string[]) =>
  new AppError(
    'seal_numbers_taken',
    409,
    `${numbers.length === 1 ? 'Seal number' : `${numbers.length} seal numbers`} already in the register: ${numbers
      .slice(0, 20)
      .join(
        ', ',
      )}${numbers.length > 20 ? ', …' : ''}. A seal number is issued once in your organisation’s register, at any of its meetings.`,
    { numbers },
  );

/**
 * The chief scrutineer (or organiser) issues a batch of numbered seals to the meeting: the batch and
 * every seal are written together. A number already in the register of the organisation running the
 * meeting, at any of its meetings (compared without leading zeros: "ZZ-01" is "ZZ-1"), refuses the
 * whole batch and names the clashing numbers. Another
 * organisation's register is neither consulted nor told about (each seal carries its issuer, set by
 * a trigger from its batch's meeting; the unique index is per issuer).
 */
export async function issueSealBatch(actor: Actor | null, eventId: string, raw: unknown): Promise<SealBatchView> {
  assertCan(actor, 'instrument.manage', { eventId });
  const input = IssueSealBatchInput.parse(raw);
  const { models, sequelize } = getDb();
  const event = await models.Event.findByPk(eventId, { attributes: ['id', 'organisationId'] });
  if (!event) throw new AppError('not_found', 404, 'No such meeting.');
  const takenInRegister = (transaction?: Transaction) =>
    sequelize.query<{ number: string }>(
      `select upper(number) as number from seals
        where organisation_id = :organisationId and ${sealKeySql('number')} in (:keys) order by 1`,
      {
        replacements: { keys: numbers.map(sealNumberKey), organisationId: event.organisationId },
        type: QueryTypes.SELECT,
        transaction,
      },
    );
  const numbers = batchSealNumbers(input.prefix, input.firstNumber, input.lastNumber);
  if (numbers.some((n) => n.length > 40))
    throw new AppError('invalid_input', 400, 'prefix: Prefix and number together must fit 40 characters.', [
      { field: 'prefix', message: 'Prefix and number together must fit 40 characters.' },
    ]);
  try {
    return await sequelize.transaction(async (transaction) => {
      // One batch at a time per register: the leading-zero comparison is this check's, not an index's.
      await sequelize.query('select pg_advisory_xact_lock(hashtext(:lock))', {
        replacements: { lock: `seal-register:${event.organisationId}` },
        transaction,
      });
      const taken = await takenInRegister(transaction);
      if (taken.length) throw clash(taken.map((t) => t.number));
      const batch = await models.SealBatch.create(
        {
          eventId,
          prefix: input.prefix,
          firstNumber: input.firstNumber,
          lastNumber: input.lastNumber,
          note: input.note,
          issuedById: actor.id,
        },
        { transaction },
      );
      await sequelize.query('insert into seals (batch_id, number) select :batchId, unnest(array[:numbers]::text[])', {
        replacements: { batchId: batch.id, numbers },
        transaction,
      });
      return {
        id: batch.id,
        prefix: batch.prefix,
        firstNumber: batch.firstNumber,
        lastNumber: batch.lastNumber,
        firstSeal: numbers[0],
        lastSeal: numbers[numbers.length - 1],
        count: numbers.length,
        used: 0,
        note: batch.note,
        issuedBy: actor.name ?? actor.email,
        createdAt: batch.createdAt.toISOString(),
      };
    });
  } catch (err) {
    // Another batch took a number between the check and the insert: the unique index says so.
    if (err instanceof UniqueConstraintError) {
      const taken = await takenInRegister();
      throw clash(taken.map((t) => t.number));
    }
    throw err;
  }
}
