import type { Metadata } from 'next';
import Link from '@/components/link';
import { redirect } from 'next/navigation';
import { format, parseISO } from 'date-fns';
import { getActor } from '@/lib/server/auth/actor';
import { listMyEntries, type MyEntry } from '@/lib/server/entries/list-my-entries';
import { formatMoney } from '@/lib/core/inputs/entries';
import { PayEntryButton } from './pay-entry-button';
import { WithdrawEntryButton } from './withdraw-entry-button';
import { PaymentWaiter } from './payment-waiter';
import { SafetyNote } from '@/components/safety-note';
import { formatInZone } from '@/lib/core/protests/protest-window';
import { listMyDeclaredMasses } from '@/lib/server/timing/declared-masses';
import { CLOCK_ASSUMPTIONS } from '@/lib/core/timing/clock-section';
import { ClockMassesForm } from '@/components/clock-masses-form';
import { CrewEntryPanel } from '@/components/crew-entry-panel';

export const metadata: Metadata = { title: 'My entries' };
export const dynamic = 'force-dynamic';

// What an inspection result asks of the entrant, beside the badge.
const RESULT_MEANING: Record<NonNullable<MyEntry['inspectionResult']>, string> = {
  conforms: 'The scrutineers found the boat within the class rules at its latest inspection.',
  does_not_conform:
    'A class rule is not met at the latest inspection: see the chief scrutineer before the boat goes on the water.',
  inconclusive:
    'A measurement is too close to a limit to decide, given its uncertainty: the chief scrutineer decides what happens next, often a measurement with a finer instrument.',
};

// Badge colours pair with the words (never colour alone).
function badgeClass(e: MyEntry) {
  if (e.inspectionResult === 'conforms') return 'bg-pass-100 text-pass-800';
  if (e.inspectionResult === 'does_not_conform') return 'bg-fail-100 text-fail-800';
  if (e.inspectionResult === 'inconclusive' || e.status === 'awaiting_payment') return 'bg-doubt-100 text-doubt-800';
  if (e.status === 'entered') return 'bg-tide-100 text-tide-700';
  return 'bg-paper-deep text-ink-soft';
}

function PaymentBanner({ entry }: { entry: MyEntry }) {
  if (entry.paidAt) {
    return (
      <div
        role="status"
        className="rounded-lg border-l-8 border-pass-600 bg-pass-100 p-4 text-pass-800"
        data-testid="payment-banner"
      >
        <p className="text-lg font-bold">Payment received — thank you</p>
        <p>
          {entry.boatName} is entered in {entry.classCode} {entry.className} at {entry.eventName} as number{' '}
          {entry.raceNumber}. A receipt is on its way by e-mail.
        </p>
      </div>
    );
  }
  if (entry.status === 'entered') {
    return (
      <div
        role="status"
        className="rounded-lg border-l-8 border-pass-600 bg-pass-100 p-4 text-pass-800"
        data-testid="payment-banner"
      >
        <p className="text-lg font-bold">You are entered</p>
        <p>This meeting charges no entry fee.</p>
      </div>
    );
  }
  if (entry.status !== 'awaiting_payment') return null;
  return (
    <div
      role="status"
      className="space-y-2 rounded-lg border-l-8 border-doubt-600 bg-doubt-100 p-4 text-doubt-800"
      data-testid="payment-banner"
    >
      <p className="text-lg font-bold">Waiting for payment confirmation…</p>
      <p>
        The payment provider tells us directly when your payment has gone through; this usually takes a few seconds.
      </p>
      <PaymentWaiter />
    </div>
  );
}

