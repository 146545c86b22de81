'use client';

// The thrust calculator: up to four set-ups, display units, the curves and their crossovers.
// Every figure comes from the public API (use-jet-results.ts); this file only arranges them.

import { useRef, useState } from 'react';
import { FORCE_UNIT_OPTIONS, SPEED_UNIT_OPTIONS, POWER_UNIT_OPTIONS } from '@/lib/core/engine/units';
import type { ForceUnit, PowerUnit, SpeedUnit } from '@/lib/core/engine/units';
import { SafetyNote } from '@/components/safety-note';
import { MAX_SETUPS, createExampleSetup, formatSpeedPair, interpolateThrustN, nextLabel } from './setup-model';
import type { DisplayUnits, SetupDraft } from './setup-model';
import { SetupFields } from './setup-fields';
import { ThrustChart } from './thrust-chart';
import type { ChartCrossing, ChartSeries } from './thrust-chart';
import { useJetResults } from './use-jet-results';
import type { JetResults } from './use-jet-results';

const DISPLAY_POWER_UNITS = POWER_UNIT_OPTIONS.filter((o) => o.value !== 'W');

export function Calculator() {
  const [setups, setSetups] = useState<SetupDraft[]>(() => [createExampleSetup('s1', 'A')]);
  const nextId = useRef(2);
  const [units, setUnits] = useState<DisplayUnits>({ power: 'kW', speed: 'km/h', force: 'N' });
  const { results, isUpdating, problem } = useJetResults(setups);

  const update = (id: string, patch: Partial<SetupDraft>) =>
    setSetups((all) => all.map((s) => (s.id === id ? { ...s, ...patch } : s)));
  // A new set-up starts as a copy of the last one: comparing usually means changing one thing.
  const add = () =>
    setSetups((all) => {
      if (all.length >= MAX_SETUPS) return all;
      const last = all[all.length - 1] ?? createExampleSetup('', 'A');
      return [...all, { ...last, id: `s${nextId.current++}`, label: nextLabel(all) }];
    });
  const remove = (id: string) => setSetups((all) => all.filter((s) => s.id !== id));

  const series: ChartSeries[] = [];
  setups.forEach((s, i) => {
    const curve = results?.curves[s.id];
    if (curve?.ok)
      series.push({ id: s.id, label: s.label || `Set-up ${i + 1}`, styleIndex: i, points: curve.data.points });
  });
  const sentences = describeCrossovers(setups, results, units.speed);

  return (
    <div className="space-y-6">
      <section aria-label="Display units" className="card grid gap-4 sm:grid-cols-3">
        <UnitSelect
          id="display-power"
          label="Show power in"
          value={units.power}
          options={DISPLAY_POWER_UNITS}
          onChange={(power: PowerUnit) => setUnits((u) => ({ ...u, power }))}
        />
        <UnitSelect
          id="display-speed"
          label="Show speed in"
          value={units.speed}
          options={SPEED_UNIT_OPTIONS}
          onChange={(speed: SpeedUnit) => setUnits((u) => ({ ...u, speed }))}
        />
        <UnitSelect
          id="display-force"
          label="Show thrust in"
          value={units.force}
          options={FORCE_UNIT_OPTIONS}
          onChange={(force: ForceUnit) => setUnits((u) => ({ ...u, force }))}
        />
      </section>

      {/* Each set-up's card has an h3: this keeps the heading levels in order (h1, h2, h3) for screen readers. */}
      <h2 className="sr-only">Set-ups</h2>
      <div className="grid gap-4 lg:grid-cols-2">
        {setups.map((s, i) => {
          const curve = results?.curves[s.id];
          return (
            <SetupFields
              key={s.id}
              index={i}
              setup={s}
              errors={curve && !curve.ok ? curve.fieldErrors : {}}
              data={curve?.ok ? curve.data : undefined}
              units={units}
              canRemove={setups.length > 1}
              onChange={(patch) => update(s.id, patch)}
              onRemove={() => remove(s.id)}
            />
          );
        })}
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <button type="button" className="btn-secondary" onClick={add} disabled={setups.length >= MAX_SETUPS}>
          Add a set-up
        </button>
        <span className="text-sm text-ink-mute">Up to {MAX_SETUPS}; a new one copies the last.</span>
      </div>

      <section aria-labelledby="curves-heading" className="card space-y-4">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="curves-heading">Thrust against boat speed</h2>
          <p role="status" aria-live="polite" data-testid="calc-status" className="text-sm font-bold text-tide-600">
            {isUpdating ? 'Updating…' : ''}
          </p>
        </div>
        {problem && (
          <p className="field-error" data-testid="calc-problem">
            {problem}
          </p>
        )}
        {series.length > 0 ? (
          <figure className={isUpdating ? 'opacity-70 transition-opacity' : 'transition-opacity'}>
            <ThrustChart
              series={series}
              crossings={sentences.flatMap((c) => (c.marker ? [c.marker] : []))}
              speedUnit={units.speed}
              forceUnit={units.force}
            />
            <figcaption className="sr-only">
              Thrust of each set-up from rest to 35 m/s; crossovers are listed below.
            </figcaption>
          </figure>
        ) : (
          <p className="text-ink-soft">{results ? 'Correct the marked fields to see the curves.' : 'Calculating…'}</p>
        )}
        {sentences.length > 0 && (
          <div>
            <h3>Where the curves cross</h3>
            <ul className="mt-2 space-y-1" data-testid="crossovers">
              {sentences.map((c) => (
                <li key={c.key}>{c.text}</li>
              ))}
            </ul>
          </div>
        )}
        <SafetyNote />
      </section>
    </div>
  );
}

