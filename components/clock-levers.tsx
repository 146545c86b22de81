'use client';

import { useMemo, useState } from 'react';
import { applyBalanceLevers, type BalanceLevers, type CatalogueImpeller } from '@/lib/core/timing/balance-levers';
import { IMPELLER_FACTOR_RANGE, type ImpellerChange } from '@/lib/core/timing/clock-thrust';
import type { ClockSection } from '@/lib/core/timing/clock-section';
import { numberOrNull } from '@/lib/core/inputs/form-values';

const toLever = (text: string) => {
  const v = text.trim() === '' ? null : numberOrNull(text);
  return v !== null && v > 0 && Number.isFinite(v) ? v : null;
};
const s2 = (v: number | null) => (v === null ? '—' : v.toFixed(2));
const signed = (v: number) => `${v >= 0 ? '+' : '−'}${Math.abs(v).toFixed(2)}`;

/** What-if levers in seconds over the course, worked out in the browser from the section's own figures. */
export function ClockLevers({ section, catalogue = [] }: { section: ClockSection; catalogue?: CatalogueImpeller[] }) {
  const [text, setText] = useState({ nozzleCapMm: '', minimumMassKg: '', powerCapKw: '' });
  const [impeller, setImpeller] = useState({ entryId: '', catalogueId: '', factor: '' });
  const chosenBoat = section.boats.find((b) => b.entryId === impeller.entryId);
  const isMatched = chosenBoat?.thrustModel === 'matched' && !!chosenBoat.curves;
  const chosenPump = isMatched ? catalogue.find((c) => c.id === impeller.catalogueId) : undefined;
  const factor = toLever(impeller.factor);
  const change: ImpellerChange | null =
    chosenBoat && (chosenPump || factor !== null)
      ? {
          ...(chosenPump && {
            pump: {
              label: chosenPump.label,
              impellerDiameterMm: chosenPump.impellerDiameterMm,
              curve: chosenPump.curve,
            },
          }),
          ...(factor !== null && { efficiencyFactor: factor }),
        }
      : null;
  const levers: BalanceLevers = {
    nozzleCapMm: toLever(text.nozzleCapMm),
    minimumMassKg: toLever(text.minimumMassKg),
    powerCapKw: toLever(text.powerCapKw),
    ...(change && chosenBoat && { impellers: { [chosenBoat.entryId]: change } }),
  };
  const key = JSON.stringify(levers);
  // eslint-disable-next-line react-hooks/exhaustive-deps
  const outcome = useMemo(() => applyBalanceLevers(section, levers), [section, key]);
  const fields: { name: keyof typeof text; label: string }[] = [
    { name: 'nozzleCapMm', label: 'Nozzle restrictor (mm, largest allowed)' },
    { name: 'minimumMassKg', label: 'Minimum all-up mass (kg, ballast up to it)' },
    { name: 'powerCapKw', label: 'Power cap (kW, as a rev limit)' },
  ];
  const distance = section.courseLengthM ?? section.assumptions.referenceDistancesM.at(-1);
  return (
    <section className="card space-y-3" aria-labelledby="levers-heading" data-testid="clock-levers">
      <h3 id="levers-heading">Balance levers in seconds ({distance} m)</h3>
      <p className="text-sm">
        Try a rule change and see each boat&apos;s predicted time move. Each boat keeps its own drag; the thrust is its
        own model&apos;s (on the matched model a power cap scales its engine curve, a restrictor changes its nozzle and
        another impeller moves where its engine and pump settle; on fixed power an impeller counts only through the pump
        efficiency). A suggestion for the rule makers, not a ruling: a boat&apos;s gap to the median is only worth
        equalising when it is larger than its uncertainty (from its power, nozzle and weighing; crew and fuel are not in
        it).
      </p>
      <div className="grid gap-2 sm:grid-cols-3">
        {fields.map((f) => (
          <div key={f.name}>
            <label htmlFor={`lever-${f.name}`} className="field-label">
              {f.label}
            </label>
            <input
              id={`lever-${f.name}`}
              inputMode="decimal"
              className="field-input"
              value={text[f.name]}
              onChange={(e) => setText((t) => ({ ...t, [f.name]: e.target.value }))}
            />
          </div>
        ))}
      </div>
      <fieldset className="grid gap-2 sm:grid-cols-3" data-testid="lever-impeller">
        <legend className="field-label">Impeller change for one boat</legend>
        <div>
          <label htmlFor="lever-impeller-boat" className="field-label">
            Boat
          </label>
          <select
            id="lever-impeller-boat"
            className="field-input"
            value={impeller.entryId}
            onChange={(e) => setImpeller({ entryId: e.target.value, catalogueId: '', factor: '' })}
          >
            <option value="">None</option>
            {section.boats.map((b) => (
              <option key={b.entryId} value={b.entryId}>
                #{b.raceNumber} {b.boatName}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="lever-impeller-pump" className="field-label">
            Impeller from the meeting&apos;s catalogue
          </label>
          <select
            id="lever-impeller-pump"
            className="field-input"
            value={impeller.catalogueId}
            disabled={!isMatched || catalogue.length === 0}
            aria-describedby="lever-impeller-pump-hint"
            onChange={(e) => setImpeller((i) => ({ ...i, catalogueId: e.target.value }))}
          >
            <option value="">Its own</option>
            {catalogue.map((c) => (
              <option key={c.id} value={c.id}>
                {c.label} (Ø {c.impellerDiameterMm} mm)
              </option>
            ))}
          </select>
          <p id="lever-impeller-pump-hint" className="field-hint">
            {catalogue.length === 0
              ? 'The meeting has no impellers in its catalogue.'
              : chosenBoat && !isMatched
                ? 'This boat runs on fixed power (no declared engine and pump curves): use the efficiency factor.'
                : 'For a boat on the matched model: its engine curve with this impeller.'}
          </p>
        </div>
        <div>
          <label htmlFor="lever-impeller-factor" className="field-label">
            Pump efficiency factor (×)
          </label>
          <input
            id="lever-impeller-factor"
            inputMode="decimal"
            className="field-input"
            value={impeller.factor}
            disabled={!chosenBoat}
            aria-describedby="lever-impeller-factor-hint"
            placeholder="1"
            onChange={(e) => setImpeller((i) => ({ ...i, factor: e.target.value }))}
          />
          <p id="lever-impeller-factor-hint" className="field-hint">
            Its pump&apos;s efficiency (or the class&apos;s, on fixed power) times this, from{' '}
            {IMPELLER_FACTOR_RANGE.min} to {IMPELLER_FACTOR_RANGE.max}: 1.05 for a 5 % better impeller.
          </p>
        </div>
      </fieldset>
      <p className="font-bold" data-testid="lever-spread" aria-live="polite">
        Class spread of predicted times: {s2(outcome.spreadBeforeS)} s today, {s2(outcome.spreadAfterS)} s with these
        levers.
      </p>
      {outcome.leftOut.length > 0 && (
        <ul className="list-disc pl-5 text-sm" data-testid="lever-left-out">
          {outcome.leftOut.map((l) => (
            <li key={l.entryId}>
              #{l.raceNumber} {l.boatName}: no time with these levers. {l.reason}
            </li>
          ))}
        </ul>
      )}
      {outcome.boats.length > 0 && (
        <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Each boat with the levers">
          <table className="w-full text-left text-sm">
            <thead className="bg-paper-deep">
              <tr>
                <th className="p-2">No.</th>
                <th className="p-2">Boat</th>
                <th className="p-2">Today (s)</th>
                <th className="p-2">With levers (s)</th>
                <th className="p-2">Change (s)</th>
                <th className="p-2">Ballast (kg)</th>
                <th className="p-2">Impeller</th>
                <th className="p-2">From the median (s, ± U at k = 2)</th>
              </tr>
            </thead>
            <tbody>
              {outcome.boats.map((b) => (
                <tr key={b.entryId} className="border-t border-paper-line">
                  <td className="figure p-2">{b.raceNumber}</td>
                  <td className="p-2">{b.boatName}</td>
                  <td className="figure p-2">{b.beforeS.toFixed(2)}</td>
                  <td className="figure p-2">{b.afterS.toFixed(2)}</td>
                  <td className="figure p-2">{signed(b.deltaS)}</td>
                  <td className="figure p-2">{b.ballastKg.toFixed(0)}</td>
                  <td className="p-2 text-xs">{b.impeller ?? 'its own'}</td>
                  <td className="figure p-2">
                    {signed(b.fromMedianS)}
                    {b.expandedUncertaintyS !== null && b.expandedUncertaintyS > 0 && (
                      <span className="block text-xs text-ink-soft">± {b.expandedUncertaintyS.toFixed(2)}</span>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
