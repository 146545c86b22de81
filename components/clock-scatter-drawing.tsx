'use client';

// The drawing inside the predicted-against-observed chart (recharts), loaded by clock-scatter.tsx when
// the chart comes near the screen, so the page's first load carries no charting library.
import {
  CartesianGrid,
  ReferenceLine,
  ResponsiveContainer,
  Scatter,
  ScatterChart,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';

export type ClockScatterPoint = { label: string; predicted: number; observed: number };

export function ClockScatterDrawing({ points, min, max }: { points: ClockScatterPoint[]; min: number; max: number }) {
  return (
    <ResponsiveContainer width="100%" height="100%">
      <ScatterChart margin={{ top: 8, right: 12, bottom: 24, left: 8 }}>
        <CartesianGrid stroke="#d5d0c2" strokeDasharray="3 3" />
        <XAxis
          type="number"
          dataKey="predicted"
          domain={[min, max]}
          tickFormatter={(v: number) => v.toFixed(1)}
          label={{ value: 'Predicted (s)', position: 'insideBottom', offset: -12 }}
        />
        <YAxis
          type="number"
          dataKey="observed"
          domain={[min, max]}
          width={56}
          tickFormatter={(v: number) => v.toFixed(1)}
          label={{ value: 'Observed (s)', angle: -90, position: 'insideLeft' }}
        />
        <ReferenceLine
          segment={[
            { x: min, y: min },
            { x: max, y: max },
          ]}
          stroke="#51606d"
          strokeDasharray="6 3"
          ifOverflow="visible"
        />
        <Tooltip
          formatter={(v, name) => [`${Number(v).toFixed(2)} s`, name === 'predicted' ? 'Predicted' : 'Observed']}
          labelFormatter={() => ''}
        />
        <Scatter data={points} fill="#1f5f8b" isAnimationActive={false} name="Boats" />
      </ScatterChart>
    </ResponsiveContainer>
  );
}