function UnitSelect<U extends string>({
  id,
  label,
  value,
  options,
  onChange,
}: {
  id: string;
  label: string;
  value: U;
  options: readonly { value: U; label: string }[];
  onChange: (u: U) => void;
}) {
  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      <select id={id} value={value} onChange={(e) => onChange(e.target.value as U)} className="field-input">
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </div>
  );
}

interface CrossoverSentence {
  key: string;
  text: string;
  marker?: ChartCrossing;
}

/** "B passes A at 33.5 m/s (120.6 km/h)": above the crossing, the set-up weaker at rest has more thrust. */
function describeCrossovers(
  setups: readonly SetupDraft[],
  results: JetResults | undefined,
  speedUnit: SpeedUnit,
): CrossoverSentence[] {
  if (!results) return [];
  const byId = new Map(setups.map((s, i) => [s.id, s.label.trim() || `Set-up ${i + 1}`]));
  const out: CrossoverSentence[] = [];
  for (const c of results.crossovers) {
    const a = results.curves[c.aId];
    const b = results.curves[c.bId];
    const nameA = byId.get(c.aId);
    const nameB = byId.get(c.bId);
    if (!a?.ok || !b?.ok || !nameA || !nameB) continue;
    const t0A = a.data.points[0].thrustN;
    const t0B = b.data.points[0].thrustN;
    const [stronger, weaker] = t0A >= t0B ? [nameA, nameB] : [nameB, nameA];
    const key = `${c.aId}-${c.bId}`;
    if (c.speedMs === null) {
      const range = c.isFromApi ? 'below 100 m/s' : 'between 0 and 35 m/s';
      const text =
        t0A === t0B
          ? `${nameA} and ${nameB} give the same thrust and do not cross ${range}.`
          : `${stronger} has more thrust than ${weaker} at every speed ${range}: the curves do not cross.`;
      out.push({ key, text });
      continue;
    }
    const thrustN = interpolateThrustN(a.data.points, c.speedMs);
    const note = !c.isFromApi
      ? ' (read from the curves: these set-ups differ in more than the nozzle)'
      : thrustN === undefined
        ? ' (beyond the chart)'
        : '';
    out.push({
      key,
      text: `${weaker} passes ${stronger} at ${formatSpeedPair(c.speedMs, speedUnit)}${note}.`,
      marker: thrustN === undefined ? undefined : { key, speedMs: c.speedMs, thrustN },
    });
  }
  return out;
}
