// The caution shown wherever safety items or verdicts appear, once per screen. On a phone it is the
// short form (same message: danger, the tool supports, officials decide); from the small breakpoint up, in full.
export function SafetyNote({ className = '' }: { className?: string }) {
  // A larger type asked for by a screen applies from the small breakpoint up (sm:text-lg, sm:text-xl), so phones stay compact.
  const extra = className
    .split(/\s+/)
    .map((c) => (/^text-(lg|xl)$/.test(c) ? `sm:${c}` : c))
    .join(' ');
  return (
    <aside
      role="note"
      data-testid="safety-note"
      className={`rounded-lg border-l-4 border-flare-500 bg-flare-100 px-3 py-2 text-sm text-ink sm:px-4 sm:py-3 sm:text-base ${extra}`}
    >
      <strong>Safety first.</strong>{' '}
      <span className="sm:hidden">
        Racing can injure and kill. Boreline supports the checks; licensed officials decide every verdict and safety
        matter.
      </span>
      <span className="hidden sm:inline">
        Jet boat racing can injure and kill. Boreline supports the checks; it never replaces them. The governing
        body&apos;s rules, local regulations and the judgement of licensed officials decide every verdict and every
        safety matter.
      </span>
    </aside>
  );
}
