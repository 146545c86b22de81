import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { appUrl } from '@/lib/server/config/env';
import { enqueueMail } from '@/lib/server/mail/outbox';
import { PublishBulletinInput } from '@/lib/core/inputs/series';
import { SERIES_CAUTION } from '@/lib/core/series/series-caution';
import { findSeriesClass } from './series-access';

export type BulletinView = {
  id: string;
  number: number;
  title: string;
  body: string;
  effectiveFrom: string;
  publishedAt: string;
  recipientCount: number;
};

/**
 * Publishes a technical bulletin of the series class (append-only, numbered in order) and queues it, in
 * the same transaction, to every entrant of the class: each person who entered a boat in any of its rounds
 * (entries not withdrawn or cancelled) and each owner of a boat with a season number in the class, once.
 */
export async function publishBulletin(
  actor: Actor | null,
  seriesId: string,
  seriesClassId: string,
  readInput: () => Promise<unknown>,
): Promise<BulletinView> {
  assertCan(actor, 'series.bulletin_publish', { seriesId });
  const input = PublishBulletinInput.parse(await readInput());
  const { sequelize } = getDb();
  return sequelize.transaction(async (transaction) => {
    const cls = await findSeriesClass(seriesId, seriesClassId, transaction);
    await sequelize.query(`select 1 from series_classes where id = :seriesClassId for update`, {
      replacements: { seriesClassId },
      transaction,
    });
    const [{ seriesName }] = await sequelize.query<{ seriesName: string }>(
      `select name || ' ' || season as "seriesName" from series where id = :seriesId`,
      { replacements: { seriesId }, type: QueryTypes.SELECT, transaction },
    );
    const recipients = await sequelize.query<{ email: string; name: string | null }>(
      `select distinct u.email, u.name from users u
        where u.suspended_at is null and u.id in (
          select e.entrant_id from entries e join race_classes rc on rc.id = e.class_id
           where rc.series_class_id = :seriesClassId and e.status in ('awaiting_payment', 'entered')
          union
          select b.owner_id from series_race_numbers n join boats b on b.id = n.boat_id where n.series_class_id = :seriesClassId)
        order by u.email`,
      { replacements: { seriesClassId }, type: QueryTypes.SELECT, transaction },
    );
    const [row] = await sequelize.query<BulletinView>(
      `insert into series_bulletins (series_class_id, number, title, body, effective_from, published_by_id, recipient_count)
       values (:seriesClassId, (select coalesce(max(number), 0) + 1 from series_bulletins where series_class_id = :seriesClassId),
               :title, :body, :effectiveFrom, :actorId, :count)
       returning id, number, title, body, effective_from::text as "effectiveFrom", published_at as "publishedAt",
                 recipient_count as "recipientCount"`,
      {
        replacements: { seriesClassId, ...input, actorId: actor.id, count: recipients.length },
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    await enqueueMail(
      recipients.map((r) => ({
        kind: 'series_bulletin',
        to: r.email,
        subject: `Technical bulletin ${row.number} (${cls.code}): ${input.title}`.slice(0, 200),
        text: [
          `Hello ${r.name ?? r.email},`,
          '',
          `${seriesName}, class ${cls.code} ${cls.name}: technical bulletin ${row.number}, in effect from ${input.effectiveFrom}.`,
          '',
          input.body,
          '',
          `Every bulletin of the class: ${appUrl()}/series/${seriesId}`,
          '',
          SERIES_CAUTION,
        ].join('\n'),
      })),
      transaction,
    );
    return { ...row, publishedAt: new Date(row.publishedAt).toISOString() };
  });
}

/** The class's bulletins, newest first (public, as the rules they amend). */
export async function listBulletins(seriesId: string, seriesClassId: string): Promise<BulletinView[]> {
  await findSeriesClass(seriesId, seriesClassId);
  const rows = await getDb().sequelize.query<BulletinView>(
    `select id, number, title, body, effective_from::text as "effectiveFrom", published_at as "publishedAt",
            recipient_count as "recipientCount"
       from series_bulletins where series_class_id = :seriesClassId order by number desc`,
    { replacements: { seriesClassId }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ ...r, publishedAt: new Date(r.publishedAt).toISOString() }));
}