export default async function MyEntriesPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const actor = await getActor();
  if (!actor) redirect('/sign-in');
  const sp = await searchParams;
  const [entries, masses] = await Promise.all([listMyEntries(actor), listMyDeclaredMasses(actor)]);
  const paidFor = entries.find((e) => e.id === sp.paid);
  const cancelledFor = entries.find((e) => e.id === sp.cancelled);
  return (
    <div className="space-y-6">
      <h1>My entries</h1>
      {paidFor && <PaymentBanner entry={paidFor} />}
      {cancelledFor && !cancelledFor.paidAt && cancelledFor.status === 'awaiting_payment' && (
        <div role="status" className="rounded-lg border-l-8 border-doubt-600 bg-doubt-100 p-4 text-doubt-800">
          <p className="font-bold">Payment cancelled</p>
          <p>Nothing was charged. Your entry is kept, awaiting payment: pay when you are ready.</p>
        </div>
      )}
      {entries.length === 0 ? (
        <p className="card text-ink-soft">
          No entries yet. Open <Link href="/boats">My boats</Link> and enter a boat at a meeting.
        </p>
      ) : (
        <ul className="space-y-3" data-testid="my-entries">
          {entries.map((e) => (
            <li key={e.id} className="card space-y-2" data-entry-id={e.id}>
              <div className="flex flex-wrap items-start justify-between gap-2">
                <div>
                  <h2 className="text-xl">{e.eventName}</h2>
                  <p className="text-ink-soft">
                    {e.venue} · {format(parseISO(e.startsOn), 'd MMM yyyy')}
                  </p>
                </div>
                <span className={`rounded-full px-3 py-1 font-bold ${badgeClass(e)}`} data-testid="entry-status">
                  {e.statusLabel}
                </span>
              </div>
              {e.declarationChange && (
                <p
                  className="rounded-lg border-2 border-flare-500 bg-flare-100 p-3 font-bold"
                  data-testid="entry-declaration-change"
                >
                  {e.declarationChange}
                </p>
              )}
              <dl className="grid grid-cols-[8rem_1fr] gap-y-1">
                <dt className="text-ink-soft">Boat</dt>
                <dd>
                  <Link href={`/boats/${e.boatId}`}>{e.boatName}</Link>
                </dd>
                <dt className="text-ink-soft">Class</dt>
                <dd>
                  {e.classCode} {e.className}
                </dd>
                <dt className="text-ink-soft">Race number</dt>
                <dd className="figure font-bold">{e.raceNumber}</dd>
                <dt className="text-ink-soft">Entry fee</dt>
                <dd>
                  {e.feeMinor > 0 ? formatMoney(e.feeMinor, e.currency) : 'none'}
                  {e.paidAt && (
                    <span className="ml-2 text-pass-800">paid {format(parseISO(e.paidAt), 'd MMM yyyy')}</span>
                  )}
                  {e.refundedAt && (
                    <span className="ml-2">refunded {format(parseISO(e.refundedAt), 'd MMM yyyy')}</span>
                  )}
                </dd>
                {e.cancelledReason && (
                  <>
                    <dt className="text-ink-soft">Reason</dt>
                    <dd>{e.cancelledReason}</dd>
                  </>
                )}
              </dl>
              {e.status === 'entered' && e.inspectionResult && (
                <p className="text-ink-soft" data-testid="result-meaning">
                  {RESULT_MEANING[e.inspectionResult]}
                </p>
              )}
              {e.partsHeld.length > 0 && (
                <div
                  className="rounded-lg border-l-8 border-doubt-600 bg-doubt-100 px-3 py-2 text-doubt-800"
                  data-testid="parts-held"
                >
                  <p className="font-bold">Held by the officials</p>
                  <ul className="list-disc pl-5">
                    {e.partsHeld.map((p, i) => (
                      <li key={i}>
                        {p.description}
                        {p.sealNumber ? ` (seal/bag ${p.sealNumber})` : ''}, since {formatInZone(p.takenAt, e.timeZone)}
                      </li>
                    ))}
                  </ul>
                  <p className="text-sm">Ask the chief scrutineer when it will be released.</p>
                </div>
              )}
              {(e.status === 'entered' || e.status === 'awaiting_payment') && (
                <>
                  <ClockMassesForm
                    entryId={e.id}
                    crewKg={masses[e.id]?.crewKg ?? null}
                    fuelKg={masses[e.id]?.fuelKg ?? null}
                    assumedCrewKg={CLOCK_ASSUMPTIONS.crewKg}
                    assumedFuelKg={CLOCK_ASSUMPTIONS.fuelKg}
                  />
                  <p>
                    <Link href={`/slot/${e.eventId}/${e.id}`}>Scrutineering slot</Link>
                  </p>
                  {/* In the page's first HTML, not streamed behind a fallback: React reveals streamed parts only
                      after the page's scripts have run, which on a phone is seconds after the rest. */}
                  <CrewEntryPanel actor={actor} entryId={e.id} />
                </>
              )}
              {e.status === 'awaiting_payment' && (
                <div className="flex flex-wrap items-start gap-3 pt-1">
                  <PayEntryButton entryId={e.id} label={e.feeMinor > 0 ? 'Pay entry fee' : 'Confirm the entry'} />
                  <WithdrawEntryButton entryId={e.id} />
                </div>
              )}
            </li>
          ))}
        </ul>
      )}
      {entries.some(
        (e) => e.inspectionResult || e.status === 'awaiting_payment' || e.status === 'entered', // crew and safety gear
      ) && <SafetyNote />}
    </div>
  );
}
