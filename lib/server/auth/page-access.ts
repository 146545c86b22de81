import 'server-only';
import { cache } from 'react';
import { notFound, redirect } from 'next/navigation';
import type { Permission } from '@/lib/core/auth/permissions';
import { parseId } from '@/lib/server/http/ids';
import { getEventHeading, type EventHeading } from '@/lib/server/events/event-heading';
import { can, getActor, type Actor } from './actor';

type Ids<K extends string> = { [P in K]: string };

export type EventPageAccess<K extends string> = { actor: Actor; eventId: string; ids: Ids<K> };

/** Where a signed-in person without the permission goes. Pass a module-level function (see decideEventPage). */
export type DeniedTo = (actor: Actor, eventId: string) => string;

type Options<K extends string> = {
  /** Further path ids to check (each a UUID, else 404), e.g. ['classId']. */
  ids?: readonly K[];
  /** Where a signed-in person without the permission goes (default /not-allowed). */
  deniedTo?: DeniedTo;
};

/**
 * The decision, made once per request for one question. A page's layout asks it first, outside the
 * segment's loading.tsx, so notFound() and redirect() still answer 404 and 307 (a streamed one answers
 * 200: Next.js 16 docs, loading.js, "Status codes"); the page asks again and gets the same promise.
 * React's cache() compares arguments with Object.is, so the key is plain strings (the path's raw ids,
 * as JSON) with the permission and deniedTo: an inline deniedTo stays correct but is asked twice.
 */
const decideEventPage = cache(
  async (permission: Permission, rawEventId: string, rawIdsJson: string, deniedTo: DeniedTo | undefined) => {
    const actor = await getActor();
    if (!actor) redirect('/sign-in');
    let eventId: string;
    const ids: Record<string, string> = {};
    try {
      eventId = parseId(rawEventId, 'event');
      for (const [key, value] of JSON.parse(rawIdsJson) as [string, string][]) ids[key] = parseId(value);
    } catch {
      notFound();
    }
    if (!can(actor, permission, { eventId })) redirect(deniedTo?.(actor, eventId) ?? '/not-allowed');
    return { actor, eventId, ids };
  },
);

/** The meeting's heading, once per request (the actor is the one object decideEventPage returned). */
const readEventHeading = cache((actor: Actor, eventId: string) => getEventHeading(actor, eventId));

/**
 * How every page of one meeting opens: a signed-in actor (else the sign-in page), well-formed ids in
 * the path (else 404: a malformed id names nothing), then the permission at that meeting (else
 * /not-allowed). The data functions the page calls check again for themselves. Call it from the
 * page's layout too, with the same arguments: that call decides the status, the page's costs nothing.
 */
export async function openEventPage<K extends string = never>(
  params: Promise<{ eventId: string } & { [P in K]: string }>,
  permission: Permission,
  options: Options<K> = {},
): Promise<EventPageAccess<K>> {
  const raw = await params;
  const rawIds = JSON.stringify((options.ids ?? []).map((key) => [key, raw[key] ?? '']));
  const decided = await decideEventPage(permission, raw.eventId, rawIds, options.deniedTo);
  return { actor: decided.actor, eventId: decided.eventId, ids: { ...decided.ids } as Ids<K> };
}

/** openEventPage, then the meeting's heading (404 when the meeting does not exist). */
export async function openEventPageWithHeading<K extends string = never>(
  params: Promise<{ eventId: string } & { [P in K]: string }>,
  permission: Permission,
  options: Options<K> = {},
): Promise<EventPageAccess<K> & { event: EventHeading }> {
  const access = await openEventPage(params, permission, options);
  const event = await readEventHeading(access.actor, access.eventId);
  if (!event) notFound();
  return { ...access, event };
}
