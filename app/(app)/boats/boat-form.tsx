'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { CreateBoatInput, UpdateBoatInput, NOZZLE_UNITS, POWER_UNITS } from '@/lib/core/inputs/boats';
import { POWER_EVIDENCE } from '@/lib/core/constants';
import { fieldErrors } from '@/lib/core/errors';
import { TextField } from '@/components/ui/text-field';
import type { BoatView } from '@/lib/server/boats/boat-view';

type Errors = Record<string, string>;

/** A number field with its unit picker beside it; the error sits under both. */
function NumberWithUnit(props: {
  name: string; label: string; unitName: string; units: readonly string[]; defaultValue?: number; defaultUnit: string; hint?: string; error?: string;
}) {
  const describedBy = [props.hint && `${props.name}-hint`, props.error && `${props.name}-error`].filter(Boolean).join(' ') || undefined;
  return (
    <div>
      <label htmlFor={props.name} className="field-label">{props.label}</label>
      <div className="flex gap-2">
        <input id={props.name} name={props.name} type="number" inputMode="decimal" step="any" defaultValue={props.defaultValue}
          aria-invalid={props.error ? true : undefined} aria-describedby={describedBy} className="field-input flex-1" />
        <select name={props.unitName} aria-label={`Unit for ${props.label.toLowerCase()}`} defaultValue={props.defaultUnit} className="field-input w-24">
          {props.units.map((u) => <option key={u} value={u}>{u}</option>)}
        </select>
      </div>
      {props.hint && <p id={`${props.name}-hint`} className="field-hint">{props.hint}</p>}
      {props.error && <p id={`${props.name}-error`} className="field-error" data-field-error={props.name}>{props.error}</p>}
    </div>
  );
}

function TextArea({ name, label, defaultValue, error, hint }: { name: string; label: string; defaultValue?: string; error?: string; hint?: string }) {
  return (
    <div>
      <label htmlFor={name} className="field-label">{label}</label>
      <textarea id={name} name={name} rows={2} defaultValue={defaultValue} aria-invalid={error ? true : undefined}
        aria-describedby={[hint && `${name}-hint`, error && `${name}-error`].filter(Boolean).join(' ') || undefined} className="field-input" />
      {hint && <p id={`${name}-hint`} className="field-hint">{hint}</p>}
      {error && <p id={`${name}-error`} className="field-error" data-field-error={name}>{error}</p>}
    </div>
  );
}

const REQUIRED_NUMBERS = ['nozzleDiameter', 'nozzleToleranceMm', 'power'];
const OPTIONAL_NUMBERS = ['displacementL', 'declaredWeightKg'];

/** Reads the form as the API wants it: numbers as numbers, an empty required one left out ("Enter …"). */
function readForm(form: HTMLFormElement): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [k, v] of new FormData(form)) if (typeof v === 'string') out[k] = v;
  for (const k of [...REQUIRED_NUMBERS, ...OPTIONAL_NUMBERS]) {
    const n = (form.elements.namedItem(k) as HTMLInputElement).valueAsNumber;
    if (Number.isNaN(n)) {
      if (OPTIONAL_NUMBERS.includes(k)) out[k] = null;
      else delete out[k];
    } else out[k] = n;
  }
  return out;
}

