import type { Metadata } from 'next';
import { format, parseISO } from 'date-fns';
import { listOrganisedMeetings } from '@/lib/server/events/list-organised-meetings';
import Link from '@/components/link';
import { InviteStaffForm } from '../invite-staff-form';
import { openOrganise } from './access';

export const metadata: Metadata = { title: 'Organise' };

const ROLE_LABEL: Record<string, string> = {
  organiser: 'Organiser',
  chief_scrutineer: 'Chief scrutineer',
  scrutineer: 'Scrutineer',
  steward: 'Steward',
};

export default async function OrganisePage() {
  const actor = await openOrganise();
  const meetings = await listOrganisedMeetings(actor);
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 data-testid="organise-heading">Organise</h1>
        {actor.organiserOf.length > 0 && (
          <Link href="/organise/events/new" className="btn-primary">
            New meeting
          </Link>
        )}
      </div>
      {meetings.length === 0 && <p>You organise no meetings yet.</p>}
      {meetings.map((m) => (
        <section key={m.id} className="card space-y-4" aria-labelledby={`m-${m.id}`}>
          <div>
            <h2 id={`m-${m.id}`}>
              <Link href={`/organise/events/${m.id}`}>{m.name}</Link>
            </h2>
            <p className="text-ink-soft">
              {m.venue} · from {format(parseISO(m.startsOn), 'd MMM yyyy')} · {m.status.replace('_', ' ')}
            </p>
          </div>
          <div>
            <h3>Staff</h3>
            <ul className="mt-2 divide-y divide-paper-line">
              {m.staff.map((s) => (
                <li key={`${s.userId}-${s.role}`} className="flex flex-wrap justify-between gap-2 py-2">
                  <span>
                    {s.name ?? s.email} <span className="text-ink-mute">{s.email}</span>{' '}
                    <span
                      data-testid="staff-address-state"
                      className={s.isAddressProven ? 'text-sm text-pass-800' : 'text-sm font-bold text-doubt-800'}
                    >
                      {s.isAddressProven ? '· address confirmed' : '· address not confirmed'}
                    </span>
                  </span>
                  <span className="font-bold">{ROLE_LABEL[s.role]}</span>
                </li>
              ))}
            </ul>
            {m.pendingInvitations.length > 0 && (
              <>
                <h3 className="mt-4">Invitations waiting</h3>
                <ul className="mt-2 divide-y divide-paper-line">
                  {m.pendingInvitations.map((i) => (
                    <li key={`${i.email}-${i.role}`} className="flex flex-wrap justify-between gap-2 py-2">
                      <span>
                        {i.email}{' '}
                        <span className="text-sm text-ink-mute">· the role waits for whoever holds this mailbox</span>
                      </span>
                      <span>
                        {ROLE_LABEL[i.role]} · until {format(parseISO(i.expiresAt), 'd MMM')}
                      </span>
                    </li>
                  ))}
                </ul>
              </>
            )}
          </div>
          <div className="flex flex-wrap gap-2">
            <Link href={`/organise/events/${m.id}`} className="btn-primary">
              Meeting, classes and rules
            </Link>
            <Link href={`/organise/events/${m.id}/entries`} className="btn-secondary">
              Entries
            </Link>
          </div>
          <InviteStaffForm eventId={m.id} />
        </section>
      ))}
    </div>
  );
}
