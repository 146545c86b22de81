'use client';

// The drawing inside the calculator's chart (recharts), loaded only once a chart is on screen
// (thrust-chart.tsx imports it with next/dynamic), so the calculator's first load carries no charting library.

import {
  CartesianGrid,
  Legend,
  Line,
  LineChart,
  ReferenceDot,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import { convertForce, convertSpeed, UNIT_LABELS } from '@/lib/core/engine/units';
import { CURVE_SPEEDS_MS } from './setup-model';
import { SERIES_STYLES, type ThrustChartProps } from './chart-series';

const round = (x: number, digits: number) => Number(x.toFixed(digits));

/** Round-number ticks from 0 up to the chart's end, about seven of them, whatever the unit. */
function speedTicks(max: number): number[] {
  const raw = max / 7;
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  const step = ([1, 2, 2.5, 5, 10].find((m) => m * magnitude >= raw) ?? 10) * magnitude;
  return Array.from({ length: Math.floor(max / step + 1e-9) + 1 }, (_, i) => round(i * step, 6));
}

export function ThrustChartDrawing({ series, crossings, speedUnit, forceUnit }: ThrustChartProps) {
  const speedLabel = UNIT_LABELS[speedUnit];
  const forceLabel = UNIT_LABELS[forceUnit];
  // One row per speed with a column per set-up: the shape recharts wants for several lines.
  const rows = CURVE_SPEEDS_MS.map((speedMs, i) => {
    const row: Record<string, number> = { speed: round(convertSpeed(speedMs, 'm/s', speedUnit), 3) };
    for (const s of series) {
      const p = s.points[i];
      if (p && p.speedMs === speedMs) row[s.id] = round(convertForce(p.thrustN, 'N', forceUnit), 2);
    }
    return row;
  });
  const maxSpeed = rows[rows.length - 1].speed;

  return (
    <ResponsiveContainer width="100%" height="100%">
      <LineChart data={rows} margin={{ top: 16, right: 16, bottom: 28, left: 8 }}>
        <CartesianGrid stroke="#d5d0c2" strokeDasharray="3 3" />
        <XAxis
          dataKey="speed"
          type="number"
          domain={[0, maxSpeed]}
          ticks={speedTicks(maxSpeed)}
          tickFormatter={(v: number) => String(v)}
          label={{ value: `Boat speed (${speedLabel})`, position: 'insideBottom', offset: -16, fill: '#2a3a48' }}
          stroke="#51606d"
        />
        <YAxis
          width={64}
          tickFormatter={(v: number) => (Math.abs(v) >= 1000 ? `${round(v / 1000, 1)}k` : String(round(v, 1)))}
          label={{ value: `Thrust (${forceLabel})`, angle: -90, position: 'insideLeft', offset: 4, fill: '#2a3a48' }}
          stroke="#51606d"
        />
        <Tooltip
          formatter={(value) => `${Number(value).toFixed(forceUnit === 'kgf' ? 1 : 0)} ${forceLabel}`}
          labelFormatter={(v) => `${Number(v).toFixed(1)} ${speedLabel}`}
        />
        <Legend verticalAlign="top" height={28} />
        {series.map((s) => {
          const style = SERIES_STYLES[s.styleIndex % SERIES_STYLES.length];
          return (
            <Line
              key={s.id}
              dataKey={s.id}
              name={s.label}
              type="monotone"
              stroke={style.color}
              strokeDasharray={style.dash}
              strokeWidth={3}
              dot={false}
              isAnimationActive={false}
            />
          );
        })}
        {crossings.map((c) => {
          const x = round(convertSpeed(c.speedMs, 'm/s', speedUnit), 3);
          const y = round(convertForce(c.thrustN, 'N', forceUnit), 2);
          return [
            <ReferenceLine key={`${c.key}-line`} x={x} stroke="#51606d" strokeDasharray="4 4" />,
            <ReferenceDot key={`${c.key}-dot`} x={x} y={y} r={7} fill="#fbfaf6" stroke="#0b1620" strokeWidth={3} />,
          ];
        })}
      </LineChart>
    </ResponsiveContainer>
  );
}
