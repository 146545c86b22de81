import type { StandingsView } from '@/lib/server/series/standings';

// The standings after the latest round held: each round's points (dropped ones in brackets, disqualifications
// marked), points deducted and the total; then each boat's position after every round.
export function StandingsTable({ standings }: { standings: StandingsView }) {
  const latest = standings.after.at(-1);
  if (!latest) return <p className="text-sm">No round has results yet.</p>;
  const held = standings.after.length;
  const positionAfter = standings.after.map((a) => new Map(a.rows.map((r) => [r.competitorId, r])));
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" data-testid="standings">
        <caption className="text-left text-ink-soft">
          Standings after {held} round{held === 1 ? '' : 's'} ({latest.roundLabel})
        </caption>
        <thead>
          <tr>
            <th scope="col">Pos.</th>
            <th scope="col">Boat</th>
            {standings.after.map((a, i) => (
              <th scope="col" key={i} title={a.roundLabel}>
                R{i + 1}
              </th>
            ))}
            <th scope="col">Deducted</th>
            <th scope="col">Total</th>
            <th scope="col">Position after each round</th>
          </tr>
        </thead>
        <tbody>
          {latest.rows.map((r) => (
            <tr key={r.competitorId}>
              <td>
                {r.position}
                {r.isTied ? '=' : ''}
              </td>
              <th scope="row" className="text-left font-normal">
                {standings.competitors[r.competitorId]?.label}
              </th>
              {r.rounds.map((x) => (
                <td key={x.roundId}>
                  {x.status
                    ? x.status.toUpperCase()
                    : x.position === null
                      ? '–'
                      : x.isDropped
                        ? `(${x.points})`
                        : x.points}
                </td>
              ))}
              <td>{r.pointsDeducted ? `−${r.pointsDeducted}` : ''}</td>
              <td className="font-bold">{r.total}</td>
              <td>{positionAfter.map((m) => m.get(r.competitorId)?.position ?? '–').join(' → ')}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
