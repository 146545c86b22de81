import type { Metadata } from 'next';
import Link from '@/components/link';
import { can } from '@/lib/server/auth/actor';
import { openInterests } from '../access';
import { listInterestRegister } from '@/lib/server/interests/list-interest-register';
import { INTEREST_KIND_SHORT } from '@/lib/core/inputs/interests';
import { DeclareInterestForm } from './declare-interest-form';
import { WithdrawInterestForm } from './withdraw-interest-form';

export const metadata: Metadata = { title: 'Declared interests' };
export const dynamic = 'force-dynamic';

// The meeting's register: every official declares their own interests; stewards and the organiser read all of it.
export default async function InterestRegisterPage({ params }: { params: Promise<{ eventId: string }> }) {
  const { actor, eventId } = await openInterests(params);
  const r = await listInterestRegister(actor, eventId);
  const isSteward = can(actor, 'protest.view_all', { eventId });
  return (
    <div className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/stewards">Stewards</Link> /{' '}
        {isSteward ? <Link href={`/stewards/${eventId}`}>{r.event.name}</Link> : r.event.name} / Declared interests
      </nav>
      <h1>Declared interests at {r.event.name}</h1>
      <p className="max-w-prose text-ink-soft">
        Declare any interest you have at this meeting: a boat you crew, own part of or sponsor, an entrant who is family
        or employs you, a team or club you belong to. A steward with an interest in a protest — or who lodged it, or
        whose boat is in it — cannot accept, hear or decide it: another steward must. Declarations are never edited;
        withdraw one with a reason and it stays in the register. A withdrawal does not clear an interest for a protest
        already lodged.
      </p>
      <DeclareInterestForm eventId={eventId} boats={r.choices.boats} entrants={r.choices.entrants} />
      <section aria-labelledby="register" className="card space-y-3">
        <h2 id="register">{r.isWholeRegister ? 'The register (every official)' : 'Your declarations'}</h2>
        {r.items.length === 0 ? (
          <p data-testid="register-empty">No interests declared yet.</p>
        ) : (
          <div className="overflow-x-auto" tabIndex={0} role="region" aria-labelledby="register">
            <table className="w-full min-w-[40rem] text-left text-sm" data-testid="interest-register">
              <thead className="bg-paper-deep">
                <tr>
                  <th className="p-2">Official</th>
                  <th className="p-2">Interest in</th>
                  <th className="p-2">Statement</th>
                  <th className="p-2">Declared ({r.event.timeZone})</th>
                  <th className="p-2">Standing</th>
                </tr>
              </thead>
              <tbody>
                {r.items.map((i) => (
                  <tr
                    key={i.id}
                    className="border-t border-paper-line align-top"
                    data-interest-id={i.id}
                    data-standing={i.withdrawal ? 'no' : 'yes'}
                  >
                    <td className="p-2">
                      {i.officialName}
                      <br />
                      <span className="text-ink-soft">{i.officialRoles.join(', ').replace(/_/g, ' ')}</span>
                    </td>
                    <td className="p-2">
                      <span className="text-ink-soft">{INTEREST_KIND_SHORT[i.kind]}:</span>{' '}
                      <strong>{i.subjectLabel}</strong>
                    </td>
                    <td className="p-2 whitespace-pre-wrap">{i.statement}</td>
                    <td className="p-2">{i.declaredAtLabel}</td>
                    <td className="p-2">
                      {i.withdrawal ? (
                        <span>
                          Withdrawn {i.withdrawal.atLabel}: {i.withdrawal.reason}
                        </span>
                      ) : (
                        <>
                          <strong>Standing</strong>
                          {i.officialId === actor.id && <WithdrawInterestForm eventId={eventId} interestId={i.id} />}
                        </>
                      )}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
    </div>
  );
}
