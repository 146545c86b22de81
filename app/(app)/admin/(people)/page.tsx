import type { Metadata } from 'next';
import { format } from 'date-fns';
import { listPeople } from '@/lib/server/admin/list-people';
import { formatInZone } from '@/lib/core/protests/protest-window';
import { PeopleList } from '../people-list';
import { openAdministration } from './access';

export const metadata: Metadata = { title: 'Administration' };

export default async function AdminPage() {
  const actor = await openAdministration();
  const people = await listPeople(actor);
  const suspended = people.filter((p) => p.suspendedAt).length;
  // Dates are worded on the server, so the page reads the same wherever it is opened.
  const labels = Object.fromEntries(
    people.map((p) => [
      p.id,
      {
        joined: format(new Date(p.createdAt), 'd MMM yyyy'),
        suspended: p.suspendedAt ? formatInZone(p.suspendedAt, 'UTC') : null,
      },
    ]),
  );
  return (
    <div className="space-y-4">
      <h1>Administration</h1>
      <h2 className="text-xl">
        People ({people.length}
        {suspended ? `, ${suspended} suspended` : ''})
      </h2>
      <p className="text-ink-soft">
        Members of the appeal body hear appeals against stewards&apos; decisions at every meeting, as the governing body
        appoints them; a member who holds a role at a meeting does not hear that meeting&apos;s appeals.
      </p>
      <PeopleList people={people} actorId={actor.id} labels={labels} />
    </div>
  );
}
