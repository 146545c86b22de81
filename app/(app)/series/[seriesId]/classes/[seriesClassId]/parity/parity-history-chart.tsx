'use client';

import dynamic from 'next/dynamic';
import { WhenVisible } from '@/components/when-visible';
import type { ParityHistory } from '@/lib/core/series/parity-history';

// recharts arrives when the chart comes near the screen (components/when-visible.tsx), not with the page.
const Drawing = dynamic(() => import('./parity-history-drawing').then((m) => m.ParityHistoryDrawing), { ssr: false });

export function ParityHistoryChart({ history }: { history: ParityHistory }) {
  const data = history.rounds.map((r, i) => ({
    round: `R${i + 1}`,
    spread: r.spreadPercent,
    cv: r.coefficientOfVariationPercent,
  }));
  // A change that took effect after round i is drawn at round i + 1, the first round it applied to.
  const marks = history.ruleChanges
    .filter((c) => c.afterRoundIndex + 1 < history.rounds.length && c.afterRoundIndex >= 0)
    .map((c) => ({ round: `R${c.afterRoundIndex + 2}`, label: `rules v${c.version}` }));
  return (
    <figure className="space-y-2">
      <WhenVisible className="h-64 w-full" data-testid="parity-history-chart">
        <Drawing data={data} marks={marks} />
      </WhenVisible>
      <figcaption className="text-sm text-ink-soft">
        Spread (solid) and coefficient of variation (dashed) by round, in per cent; dotted lines mark the first round
        under new series rules.
      </figcaption>
    </figure>
  );
}
