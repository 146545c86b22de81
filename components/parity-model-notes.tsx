import type { ReportInputs, ReportResults } from '@/lib/core/reports/parity-figures';
import type { BoatModelUsed } from '@/lib/core/reports/matched-figures';
import { POWER_EVIDENCE_LABELS, type PowerEvidence } from '@/lib/core/reports/power-uncertainty';

// Which model each boat's figures come from (fixed power, or its engine and pump matched), the points the
// pump may not reach (cavitation), and the power uncertainty shares used: beside the per-boat table.

/** The model a boat used; fixed power when the class did not choose the matched model. */
export function modelOf(results: ReportResults, entryId: string): BoatModelUsed {
  return results.modelUsed?.[entryId] ?? { model: 'fixed_power' };
}

/** True when the point at this speed (0: static) was flagged as cavitating. */
export function isCavitatingAt(results: ReportResults, entryId: string, speedMs: number): boolean {
  return !!modelOf(results, entryId).points?.some((p) => p.speedMs === speedMs && p.cavitating === true);
}

export function ModelCell({ results, entryId }: { results: ReportResults; entryId: string }) {
  const m = modelOf(results, entryId);
  return (
    <td className="p-2" data-col="model" data-model={m.model}>
      {m.model === 'matched' ? 'matched' : 'fixed power'}
      {m.reason && <span className="block text-xs text-ink-mute">{m.reason}</span>}
    </td>
  );
}

/** A flagged figure is an upper bound: shown as "≤ figure" with the reason in its title. */
export function UpperBoundMark({ flagged }: { flagged: boolean }) {
  if (!flagged) return null;
  return (
    <span className="font-bold text-flare-600" title="The pump cavitates here: this thrust is an upper bound">
      ≤{' '}
    </span>
  );
}

export function ReportModelNotes({ inputs, results }: { inputs: ReportInputs; results: ReportResults }) {
  const a = inputs.assumptions;
  const used = Object.entries(results.modelUsed ?? {});
  const matched = used.filter(([, m]) => m.model === 'matched');
  const flagged = matched.filter(([, m]) => m.points?.some((p) => p.cavitating));
  const name = (id: string) => {
    const b = inputs.boats.find((x) => x.entryId === id);
    return b ? `#${b.raceNumber} ${b.boatName}` : id;
  };
  const shares = a.powerEvidenceShares;
  const equalisingOnFixed = matched.filter(([, m]) => m.equalisingModel === 'fixed_power');
  const fallbackTrials = (results.odds?.boats ?? []).reduce((s, b) => s + (b.noOperatingPointTrials ?? 0), 0);
  return (
    <section aria-labelledby="report-model" className="card space-y-2 text-sm" data-testid="report-model-notes">
      <h2 id="report-model" className="text-xl">
        Model per boat
      </h2>
      {a.reportModel === 'matched' ? (
        <>
          <p>
            This class reports on the <strong>matched model</strong>: a boat that declared both an engine curve and a
            pump curve is figured where its engine and pump settle (pump affinity laws: Karassik, <em>Pump Handbook</em>
            ; Brennen, <em>Hydrodynamics of Pumps</em>, 1994) at its measured nozzle; the others at fixed power. The
            “Model” column says which ({matched.length} of {used.length} boats matched). A declared engine curve gives
            the shape of power against rpm only: it is scaled so that its peak is the power the inspection confirmed
            (the power the fixed-power figures use).
          </p>
          <p>
            Uncertainty of a matched figure: first order, by finite differences, from the boat&apos;s power uncertainty
            (applied to its whole engine curve) and its nozzle diameter; the uncertainty of the declared curves
            themselves is not computed. For matched boats the equalising nozzles (static, and over the speed range) are
            searched with the matched model, and the odds below take each trial&apos;s drawn power (scaling the levelled
            curve) and drawn nozzle through it
            {fallbackTrials > 0 &&
              ` (${fallbackTrials} boat-trials had no operating point on the curves and used fixed power for those draws)`}
            {equalisingOnFixed.length > 0 &&
              `; no nozzle brings ${equalisingOnFixed.map(([id]) => name(id)).join(', ')} to the median on the matched model, so the equalising nozzles shown for it are at fixed power`}
            . The crossover speed and the chart&apos;s median line still use the fixed-power model at the confirmed
            power; in the what-if sandbox a power change scales a matched boat&apos;s levelled curve. Cavitation is
            checked only for matched boats that declared their inlet (a boat without a pump curve has no known rpm).
          </p>
        </>
      ) : (
        <p>Every boat is figured at fixed shaft power (the class chose the fixed-power model).</p>
      )}
      {flagged.length > 0 && (
        <div data-testid="cavitation-flags">
          <p className="font-bold text-flare-600">
            Cavitation: at the speeds below the pump inlet has less suction head than the pump needs. A flagged figure
            (marked ≤) is an upper bound, static thrust included: the pump cannot deliver the flow the model assumes.
          </p>
          <ul className="mt-1 list-disc pl-5">
            {flagged.map(([id, m]) => (
              <li key={id}>
                {name(id)}: at{' '}
                {m
                  .points!.filter((p) => p.cavitating)
                  .map((p) => (p.speedMs === 0 ? 'rest' : `${p.speedMs} m/s`))
                  .join(', ')}
              </li>
            ))}
          </ul>
        </div>
      )}
      {shares && (
        <p data-testid="power-shares">
          Power uncertainty by evidence (expanded, k = 2, share of the power):{' '}
          {(['dyno_sheet', 'maker_rating', 'declaration_only'] as PowerEvidence[])
            .map((k) => `${POWER_EVIDENCE_LABELS[k]} ${+(shares[k] * 100).toFixed(2)} %`)
            .join(', ')}{' '}
          ({shares.source === 'class' ? 'set by the class rules' : 'common practice, no published source'}).
        </p>
      )}
      <p className="text-ink-mute">These figures support the officials; the class rules and the officials decide.</p>
    </section>
  );
}
