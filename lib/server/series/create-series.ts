import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { can, type Actor } from '@/lib/server/auth/actor';
import { AppError, fieldError } from '@/lib/core/errors';
import { CreateSeriesInput } from '@/lib/core/inputs/series';

/**
 * Starts a series for one or more organisations. Its starter must be an organiser of every organisation
 * named (or the site administrator) and becomes its secretary. Checked before the body is read: someone
 * who organises nowhere is refused at once.
 */
export async function createSeries(
  actor: Actor | null,
  readInput: () => Promise<unknown>,
): Promise<{ id: string; name: string; season: number }> {
  if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
  if (!actor.isAdmin && actor.organiserOf.length === 0)
    throw new AppError('forbidden', 403, 'Only an organiser may start a series.');
  const input = CreateSeriesInput.parse(await readInput());
  const orgIds = [...new Set(input.organisationIds)];
  for (const organisationId of orgIds)
    if (!can(actor, 'series.create', { organisationId }))
      throw fieldError('organisationIds', 'You may only start a series for organisations you organise for.', 403);
  const { sequelize } = getDb();
  const created = sequelize.transaction(async (transaction) => {
    const found = await sequelize.query<{ id: string }>(`select id from organisations where id in (:orgIds)`, {
      replacements: { orgIds },
      type: QueryTypes.SELECT,
      transaction,
    });
    if (found.length !== orgIds.length)
      throw fieldError('organisationIds', 'One of these organisations does not exist.');
    const [taken] = await sequelize.query(
      `select 1 from series where lower(name) = lower(:name) and season = :season`,
      {
        replacements: input,
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    if (taken) throw fieldError('name', 'A series of this name already runs this season.', 409);
    const [row] = await sequelize.query<{ id: string; name: string; season: number }>(
      `with s as (insert into series (name, season, created_by_id) values (:name, :season, :actorId) returning id, name, season),
            o as (insert into series_organisations (series_id, organisation_id) select s.id, x from s, unnest(array[:orgIds]::uuid[]) x),
            m as (insert into series_officials (series_id, user_id, role, appointed_by_id) select s.id, :actorId, 'series_secretary', :actorId from s)
       select * from s`,
      { replacements: { ...input, orgIds, actorId: actor.id }, type: QueryTypes.SELECT, transaction },
    );
    return row;
  });
  // Two starters racing past the check above: the unique index decides, and the loser hears 409.
  return created.catch((e: unknown) => {
    if ((e as { parent?: { code?: string } })?.parent?.code === '23505')
      throw fieldError('name', 'A series of this name already runs this season.', 409);
    throw e;
  });
}
