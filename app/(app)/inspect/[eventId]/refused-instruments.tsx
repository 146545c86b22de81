// Under an instrument choice at the dock: each instrument of that quantity that cannot be chosen now
// (calibration overdue, or out of use after a failed check today), why, and which usable one to take.
import type { InstrumentView } from '@/lib/server/inspections/list-instruments';
import { usableAlternatives } from '@/lib/core/inspections/usable-alternatives';

export function RefusedInstruments({ instruments, testId }: { instruments: InstrumentView[]; testId: string }) {
  const refused = instruments.filter((i) => !i.calibration.usable);
  if (refused.length === 0) return null;
  return (
    <ul className="mt-2 space-y-1 text-base" data-testid={testId}>
      {refused.map((i) => {
        const instead = usableAlternatives(instruments, i);
        return (
          <li key={i.id} data-refused-instrument={i.id}>
            <span className="font-bold">{i.name}</span> cannot be chosen: {i.calibration.reason}.{' '}
            {instead.length > 0
              ? `Use ${instead.map((a) => a.name).join(' or ')} instead.`
              : 'No other usable instrument of this kind is on the list: ask the chief scrutineer.'}
          </li>
        );
      })}
    </ul>
  );
}
