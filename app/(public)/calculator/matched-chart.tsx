'use client';

// The matched mode's chart: thrust against boat speed at the operating point, the fixed-power
// figure for comparison (the power and efficiency of the first operating point held at every speed), and the speeds where the inlet cavitates shaded
// (the thrust there is an upper bound). Loaded lazily by matched-mode.tsx. The same facts are in
// the table and the sentences beside the chart.

import {
  CartesianGrid,
  Legend,
  Line,
  LineChart,
  ReferenceArea,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import type { MatchedPerformancePoint } from '@/lib/core/engine/calculation-api';
import { CAVITATION_WORDS, MATCHED_SPEEDS_MS } from './matched-model';

interface Props {
  points: readonly MatchedPerformancePoint[];
  /** Fixed-power thrust per point (same index), at the power and efficiency of the first operating point. */
  fixed: readonly (number | undefined)[];
  cavitating: readonly { fromMs: number; toMs: number }[];
}

const round = (x: number, digits: number) => Number(x.toFixed(digits));

/** The shaded region's words on two lines at its lower left, clear of the legend and the curve. */
function CavitationLabel({ viewBox }: { viewBox?: { x?: number; y?: number; width?: number; height?: number } }) {
  if (viewBox?.x === undefined || viewBox.y === undefined || viewBox.height === undefined) return null;
  const x = viewBox.x + 6;
  const y = viewBox.y + viewBox.height - 28;
  const [head, rest] = CAVITATION_WORDS.split(': ');
  return (
    <text x={x} y={y} fill="#7a3606" fontSize={12} data-testid="matched-cavitation-label">
      <tspan x={x} dy={0}>
        {head}:
      </tspan>{' '}
      <tspan x={x} dy={15}>
        {rest}
      </tspan>
    </text>
  );
}

export function MatchedChart({ points, fixed, cavitating }: Props) {
  const bySpeed = new Map(points.map((p, i) => [p.speedMs, { p, f: fixed[i] }]));
  // Every sweep speed gets a row, so a speed without an operating point shows as a gap.
  const rows = MATCHED_SPEEDS_MS.map((speed) => {
    const hit = bySpeed.get(speed);
    const row: Record<string, number | null> = { speed, matched: null, fixed: null };
    if (hit) {
      row.matched = round(hit.p.thrustN, 1);
      row.fixed = hit.f === undefined ? null : round(hit.f, 1);
    }
    return row;
  });
  const maxSpeed = MATCHED_SPEEDS_MS[MATCHED_SPEEDS_MS.length - 1];
  const step = 0.25; // half the sweep step: the shading covers each flagged point's neighbourhood.

  return (
    <div data-testid="matched-chart" className="h-80 w-full sm:h-96">
      <ResponsiveContainer width="100%" height="100%">
        <LineChart data={rows} margin={{ top: 16, right: 16, bottom: 28, left: 8 }}>
          <CartesianGrid stroke="#d5d0c2" strokeDasharray="3 3" />
          <XAxis
            dataKey="speed"
            type="number"
            domain={[0, maxSpeed]}
            ticks={[0, 5, 10, 15, 20, 25, 30, 35, 40]}
            label={{ value: 'Boat speed (m/s)', position: 'insideBottom', offset: -16, fill: '#2a3a48' }}
            stroke="#51606d"
          />
          <YAxis
            width={64}
            tickFormatter={(v: number) => (Math.abs(v) >= 1000 ? `${round(v / 1000, 1)}k` : String(round(v, 1)))}
            label={{ value: 'Thrust (N)', angle: -90, position: 'insideLeft', offset: 4, fill: '#2a3a48' }}
            stroke="#51606d"
          />
          {cavitating.map((r) => (
            <ReferenceArea
              key={`cav-${r.fromMs}`}
              x1={Math.max(0, r.fromMs - step)}
              x2={Math.min(maxSpeed, r.toMs + step)}
              fill="#c2560a"
              fillOpacity={0.15}
              stroke="#c2560a"
              strokeDasharray="3 3"
              className="matched-cavitation"
              label={<CavitationLabel />}
            />
          ))}
          <Tooltip
            formatter={(value) => `${Number(value).toFixed(0)} N`}
            labelFormatter={(v) => `${Number(v).toFixed(1)} m/s`}
          />
          <Legend verticalAlign="top" height={28} />
          <Line
            dataKey="matched"
            name="Matched to engine and pump"
            type="monotone"
            stroke="#174c70"
            strokeWidth={3}
            dot={false}
            connectNulls={false}
            isAnimationActive={false}
          />
          <Line
            dataKey="fixed"
            name="Fixed power of the first point"
            type="monotone"
            stroke="#c2560a"
            strokeDasharray="9 4"
            strokeWidth={2}
            dot={false}
            connectNulls={false}
            isAnimationActive={false}
          />
        </LineChart>
      </ResponsiveContainer>
    </div>
  );
}
