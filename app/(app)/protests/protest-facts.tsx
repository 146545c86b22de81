import { formatMoney } from '@/lib/core/inputs/entries';
import { REQUESTED_CHECKS, type RequestedCheck } from '@/lib/core/protests/protest-states';
import type { ProtestDetail } from '@/lib/server/protests/get-protest';
import { windowDeadlineTerm } from '@/lib/core/protests/protest-window';

/** The matter, the fee and, once there is one, the decision with its reasons, penalty, refund and appeal deadline. */
export function ProtestFacts({ p }: { p: ProtestDetail }) {
  const fee = p.feeMinor > 0 ? formatMoney(p.feeMinor, p.currency) : null;
  return (
    <>
      <dl className="card grid gap-y-2 sm:grid-cols-[12rem_1fr]">
        <dt className="text-ink-soft">Meeting</dt>
        <dd>{p.eventName}</dd>
        <dt className="text-ink-soft">Protester</dt>
        <dd>{p.lodgedByName}</dd>
        <dt className="text-ink-soft">Protested</dt>
        <dd data-testid="protest-target">{p.targetLabel}</dd>
        <dt className="text-ink-soft">Rule</dt>
        <dd>{p.ruleReference}</dd>
        <dt className="text-ink-soft">Grounds</dt>
        <dd className="whitespace-pre-wrap">{p.grounds}</dd>
        {p.requestedChecks.length > 0 && (
          <>
            <dt className="text-ink-soft">Checks asked for</dt>
            <dd>{p.requestedChecks.map((c) => REQUESTED_CHECKS[c as RequestedCheck] ?? c).join(', ')}</dd>
          </>
        )}
        <dt className="text-ink-soft">Submitted</dt>
        <dd>{p.lodgedAtLabel}</dd>
        <dt className="text-ink-soft" data-testid="window-term">
          {windowDeadlineTerm(p.windowDeadline)}
        </dt>
        <dd>{p.windowDeadlineLabel}</dd>
        <dt className="text-ink-soft">Fee</dt>
        <dd data-testid="protest-fee">
          {fee ? `${fee}${p.paidAt ? ' — paid' : ' — not paid yet'}` : 'none'}
          {p.refundedAt && (
            <strong className="ml-2 text-pass-800" data-testid="refund">
              refunded (refund {p.refundId})
            </strong>
          )}
        </dd>
        {p.hearingAtLabel && (
          <>
            <dt className="text-ink-soft">Hearing</dt>
            <dd data-testid="hearing">
              {p.hearingAtLabel}, {p.hearingPlace}
            </dd>
          </>
        )}
      </dl>
      {p.decidedAt && (
        <section
          aria-labelledby="decision"
          className="card space-y-2 border-l-8 border-tide-600"
          data-testid="decision"
        >
          <h2 id="decision">
            {p.status === 'rejected' ? `Rejected as invalid: ${p.rejectionLabel}` : `Decision: ${p.statusLabel}`}
          </h2>
          <p className="text-sm text-ink-soft">
            {p.decidedAtLabel} · stewards: {p.decidedByNames.join(', ')}
          </p>
          <p className="whitespace-pre-wrap">{p.decisionReasons}</p>
          {p.penalty && (
            <p>
              <strong>Penalty:</strong> {p.penalty}
            </p>
          )}
          {fee && p.paidAt && (
            <p data-testid="fee-outcome">
              {p.refundedAt ? `The fee of ${fee} is refunded to the card that paid it.` : `The fee of ${fee} is kept.`}
            </p>
          )}
          <p className="font-bold" data-testid="appeal-deadline">
            Notice of appeal is due by {p.appealDeadlineLabel}.
          </p>
          <a className="btn-secondary" href={`/api/protests/${p.id}/decision.pdf`} data-testid="decision-pdf">
            Written decision (PDF)
          </a>
        </section>
      )}
    </>
  );
}
