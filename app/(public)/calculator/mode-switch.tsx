'use client';

// The calculator's two modes: fixed shaft power (the set-ups) or the jet matched to its engine and
// pump. The mode is kept in the address (?mode=matched) so it can be linked. Both modes stay
// mounted, so switching back and forth loses nothing typed.

import type { ReactNode } from 'react';
import { useState } from 'react';
import dynamic from 'next/dynamic';

// The matched mode's code (its engine and pump model and the checks of its input) is fetched when that mode is
// first shown, not with the page: most visits use the fixed-power set-ups, and on a phone that code took longer
// to start than the rest of the page. Opened at ?mode=matched, the server renders it as before.
const MatchedMode = dynamic(() => import('./matched-mode').then((m) => m.MatchedMode), {
  loading: () => (
    <p role="status" className="text-lg">
      Loading the matched calculator…
    </p>
  ),
});

export type CalculatorMode = 'fixed' | 'matched';

const MODES: { value: CalculatorMode; label: string; hint: string }[] = [
  { value: 'fixed', label: 'Fixed shaft power', hint: 'Compare up to four set-ups at a power you give.' },
  {
    value: 'matched',
    label: 'Matched to engine and pump',
    hint: 'The power and rpm found from an engine curve and a pump curve.',
  },
];

export function CalculatorModes({ initialMode, fixed }: { initialMode: CalculatorMode; fixed: ReactNode }) {
  const [mode, setMode] = useState<CalculatorMode>(initialMode);
  // The matched mode is mounted when first chosen (its chart loads then), and kept.
  const [matchedShown, setMatchedShown] = useState(initialMode === 'matched');
  const choose = (m: CalculatorMode) => {
    setMode(m);
    if (m === 'matched') setMatchedShown(true);
    const url = new URL(window.location.href);
    if (m === 'matched') url.searchParams.set('mode', 'matched');
    else url.searchParams.delete('mode');
    window.history.replaceState(window.history.state, '', url);
  };
  return (
    <div className="space-y-6">
      <div role="group" aria-label="Calculator mode" className="flex flex-wrap gap-3" data-testid="calculator-mode">
        {MODES.map((m) => (
          <button
            key={m.value}
            type="button"
            aria-pressed={mode === m.value}
            title={m.hint}
            onClick={() => choose(m.value)}
            className={mode === m.value ? 'btn-primary' : 'btn-secondary'}
          >
            {m.label}
          </button>
        ))}
      </div>
      <div hidden={mode !== 'fixed'}>{fixed}</div>
      {matchedShown && (
        <div hidden={mode !== 'matched'}>
          <MatchedMode />
        </div>
      )}
    </div>
  );
}
