import Link from '@/components/link';
import type { ProtestDetail } from '@/lib/server/protests/get-protest';

/**
 * Who may not act on this protest: the viewer's own interest (the steps are then not offered, and
 * the server refuses them too), the other stewards who have one, and stewards' team interests,
 * which are free text and must be checked against the parties by hand.
 */
export function ConflictNotice({ p }: { p: ProtestDetail }) {
  const others = p.stewardConflicts; // the viewer too, under their name: the panel is chosen from this list
  if (p.viewerConflict.length === 0 && others.length === 0 && p.stewardTeamInterests.length === 0) return null;
  return (
    <section
      aria-labelledby="interests"
      className="card space-y-3 border-l-8 border-doubt-600"
      data-testid="conflict-notice"
    >
      <h2 id="interests">Interests in this protest</h2>
      {p.viewerConflict.length > 0 && (
        <div role="note" className="rounded-lg bg-doubt-100 p-3 text-doubt-800" data-testid="viewer-conflict">
          <p className="font-bold">
            You have an interest in this protest: another steward of this meeting must accept, hear and decide it.
          </p>
          <ul className="list-disc pl-6">
            {p.viewerConflict.map((r) => (
              <li key={r}>{r.charAt(0).toUpperCase() + r.slice(1)}.</li>
            ))}
          </ul>
        </div>
      )}
      {others.length > 0 && (
        <div data-testid="steward-conflicts">
          <p className="font-bold">Stewards with an interest (they cannot sit on the panel):</p>
          <ul className="list-disc pl-6">
            {others.map((c) => (
              <li key={c.officialId}>{c.reasons.join('; ')}.</li>
            ))}
          </ul>
        </div>
      )}
      {p.stewardTeamInterests.length > 0 && (
        <div data-testid="steward-team-interests">
          <p className="font-bold">Team interests declared by stewards — check them against the parties:</p>
          <ul className="list-disc pl-6">
            {p.stewardTeamInterests.map((t, i) => (
              <li key={i}>
                {t.officialName}: {t.teamName} (“{t.statement}”)
              </li>
            ))}
          </ul>
        </div>
      )}
      <p className="text-sm">
        <Link href={`/stewards/${p.eventId}/interests`}>The meeting’s register of declared interests</Link>
      </p>
    </section>
  );
}
