import type { CrewFinding } from '@/lib/core/crew/assess-crew';
import { formatCalendarDate } from '@/lib/core/format/time';

/** What is not in order for an entry's people and gear on a meeting day; words, not colour alone. */
export function CrewFindings({
  findings,
  day,
  testId = 'crew-findings',
}: {
  findings: CrewFinding[];
  day: string;
  testId?: string;
}) {
  if (findings.length === 0)
    return (
      <p className="font-bold text-pass-800" data-testid={testId} data-state="in-order">
        ✓ People and dated gear in order on {formatCalendarDate(day)}.
      </p>
    );
  const hasFinding = findings.some((f) => f.severity === 'finding');
  return (
    <div
      className={`rounded-lg border-l-8 px-3 py-2 ${hasFinding ? 'border-fail-600 bg-fail-100 text-fail-800' : 'border-doubt-600 bg-doubt-100 text-doubt-800'}`}
      data-testid={testId}
      data-state={hasFinding ? 'findings' : 'warnings'}
    >
      <p className="font-bold">
        {hasFinding ? 'Not in order' : 'In order today, not for the whole meeting'} on {formatCalendarDate(day)}
      </p>
      <ul className="list-disc pl-5">
        {findings.map((f, i) => (
          <li key={i} data-code={f.code}>
            <span className="font-bold">{f.severity === 'finding' ? '✕ ' : '! '}</span>
            {f.text}
          </li>
        ))}
      </ul>
    </div>
  );
}
