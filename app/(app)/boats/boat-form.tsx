'use client';

import { useRouter } from 'next/navigation';
import { CreateBoatInput, UpdateBoatInput, NOZZLE_UNITS, POWER_UNITS } from '@/lib/core/inputs/boats';
import { POWER_EVIDENCE } from '@/lib/core/constants';
import { fieldErrors } from '@/lib/core/errors';
import { TextField } from '@/components/ui/text-field';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { CHECK_FIELDS_MESSAGE, refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import type { BoatView } from '@/lib/server/boats/boat-view';

/** A number field with its unit picker beside it; the error sits under both. */
function NumberWithUnit(props: {
  name: string;
  label: string;
  unitName: string;
  units: readonly string[];
  defaultValue?: number;
  defaultUnit: string;
  hint?: string;
  error?: string;
}) {
  const describedBy =
    [props.hint && `${props.name}-hint`, props.error && `${props.name}-error`].filter(Boolean).join(' ') || undefined;
  return (
    <div>
      <label htmlFor={props.name} className="field-label">
        {props.label}
      </label>
      <div className="flex gap-2">
        <input
          id={props.name}
          name={props.name}
          type="number"
          inputMode="decimal"
          step="any"
          defaultValue={props.defaultValue}
          aria-invalid={props.error ? true : undefined}
          aria-describedby={describedBy}
          className="field-input flex-1"
        />
        <select
          name={props.unitName}
          aria-label={`Unit for ${props.label.toLowerCase()}`}
          defaultValue={props.defaultUnit}
          className="field-input w-24"
        >
          {props.units.map((u) => (
            <option key={u} value={u}>
              {u}
            </option>
          ))}
        </select>
      </div>
      {props.hint && (
        <p id={`${props.name}-hint`} className="field-hint">
          {props.hint}
        </p>
      )}
      {props.error && (
        <p id={`${props.name}-error`} className="field-error" data-field-error={props.name}>
          {props.error}
        </p>
      )}
    </div>
  );
}

function TextArea({
  name,
  label,
  defaultValue,
  error,
  hint,
}: {
  name: string;
  label: string;
  defaultValue?: string;
  error?: string;
  hint?: string;
}) {
  return (
    <div>
      <label htmlFor={name} className="field-label">
        {label}
      </label>
      <textarea
        id={name}
        name={name}
        rows={2}
        defaultValue={defaultValue}
        aria-invalid={error ? true : undefined}
        aria-describedby={[hint && `${name}-hint`, error && `${name}-error`].filter(Boolean).join(' ') || undefined}
        className="field-input"
      />
      {hint && (
        <p id={`${name}-hint`} className="field-hint">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${name}-error`} className="field-error" data-field-error={name}>
          {error}
        </p>
      )}
    </div>
  );
}

const REQUIRED_NUMBERS = ['nozzleDiameter', 'nozzleToleranceMm', 'power'];
const OPTIONAL_NUMBERS = ['displacementL', 'declaredWeightKg'];

/** Reads the form as the API wants it: numbers as numbers, an empty required one left out ("Enter …"). */
function readForm(form: FormData): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [k, v] of form) if (typeof v === 'string') out[k] = v;
  for (const k of [...REQUIRED_NUMBERS, ...OPTIONAL_NUMBERS]) {
    // A number field's value is '' when empty or not a number (the browser's own reading), as valueAsNumber's NaN.
    const typed = String(form.get(k) ?? '');
    const n = typed.trim() === '' ? NaN : Number(typed);
    if (Number.isNaN(n)) {
      if (OPTIONAL_NUMBERS.includes(k)) out[k] = null;
      else delete out[k];
    } else out[k] = n;
  }
  return out;
}

export function BoatForm({ boat }: { boat?: BoatView }) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const body = readForm(data);
      const parsed = (boat ? UpdateBoatInput : CreateBoatInput).safeParse(body);
      if (!parsed.success) return { ok: false, fieldErrors: fieldErrors(parsed.error), message: CHECK_FIELDS_MESSAGE };
      const answer = await requestJson<{ id: string }>(boat ? `/api/boats/${boat.id}` : '/api/boats', {
        method: boat ? 'PATCH' : 'POST',
        body,
        fallbackMessage: 'The boat could not be saved. Try again.',
      });
      if (!answer.ok) return refusalState(answer);
      if (!boat) {
        router.push(`/boats/${answer.data.id}`);
        return { ok: true };
      }
      router.refresh();
      return { ok: true, message: 'Declaration saved.' };
    },
    { ok: false },
  );
  const errors = state.fieldErrors ?? {};

  return (
    <form {...form} aria-label={boat ? 'Edit the declaration' : 'Register a boat'}>
      <fieldset disabled={isPending} className="space-y-4">
        <TextField name="name" label="Boat name" defaultValue={boat?.name} autoComplete="off" error={errors.name} />
        <TextField
          name="hullNumber"
          label="Hull or sail number"
          defaultValue={boat?.hullNumber}
          autoComplete="off"
          hint="As painted on the hull, like 42 or NZ-42. A plain number (1–9999) is asked for as your race number when you enter."
          error={errors.hullNumber}
        />
        <TextArea
          name="hullDescription"
          label="Hull"
          defaultValue={boat?.hullDescription}
          hint="Builder, model, length: as you would describe it."
          error={errors.hullDescription}
        />
        <TextArea
          name="pumpDescription"
          label="Jet pump"
          defaultValue={boat?.pumpDescription}
          hint="Maker and model as written on the pump."
          error={errors.pumpDescription}
        />
        <TextArea
          name="impellerDescription"
          label="Impeller"
          defaultValue={boat?.impellerDescription}
          error={errors.impellerDescription}
        />
        <NumberWithUnit
          name="nozzleDiameter"
          label="Nozzle exit diameter"
          unitName="nozzleUnit"
          units={NOZZLE_UNITS}
          defaultUnit="mm"
          defaultValue={boat?.declaredNozzleMm}
          hint="Stored in mm (1 in = 25.4 mm)."
          error={errors.nozzleDiameter ?? errors.nozzleUnit}
        />
        <TextField
          name="nozzleToleranceMm"
          label="Nozzle tolerance"
          unit="± mm"
          type="number"
          inputMode="decimal"
          step="any"
          defaultValue={boat?.declaredNozzleToleranceMm ?? 0.1}
          hint="How sure you are of the diameter; 0.1 mm if unsure."
          error={errors.nozzleToleranceMm}
        />
        <TextArea
          name="engineDescription"
          label="Engine"
          defaultValue={boat?.engineDescription}
          hint="Maker, model and any modifications."
          error={errors.engineDescription}
        />
        <NumberWithUnit
          name="power"
          label="Declared power"
          unitName="powerUnit"
          units={POWER_UNITS}
          defaultUnit="kW"
          defaultValue={boat?.declaredPowerKw}
          hint="Stored in kW (1 hp = 0.7457 kW, 1 PS = 0.7355 kW)."
          error={errors.power ?? errors.powerUnit}
        />
        <div>
          <label htmlFor="powerEvidence" className="field-label">
            What backs the power figure
          </label>
          <select
            id="powerEvidence"
            name="powerEvidence"
            defaultValue={boat?.powerEvidence ?? 'none'}
            className="field-input"
          >
            {Object.entries(POWER_EVIDENCE).map(([v, label]) => (
              <option key={v} value={v}>
                {label}
              </option>
            ))}
          </select>
          <FieldError name="powerEvidence" error={errors.powerEvidence} />
        </div>
        <TextField
          name="displacementL"
          label="Engine displacement"
          unit="L"
          type="number"
          inputMode="decimal"
          step="any"
          defaultValue={boat?.displacementL ?? undefined}
          hint="Optional."
          error={errors.displacementL}
        />
        <TextField
          name="declaredWeightKg"
          label="Weight"
          unit="kg"
          type="number"
          inputMode="decimal"
          step="any"
          defaultValue={boat?.declaredWeightKg ?? undefined}
          hint="Optional; say with or without driver as your class counts it."
          error={errors.declaredWeightKg}
        />
        <FormMessage state={state} testId="boat-form-message" />
        <button type="submit" className="btn-primary w-full sm:w-auto">
          {isPending ? 'Saving…' : boat ? 'Save the declaration' : 'Register the boat'}
        </button>
      </fieldset>
    </form>
  );
}
