import 'server-only';
import { cache } from 'react';
import { redirect } from 'next/navigation';
import { can, getActor } from '@/lib/server/auth/actor';

// Who may open administration: the layout calls this before the page's loading.tsx streams anything
// (so the redirect keeps its 307), the page calls it again for the actor: one decision per request.
export const openAdministration = cache(async () => {
  const actor = await getActor();
  if (!actor || !can(actor, 'admin.manage_users')) redirect('/not-allowed');
  return actor;
});
