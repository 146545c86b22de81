'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { SAFETY_ITEMS, SAFETY_ITEM_KEYS } from '@/lib/core/constants';
import type { ClassRules } from '@/lib/core/inputs/class-rules';
import { TextField } from '@/components/ui/text-field';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { numberOrNull } from '@/lib/core/inputs/form-values';
import { convertPower, type PowerUnit } from '@/lib/core/engine/units';
import { POWER_EVIDENCE_LABELS, POWER_EVIDENCE_SHARE } from '@/lib/core/reports/power-uncertainty';
import {
  BURDEN_CONTEXTS,
  BURDEN_CONTEXT_WORDS,
  BURDEN_WORDS,
  BURDENS_OF_PROOF,
  resolveBurdenRules,
} from '@/lib/core/engine/conformity-burden';
import { MeasuredItemsEditor, NozzleMethodFields } from './measured-items-editor';

const INCONCLUSIVE_MEANS = {
  conformity: 'an inconclusive result is not accepted: measure again with a better instrument or fix the part.',
  non_conformity: 'an inconclusive result is “non-conformity not proven”: the part stands.',
} as const;

const RULE_TEXT = {
  simple: 'Simple acceptance: the reading itself is compared with the limit (no guard band).',
  guarded: 'Guarded acceptance: the limit is tightened by the expanded uncertainty U; a reading must sit inside it.',
  iso14253:
    'ISO 14253-1 three-way: conformity only when proven inside the limit less U, non-conformity only beyond the limit plus U; in between the verdict is inconclusive (measure again).',
} as const;

type Props = { eventId: string; classId: string; rules: ClassRules; editingVersion: number; isDraft: boolean };

/** "5" (per cent) → 0.05; empty → NaN, which the rules refuse beside the field. */
const percentShare = (v: FormDataEntryValue | null) => {
  const t = String(v ?? '').trim();
  return t === '' ? Number.NaN : Number(t) / 100;
};

