import 'server-only';
import { cache } from 'react';
import { redirect } from 'next/navigation';
import { allRolesOf, getActor } from '@/lib/server/auth/actor';
import { rolesCan } from '@/lib/core/auth/permissions';

// Who may open the organiser's area: the layout calls this before the page's loading.tsx streams
// anything (so a redirect keeps its 307), the page calls it again for the actor: one decision per request.
export const openOrganise = cache(async () => {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  // The area the navigation shows for the same permission (lib/core/navigation.ts).
  if (!rolesCan(allRolesOf(actor), 'event.create')) redirect('/not-allowed');
  return actor;
});
