'use client';

import { useRouter } from 'next/navigation';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { numberOrNull } from '@/lib/core/inputs/form-values';
import { CREW_KG_RANGE, FUEL_KG_RANGE, checkDeclaredMasses } from '@/lib/core/inputs/declared-masses-check';

/**
 * The crew and fuel masses of one entry, declared by its entrant for the predicted runs of the meeting's parity
 * report. An empty field is not declared: the report states the assumption it used instead.
 */
export function ClockMassesForm({
  entryId,
  crewKg,
  fuelKg,
  assumedCrewKg,
  assumedFuelKg,
}: {
  entryId: string;
  crewKg: number | null;
  fuelKg: number | null;
  assumedCrewKg: number;
  assumedFuelKg: number;
}) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(async (_prev: FormState | null, data: FormData) => {
    // Checked here as the server's schema checks it first: a typed word must not travel as JSON null (which clears).
    const checked = checkDeclaredMasses({
      crewKg: numberOrNull(data.get('crewKg')),
      fuelKg: numberOrNull(data.get('fuelKg')),
    });
    if (!checked.ok) return refusalState({ message: '', fieldErrors: checked.fieldErrors });
    const answer = await requestJson(`/api/entries/${entryId}/masses`, {
      method: 'PUT',
      body: checked.data,
      fallbackMessage: 'The masses could not be saved. Try again.',
    });
    if (!answer.ok) return refusalState(answer);
    router.refresh();
    return { ok: true, message: 'Saved: the next predicted times use them.' };
  }, null);
  const id = (name: string) => `${name}-${entryId}`;
  return (
    <form {...form} className="space-y-2" data-testid="masses-form" aria-label="Crew and fuel for the predicted times">
      <fieldset disabled={isPending} className="space-y-2">
        <legend className="font-bold">Crew and fuel aboard</legend>
        <p className="text-sm text-ink-soft">
          For the predicted run times in the meeting&apos;s parity report, added to the boat&apos;s weighed mass. Left
          empty, {assumedCrewKg} kg crew and {assumedFuelKg} kg fuel are assumed, and the report says so. A report
          already published keeps the figures it was published with.
        </p>
        <div className="grid gap-2 sm:grid-cols-2">
          <TextField
            id={id('crewKg')}
            name="crewKg"
            label="Crew, everyone aboard in their gear"
            unit="kg"
            inputMode="decimal"
            defaultValue={crewKg ?? ''}
            hint={`${CREW_KG_RANGE.min} to ${CREW_KG_RANGE.max} kg`}
            error={state?.fieldErrors?.crewKg}
          />
          <TextField
            id={id('fuelKg')}
            name="fuelKg"
            label="Fuel at the start of a run"
            unit="kg"
            inputMode="decimal"
            defaultValue={fuelKg ?? ''}
            hint={`${FUEL_KG_RANGE.min} to ${FUEL_KG_RANGE.max} kg`}
            error={state?.fieldErrors?.fuelKg}
          />
        </div>
        <FormMessage state={state} testId={`masses-message-${entryId}`} />
        <button type="submit" className="btn-secondary">
          {isPending ? 'Saving…' : 'Save crew and fuel'}
        </button>
      </fieldset>
    </form>
  );
}
