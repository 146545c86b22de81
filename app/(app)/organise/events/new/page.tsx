import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { getActor } from '@/lib/server/auth/actor';
import { listOrganisingClubs } from '@/lib/server/events/organiser-context';
import { EventForm } from '../event-form';

export const metadata: Metadata = { title: 'New meeting' };

export default async function NewEventPage() {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  const clubs = await listOrganisingClubs(actor);
  if (clubs.length === 0) redirect('/not-allowed');
  return (
    <div className="max-w-3xl space-y-4">
      <h1>New meeting</h1>
      <div className="card">
        <EventForm organisations={clubs} />
      </div>
    </div>
  );
}
