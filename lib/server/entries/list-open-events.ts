import 'server-only';
import { QueryTypes } from 'sequelize';
import { getDb } from '@/lib/server/db';
import { assertCan, type Actor } from '@/lib/server/auth/actor';
import type { ClassRules } from '@/lib/core/inputs/class-rules';

export type OpenClass = {
  id: string;
  name: string;
  code: string;
  description: string;
  rulesVersion: number;
  rules: ClassRules;
};
export type OpenEvent = {
  id: string;
  name: string;
  venue: string;
  startsOn: string;
  endsOn: string;
  entryFeeMinor: number;
  currency: string;
  /** A boat may enter several classes here (keeping one race number). */
  severalClassesPerBoat: boolean;
  classes: OpenClass[];
};

const day = (v: string | Date) => (typeof v === 'string' ? v : v.toISOString().slice(0, 10));

/**
 * Meetings taking entries, each with the classes that have published rules and the latest
 * published version of those rules (a class without published rules cannot be entered yet).
 */
export async function listOpenEvents(actor: Actor | null): Promise<OpenEvent[]> {
  assertCan(actor, 'entry.submit_own');
  const { sequelize } = getDb();
  const events = await sequelize.query<
    Omit<OpenEvent, 'classes' | 'startsOn' | 'endsOn'> & { startsOn: string | Date; endsOn: string | Date }
  >(
    `select id, name, venue, starts_on as "startsOn", ends_on as "endsOn", entry_fee_minor as "entryFeeMinor", currency,
            several_classes_per_boat as "severalClassesPerBoat"
       from events where status = 'entries_open' order by starts_on, name`,
    { type: QueryTypes.SELECT },
  );
  if (events.length === 0) return [];
  const classes = await sequelize.query<OpenClass & { eventId: string }>(
    `select distinct on (c.id) c.id, c.event_id as "eventId", c.name, c.code, c.description,
            v.version as "rulesVersion", v.rules
       from race_classes c join class_rule_versions v on v.class_id = c.id and v.status = 'published'
      where c.event_id in (:ids)
      order by c.id, v.effective_from desc, v.version desc`,
    { replacements: { ids: events.map((e) => e.id) }, type: QueryTypes.SELECT },
  );
  return events.map((e) => ({
    ...e,
    startsOn: day(e.startsOn),
    endsOn: day(e.endsOn),
    classes: classes
      .filter((c) => c.eventId === e.id)
      .sort((a, b) => a.code.localeCompare(b.code))
      .map(({ eventId: _e, ...c }) => c),
  }));
}
