import { redirect } from 'next/navigation';
import { can, getActor } from '@/lib/server/auth/actor';
import { listMyMeetings } from '@/lib/server/events/list-my-meetings';
import { pickCurrentMeeting } from '@/lib/core/events/pick-current-meeting';

export const dynamic = 'force-dynamic';

// The installed app's shortcut (app/manifest.ts): the dock of the person's current meeting, decided now
// (pickCurrentMeeting), among the meetings where they may record; the list of meetings when they record at
// none. No loading.tsx above this page, so the redirect is a real 307. With no signal the service worker
// answers this address with the last dock screen it kept (components/offline/boreline-sw.ts).
export default async function CurrentDockPage(): Promise<never> {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  const meetings = (await listMyMeetings(actor)).filter((m) => can(actor, 'inspection.record', { eventId: m.id }));
  const meeting = pickCurrentMeeting(meetings, new Date());
  redirect(meeting ? `/inspect/${meeting.id}` : '/inspect');
}