export function RulesForm({ eventId, classId, rules, editingVersion, isDraft }: Props) {
  const router = useRouter();
  const [powerUnit, setPowerUnit] = useState<PowerUnit>('kW');
  const shown = (kw: number | null) => (kw == null ? '' : +convertPower(kw, 'kW', powerUnit).toFixed(2));

  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, f: FormData): Promise<FormState> => {
      const n = (k: string) => numberOrNull(f.get(k));
      const body = {
        powerUnit,
        rules: {
          nozzle: {
            maxMm: n('nozzle.maxMm'),
            minMm: n('nozzle.minMm'),
            minReadings: n('nozzle.minReadings'),
            defaultUncertaintyMm: n('nozzle.defaultUncertaintyMm'),
            checkMethod: f.get('nozzle.checkMethod') ?? 'two_point',
            gaugeNoGoMm: f.has('nozzle.gaugeNoGoMm') ? n('nozzle.gaugeNoGoMm') : (rules.nozzle.gaugeNoGoMm ?? null),
            gaugeGoMm: f.has('nozzle.gaugeGoMm') ? n('nozzle.gaugeGoMm') : (rules.nozzle.gaugeGoMm ?? null),
          },
          power: {
            minKw: n('power.minKw'),
            maxKw: n('power.maxKw'),
            defaultUncertaintyKw: n('power.defaultUncertaintyKw'),
            // Percent on the form, a share in the rules; all three empty: the common-practice shares.
            ...(['dyno_sheet', 'maker_rating', 'declaration_only'].some((k) => f.get(`power.share.${k}`) !== '') && {
              evidenceShares: {
                dyno_sheet: percentShare(f.get('power.share.dyno_sheet')),
                maker_rating: percentShare(f.get('power.share.maker_rating')),
                declaration_only: percentShare(f.get('power.share.declaration_only')),
              },
            }),
          },
          weight: {
            minKg: n('weight.minKg'),
            includesDriver: f.get('weight.includesDriver') === 'on',
            defaultUncertaintyKg: n('weight.defaultUncertaintyKg'),
          },
          decisionRule: f.get('decisionRule'),
          burdenOfProof: { inspection: f.get('burdenOfProof.inspection'), protest: f.get('burdenOfProof.protest') },
          safetyItems: f.getAll('safetyItems'),
          // Every item the editor holds, always sent: saving the form never drops one.
          measuredItems: JSON.parse(String(f.get('measuredItemsJson') ?? '[]')),
          parity: {
            pumpEfficiency: n('parity.pumpEfficiency'),
            nozzleLossCoefficient: n('parity.nozzleLossCoefficient'),
            inletLossCoefficient: n('parity.inletLossCoefficient'),
            wakeFraction: n('parity.wakeFraction'),
            referenceSpeedsMs: String(f.get('parity.referenceSpeedsMs') ?? '')
              .split(/[;, ]+/)
              .filter(Boolean)
              .map(Number),
            reportModel: f.get('parity.reportModel') ?? 'fixed_power',
          },
        },
      };
      const answer = await requestJson(`/api/events/${eventId}/classes/${classId}/rules`, { method: 'PUT', body });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return {
        ok: true,
        message: isDraft
          ? `Draft v${editingVersion} saved.`
          : `Saved as draft v${editingVersion + 1}; the published version is unchanged.`,
      };
    },
    { ok: false },
  );
  const fieldErrors = state.fieldErrors ?? {};

  const err = (path: string) => fieldErrors[`rules.${path}`];
  return (
    <form {...form} className="space-y-6">
      <fieldset disabled={isPending} className="space-y-6">
        <fieldset className="grid gap-3 sm:grid-cols-2">
          <legend className="mb-2 text-lg font-bold">Nozzle exit diameter</legend>
          <TextField
            name="nozzle.maxMm"
            label="Maximum"
            unit="mm"
            inputMode="decimal"
            defaultValue={rules.nozzle.maxMm ?? ''}
            error={err('nozzle.maxMm')}
          />
          <TextField
            name="nozzle.minMm"
            label="Minimum"
            unit="mm"
            inputMode="decimal"
            defaultValue={rules.nozzle.minMm ?? ''}
            error={err('nozzle.minMm')}
          />
          <TextField
            name="nozzle.minReadings"
            label="Two-point readings required"
            unit="count"
            inputMode="numeric"
            defaultValue={rules.nozzle.minReadings}
            error={err('nozzle.minReadings')}
          />
          <TextField
            name="nozzle.defaultUncertaintyMm"
            label="Default expanded uncertainty U (k = 2)"
            unit="mm"
            inputMode="decimal"
            defaultValue={rules.nozzle.defaultUncertaintyMm}
            error={err('nozzle.defaultUncertaintyMm')}
          />
          <NozzleMethodFields rules={rules} err={err} />
        </fieldset>
        <fieldset className="grid gap-3 sm:grid-cols-2">
          <legend className="mb-2 text-lg font-bold">Engine power band</legend>
          <div className="sm:col-span-2">
            <label htmlFor="powerUnit" className="field-label">
              Enter power in
            </label>
            <select
              id="powerUnit"
              className="field-input"
              value={powerUnit}
              onChange={(e) => setPowerUnit(e.target.value as PowerUnit)}
            >
              <option value="kW">kW</option>
              <option value="hp">hp (550 ft·lbf/s)</option>
              <option value="PS">PS (metric hp)</option>
            </select>
          </div>
          <TextField
            key={`min-${powerUnit}`}
            name="power.minKw"
            label="Minimum"
            unit={powerUnit}
            inputMode="decimal"
            defaultValue={shown(rules.power.minKw)}
            error={err('power.minKw')}
          />
          <TextField
            key={`max-${powerUnit}`}
            name="power.maxKw"
            label="Maximum"
            unit={powerUnit}
            inputMode="decimal"
            defaultValue={shown(rules.power.maxKw)}
            error={err('power.maxKw')}
          />
          <TextField
            key={`u-${powerUnit}`}
            name="power.defaultUncertaintyKw"
            label="Power uncertainty"
            unit={powerUnit}
            inputMode="decimal"
            defaultValue={shown(rules.power.defaultUncertaintyKw)}
            error={err('power.defaultUncertaintyKw')}
          />
          <p className="text-sm text-ink-soft sm:col-span-2">
            Power uncertainty by the evidence the scrutineer sees (expanded, k = 2, per cent of the power). Leave all
            three empty for the common-practice figures: dyno sheet {POWER_EVIDENCE_SHARE.dyno_sheet * 100} %, maker’s
            rating {POWER_EVIDENCE_SHARE.maker_rating * 100} %, declaration only{' '}
            {POWER_EVIDENCE_SHARE.declaration_only * 100} %.
          </p>
          {(['dyno_sheet', 'maker_rating', 'declaration_only'] as const).map((k) => (
            <TextField
              key={k}
              name={`power.share.${k}`}
              label={`Share: ${POWER_EVIDENCE_LABELS[k]}`}
              unit="%"
              inputMode="decimal"
              defaultValue={rules.power.evidenceShares ? +(rules.power.evidenceShares[k] * 100).toFixed(4) : ''}
              error={err(`power.evidenceShares.${k}`) ?? err('power.evidenceShares')}
            />
          ))}
        </fieldset>
        <fieldset className="grid gap-3 sm:grid-cols-2">
          <legend className="mb-2 text-lg font-bold">Minimum weight</legend>
          <TextField
            name="weight.minKg"
            label="Minimum all-up weight"
            unit="kg"
            inputMode="decimal"
            defaultValue={rules.weight.minKg ?? ''}
            error={err('weight.minKg')}
          />
          <TextField
            name="weight.defaultUncertaintyKg"
            label="Weighing uncertainty"
            unit="kg"
            inputMode="decimal"
            defaultValue={rules.weight.defaultUncertaintyKg}
            error={err('weight.defaultUncertaintyKg')}
          />
          <label className="flex min-h-touch items-center gap-3 sm:col-span-2">
            <input
              type="checkbox"
              name="weight.includesDriver"
              defaultChecked={rules.weight.includesDriver}
              className="h-6 w-6"
            />
            The minimum includes the driver
          </label>
        </fieldset>
        <fieldset className="space-y-2">
          <legend className="mb-2 text-lg font-bold">Decision rule (fixed before anyone measures)</legend>
          {(Object.keys(RULE_TEXT) as (keyof typeof RULE_TEXT)[]).map((r) => (
            <label key={r} className="flex min-h-touch items-start gap-3 rounded-lg border border-paper-line p-3">
              <input
                type="radio"
                name="decisionRule"
                value={r}
                defaultChecked={rules.decisionRule === r}
                className="mt-1 h-6 w-6"
              />
              <span>{RULE_TEXT[r]}</span>
            </label>
          ))}
          <FieldError name="rules.decisionRule" id="decisionRule-error" error={err('decisionRule')} />
        </fieldset>
        <fieldset className="space-y-3" data-testid="burden-of-proof">
          <legend className="mb-2 text-lg font-bold">
            Who must prove (burden of proof, fixed before anyone measures)
          </legend>
          <p className="text-ink-soft">
            Under ISO 14253-1 the uncertainty counts against whoever must prove; it only matters when a result is
            inconclusive.
          </p>
          {BURDEN_CONTEXTS.map((context) => (
            <div key={context} role="radiogroup" aria-labelledby={`burden-${context}`} className="space-y-2">
              <p id={`burden-${context}`} className="font-bold">
                {BURDEN_CONTEXT_WORDS[context]}
              </p>
              {BURDENS_OF_PROOF.map((b) => (
                <label key={b} className="flex min-h-touch items-start gap-3 rounded-lg border border-paper-line p-3">
                  <input
                    type="radio"
                    name={`burdenOfProof.${context}`}
                    value={b}
                    defaultChecked={resolveBurdenRules(rules)[context] === b}
                    className="mt-1 h-6 w-6"
                  />
                  <span>
                    {BURDEN_WORDS[b]}: {INCONCLUSIVE_MEANS[b]}
                  </span>
                </label>
              ))}
              <FieldError
                name={`rules.burdenOfProof.${context}`}
                id={`burdenOfProof-${context}-error`}
                error={err(`burdenOfProof.${context}`)}
              />
            </div>
          ))}
        </fieldset>
        <fieldset className="grid gap-2 sm:grid-cols-2">
          <legend className="mb-2 text-lg font-bold">Required safety items</legend>
          {SAFETY_ITEM_KEYS.map((k) => (
            <label key={k} className="flex min-h-touch items-center gap-3">
              <input
                type="checkbox"
                name="safetyItems"
                value={k}
                defaultChecked={rules.safetyItems.includes(k)}
                className="h-6 w-6"
              />
              {SAFETY_ITEMS[k]}
            </label>
          ))}
        </fieldset>
        <MeasuredItemsEditor items={rules.measuredItems ?? []} err={err} />
        <fieldset className="grid gap-3 sm:grid-cols-2">
          <legend className="mb-2 text-lg font-bold">Parity model assumptions</legend>
          <TextField
            name="parity.pumpEfficiency"
            label="Pump efficiency η"
            unit="0–1"
            inputMode="decimal"
            defaultValue={rules.parity.pumpEfficiency}
            error={err('parity.pumpEfficiency')}
          />
          <TextField
            name="parity.nozzleLossCoefficient"
            label="Nozzle loss coefficient Kn"
            unit="–"
            inputMode="decimal"
            defaultValue={rules.parity.nozzleLossCoefficient}
            error={err('parity.nozzleLossCoefficient')}
          />
          <TextField
            name="parity.inletLossCoefficient"
            label="Inlet loss coefficient Ki"
            unit="–"
            inputMode="decimal"
            defaultValue={rules.parity.inletLossCoefficient}
            error={err('parity.inletLossCoefficient')}
          />
          <TextField
            name="parity.wakeFraction"
            label="Wake fraction w"
            unit="–"
            inputMode="decimal"
            defaultValue={rules.parity.wakeFraction}
            error={err('parity.wakeFraction')}
          />
          <TextField
            name="parity.referenceSpeedsMs"
            label="Reference speeds"
            unit="m/s, comma-separated"
            defaultValue={rules.parity.referenceSpeedsMs.join(', ')}
            error={
              err('parity.referenceSpeedsMs') ??
              Object.entries(fieldErrors).find(([k]) => k.startsWith('rules.parity.referenceSpeedsMs.'))?.[1]
            }
            className="sm:col-span-2"
          />
          <div className="sm:col-span-2">
            <label htmlFor="parity.reportModel" className="field-label">
              Report model
            </label>
            <select
              id="parity.reportModel"
              name="parity.reportModel"
              defaultValue={rules.parity.reportModel ?? 'fixed_power'}
              className="field-input"
              aria-describedby="parity.reportModel-hint"
            >
              <option value="fixed_power">Fixed power for every boat</option>
              <option value="matched">Matched: engine curve × pump curve where a boat declared both</option>
            </select>
            <p id="parity.reportModel-hint" className="field-hint">
              With the matched model, a boat with both curves is reported where its engine and pump settle; the report
              says which model each boat used.
            </p>
          </div>
        </fieldset>
        <FormMessage state={state} />
        <button type="submit" className="btn-primary">
          {isPending
            ? 'Saving…'
            : isDraft
              ? `Save draft v${editingVersion}`
              : `Save as new draft v${editingVersion + 1}`}
        </button>
      </fieldset>
    </form>
  );
}
