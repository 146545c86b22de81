'use client';

// The parity history's drawing (recharts), loaded by parity-history-chart.tsx when it comes near the screen.
import { CartesianGrid, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';

export function ParityHistoryDrawing({
  data,
  marks,
}: {
  data: { round: string; spread: number; cv: number | null }[];
  marks: { round: string; label: string }[];
}) {
  return (
    <ResponsiveContainer width="100%" height="100%">
      <LineChart data={data} margin={{ top: 16, right: 16, bottom: 8, left: 8 }}>
        <CartesianGrid strokeDasharray="3 3" />
        <XAxis dataKey="round" />
        <YAxis unit=" %" />
        <Tooltip formatter={(v) => (typeof v === 'number' ? `${v.toFixed(1)} %` : String(v))} />
        <Line type="linear" dataKey="spread" name="Spread" stroke="#1f5f8b" isAnimationActive={false} />
        <Line type="linear" dataKey="cv" name="CV" stroke="#2a3a48" strokeDasharray="6 3" isAnimationActive={false} />
        {marks.map((m) => (
          <ReferenceLine key={m.label} x={m.round} stroke="#e76b10" strokeDasharray="2 3" label={m.label} />
        ))}
      </LineChart>
    </ResponsiveContainer>
  );
}
