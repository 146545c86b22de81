'use client';

// The drawings inside the parity report's charts (recharts). parity-charts.tsx loads this file with
// next/dynamic when a chart is on screen and keeps each chart's box, captions and legend itself, so
// the report's first load carries no charting library and nothing moves while it arrives.
import {
  Bar,
  BarChart,
  CartesianGrid,
  ErrorBar,
  Line,
  LineChart,
  ReferenceDot,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import type { ForceUnit, SpeedUnit } from '@/lib/core/engine/units';

export type DrawnBoat = { entryId: string; label: string; stroke: string; dash: string };
export type CrossoverDot = { key: string; x: number; y: number };

export function ThrustCurvesDrawing({
  lineData,
  boats,
  crossovers,
  cavitation = [],
  forceUnit,
  speedUnit,
  labels,
}: {
  lineData: Record<string, number>[];
  boats: DrawnBoat[];
  crossovers: CrossoverDot[];
  /** Points where a boat's pump cavitates (its thrust there an upper bound): hollow red rings. */
  cavitation?: CrossoverDot[];
  forceUnit: ForceUnit;
  speedUnit: SpeedUnit;
  labels: Map<string, string>;
}) {
  return (
    <ResponsiveContainer width="100%" height="100%">
      <LineChart data={lineData} margin={{ top: 8, right: 12, bottom: 20, left: 8 }}>
        <CartesianGrid stroke="#d5d0c2" strokeDasharray="3 3" />
        <XAxis
          dataKey="speed"
          type="number"
          domain={[0, 'dataMax']}
          label={{ value: speedUnit, position: 'insideBottom', offset: -10 }}
        />
        <YAxis width={60} />
        <Tooltip
          formatter={(v, name) => [
            `${v} ${forceUnit}`,
            name === 'median' ? 'Median boat' : (labels.get(String(name)) ?? String(name)),
          ]}
          labelFormatter={(v) => `${v} ${speedUnit}`}
        />
        {boats.map((b) => (
          <Line
            key={b.entryId}
            dataKey={b.entryId}
            name={b.label}
            dot={false}
            stroke={b.stroke}
            strokeDasharray={b.dash || undefined}
            strokeWidth={1.5}
            isAnimationActive={false}
          />
        ))}
        <Line dataKey="median" dot={false} stroke="#e86a10" strokeWidth={3} isAnimationActive={false} />
        {crossovers.map((c) => (
          <ReferenceDot key={c.key} x={c.x} y={c.y} r={5} fill="#fbfaf6" stroke="#0b1620" />
        ))}
        {cavitation.map((c) => (
          <ReferenceDot key={c.key} x={c.x} y={c.y} r={7} fill="none" stroke="#b3261e" strokeWidth={2} />
        ))}
      </LineChart>
    </ResponsiveContainer>
  );
}

type Bars = { name: string; err: number }[];

export function DeviationDrawing({ data }: { data: (Bars[number] & { dev: number })[] }) {
  return (
    <ResponsiveContainer width="100%" height="100%">
      <BarChart data={data} layout="vertical" margin={{ left: 8, right: 16 }}>
        <CartesianGrid stroke="#d5d0c2" strokeDasharray="3 3" />
        <XAxis type="number" unit=" %" />
        <YAxis type="category" dataKey="name" width={130} tick={{ fontSize: 12 }} />
        <ReferenceLine x={0} stroke="#0b1620" />
        <Tooltip formatter={(v) => [`${v} %`, 'Deviation']} />
        <Bar dataKey="dev" fill="#1f5f8b" isAnimationActive={false}>
          <ErrorBar dataKey="err" width={6} stroke="#0b1620" direction="x" />
        </Bar>
      </BarChart>
    </ResponsiveContainer>
  );
}

export function JetVelocityDrawing({
  data,
  speedUnit,
}: {
  data: (Bars[number] & { vj: number })[];
  speedUnit: SpeedUnit;
}) {
  return (
    <ResponsiveContainer width="100%" height="100%">
      <BarChart data={data} layout="vertical" margin={{ left: 8, right: 16 }}>
        <CartesianGrid stroke="#d5d0c2" strokeDasharray="3 3" />
        <XAxis type="number" domain={['dataMin - 2', 'dataMax + 2']} tickFormatter={(v: number) => v.toFixed(0)} />
        <YAxis type="category" dataKey="name" width={130} tick={{ fontSize: 12 }} />
        <Tooltip formatter={(v) => [`${v} ${speedUnit}`, 'Jet velocity']} />
        <Bar dataKey="vj" fill="#2a3a48" isAnimationActive={false}>
          <ErrorBar dataKey="err" width={6} stroke="#e86a10" direction="x" />
        </Bar>
      </BarChart>
    </ResponsiveContainer>
  );
}
