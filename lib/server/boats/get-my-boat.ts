import 'server-only';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import { ensureCurrentTag, tagUrl } from '@/lib/server/tags/tokens';
import { listDeclarationVersions, type DeclarationVersionView } from './list-declaration-versions';
import { findOwnBoat, toBoatView, toDocumentView, type BoatDocumentView, type BoatView } from './boat-view';

export type BoatEntrySummary = {
  id: string;
  eventId: string;
  eventName: string;
  startsOn: string;
  classId: string;
  className: string;
  classCode: string;
  raceNumber: number;
  status: string;
};

export type MyBoat = {
  boat: BoatView;
  documents: BoatDocumentView[];
  tag: { token: string; url: string; issuedAt: string };
  /** Live entries (awaiting payment or entered) at meetings not yet over, soonest first. */
  entries: BoatEntrySummary[];
  /** The declaration's versions, newest first: who, when, what changed. */
  declarationVersions: DeclarationVersionView[];
};

/** The actor's own boat with its documents, current tag (issued on first view) and live entries. */
export async function getMyBoat(actor: Actor | null, boatId: string): Promise<MyBoat> {
  assertCan(actor, 'boat.manage_own');
  const boat = await findOwnBoat(actor, boatId);
  const { models, sequelize } = getDb();
  const [documents, token, declarationVersions] = await Promise.all([
    models.BoatDocument.findAll({ where: { boatId: boat.id }, order: [['createdAt', 'DESC']] }),
    ensureCurrentTag(boat.id),
    listDeclarationVersions(boat.id),
  ]);
  const tag = await models.BoatTag.findOne({ where: { token } });
  const [entries] = await sequelize.query(
    `select e.id, e.event_id as "eventId", ev.name as "eventName", ev.starts_on as "startsOn", c.id as "classId", c.name as "className",
            c.code as "classCode", e.race_number as "raceNumber", e.status
       from entries e join events ev on ev.id = e.event_id join race_classes c on c.id = e.class_id
      where e.boat_id = :boatId and e.entrant_id = :uid and e.status in ('awaiting_payment', 'entered')
        and ev.ends_on >= current_date
      order by ev.starts_on`,
    { replacements: { boatId: boat.id, uid: actor.id } },
  );
  return {
    boat: toBoatView(boat),
    documents: documents.map(toDocumentView),
    tag: { token, url: tagUrl(token), issuedAt: (tag?.issuedAt ?? new Date()).toISOString() },
    entries: (entries as (Omit<BoatEntrySummary, 'startsOn'> & { startsOn: string | Date })[]).map((e) => ({
      ...e,
      startsOn: typeof e.startsOn === 'string' ? e.startsOn : e.startsOn.toISOString().slice(0, 10),
    })),
    declarationVersions,
  };
}
