import type { Metadata } from 'next';
import Link from '@/components/link';
import { formatMoney } from '@/lib/core/inputs/entries';

import { PaymentWaiter } from '../../entries/payment-waiter';
import { DecisionCaution, ProtestStatusBadge } from '../protest-badges';
import { EvidenceList } from '../evidence-list';
import { ProtestFacts } from '../protest-facts';
import { openMyProtest } from './access';
import { EvidenceForm } from './evidence-form';
import { PayFeeButton } from './pay-fee-button';

export const metadata: Metadata = { title: 'Protest' };
export const dynamic = 'force-dynamic';

export default async function ProtestPage({
  params,
  searchParams,
}: {
  params: Promise<{ protestId: string }>;
  searchParams: Promise<Record<string, string | undefined>>;
}) {
  const [p, sp] = await Promise.all([openMyProtest(params), searchParams]);
  return (
    <div className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/protests">My protests</Link> / {p.targetLabel}
      </nav>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1>Protest against {p.targetLabel}</h1>
        <ProtestStatusBadge status={p.status} />
      </div>
      {p.status === 'awaiting_fee' && sp.paid && (
        <div
          role="status"
          className="space-y-2 rounded-lg border-l-8 border-doubt-600 bg-doubt-100 p-4 text-doubt-800"
          data-testid="payment-banner"
        >
          <p className="text-lg font-bold">Waiting for payment confirmation…</p>
          <p>The payment provider tells us directly when the fee is paid; your protest is lodged then.</p>
          <PaymentWaiter />
        </div>
      )}
      {p.status === 'lodged' && sp.paid && p.paidAt && (
        <div
          role="status"
          className="rounded-lg border-l-8 border-pass-600 bg-pass-100 p-4 text-pass-800"
          data-testid="payment-banner"
        >
          <p className="text-lg font-bold">Fee received — your protest is lodged</p>
          <p>The stewards have been told. You will hear from them by e-mail.</p>
        </div>
      )}
      {p.can.pay && !sp.paid && (
        <div className="card space-y-2">
          <p>Your protest is saved but not lodged until the fee of {formatMoney(p.feeMinor, p.currency)} is paid.</p>
          <PayFeeButton protestId={p.id} label="Pay the protest fee" />
        </div>
      )}
      <ProtestFacts p={p} />
      <section aria-labelledby="evidence" className="card space-y-4">
        <h2 id="evidence">Evidence</h2>
        <EvidenceList evidence={p.evidence} timeZone={p.timeZone} />
        {p.can.addEvidence && <EvidenceForm protestId={p.id} />}
      </section>
      {p.reinspections.length > 0 && (
        <section aria-labelledby="reinspection" className="card">
          <h2 id="reinspection">Re-inspection</h2>
          <ul>
            {p.reinspections.map((t) => (
              <li key={t.id}>
                {t.reason} —{' '}
                {t.doneAt
                  ? `recorded by the scrutineers${t.verdict ? `: ${t.verdict.replace(/_/g, ' ')}` : ''}`
                  : 'waiting for the scrutineers'}
              </li>
            ))}
          </ul>
        </section>
      )}
      <DecisionCaution />
    </div>
  );
}
