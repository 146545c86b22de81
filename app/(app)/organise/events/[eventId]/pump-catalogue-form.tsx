'use client';

import { useRouter } from 'next/navigation';
import { TextField } from '@/components/ui/text-field';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { CHECK_FIELDS_MESSAGE, refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { fieldErrorsByBox, parseCurveText } from '@/lib/core/boats/curve-text';

// The organiser enters an impeller model and trim with the maker's curve once; every entrant can then
// choose it for their boat (POST /api/events/:eventId/pump-catalogue). Nothing typed is lost on a refusal.

const BOXES = ['maker', 'model', 'trimCode', 'impellerDiameterMm', 'curve'] as const;

export function PumpCatalogueForm({ eventId }: { eventId: string }) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const curve = parseCurveText(
        String(data.get('curve') ?? ''),
        3,
        'flow coefficient, head coefficient and efficiency',
      );
      if (!curve.ok) return { ok: false, fieldErrors: { curve: curve.message }, message: CHECK_FIELDS_MESSAGE };
      const diameter = String(data.get('impellerDiameterMm') ?? '').trim();
      const answer = await requestJson(`/api/events/${eventId}/pump-catalogue`, {
        body: {
          maker: String(data.get('maker') ?? ''),
          model: String(data.get('model') ?? ''),
          trimCode: String(data.get('trimCode') ?? ''),
          impellerDiameterMm: diameter === '' ? undefined : Number(diameter),
          curve: curve.points.map(([flowCoefficient, headCoefficient, efficiency]) => ({
            flowCoefficient,
            headCoefficient,
            efficiency,
          })),
        },
        fallbackMessage: 'The impeller could not be added. Try again.',
      });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true, message: 'Added to the catalogue: entrants can choose it now.' };
    },
    { ok: false },
    { resetOnSuccess: true },
  );
  const errors = fieldErrorsByBox(state.fieldErrors ?? {}, BOXES);
  const id = (n: string) => `catalogue-${n}`;
  return (
    <form {...form} aria-label="Add an impeller to the catalogue">
      <fieldset disabled={isPending} className="grid gap-3 sm:grid-cols-2">
        <TextField id={id('maker')} name="maker" label="Maker" autoComplete="off" error={errors.maker} />
        <TextField id={id('model')} name="model" label="Impeller model" autoComplete="off" error={errors.model} />
        <TextField id={id('trimCode')} name="trimCode" label="Trim" autoComplete="off" error={errors.trimCode} />
        <TextField
          id={id('impellerDiameterMm')}
          name="impellerDiameterMm"
          label="Impeller diameter"
          unit="mm"
          inputMode="decimal"
          error={errors.impellerDiameterMm}
        />
        <div className="sm:col-span-2">
          <label htmlFor={id('curve')} className="field-label">
            Pump curve
          </label>
          <textarea
            id={id('curve')}
            name="curve"
            rows={5}
            inputMode="decimal"
            spellCheck={false}
            aria-invalid={errors.curve ? true : undefined}
            aria-describedby={`${id('curve')}-hint${errors.curve ? ` ${id('curve')}-error` : ''}`}
            className="field-input font-mono"
          />
          <p id={`${id('curve')}-hint`} className="field-hint">
            The maker’s points, one a line: flow coefficient φ, head coefficient ψ, efficiency η; φ increasing.
          </p>
          <FieldError id={`${id('curve')}-error`} name="curve" error={errors.curve} />
        </div>
        <p className="text-sm text-ink-soft sm:col-span-2">
          An entry cannot be changed later (a boat that chose it keeps a copy of its curve): add a corrected one.
        </p>
        <FormMessage state={state} testId="catalogue-message" className="sm:col-span-2" />
        <FieldError name="form" error={errors.form} className="sm:col-span-2" />
        <button type="submit" className="btn-primary sm:col-span-2 sm:justify-self-start">
          {isPending ? 'Adding…' : 'Add to the catalogue'}
        </button>
      </fieldset>
    </form>
  );
}
