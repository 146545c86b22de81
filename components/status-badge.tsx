// An entry's status in words and colour (never colour alone).
const STATUS: Record<string, { label: string; className: string }> = {
  awaiting_payment: { label: 'Awaiting payment', className: 'bg-doubt-100 text-doubt-800' },
  entered: { label: 'Entered', className: 'bg-tide-100 text-tide-700' },
  withdrawn: { label: 'Withdrawn', className: 'bg-paper-deep text-ink-soft' },
  cancelled: { label: 'Cancelled', className: 'bg-paper-deep text-ink-soft' },
};
const INSPECTION: Record<string, { label: string; className: string }> = {
  conforms: { label: '✓ Inspected: conforms', className: 'bg-pass-100 text-pass-800' },
  does_not_conform: { label: '✕ Inspected: does not conform', className: 'bg-fail-100 text-fail-800' },
  inconclusive: { label: '? Inspected: inconclusive', className: 'bg-doubt-100 text-doubt-800' },
};

export function StatusBadge({ status, inspection }: { status: string; inspection?: string | null }) {
  const s = status === 'entered' && inspection ? INSPECTION[inspection] : STATUS[status];
  return (
    <span className={`inline-block rounded-full px-3 py-1 text-sm font-bold ${s?.className ?? ''}`}>
      {s?.label ?? status}
    </span>
  );
}
