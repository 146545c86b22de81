import 'server-only';
import { cache } from 'react';
import { notFound, redirect } from 'next/navigation';
import { getActor } from '@/lib/server/auth/actor';
import { getProtest } from '@/lib/server/protests/get-protest';
import { AppError } from '@/lib/core/errors';

// Who may open a protest page: the layout calls this before the page's loading.tsx streams anything
// (so sign-in and a 404 keep their statuses), the page calls it again for its data: one read per request.
const openProtestById = cache(async (protestId: string) => {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  // Someone else's protest reads exactly like a missing one (getProtest answers 404 for both).
  return getProtest(actor, protestId).catch((err) => {
    if (err instanceof AppError && err.status === 404) notFound();
    throw err;
  });
});

export const openMyProtest = async (params: Promise<{ protestId: string }>) =>
  openProtestById((await params).protestId);
