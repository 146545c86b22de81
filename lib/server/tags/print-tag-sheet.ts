import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { AppError } from '@/lib/core/errors';
import { ensureCurrentTags, tagUrl } from './tokens';
import { buildTagSheetPdf } from '../../core/tags/tag-sheet';

export type SheetFormat = 'a4-2x7' | 'letter-2x5';

/** A printable sheet of QR tags, one label per live entry of the event (optionally one class). */
export async function printTagSheet(
  actor: Actor | null,
  eventId: string,
  opts: { classId?: string; sheet: SheetFormat },
) {
  assertCan(actor, 'tags.print', { eventId });
  const { sequelize, models } = getDb();
  const event = await models.Event.findByPk(eventId);
  if (!event) throw new AppError('not_found', 404, 'No such event.');
  const [rows] = await sequelize.query(
    `select e.race_number as "raceNumber", b.id as "boatId", b.name as "boatName", c.name as "className", c.code as "classCode"
       from entries e join boats b on b.id = e.boat_id join race_classes c on c.id = e.class_id
      where e.event_id = :eventId and e.status in ('awaiting_payment', 'entered') ${opts.classId ? 'and e.class_id = :classId' : ''}
      order by c.code, e.race_number`,
    { replacements: { eventId, classId: opts.classId ?? null } },
  );
  const list = rows as { raceNumber: number; boatId: string; boatName: string; className: string; classCode: string }[];
  const tokens = await ensureCurrentTags(list.map((r) => r.boatId));
  const pdf = await buildTagSheetPdf({
    title: `${event.name} — boat tags`,
    sheet: opts.sheet,
    labels: list.map((r) => ({
      tagUrl: tagUrl(tokens.get(r.boatId)!),
      raceNumber: String(r.raceNumber),
      boatName: r.boatName,
      className: `${r.classCode} ${r.className}`,
    })),
  });
  return { pdf, count: list.length, fileName: `${event.slug}-tags.pdf` };
}
