// Boreline's mark: a nozzle bore seen end-on, with the measured diameter line across it.
export function BrandMark({ className = 'h-8 w-8' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <circle cx="16" cy="16" r="14" fill="#103a57" />
      <circle cx="16" cy="16" r="8.5" fill="none" stroke="#fbfaf6" strokeWidth="3" />
      <line x1="3" y1="16" x2="29" y2="16" stroke="#e86a10" strokeWidth="3" strokeLinecap="round" />
    </svg>
  );
}

export function BrandName() {
  return <span className="text-xl font-bold tracking-tight text-ink">Boreline</span>;
}
