'use client';

import type { RuleResult } from '@/lib/core/inspections/decide-inspection';
import { SafetyNote } from '@/components/safety-note';
import { VerdictBadge } from '@/components/verdict-badge';
import { formatFigure, RULE_UNIT_KINDS, type FigureKind } from '@/lib/core/format/figures';
import { BURDEN_WORDS } from '@/lib/core/engine/conformity-burden';
import { BudgetTable } from './budget-table';
import { useEffect, useState } from 'react';
import { playTones, signalFor, SOUND_SETTING } from './verdict-signal';

export type ShownVerdict = {
  label: string;
  rules: RuleResult[];
  overall: string;
  provisional: boolean;
  inspectionId: string | null;
  scopeWords?: string | null;
  /** The power evidence the scrutineer recorded, in words. */
  powerEvidence?: string | null;
};

/** The kind of each value: measured at the dock, confirmed against evidence, or declared only (older records: measured). */
const kindOf = (r: RuleResult) => (r.valueKind !== undefined ? r.valueKind : r.measured ? 'measured' : null);

const KIND_OF_UNIT: Record<NonNullable<RuleResult['unit']>, FigureKind> = RULE_UNIT_KINDS;
const fmt = (v: number | null, unit: RuleResult['unit']) => (unit ? formatFigure(v, KIND_OF_UNIT[unit]) : '—');
// U is a small figure: one more digit than the readings in mm (lib/core/format/figures.ts).
const fmtU = (v: number | null, unit: RuleResult['unit']) =>
  unit === 'mm' ? formatFigure(v, 'uncertaintyMm') : fmt(v, unit);

/**
 * The verdict felt as well as read (verdict-signal.ts): a vibration when it appears, and a sound if the
 * scrutineer switched it on (kept on the phone). The words above are always there.
 */
function VerdictFeel({ overall }: { overall: string }) {
  const [isSoundOn, setSoundOn] = useState(() => localStorage.getItem(SOUND_SETTING) === 'on');
  const [soundAtStart] = useState(isSoundOn);
  useEffect(() => {
    const signal = signalFor(overall);
    if (!signal) return;
    if ('vibrate' in navigator) navigator.vibrate(signal.vibrateMs);
    if (soundAtStart) void playTones(signal).catch(() => undefined);
  }, [overall, soundAtStart]);
  return (
    <label className="flex min-h-touch items-center gap-3">
      <input
        type="checkbox"
        className="h-6 w-6"
        checked={isSoundOn}
        data-testid="verdict-sound"
        onChange={(e) => {
          setSoundOn(e.target.checked);
          localStorage.setItem(SOUND_SETTING, e.target.checked ? 'on' : 'off');
          const signal = signalFor(overall);
          if (e.target.checked && signal) void playTones(signal).catch(() => undefined);
        }}
      />
      Sound with each verdict (the phone also vibrates: one pulse conforms, two inconclusive, three does not conform)
    </label>
  );
}

