'use client';

import { useState } from 'react';
import type { ForceUnit, SpeedUnit } from '@/lib/core/engine/units';
import type { ReportInputs, ReportResults } from '@/lib/core/reports/parity-figures';
import { ParityCharts } from './parity-charts';
import { ParityTables } from './parity-tables';
import { ParityOdds } from './parity-odds';

const FORCE_UNITS: ForceUnit[] = ['N', 'kgf', 'lbf'];
const SPEED_UNITS: SpeedUnit[] = ['km/h', 'm/s', 'kn', 'mph'];

/** The report's charts and tables under one unit switch, so a figure reads the same in both. */
export function ParityReport({ inputs, results }: { inputs: ReportInputs; results: ReportResults }) {
  const [forceUnit, setForceUnit] = useState<ForceUnit>('N');
  const [speedUnit, setSpeedUnit] = useState<SpeedUnit>('km/h');
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap gap-4" data-testid="unit-switch">
        <label className="flex items-center gap-2 font-bold">
          Force
          <select
            className="field-input w-auto"
            value={forceUnit}
            onChange={(e) => setForceUnit(e.target.value as ForceUnit)}
            aria-label="Force unit"
          >
            {FORCE_UNITS.map((u) => (
              <option key={u}>{u}</option>
            ))}
          </select>
        </label>
        <label className="flex items-center gap-2 font-bold">
          Speed
          <select
            className="field-input w-auto"
            value={speedUnit}
            onChange={(e) => setSpeedUnit(e.target.value as SpeedUnit)}
            aria-label="Speed unit"
          >
            {SPEED_UNITS.map((u) => (
              <option key={u}>{u}</option>
            ))}
          </select>
        </label>
      </div>
      <ParityCharts inputs={inputs} results={results} forceUnit={forceUnit} speedUnit={speedUnit} />
      <ParityTables inputs={inputs} results={results} forceUnit={forceUnit} speedUnit={speedUnit} />
      <ParityOdds inputs={inputs} results={results} forceUnit={forceUnit} speedUnit={speedUnit} />
    </div>
  );
}
