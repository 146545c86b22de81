import type { Metadata } from 'next';
import Link from '@/components/link';
import { PENALTY_KIND_LABELS } from '@/lib/core/penalties/penalty-kinds';
import { AppealCaution } from '../appeal-caution';
import { openAppeal } from './access';
import { AppealBodyActions } from './appeal-body-actions';
import { PayAppealFeeButton } from './pay-appeal-fee-button';

export const metadata: Metadata = { title: 'Appeal' };
export const dynamic = 'force-dynamic';

const FEE_WORDS = { none: 'No fee', due: 'due', paid: 'paid', refunded: 'refunded' } as const;

export default async function AppealPage({
  params,
  searchParams,
}: {
  params: Promise<{ appealId: string }>;
  searchParams: Promise<{ paid?: string }>;
}) {
  const { appeal: a, catalogue } = await openAppeal(params);
  const { paid } = await searchParams;
  return (
    <div className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/appeals">Appeals</Link> / #{a.entry.raceNumber} {a.entry.boatName}
      </nav>
      <h1>
        Appeal: {a.penalty.code} {a.penalty.label} on #{a.entry.raceNumber} {a.entry.boatName}
      </h1>
      <p className="text-lg font-bold" data-testid="appeal-status">
        {a.statusLabel}
      </p>
      <AppealCaution />
      <dl className="card grid gap-2 sm:grid-cols-[12rem_1fr]">
        <dt className="font-bold">Meeting</dt>
        <dd>{a.eventName}</dd>
        <dt className="font-bold">Stewards&apos; reason</dt>
        <dd>{a.penalty.reason}</dd>
        <dt className="font-bold">Appellant</dt>
        <dd>{a.lodgedByName}</dd>
        <dt className="font-bold">Grounds</dt>
        <dd className="whitespace-pre-line">{a.grounds}</dd>
        <dt className="font-bold">Notice due by</dt>
        <dd>{a.noticeDeadlineLabel}</dd>
        <dt className="font-bold">Fee</dt>
        <dd>{a.fee ? `${a.fee}, ${FEE_WORDS[a.feeState]}` : FEE_WORDS.none}</dd>
        {a.hearingAtLabel && (
          <>
            <dt className="font-bold">Hearing</dt>
            <dd>
              {a.hearingAtLabel}, {a.hearingPlace}
            </dd>
          </>
        )}
        {a.decisionReasons && (
          <>
            <dt className="font-bold">Decision</dt>
            <dd className="whitespace-pre-line">{a.decisionReasons}</dd>
          </>
        )}
      </dl>
      {a.you.mayPay && (
        <div className="card space-y-2">
          {paid ? (
            <p>Payment received by the provider: the appeal is lodged once its confirmation arrives.</p>
          ) : (
            <p>The appeal is lodged once the fee is paid, before the notice deadline.</p>
          )}
          <PayAppealFeeButton appealId={a.id} label={`Pay the appeal fee (${a.fee})`} />
        </div>
      )}
      {a.you.mayHear && (a.status === 'lodged' || a.status === 'hearing_scheduled') && (
        <AppealBodyActions
          appealId={a.id}
          catalogue={Object.fromEntries(
            catalogue.map((i) => [
              i.id,
              `${i.code}: ${i.label} (${PENALTY_KIND_LABELS[i.kind]}${i.amount ? `, ${i.amount}` : ''})`,
            ]),
          )}
        />
      )}
    </div>
  );
}