export function BoatForm({ boat }: { boat?: BoatView }) {
  const router = useRouter();
  const [errors, setErrors] = useState<Errors>({});
  const [message, setMessage] = useState<{ ok: boolean; text: string }>();
  const [isBusy, setBusy] = useState(false);

  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    setMessage(undefined);
    const body = readForm(e.currentTarget);
    const parsed = (boat ? UpdateBoatInput : CreateBoatInput).safeParse(body);
    if (!parsed.success) {
      setErrors(fieldErrors(parsed.error));
      setMessage({ ok: false, text: 'Check the fields marked below.' });
      return;
    }
    setBusy(true);
    setErrors({});
    const res = await fetch(boat ? `/api/boats/${boat.id}` : '/api/boats', {
      method: boat ? 'PATCH' : 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(body),
    });
    const json = await res.json().catch(() => null);
    setBusy(false);
    if (!res.ok) {
      const next: Errors = {};
      for (const d of json?.error?.details ?? []) next[d.field] ??= d.message;
      setErrors(next);
      setMessage({ ok: false, text: json?.error?.message ?? 'The boat could not be saved. Try again.' });
      return;
    }
    if (!boat) {
      router.push(`/boats/${json.data.id}`);
      return;
    }
    setMessage({ ok: true, text: 'Declaration saved.' });
    router.refresh();
  }

  return (
    <form onSubmit={onSubmit} noValidate aria-label={boat ? 'Edit the declaration' : 'Register a boat'}>
      <fieldset disabled={isBusy} className="space-y-4">
        <TextField name="name" label="Boat name" defaultValue={boat?.name} autoComplete="off" error={errors.name} />
        <TextField name="hullNumber" label="Hull or sail number" defaultValue={boat?.hullNumber} autoComplete="off"
          hint="As painted on the hull, like 42 or NZ-42. A plain number (1–9999) is asked for as your race number when you enter." error={errors.hullNumber} />
        <TextArea name="hullDescription" label="Hull" defaultValue={boat?.hullDescription} hint="Builder, model, length: as you would describe it." error={errors.hullDescription} />
        <TextArea name="pumpDescription" label="Jet pump" defaultValue={boat?.pumpDescription} hint="Maker and model as written on the pump." error={errors.pumpDescription} />
        <TextArea name="impellerDescription" label="Impeller" defaultValue={boat?.impellerDescription} error={errors.impellerDescription} />
        <NumberWithUnit name="nozzleDiameter" label="Nozzle exit diameter" unitName="nozzleUnit" units={NOZZLE_UNITS} defaultUnit="mm"
          defaultValue={boat?.declaredNozzleMm} hint="Stored in mm (1 in = 25.4 mm)." error={errors.nozzleDiameter ?? errors.nozzleUnit} />
        <TextField name="nozzleToleranceMm" label="Nozzle tolerance" unit="± mm" type="number" inputMode="decimal" step="any"
          defaultValue={boat?.declaredNozzleToleranceMm ?? 0.1} hint="How sure you are of the diameter; 0.1 mm if unsure." error={errors.nozzleToleranceMm} />
        <TextArea name="engineDescription" label="Engine" defaultValue={boat?.engineDescription} hint="Maker, model and any modifications." error={errors.engineDescription} />
        <NumberWithUnit name="power" label="Declared power" unitName="powerUnit" units={POWER_UNITS} defaultUnit="kW"
          defaultValue={boat?.declaredPowerKw} hint="Stored in kW (1 hp = 0.7457 kW, 1 PS = 0.7355 kW)." error={errors.power ?? errors.powerUnit} />
        <div>
          <label htmlFor="powerEvidence" className="field-label">What backs the power figure</label>
          <select id="powerEvidence" name="powerEvidence" defaultValue={boat?.powerEvidence ?? 'none'} className="field-input">
            {Object.entries(POWER_EVIDENCE).map(([v, label]) => <option key={v} value={v}>{label}</option>)}
          </select>
          {errors.powerEvidence && <p className="field-error" data-field-error="powerEvidence">{errors.powerEvidence}</p>}
        </div>
        <TextField name="displacementL" label="Engine displacement" unit="L" type="number" inputMode="decimal" step="any"
          defaultValue={boat?.displacementL ?? undefined} hint="Optional." error={errors.displacementL} />
        <TextField name="declaredWeightKg" label="Weight" unit="kg" type="number" inputMode="decimal" step="any"
          defaultValue={boat?.declaredWeightKg ?? undefined} hint="Optional; say with or without driver as your class counts it." error={errors.declaredWeightKg} />
        <div aria-live="polite">
          {message && <p className={message.ok ? 'font-bold text-pass-600' : 'field-error'} data-testid="boat-form-message">{message.text}</p>}
        </div>
        <button type="submit" className="btn-primary w-full sm:w-auto">
          {isBusy ? 'Saving…' : boat ? 'Save the declaration' : 'Register the boat'}
        </button>
      </fieldset>
    </form>
  );
}
