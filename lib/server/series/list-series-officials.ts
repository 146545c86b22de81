import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import type { SeriesOfficialRole } from '@/lib/core/inputs/series';
import { assertSeriesExists } from './series-access';

export type SeriesOfficialsView = {
  officials: { userId: string; name: string | null; email: string; role: SeriesOfficialRole; appointedAt: string }[];
  /** Invitations not yet accepted and not expired: the role waits for whoever holds the mailbox. */
  pendingInvitations: { id: string; email: string; role: SeriesOfficialRole; invitedAt: string; expiresAt: string }[];
};

/** The series' officials and its open invitations, for the secretary (series.manage). */
export async function listSeriesOfficials(actor: Actor | null, seriesId: string): Promise<SeriesOfficialsView> {
  assertCan(actor, 'series.manage', { seriesId });
  await assertSeriesExists(seriesId);
  const { sequelize } = getDb();
  type Stamped<T, K extends string> = Omit<T, K> & Record<K, Date>;
  const officials = await sequelize.query<Stamped<SeriesOfficialsView['officials'][number], 'appointedAt'>>(
    `select u.id as "userId", u.name, u.email, o.role, o.appointed_at as "appointedAt"
       from series_officials o join users u on u.id = o.user_id
      where o.series_id = :seriesId order by o.role, lower(coalesce(u.name, u.email))`,
    { replacements: { seriesId }, type: QueryTypes.SELECT },
  );
  const invitations = await sequelize.query<
    Stamped<SeriesOfficialsView['pendingInvitations'][number], 'invitedAt' | 'expiresAt'>
  >(
    `select id, email, role, created_at as "invitedAt", expires_at as "expiresAt"
       from staff_invitations
      where series_id = :seriesId and accepted_at is null and expires_at > now()
      order by created_at, id`,
    { replacements: { seriesId }, type: QueryTypes.SELECT },
  );
  const iso = (d: Date) => new Date(d).toISOString();
  return {
    officials: officials.map((o) => ({ ...o, appointedAt: iso(o.appointedAt) })),
    pendingInvitations: invitations.map((i) => ({ ...i, invitedAt: iso(i.invitedAt), expiresAt: iso(i.expiresAt) })),
  };
}
