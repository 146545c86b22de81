'use client';

import type { OtherEntry } from './form-model';

const RESULT_WORDS: Record<string, string> = {
  conforms: 'conforms',
  does_not_conform: 'does not conform',
  inconclusive: 'inconclusive',
};

/**
 * A boat entered in several classes at this meeting: one inspection per class, each judged under that
 * class's rules. Beside a card (current: that card's class) or after a verdict (current: null), the
 * other classes are a tap away; the form starts afresh for each.
 */
export function ClassSwitcher({
  raceNumber,
  boatName,
  current,
  others,
  onSwitch,
}: {
  raceNumber: number;
  boatName: string;
  current: string | null;
  others: OtherEntry[];
  onSwitch: (entryId: string) => void;
}) {
  return (
    <nav aria-label="Classes this boat is entered in" className="card space-y-2" data-testid="class-switcher">
      {current ? (
        <p>
          No. <span className="figure">{raceNumber}</span> {boatName} is entered in {others.length + 1} classes here.
          Each class has its own inspection under its own rules: this card is <strong>{current}</strong>.
        </p>
      ) : (
        <p>
          No. <span className="figure">{raceNumber}</span> {boatName} is also entered in{' '}
          {others.map((e) => e.classCode).join(' and ')} here, inspected under that class&rsquo;s own rules: inspect it
          while the boat is at the dock.
        </p>
      )}
      <ul className="flex flex-wrap gap-2">
        {others.map((e) => (
          <li key={e.entryId}>
            <button
              type="button"
              className="btn-secondary"
              data-entry-id={e.entryId}
              onClick={() => onSwitch(e.entryId)}
            >
              Inspect under {e.classCode}{' '}
              <span className="font-normal">
                ({e.inspectionResult ? (RESULT_WORDS[e.inspectionResult] ?? e.inspectionResult) : 'not inspected yet'})
              </span>
            </button>
          </li>
        ))}
      </ul>
    </nav>
  );
}
