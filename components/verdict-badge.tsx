// A verdict in words, colour and icon together (never colour alone), readable in sunlight.
const STYLE: Record<string, { icon: string; words: string; className: string }> = {
  conforms: { icon: '✓', words: 'Conforms', className: 'border-pass-600 bg-pass-100 text-pass-800' },
  does_not_conform: { icon: '✕', words: 'Does not conform', className: 'border-fail-600 bg-fail-100 text-fail-800' },
  inconclusive: { icon: '?', words: 'Inconclusive', className: 'border-doubt-600 bg-doubt-100 text-doubt-800' },
  waiting: { icon: '…', words: 'Not inspected yet', className: 'border-ink-mute bg-paper-deep text-ink' },
  pending: { icon: '…', words: 'Not decided yet', className: 'border-ink-mute bg-paper-deep text-ink' },
  // An earlier verdict that no longer counts: the owner changed the declaration after it.
  reinspection_required: {
    icon: '↻',
    words: 'Re-inspection required',
    className: 'border-flare-600 bg-flare-100 text-ink',
  },
};

export function VerdictBadge({ verdict, large = false }: { verdict: string; large?: boolean }) {
  const s = STYLE[verdict] ?? STYLE.waiting;
  return (
    <span
      data-verdict={verdict}
      className={`inline-flex items-center gap-2 whitespace-nowrap rounded-full border-2 font-bold ${large ? 'px-4 py-2 text-2xl' : 'px-3 py-1 text-lg'} ${s.className}`}
    >
      <span
        aria-hidden="true"
        className="inline-flex h-[1.4em] w-[1.4em] items-center justify-center rounded-full bg-white/70"
      >
        {s.icon}
      </span>
      {s.words}
    </span>
  );
}
