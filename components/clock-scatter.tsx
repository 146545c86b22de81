'use client';

import dynamic from 'next/dynamic';
import { WhenVisible } from './when-visible';
import type { ClockScatterPoint } from './clock-scatter-drawing';

const ClockScatterDrawing = dynamic(() => import('./clock-scatter-drawing').then((m) => m.ClockScatterDrawing), {
  ssr: false,
});

/** Predicted against observed mean time per boat, with the identity line (on it, the model matches the clock). */
export function ClockScatter({ points }: { points: ClockScatterPoint[] }) {
  const all = points.flatMap((p) => [p.predicted, p.observed]);
  const pad = Math.max(0.5, (Math.max(...all) - Math.min(...all)) * 0.08);
  const min = Math.floor((Math.min(...all) - pad) * 2) / 2;
  const max = Math.ceil((Math.max(...all) + pad) * 2) / 2;
  return (
    <figure className="space-y-2">
      <WhenVisible className="h-72 w-full sm:h-80" data-testid="clock-chart">
        <ClockScatterDrawing points={points} min={min} max={max} />
      </WhenVisible>
      <figcaption className="text-sm text-ink-soft">
        Each dot is one boat: its predicted time across, its mean observed time up. The dashed line is where the two
        agree; a dot above it ran slower than the model said.
      </figcaption>
    </figure>
  );
}
