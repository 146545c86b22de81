'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { TextField } from '@/components/ui/text-field';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { CHECK_FIELDS_MESSAGE, refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { ENGINE_CURVE_SHAPES, ENGINE_CURVE_SHAPE_LABELS } from '@/lib/core/engine/engine-curve-shapes';
import type { StoredBoatPerformance } from '@/lib/core/boats/declared-performance';
import { curveToText, fieldErrorsByBox, parseCurveText } from '@/lib/core/boats/curve-text';

// The owner's engine curve, pump characteristic and inlet data (PUT /api/boats/:boatId/performance).
// Curve points are typed one a line; the server checks them with the matched calculator's own rules
// and names the point it refuses, shown beside its box. Nothing typed is lost on a refusal.

export type CatalogueChoice = { id: string; label: string };

const BOXES = [
  'engine',
  'engine.curve',
  'engine.ratedPowerKw',
  'engine.ratedRpm',
  'engine.shape',
  'engine.limiterRpm',
  'pump',
  'pump.curve',
  'pump.impellerDiameterMm',
  'pump.catalogueEntryId',
  'suction',
  'suction.inletDepthM',
  'suction.waterTemperatureC',
  'suction.suctionSpecificSpeed',
] as const;

const numberOrUndefined = (v: FormDataEntryValue | null) => {
  const s = String(v ?? '').trim();
  return s === '' ? undefined : Number(s);
};

function buildBody(data: FormData): { body?: unknown; fieldErrors?: Record<string, string> } {
  const errors: Record<string, string> = {};
  const engineKind = String(data.get('engineKind'));
  const pumpKind = String(data.get('pumpKind'));
  const limiterRpm = numberOrUndefined(data.get('limiterRpm'));
  let engine: unknown = null;
  if (engineKind === 'points') {
    const parsed = parseCurveText(String(data.get('engineCurve') ?? ''), 2, 'rpm and power in kW');
    if (!parsed.ok) errors['engine.curve'] = parsed.message;
    else engine = { kind: 'points', curve: parsed.points.map(([rpm, powerKw]) => ({ rpm, powerKw })), limiterRpm };
  } else if (engineKind === 'rated') {
    engine = {
      kind: 'rated',
      ratedPowerKw: numberOrUndefined(data.get('ratedPowerKw')),
      ratedRpm: numberOrUndefined(data.get('ratedRpm')),
      shape: String(data.get('shape')),
      limiterRpm,
    };
  }
  let pump: unknown = null;
  if (pumpKind === 'points') {
    const parsed = parseCurveText(
      String(data.get('pumpCurve') ?? ''),
      3,
      'flow coefficient, head coefficient and efficiency',
    );
    if (!parsed.ok) errors['pump.curve'] = parsed.message;
    else
      pump = {
        kind: 'points',
        impellerDiameterMm: numberOrUndefined(data.get('impellerDiameterMm')),
        curve: parsed.points.map(([flowCoefficient, headCoefficient, efficiency]) => ({
          flowCoefficient,
          headCoefficient,
          efficiency,
        })),
      };
  } else if (pumpKind === 'catalogue') {
    pump = { kind: 'catalogue', catalogueEntryId: String(data.get('catalogueEntryId') ?? '') };
  }
  const inletDepthM = numberOrUndefined(data.get('inletDepthM'));
  const suction =
    inletDepthM === undefined
      ? null
      : {
          inletDepthM,
          waterTemperatureC: numberOrUndefined(data.get('waterTemperatureC')),
          suctionSpecificSpeed: numberOrUndefined(data.get('suctionSpecificSpeed')),
        };
  if (Object.keys(errors).length) return { fieldErrors: errors };
  return { body: { engine, pump, suction } };
}

