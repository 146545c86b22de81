import 'server-only';
import { cache } from 'react';
import { notFound, redirect } from 'next/navigation';
import { getActor } from '@/lib/server/auth/actor';
import { getAppeal } from '@/lib/server/appeals/get-appeal';
import { readCatalogue } from '@/lib/server/penalties/penalty-catalogue';
import { AppError } from '@/lib/core/errors';

// Who may open an appeal page: the layout calls this before the page's loading.tsx streams anything (so sign-in
// and a 404 keep their statuses), the page calls it again for its data: one read per request.
const openAppealById = cache(async (appealId: string) => {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  // An appeal the person may not read looks exactly like a missing one (getAppeal answers 404 for both).
  const appeal = await getAppeal(actor, appealId).catch((err) => {
    if (err instanceof AppError && err.status === 404) notFound();
    throw err;
  });
  // The appeal body amends from the meeting's catalogue.
  const catalogue = appeal.you.mayHear ? await readCatalogue(appeal.eventId) : [];
  return { actor, appeal, catalogue };
});

export const openAppeal = async (params: Promise<{ appealId: string }>) => openAppealById((await params).appealId);
