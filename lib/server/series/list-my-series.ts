import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import type { Actor } from '@/lib/server/auth/actor';
import type { Role } from '@/lib/core/auth/permissions';

export type MySeries = {
  id: string;
  name: string;
  season: number;
  roles: Role[];
  classes: { id: string; code: string; name: string }[];
};

/** The series where this person is an official (secretary or series steward), newest season first. */
export async function listMySeries(actor: Actor): Promise<MySeries[]> {
  const ids = Object.keys(actor.seriesRoles);
  if (!ids.length) return [];
  const rows = await getDb().sequelize.query<Omit<MySeries, 'roles'>>(
    `select s.id, s.name, s.season,
            coalesce((select json_agg(json_build_object('id', c.id, 'code', c.code, 'name', c.name) order by c.code)
                        from series_classes c where c.series_id = s.id), '[]') as classes
       from series s where s.id in (:ids) order by s.season desc, s.name`,
    { replacements: { ids }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ ...r, roles: actor.seriesRoles[r.id] ?? [] }));
}
