// What the calculator's chart draws, shared by its wrapper (thrust-chart.tsx), the drawing loaded on
// demand (thrust-chart-drawing.tsx) and the set-up fields (their colour swatch).
import type { ForceUnit, SpeedUnit } from '@/lib/core/engine/units';
import type { CurvePoint } from './setup-model';

/** One style per set-up slot (theme colours: tide, flare, pass, ink). */
export const SERIES_STYLES = [
  { color: '#174c70', dash: undefined },
  { color: '#c2560a', dash: '9 4' },
  { color: '#1d7a36', dash: '2 4' },
  { color: '#0b1620', dash: '14 4 3 4' },
] as const;

export interface ChartSeries {
  id: string;
  label: string;
  styleIndex: number;
  points: readonly CurvePoint[];
}

export interface ChartCrossing {
  key: string;
  speedMs: number;
  thrustN: number;
}

export interface ThrustChartProps {
  series: readonly ChartSeries[];
  crossings: readonly ChartCrossing[];
  speedUnit: SpeedUnit;
  forceUnit: ForceUnit;
}
