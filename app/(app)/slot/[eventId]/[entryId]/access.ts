import 'server-only';
import { cache } from 'react';
import { notFound, redirect } from 'next/navigation';
import { getActor } from '@/lib/server/auth/actor';
import { parseId } from '@/lib/server/http/ids';
import { AppError } from '@/lib/core/errors';
import { openEntryBooking } from '@/lib/server/schedule/book-slot';

// Who may open an entry's slot page: its entrant or the chief scrutineer (else 404, as for a missing entry).
// The layout decides first, outside loading.tsx, so the status holds; the page gets the same answer (cache()).
export const openSlotPage = cache(async (rawEventId: string, rawEntryId: string) => {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  try {
    return await openEntryBooking(actor, parseId(rawEventId, 'event'), parseId(rawEntryId, 'entry'));
  } catch (err) {
    if (err instanceof AppError && err.status === 404) notFound();
    throw err;
  }
});
