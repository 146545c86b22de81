import type { Metadata } from 'next';
import Link from '@/components/link';
import { openSeals } from '../access';
import { listSealBatches } from '@/lib/server/seals/list-seal-batches';
import { listSeals, loadSealHistory } from '@/lib/server/seals/seal-register';
import { canManageInstruments } from '@/lib/server/inspections/manage-instruments-access';
import { SEAL_ACTION_WORDS } from '@/lib/core/seals/seal-words';
import { AppError } from '@/lib/core/errors';
import { ListSealsQuery } from '@/lib/core/inputs/seals';
import { SafetyNote } from '@/components/safety-note';
import { IssueBatchForm } from './issue-batch-form';

export const metadata: Metadata = { title: 'Seal register' };
export const dynamic = 'force-dynamic';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[1-8][0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/i;

// The meeting's seal register: the batches issued here, every seal with its state, search by number,
// and one seal's whole history across meetings (?seal=<id>).
export default async function SealsPage({
  params,
  searchParams,
}: {
  params: Promise<{ eventId: string }>;
  searchParams: Promise<{ q?: string; seal?: string }>;
}) {
  const { actor, eventId, event } = await openSeals(params);
  const sp = await searchParams;
  const query = ListSealsQuery.safeParse({ q: typeof sp.q === 'string' ? sp.q : '' });
  const q = query.success ? query.data.q : '';
  const [batches, { seals, isCut }] = await Promise.all([
    listSealBatches(actor, eventId),
    listSeals(actor, eventId, { q }),
  ]);
  let history: Awaited<ReturnType<typeof loadSealHistory>> | null = null;
  if (typeof sp.seal === 'string' && UUID.test(sp.seal)) {
    try {
      history = await loadSealHistory(actor, eventId, sp.seal.toLowerCase());
    } catch (err) {
      if (!(err instanceof AppError && err.status === 404)) throw err;
    }
  }
  const when = (iso: string) =>
    new Date(iso).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: event.timeZone });
  return (
    <div className="space-y-5 text-lg">
      <nav aria-label="Breadcrumb" className="text-lg">
        <Link href="/inspect">Inspect</Link> / <Link href={`/inspect/${eventId}/board`}>{event.name}</Link> / Seals
      </nav>
      <h1>Seal register</h1>
      <p className="text-ink-soft">
        Numbered seals issued to this meeting’s scrutineers. A seal is applied to a component at the dock, checked at
        every later inspection at any meeting, and removed with a reason; nothing in its history is ever changed. Times
        in {event.timeZone}. A seal found broken or missing is a finding in that inspection’s verdict.
      </p>
      <SafetyNote />
      {canManageInstruments(actor, eventId) ? (
        <IssueBatchForm eventId={eventId} />
      ) : (
        <p>Only the chief scrutineer or the organiser issues seal batches.</p>
      )}

      <section aria-labelledby="batches-heading" className="space-y-2">
        <h2 id="batches-heading" className="text-xl">
          Batches ({batches.length})
        </h2>
        {batches.length === 0 ? (
          <p>None issued yet.</p>
        ) : (
          <ul className="divide-y divide-paper-line" data-testid="seal-batches">
            {batches.map((b) => (
              <li key={b.id} className="py-2" data-batch-id={b.id}>
                <span className="figure font-bold">
                  {b.firstSeal} – {b.lastSeal}
                </span>{' '}
                · {b.count} seals, {b.used} used · issued by {b.issuedBy} {when(b.createdAt)}
                {b.note ? <span className="block text-ink-soft">{b.note}</span> : null}
              </li>
            ))}
          </ul>
        )}
      </section>

      {history && (
        <section aria-labelledby="history-heading" className="card space-y-2" data-testid="seal-history">
          <h2 id="history-heading" className="text-xl">
            Seal {history.seal.number}: its whole history
          </h2>
          <p className="text-ink-soft">
            {history.seal.issuedTo ? `Issued to ${history.seal.issuedTo}.` : 'Carried over from a free-text record.'}
          </p>
          {history.events.length === 0 ? (
            <p>Unused: nothing recorded yet.</p>
          ) : (
            <ol className="divide-y divide-paper-line">
              {history.events.map((e) => (
                <li key={e.id} className="py-2" data-action={e.action}>
                  <p>
                    <strong>{SEAL_ACTION_WORDS[e.action]}</strong> · {when(e.at)} · by {e.recordedBy}
                  </p>
                  <p className="text-ink-soft">
                    {[
                      e.component && `on the ${e.component}`,
                      e.boatName && `of ${e.boatName}`,
                      e.position && `at ${e.position}`,
                      e.eventName && `at ${e.eventName}`,
                      e.inspectionId && `inspection ${e.inspectionId.slice(0, 8)}`,
                      e.photoId && 'with a photo',
                      e.reason && `reason: ${e.reason}`,
                    ]
                      .filter(Boolean)
                      .join(' · ')}
                  </p>
                </li>
              ))}
            </ol>
          )}
        </section>
      )}

      <section aria-labelledby="seals-heading" className="space-y-3">
        <h2 id="seals-heading" className="text-xl">
          Seals
        </h2>
        <form method="get" className="flex flex-wrap items-end gap-2" role="search">
          <div>
            <label htmlFor="seal-search" className="field-label">
              Find by number
            </label>
            <input id="seal-search" name="q" defaultValue={q} className="field-input min-h-touch" autoComplete="off" />
          </div>
          <button type="submit" className="btn-secondary">
            Find
          </button>
        </form>
        {!query.success && <p className="field-error">Search by seal number: letters, digits or dashes.</p>}
        {seals.length === 0 ? (
          <p>{q ? `No seal number contains “${q}”.` : 'No seals yet.'}</p>
        ) : (
          <table className="w-full text-left" data-testid="seal-list">
            <thead>
              <tr>
                <th scope="col">Number</th>
                <th scope="col">State</th>
                <th scope="col">Issued to</th>
              </tr>
            </thead>
            <tbody>
              {seals.map((s) => (
                <tr key={s.id} data-seal={s.number} data-state={s.lastAction ?? 'unused'}>
                  <td className="figure">
                    <Link href={`/inspect/${eventId}/seals?${new URLSearchParams({ q, seal: s.id })}`}>{s.number}</Link>
                  </td>
                  <td>{s.state}</td>
                  <td>{s.issuedTo ?? 'free-text record'}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
        {isCut && <p>Showing the first 1000: narrow the search.</p>}
      </section>
    </div>
  );
}
