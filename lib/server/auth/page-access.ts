import 'server-only';
import { notFound, redirect } from 'next/navigation';
import type { Permission } from '@/lib/core/auth/permissions';
import { parseId } from '@/lib/server/http/ids';
import { getEventHeading, type EventHeading } from '@/lib/server/events/event-heading';
import { can, getActor, type Actor } from './actor';

type Ids<K extends string> = { [P in K]: string };

export type EventPageAccess<K extends string> = { actor: Actor; eventId: string; ids: Ids<K> };

type Options<K extends string> = {
  /** Further path ids to check (each a UUID, else 404), e.g. ['classId']. */
  ids?: readonly K[];
  /** Where a signed-in person without the permission goes (default /not-allowed). */
  deniedTo?: (actor: Actor, eventId: string) => string;
};

/**
 * How every page of one meeting opens: a signed-in actor (else the sign-in page), well-formed ids in
 * the path (else 404: a malformed id names nothing), then the permission at that meeting (else
 * /not-allowed). The data functions the page calls check again for themselves.
 */
export async function openEventPage<K extends string = never>(
  params: Promise<{ eventId: string } & { [P in K]: string }>,
  permission: Permission,
  options: Options<K> = {},
): Promise<EventPageAccess<K>> {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  const raw = await params;
  let eventId: string;
  const ids = {} as Ids<K>;
  try {
    eventId = parseId(raw.eventId, 'event');
    for (const key of options.ids ?? []) ids[key] = parseId(raw[key]);
  } catch {
    notFound();
  }
  if (!can(actor, permission, { eventId })) redirect(options.deniedTo?.(actor, eventId) ?? '/not-allowed');
  return { actor, eventId, ids };
}

/** openEventPage, then the meeting's heading (404 when the meeting does not exist). */
export async function openEventPageWithHeading<K extends string = never>(
  params: Promise<{ eventId: string } & { [P in K]: string }>,
  permission: Permission,
  options: Options<K> = {},
): Promise<EventPageAccess<K> & { event: EventHeading }> {
  const access = await openEventPage(params, permission, options);
  const event = await getEventHeading(access.actor, access.eventId);
  if (!event) notFound();
  return { ...access, event };
}
