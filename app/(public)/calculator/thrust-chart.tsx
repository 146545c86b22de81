'use client';

// Thrust against boat speed for every set-up, in the display units chosen, with each crossover
// marked. Lines differ by dash pattern as well as colour, so they stay apart in sunlight and for
// colour-vision deficiencies; the same crossovers are listed in words beside the chart.

import dynamic from 'next/dynamic';
import { WhenVisible } from '@/components/when-visible';
import type { ThrustChartProps } from './chart-series';

export { SERIES_STYLES, type ChartCrossing, type ChartSeries } from './chart-series';

// recharts is loaded when the chart is drawn, not with the page, and the chart is drawn when it comes
// near the screen: the wrapper keeps the chart's box (nothing moves while the library arrives).
const ThrustChartDrawing = dynamic(() => import('./thrust-chart-drawing').then((m) => m.ThrustChartDrawing), {
  ssr: false,
});

export function ThrustChart(props: ThrustChartProps) {
  return (
    <WhenVisible className="h-80 w-full sm:h-96" data-testid="thrust-chart">
      <ThrustChartDrawing {...props} />
    </WhenVisible>
  );
}
