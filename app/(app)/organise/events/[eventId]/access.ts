import 'server-only';
import { cache } from 'react';
import { notFound } from 'next/navigation';
import type { Actor } from '@/lib/server/auth/actor';
import { openEventPage, openEventPageWithHeading } from '@/lib/server/auth/page-access';
import { getClassWithVersions } from '@/lib/server/classes/manage-classes';
import { AppError } from '@/lib/core/errors';

// Who may open each organiser's page of a meeting. Each page's layout calls its opener before the
// page's loading.tsx streams anything (so a 404 or a redirect keeps its status), the page calls it
// again for its data: one decision per request (page-access.ts and the cache below).
type Params = Promise<{ eventId: string }>;
type ClassParams = Promise<{ eventId: string; classId: string }>;

export const openMeeting = (params: Params) => openEventPage(params, 'event.edit');
export const openEntries = (params: Params) => openEventPageWithHeading(params, 'entry.view_all');
export const openResults = (params: Params) => openEventPage(params, 'results.publish');
export const openPenaltyCatalogue = (params: Params) => openEventPageWithHeading(params, 'penalty.catalogue_manage');

/** A class of this meeting with its rule versions, once per request (404 when the meeting has no such class). */
const readClass = cache(async (actor: Actor, eventId: string, classId: string) => {
  try {
    return await getClassWithVersions(actor, eventId, classId);
  } catch (err) {
    if (err instanceof AppError && err.status === 404) notFound();
    throw err;
  }
});

async function openClass(params: ClassParams, permission: 'class.edit' | 'report.publish') {
  const access = await openEventPage(params, permission, { ids: ['classId'] });
  return {
    ...access,
    classId: access.ids.classId,
    cls: await readClass(access.actor, access.eventId, access.ids.classId),
  };
}

export const openClassRules = (params: ClassParams) => openClass(params, 'class.edit');
export const openClassReport = (params: ClassParams) => openClass(params, 'report.publish');