/** Every rule's verdict and the overall result, at once, with the caution that officials decide. */
export function VerdictPanel({ verdict, onNext }: { verdict: ShownVerdict; onNext: () => void }) {
  const { rules, overall } = verdict;
  // "Measure again" only when a measured value leaves the overall result open: under "Does not
  // conform" another reading changes nothing, and a declared figure is not re-measured with an instrument.
  const inconclusive =
    overall === 'inconclusive' && rules.some((r) => r.verdict === 'inconclusive' && kindOf(r) === 'measured');
  // Who had to prove (records from before the burden of proof carry none: nothing is said).
  const burden = rules.find((r) => r.burdenOfProof)?.burdenOfProof ?? null;
  return (
    <section
      aria-labelledby="verdict-heading"
      className="card space-y-4 text-lg"
      data-testid="verdict"
      data-overall={overall}
      data-provisional={verdict.provisional}
    >
      <h2 id="verdict-heading" className="text-2xl">
        Result for {verdict.label}
      </h2>
      <div className="flex flex-wrap items-center gap-3" data-testid="overall-verdict">
        <span className="font-bold">Overall:</span> <VerdictBadge verdict={overall} large />
      </div>
      {verdict.scopeWords && (
        <p className="rounded-lg border-2 border-flare-500 bg-flare-100 p-3 font-bold" data-testid="verdict-scope">
          {verdict.scopeWords}
        </p>
      )}
      {rules.length === 0 ? (
        <p className="rounded-lg bg-doubt-100 p-3 font-bold text-doubt-800" data-testid="provisional-note">
          Kept on this phone. This phone has no copy of the class rules, so the server decides when the record is sent.
        </p>
      ) : verdict.provisional ? (
        <p className="rounded-lg bg-doubt-100 p-3 font-bold text-doubt-800" data-testid="provisional-note">
          Worked out on this phone while offline, from its copy of the class rules. The server decides when the record
          is sent.
        </p>
      ) : (
        <p className="text-ink-soft">
          Decided by the server against the class rules in force when you measured; stored and never changed.
        </p>
      )}
      {burden && (
        <p data-testid="verdict-burden" data-burden={burden}>
          <span className="font-bold">Burden of proof:</span> {BURDEN_WORDS[burden]}.{' '}
          {burden === 'conformity'
            ? 'An inconclusive result is not accepted: measure again with a better instrument or fix the part.'
            : 'An inconclusive result means non-conformity is not proven: the part stands.'}
        </p>
      )}
      {inconclusive && burden === 'non_conformity' ? (
        <p
          className="rounded-lg border-2 border-doubt-600 bg-doubt-100 p-3 text-xl font-bold text-doubt-800"
          data-testid="not-proven"
        >
          ? Non-conformity not proven: the reading is too close to the limit to prove the protest, so the part stands.
          The stewards decide.
        </p>
      ) : (
        inconclusive && (
          <p
            className="rounded-lg border-2 border-doubt-600 bg-doubt-100 p-3 text-xl font-bold text-doubt-800"
            data-testid="measure-again"
          >
            ? Measure again with a better instrument: the reading is too close to the limit for this one to decide.
            {burden === 'conformity' && ' Not accepted until then (or fix the part).'}
          </p>
        )
      )}
      {verdict.powerEvidence && (
        <p data-testid="verdict-power-evidence">
          <span className="font-bold">Power evidence seen:</span> {verdict.powerEvidence}
        </p>
      )}
      <ul className="divide-y divide-paper-line" data-testid="rule-verdicts">
        {rules.map((r) => (
          <li key={r.rule} className="space-y-1 py-3" data-rule={r.rule} data-verdict={r.verdict}>
            <div className="flex flex-wrap items-center justify-between gap-2">
              <span className="font-bold">{r.label}</span>
              <VerdictBadge verdict={r.verdict} />
            </div>
            {r.unit && (
              <p className="figure text-lg">
                {kindOf(r) && r.decisiveValue != null ? (
                  <span data-value-kind={kindOf(r)}>
                    {kindOf(r)} {fmt(r.decisiveValue, r.unit)} ·{' '}
                  </span>
                ) : (
                  ''
                )}
                limit {fmt(r.limit, r.unit)}
                {r.acceptanceLimit != null && r.acceptanceLimit !== r.limit
                  ? ` · accepted to ${fmt(r.acceptanceLimit, r.unit)}`
                  : ''}
                {r.expandedUncertainty != null ? ` · U ${fmtU(r.expandedUncertainty, r.unit)}` : ''}
              </p>
            )}
            <p className="text-ink-soft">{r.explanation}</p>
            {r.budget && (
              <BudgetTable
                budget={r.budget}
                caption={`${r.label}: the decisive reading corrected to 20 °C; terms combined by the law of propagation (JCGM 100:2008, 5.1.2), k = 2.`}
              />
            )}
          </li>
        ))}
      </ul>
      <SafetyNote className="text-lg" />
      <VerdictFeel overall={overall} />
      <button type="button" className="btn-primary min-h-[3.5rem] w-full text-xl" onClick={onNext}>
        Next boat
      </button>
    </section>
  );
}
