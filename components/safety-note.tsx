// The caution shown wherever safety items or verdicts appear.
export function SafetyNote({ className = '' }: { className?: string }) {
  return (
    <aside role="note" className={`rounded-lg border-l-4 border-flare-500 bg-flare-100 px-4 py-3 text-base text-ink ${className}`}>
      <strong>Safety first.</strong> Jet boat racing can injure and kill. Boreline supports the checks; it never replaces
      them. The governing body&apos;s rules, local regulations and the judgement of licensed officials decide every
      verdict and every safety matter.
    </aside>
  );
}
