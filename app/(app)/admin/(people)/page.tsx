import type { Metadata } from 'next';
import { format } from 'date-fns';
import { listPeople } from '@/lib/server/admin/list-people';
import { formatInZone } from '@/lib/core/protests/protest-window';
import { PeopleList } from '../people-list';
import { ChainCheckButton } from '../chain-check';
import { lastSelfCheck } from '@/lib/server/chain/chain-service';
import { openAdministration } from './access';

export const metadata: Metadata = { title: 'Administration' };

export default async function AdminPage() {
  const actor = await openAdministration();
  const people = await listPeople(actor);
  const suspended = people.filter((p) => p.suspendedAt).length;
  const chainCheck = await lastSelfCheck(actor);
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
      <section aria-labelledby="chain-heading" className="space-y-2">
        <h2 id="chain-heading" className="text-xl">
          Record chains
        </h2>
        {chainCheck && chainCheck.broken.length > 0 ? (
          <div role="alert" className="rounded border-2 border-red-700 p-3">
            <p className="font-semibold">
              A record chain is broken: a stored record no longer matches what was chained. Keep the database as it is,
              export the meeting&apos;s bundle and find who changed it.
            </p>
            <ul className="list-disc pl-5 text-sm">
              {chainCheck.broken.map((b) => (
                <li key={b.chain}>
                  Chain {b.chain}: {b.problem.message}
                </li>
              ))}
            </ul>
          </div>
        ) : null}
        <p className="text-sm">
          {chainCheck
            ? `Last checked ${formatInZone(chainCheck.checkedAt, 'UTC')}: ${chainCheck.chains} chains, ${chainCheck.records} records, ${
                chainCheck.broken.length ? `${chainCheck.broken.length} broken` : 'all whole'
              }.`
            : 'Not checked yet: the nightly check runs on its own, or check now.'}
        </p>
        <ChainCheckButton />
      </section>
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
