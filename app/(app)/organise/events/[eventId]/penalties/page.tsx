import type { Metadata } from 'next';
import Link from '@/components/link';
import { listPenaltyCatalogue } from '@/lib/server/penalties/penalty-catalogue';
import { GOVERNING_BODY_CAUTION, PENALTY_AMOUNT_UNITS, PENALTY_KIND_LABELS } from '@/lib/core/penalties/penalty-kinds';
import { SafetyNote } from '@/components/safety-note';
import { openPenaltyCatalogue } from '../access';
import { CatalogueForm } from './catalogue-form';

export const metadata: Metadata = { title: 'Penalty catalogue' };
export const dynamic = 'force-dynamic';

export default async function PenaltyCataloguePage({ params }: { params: Promise<{ eventId: string }> }) {
  const { actor, eventId, event } = await openPenaltyCatalogue(params);
  const items = await listPenaltyCatalogue(actor, eventId);
  return (
    <div className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/organise">Organise</Link> / <Link href={`/organise/events/${eventId}`}>{event.name}</Link> /
        Penalty catalogue
      </nav>
      <h1>Penalty catalogue of {event.name}</h1>
      <SafetyNote />
      <p className="text-sm text-ink-soft" data-testid="governing-body-caution">
        {GOVERNING_BODY_CAUTION}
      </p>
      <p>
        The stewards impose penalties from this list. An item is never changed once added: a penalty keeps the words and
        amount it was imposed with.
      </p>
      {items.length === 0 ? (
        <p className="card text-ink-soft">The catalogue is empty.</p>
      ) : (
        <table className="w-full text-left text-sm" data-testid="catalogue-table">
          <thead className="bg-paper-deep">
            <tr>
              <th className="p-2">Code</th>
              <th className="p-2">Kind</th>
              <th className="p-2">Amount</th>
              <th className="p-2">Description</th>
              <th className="p-2">Rule</th>
            </tr>
          </thead>
          <tbody>
            {items.map((i) => (
              <tr key={i.id} className="border-t border-paper-line">
                <td className="p-2 font-bold">{i.code}</td>
                <td className="p-2">{PENALTY_KIND_LABELS[i.kind]}</td>
                <td className="figure p-2">
                  {i.amount === null ? '—' : `${i.amount} ${PENALTY_AMOUNT_UNITS[i.kind]}`}
                </td>
                <td className="p-2">{i.label}</td>
                <td className="p-2">{i.ruleReference || '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <CatalogueForm eventId={eventId} />
    </div>
  );
}
