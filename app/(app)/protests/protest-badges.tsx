import { SafetyNote } from '@/components/safety-note';
import type { ProtestStatus } from '@/lib/core/protests/protest-states';
import { PROTEST_STATUS_LABELS } from '@/lib/core/protests/protest-states';
import type { Integrity } from '@/lib/server/protests/list-evidence';

// Protest states and evidence integrity in words, colour and icon together (never colour alone).
const STATUS_STYLE: Record<ProtestStatus, string> = {
  awaiting_fee: 'bg-doubt-100 text-doubt-800',
  lodged: 'bg-tide-100 text-tide-700',
  accepted: 'bg-tide-100 text-tide-700',
  hearing_scheduled: 'bg-tide-100 text-tide-700',
  rejected: 'bg-paper-deep text-ink-soft',
  upheld: 'bg-pass-100 text-pass-800',
  dismissed: 'bg-fail-100 text-fail-800',
  withdrawn: 'bg-paper-deep text-ink-soft',
};

export function ProtestStatusBadge({ status }: { status: ProtestStatus }) {
  return (
    <span
      className={`inline-block rounded-full px-3 py-1 font-bold ${STATUS_STYLE[status]}`}
      data-testid="protest-status"
      data-status={status}
    >
      {PROTEST_STATUS_LABELS[status]}
    </span>
  );
}

const INTEGRITY: Record<Integrity, { icon: string; words: string; className: string }> = {
  intact: { icon: '✓', words: 'Intact', className: 'border-pass-600 bg-pass-100 text-pass-800' },
  altered: { icon: '✕', words: 'Altered since upload', className: 'border-fail-600 bg-fail-100 text-fail-800' },
  missing: { icon: '!', words: 'Missing from storage', className: 'border-fail-600 bg-fail-100 text-fail-800' },
};

export function IntegrityBadge({ integrity }: { integrity: Integrity }) {
  const s = INTEGRITY[integrity];
  return (
    <span
      className={`inline-flex items-center gap-1 rounded-full border-2 px-2 py-0.5 text-sm font-bold ${s.className}`}
      data-testid="integrity"
      data-integrity={integrity}
    >
      <span aria-hidden="true">{s.icon}</span>
      {s.words}
    </span>
  );
}

/** The caution wherever protest decisions appear: officials decide, and there is a route to appeal. */
export function DecisionCaution() {
  return (
    <div className="space-y-2" data-testid="decision-caution">
      <SafetyNote />
      <p className="text-sm text-ink-soft">
        Every stewards&apos; decision can be appealed as the governing body&apos;s rules provide; the notice-of-appeal
        deadline is shown with the decision.
      </p>
    </div>
  );
}