export function PerformanceForm({
  boatId,
  declared,
  catalogue,
}: {
  boatId: string;
  declared: StoredBoatPerformance | null;
  catalogue: CatalogueChoice[];
}) {
  const router = useRouter();
  const e = declared?.engine ?? null;
  const p = declared?.pump ?? null;
  const s = declared?.suction ?? null;
  const [engineKind, setEngineKind] = useState<string>(e?.kind ?? 'none');
  const [pumpKind, setPumpKind] = useState<string>(p?.kind ?? 'none');
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const built = buildBody(data);
      if (built.fieldErrors) return { ok: false, fieldErrors: built.fieldErrors, message: CHECK_FIELDS_MESSAGE };
      const answer = await requestJson(`/api/boats/${boatId}/performance`, {
        method: 'PUT',
        body: built.body,
        fallbackMessage: 'The curves could not be saved. Try again.',
      });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true, message: 'Saved; the declaration has a new version.' };
    },
    { ok: false },
  );
  const errors = fieldErrorsByBox(state.fieldErrors ?? {}, BOXES);
  const id = (n: string) => `performance-${n}`;
  const select = (
    name: string,
    label: string,
    value: string,
    onChange: (v: string) => void,
    options: [string, string][],
  ) => (
    <div>
      <label htmlFor={id(name)} className="field-label">
        {label}
      </label>
      <select
        id={id(name)}
        name={name}
        value={value}
        onChange={(ev) => onChange(ev.target.value)}
        className="field-input"
      >
        {options.map(([v, l]) => (
          <option key={v} value={v}>
            {l}
          </option>
        ))}
      </select>
    </div>
  );
  const area = (name: string, box: string, label: string, hint: string, defaultValue: string) => (
    <div className="sm:col-span-2">
      <label htmlFor={id(name)} className="field-label">
        {label}
      </label>
      <textarea
        id={id(name)}
        name={name}
        rows={5}
        defaultValue={defaultValue}
        inputMode="decimal"
        spellCheck={false}
        aria-invalid={errors[box] ? true : undefined}
        aria-describedby={`${id(name)}-hint${errors[box] ? ` ${id(name)}-error` : ''}`}
        className="field-input font-mono"
      />
      <p id={`${id(name)}-hint`} className="field-hint">
        {hint}
      </p>
      <FieldError id={`${id(name)}-error`} name={box} error={errors[box]} />
    </div>
  );
  return (
    <form {...form} aria-label="Engine and pump curves">
      <fieldset disabled={isPending} className="grid gap-3 sm:grid-cols-2">
        <legend className="sr-only">Engine and pump curves</legend>
        {select('engineKind', 'Engine power', engineKind, setEngineKind, [
          ['none', 'Not declared'],
          ['points', 'Power curve (points)'],
          ['rated', 'Rated power and rpm with a curve shape'],
        ])}
        <FieldError name="engine" error={errors.engine} className="sm:col-span-2" />
        {engineKind === 'points' &&
          area(
            'engineCurve',
            'engine.curve',
            'Engine curve',
            'One point a line: rpm, then power at the pump shaft in kW (for example “6000 280”), rpm increasing, at least 2 points.',
            e?.kind === 'points' ? curveToText(e.curve.map((q) => [q.rpm, q.powerKw])) : '',
          )}
        {engineKind === 'rated' && (
          <>
            <TextField
              id={id('ratedPowerKw')}
              name="ratedPowerKw"
              label="Rated power"
              unit="kW"
              inputMode="decimal"
              defaultValue={e?.kind === 'rated' ? e.ratedPowerKw : undefined}
              error={errors['engine.ratedPowerKw']}
            />
            <TextField
              id={id('ratedRpm')}
              name="ratedRpm"
              label="At"
              unit="rpm"
              inputMode="decimal"
              defaultValue={e?.kind === 'rated' ? e.ratedRpm : undefined}
              error={errors['engine.ratedRpm']}
            />
            <div className="sm:col-span-2">
              <label htmlFor={id('shape')} className="field-label">
                Curve shape
              </label>
              <select
                id={id('shape')}
                name="shape"
                defaultValue={e?.kind === 'rated' ? e.shape : 'spark_ignition'}
                className="field-input"
              >
                {ENGINE_CURVE_SHAPES.map((k) => (
                  <option key={k} value={k}>
                    {ENGINE_CURVE_SHAPE_LABELS[k]}
                  </option>
                ))}
              </select>
              <FieldError name="engine.shape" error={errors['engine.shape']} />
            </div>
          </>
        )}
        {engineKind !== 'none' && (
          <TextField
            id={id('limiterRpm')}
            name="limiterRpm"
            label="Rev limiter"
            unit="rpm"
            inputMode="decimal"
            hint="Leave empty when the engine has none."
            defaultValue={e?.limiterRpm}
            error={errors['engine.limiterRpm']}
          />
        )}
        {select('pumpKind', 'Jet pump', pumpKind, setPumpKind, [
          ['none', 'Not declared'],
          ['points', 'Maker’s curve (points)'],
          ['catalogue', 'Impeller model and trim from a meeting’s catalogue'],
        ])}
        <FieldError name="pump" error={errors.pump} className="sm:col-span-2" />
        {pumpKind === 'points' && (
          <>
            <TextField
              id={id('impellerDiameterMm')}
              name="impellerDiameterMm"
              label="Impeller diameter"
              unit="mm"
              inputMode="decimal"
              defaultValue={p?.kind === 'points' ? p.impellerDiameterMm : undefined}
              error={errors['pump.impellerDiameterMm']}
            />
            {area(
              'pumpCurve',
              'pump.curve',
              'Pump curve',
              'One point a line: flow coefficient φ, head coefficient ψ, efficiency η (for example “0.12 5.9 0.88”), φ increasing, at least 2 points.',
              p?.kind === 'points'
                ? curveToText(p.curve.map((q) => [q.flowCoefficient, q.headCoefficient, q.efficiency]))
                : '',
            )}
          </>
        )}
        {pumpKind === 'catalogue' && (
          <div className="sm:col-span-2">
            <label htmlFor={id('catalogueEntryId')} className="field-label">
              Impeller
            </label>
            {catalogue.length === 0 ? (
              <p className="field-hint">No meeting has a catalogue yet: give the maker’s points instead.</p>
            ) : (
              <select
                id={id('catalogueEntryId')}
                name="catalogueEntryId"
                defaultValue={p?.kind === 'catalogue' ? p.catalogueEntryId : catalogue[0].id}
                className="field-input"
              >
                {catalogue.map((c) => (
                  <option key={c.id} value={c.id}>
                    {c.label}
                  </option>
                ))}
              </select>
            )}
            <FieldError name="pump.catalogueEntryId" error={errors['pump.catalogueEntryId']} />
          </div>
        )}
        <TextField
          id={id('inletDepthM')}
          name="inletDepthM"
          label="Pump inlet depth below the water"
          unit="m"
          inputMode="decimal"
          hint="With the suction specific speed, it lets the report flag figures the pump may not reach (cavitation). Leave empty to skip."
          defaultValue={s?.inletDepthM}
          error={errors['suction.inletDepthM'] ?? errors.suction}
        />
        <TextField
          id={id('suctionSpecificSpeed')}
          name="suctionSpecificSpeed"
          label="Suction specific speed (dimensionless, from the maker)"
          inputMode="decimal"
          defaultValue={s?.suctionSpecificSpeed}
          error={errors['suction.suctionSpecificSpeed']}
        />
        <TextField
          id={id('waterTemperatureC')}
          name="waterTemperatureC"
          label="Water temperature"
          unit="°C"
          inputMode="decimal"
          hint="Leave empty for the meeting’s water."
          defaultValue={s?.waterTemperatureC}
          error={errors['suction.waterTemperatureC']}
        />
        <p className="text-sm text-ink-soft sm:col-span-2">
          Part of the declaration: a change makes a new version, and after an inspection the scrutineers will ask to
          inspect the boat again.
        </p>
        <FormMessage state={state} testId="performance-message" className="sm:col-span-2" />
        <FieldError name="form" error={errors.form} className="sm:col-span-2" />
        <button type="submit" className="btn-primary sm:col-span-2 sm:justify-self-start">
          {isPending ? 'Saving…' : 'Save the curves'}
        </button>
      </fieldset>
    </form>
  );
}
