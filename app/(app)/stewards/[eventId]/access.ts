import 'server-only';
import { cache } from 'react';
import { notFound } from 'next/navigation';
import type { Actor } from '@/lib/server/auth/actor';
import { openEventPage, openEventPageWithHeading } from '@/lib/server/auth/page-access';
import { getProtest } from '@/lib/server/protests/get-protest';
import { AppError } from '@/lib/core/errors';

// Who may open each stewards' page of a meeting. Each page's layout calls its opener before the
// page's loading.tsx streams anything (so a 404 or a redirect keeps its status), the page calls it
// again for its data: one decision per request (page-access.ts and the cache below).
type Params = Promise<{ eventId: string }>;

export const openQueue = (params: Params) => openEventPage(params, 'protest.view_all');
export const openAudit = (params: Params) => openEventPageWithHeading(params, 'audit.read');
export const openInterests = (params: Params) => openEventPage(params, 'interest.declare');
export const openPenalties = (params: Params) => openEventPageWithHeading(params, 'penalty.apply');

/** The protest, once per request (404 when it does not exist or the actor may not see it). */
const readProtest = cache((actor: Actor, protestId: string) =>
  getProtest(actor, protestId).catch((err) => {
    if (err instanceof AppError && err.status === 404) notFound();
    throw err;
  }),
);

/** A protest at this meeting: one at another meeting reads as missing here. */
export async function openStewardProtest(params: Promise<{ eventId: string; protestId: string }>) {
  const { actor, eventId } = await openEventPage(params, 'protest.view_all');
  const protest = await readProtest(actor, (await params).protestId);
  if (protest.eventId !== eventId) notFound();
  return { actor, eventId, protest };
}
