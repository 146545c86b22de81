'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { TextField } from '@/components/ui/text-field';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { numberOrNull } from '@/lib/core/inputs/form-values';
import { INSTRUMENT_TYPES, INSTRUMENT_TYPE_LABELS } from '@/lib/core/inputs/instrument-calibration';

/** Put an instrument on the meeting's list: what it measures, and its error limit and resolution or its certificate's U. */
export function AddInstrumentForm({ eventId }: { eventId: string }) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, f: FormData): Promise<FormState> => {
      const answer = await requestJson(`/api/events/${eventId}/instruments`, {
        body: {
          name: f.get('name'),
          quantity: f.get('quantity'),
          errorLimit: numberOrNull(f.get('errorLimit')),
          resolution: numberOrNull(f.get('resolution')),
          expandedUncertainty: numberOrNull(f.get('expandedUncertainty')),
          instrumentType: f.get('instrumentType') || null,
          serial: f.get('serial') || null,
          rangeMin: numberOrNull(f.get('rangeMin')),
          rangeMax: numberOrNull(f.get('rangeMax')),
          material: f.get('material') || null,
        },
      });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true, message: 'Added: the dock offers it from now on.' };
    },
    { ok: false },
    { resetOnSuccess: true },
  );
  const fieldErrors = state.fieldErrors ?? {};
  return (
    <form {...form} className="card space-y-3" aria-labelledby="add-instrument-heading">
      <h2 id="add-instrument-heading" className="text-xl">
        Add an instrument
      </h2>
      <fieldset disabled={isPending} className="space-y-3">
        <TextField
          name="name"
          label="Name"
          hint="As written on it, so the scrutineer picks the right one: “Caliper 300 mm, serial 4411”."
          error={fieldErrors.name}
          autoComplete="off"
        />
        <div>
          <label htmlFor="quantity" className="field-label">
            What it measures
          </label>
          <select
            id="quantity"
            name="quantity"
            className="field-input min-h-touch"
            defaultValue="length"
            aria-invalid={fieldErrors.quantity ? true : undefined}
          >
            <option value="length">Length: nozzle diameters (mm)</option>
            <option value="mass">Mass: a scale (kg)</option>
          </select>
          <FieldError name="quantity" error={fieldErrors.quantity} />
        </div>
        <div className="grid gap-3 sm:grid-cols-2">
          <div>
            <label htmlFor="instrumentType" className="field-label">
              Kind of instrument
            </label>
            <select id="instrumentType" name="instrumentType" className="field-input min-h-touch" defaultValue="">
              <option value="">Not said</option>
              {INSTRUMENT_TYPES.map((t) => (
                <option key={t} value={t}>
                  {INSTRUMENT_TYPE_LABELS[t]}
                </option>
              ))}
            </select>
            <FieldError name="instrumentType" error={fieldErrors.instrumentType} />
          </div>
          <TextField name="serial" label="Serial number" error={fieldErrors.serial} autoComplete="off" />
          <TextField name="rangeMin" label="Range from" inputMode="decimal" error={fieldErrors.rangeMin} />
          <TextField name="rangeMax" label="Range to" inputMode="decimal" error={fieldErrors.rangeMax} />
          <TextField
            name="material"
            label="Material"
            hint="For its thermal expansion: “steel”."
            error={fieldErrors.material}
            autoComplete="off"
          />
        </div>
        <p className="text-ink-soft">
          Give the error limit and resolution from its data sheet, or the expanded uncertainty U (k = 2) from a
          calibration certificate. Units: mm for length, kg for mass.
        </p>
        <div className="grid gap-3 sm:grid-cols-3">
          <TextField
            name="errorLimit"
            label="Error limit a"
            inputMode="decimal"
            autoComplete="off"
            error={fieldErrors.errorLimit}
          />
          <TextField
            name="resolution"
            label="Resolution δ"
            inputMode="decimal"
            autoComplete="off"
            error={fieldErrors.resolution}
          />
          <TextField
            name="expandedUncertainty"
            label="Certificate U (k = 2)"
            inputMode="decimal"
            autoComplete="off"
            error={fieldErrors.expandedUncertainty}
          />
        </div>
        <FormMessage state={state} />
        <button type="submit" className="btn-primary min-h-touch text-lg">
          {isPending ? 'Adding…' : 'Add the instrument'}
        </button>
      </fieldset>
    </form>
  );
}

/** Take an instrument out of service, after a confirmation (it cannot be put back; add it again if need be). */
export function RetireInstrumentButton({
  eventId,
  instrumentId,
  name,
}: {
  eventId: string;
  instrumentId: string;
  name: string;
}) {
  const router = useRouter();
  const [isAsking, setAsking] = useState(false);
  const { state, isPending, form } = useFormAction(
    async (): Promise<FormState> => {
      const answer = await requestJson(`/api/events/${eventId}/instruments/${instrumentId}/retire`, { body: {} });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true };
    },
    { ok: false },
  );
  if (!isAsking)
    return (
      <button type="button" className="btn-secondary min-h-touch text-base" onClick={() => setAsking(true)}>
        Retire…
      </button>
    );
  return (
    <form
      {...form}
      className="space-y-2 rounded-lg border-2 border-doubt-600 bg-doubt-100 p-3"
      role="group"
      aria-label={`Retire ${name}`}
    >
      <p className="font-bold">Retire {name}? The dock stops offering it; records already made with it keep it.</p>
      <FormMessage state={state} />
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn-primary min-h-touch text-base" disabled={isPending}>
          {isPending ? 'Retiring…' : 'Yes, retire it'}
        </button>
        <button
          type="button"
          className="btn-secondary min-h-touch text-base"
          disabled={isPending}
          onClick={() => setAsking(false)}
        >
          Keep it
        </button>
      </div>
    </form>
  );
}
