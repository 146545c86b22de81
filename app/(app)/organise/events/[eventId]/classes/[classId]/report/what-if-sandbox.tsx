'use client';

import { useMemo, useState } from 'react';
import { useRouter } from 'next/navigation';
import {
  applyRuleWhatIf,
  applyWhatIf,
  computeReportResults,
  type ReportInputs,
} from '@/lib/core/reports/parity-figures';
import type { ClassRules } from '@/lib/core/inputs/class-rules';
import { FormMessage } from '@/components/forms/form-message';
import { requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

const num = (s: string) => (s.trim() === '' ? null : Number(s));

/**
 * Rule makers try a nozzle limit, a power band or one boat's nozzle and see the projected spread
 * and each boat's change, computed in the browser by the same engine. Nothing is saved unless the
 * organiser turns it into a new draft version of the class rules.
 */
export function WhatIfSandbox({
  eventId,
  classId,
  inputs,
  rules,
}: {
  eventId: string;
  classId: string;
  inputs: ReportInputs;
  rules: ClassRules;
}) {
  const router = useRouter();
  const [nozzleMax, setNozzleMax] = useState(String(rules.nozzle.maxMm ?? ''));
  const [nozzleMin, setNozzleMin] = useState(String(rules.nozzle.minMm ?? ''));
  const [powerMax, setPowerMax] = useState(String(rules.power.maxKw ?? ''));
  const [boatId, setBoatId] = useState(inputs.boats[0]?.entryId ?? '');
  const [boatNozzle, setBoatNozzle] = useState('');

  const projected = useMemo(() => {
    try {
      const rule = { nozzleMaxMm: num(nozzleMax), nozzleMinMm: num(nozzleMin), powerMaxKw: num(powerMax) };
      if (Object.values(rule).some((v) => v !== null && !(v > 0))) return { error: 'Limits must be positive numbers.' };
      let next = applyRuleWhatIf(inputs, rule);
      const d = num(boatNozzle);
      if (d !== null) {
        if (!(d > 0 && d < 1000)) return { error: 'The boat nozzle must be between 0 and 1000 mm.' };
        next = applyWhatIf(next, { nozzleByEntry: { [boatId]: d } });
      }
      return { before: computeReportResults(inputs), after: computeReportResults(next), next };
    } catch (e) {
      return { error: (e as Error).message };
    }
  }, [inputs, nozzleMax, nozzleMin, powerMax, boatId, boatNozzle]);

  // Saving is the one thing here that reaches the server: a small form of its own (Enter in a limit field saves nothing).
  const { state, isPending, form } = useFormAction(
    async (): Promise<FormState> => {
      const body = {
        powerUnit: 'kW',
        rules: {
          ...rules,
          nozzle: { ...rules.nozzle, maxMm: num(nozzleMax), minMm: num(nozzleMin) },
          power: { ...rules.power, maxKw: num(powerMax) },
        },
      };
      const answer = await requestJson(`/api/events/${eventId}/classes/${classId}/rules`, { method: 'PUT', body });
      // The limits here have no fields of the rules form to point to: the server's message names them.
      if (!answer.ok) return { ok: false, message: answer.message };
      router.refresh();
      return { ok: true, message: 'Saved as a draft rule version: review and publish it on the class page.' };
    },
    { ok: false },
  );

  if (inputs.boats.length === 0) return null;

  const spread = (r?: ReturnType<typeof computeReportResults>) => r?.parity?.summary.spreadPercent;
  return (
    <section className="card space-y-4" aria-labelledby="what-if" data-testid="what-if">
      <h2 id="what-if" className="text-xl">
        What if the rules changed?
      </h2>
      <div className="grid gap-3 sm:grid-cols-3">
        <label className="block">
          <span className="field-label">Nozzle maximum (mm)</span>
          <input
            className="field-input"
            inputMode="decimal"
            value={nozzleMax}
            onChange={(e) => setNozzleMax(e.target.value)}
          />
        </label>
        <label className="block">
          <span className="field-label">Nozzle minimum (mm)</span>
          <input
            className="field-input"
            inputMode="decimal"
            value={nozzleMin}
            onChange={(e) => setNozzleMin(e.target.value)}
          />
        </label>
        <label className="block">
          <span className="field-label">Power maximum (kW)</span>
          <input
            className="field-input"
            inputMode="decimal"
            value={powerMax}
            onChange={(e) => setPowerMax(e.target.value)}
          />
        </label>
        <label className="block sm:col-span-2">
          <span className="field-label">One boat</span>
          <select className="field-input" value={boatId} onChange={(e) => setBoatId(e.target.value)}>
            {inputs.boats.map((b) => (
              <option key={b.entryId} value={b.entryId}>
                #{b.raceNumber} {b.boatName} ({b.nozzleDiameterMm.toFixed(2)} mm)
              </option>
            ))}
          </select>
        </label>
        <label className="block">
          <span className="field-label">…with nozzle (mm)</span>
          <input
            className="field-input"
            inputMode="decimal"
            value={boatNozzle}
            onChange={(e) => setBoatNozzle(e.target.value)}
          />
        </label>
      </div>
      {'error' in projected ? (
        <p className="field-error">{projected.error}</p>
      ) : (
        <>
          <p className="text-lg" data-testid="what-if-spread">
            Spread {spread(projected.before)?.toFixed(2)} % → <strong>{spread(projected.after)?.toFixed(2)} %</strong>
          </p>
          <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="What-if figures per boat">
            <table className="w-full min-w-[32rem] text-left text-sm">
              <thead>
                <tr>
                  <th className="p-2">Boat</th>
                  <th className="p-2">Nozzle mm</th>
                  <th className="p-2">Static thrust N</th>
                  <th className="p-2">vs median</th>
                </tr>
              </thead>
              <tbody>
                {projected.after.parity!.boats.map((b, i) => {
                  const was = projected.before.parity!.boats[i];
                  return (
                    <tr key={b.id} className="border-t border-paper-line">
                      <td className="p-2">{b.label}</td>
                      <td className="figure p-2">
                        {was.nozzleDiameterMm.toFixed(2)}
                        {b.nozzleDiameterMm !== was.nozzleDiameterMm && (
                          <>
                            {' '}
                            → <strong>{b.nozzleDiameterMm.toFixed(2)}</strong>
                          </>
                        )}
                      </td>
                      <td className="figure p-2">
                        {was.staticThrustN.toFixed(0)} → {b.staticThrustN.toFixed(0)}
                      </td>
                      <td className="figure p-2">
                        {was.deviationFromMedianPercent.toFixed(2)} → {b.deviationFromMedianPercent.toFixed(2)} %
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
        </>
      )}
      <form {...form} className="space-y-2">
        <FormMessage state={state} />
        <button type="submit" className="btn-secondary" disabled={isPending}>
          Turn these limits into a new draft rule version
        </button>
      </form>
    </section>
  );
}
