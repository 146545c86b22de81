import type { Actor } from '@/lib/server/auth/actor';
import { listCrewFindings } from '@/lib/server/crew/list-crew-findings';
import { formatCalendarDate } from '@/lib/core/format/time';

/** On the chief scrutineer's board: boats whose people or dated gear are not in order today, before they reach the dock. */
export async function CrewBoardPanel({ actor, eventId }: { actor: Actor; eventId: string }) {
  const { day, rows, undeclared, entryCount } = await listCrewFindings(actor, eventId);
  if (!day) return null;
  return (
    <section className="card space-y-2" aria-labelledby="crew-board-heading" data-testid="crew-board">
      <h2 id="crew-board-heading" className="text-xl">
        Crew and dated gear on {formatCalendarDate(day)}
      </h2>
      {undeclared.length > 0 && (
        <p data-testid="crew-board-undeclared">
          <span className="font-bold">✕ No crew or gear declared yet ({undeclared.length}):</span>{' '}
          {undeclared.map((u) => u.raceNumber).join(', ')}
        </p>
      )}
      {rows.length === 0 && undeclared.length === 0 ? (
        <p className="font-bold text-pass-800">✓ All {entryCount} boats: people and dated gear in order.</p>
      ) : (
        rows.length > 0 && (
          <ul className="space-y-2">
            {rows.map((r) => {
              const hasFinding = r.findings.some((f) => f.severity === 'finding');
              return (
                <li key={r.entryId} data-entry-id={r.entryId} data-testid="crew-board-row">
                  <p className="font-bold">
                    <span className="figure">{r.raceNumber}</span> {r.boatName} · {r.classCode}{' '}
                    <span className={hasFinding ? 'text-fail-800' : 'text-doubt-800'}>
                      {hasFinding ? '✕ not in order' : '! runs out during the meeting'}
                    </span>
                  </p>
                  <ul className="list-disc pl-5">
                    {r.findings.map((f, i) => (
                      <li key={i} data-code={f.code}>
                        {f.text}
                      </li>
                    ))}
                  </ul>
                </li>
              );
            })}
          </ul>
        )
      )}
      <p className="text-sm text-ink-soft">
        Dates are judged in the meeting’s time zone; an item is valid through the end of its date (common practice). The
        local rulebook and the officials decide.
      </p>
    </section>
  );
}
