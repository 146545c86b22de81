import 'server-only';
import { Op } from 'sequelize';
import { getDb } from '@/lib/server/db';
import type { Actor } from '@/lib/server/auth/actor';

/** Clubs where the person may create meetings. */
export async function listOrganisingClubs(actor: Actor) {
  if (actor.organiserOf.length === 0) return [];
  const orgs = await getDb().models.Organisation.findAll({
    where: { id: { [Op.in]: actor.organiserOf } },
    order: [['name', 'ASC']],
  });
  return orgs.map((o) => ({ id: o.id, name: o.name }));
}
