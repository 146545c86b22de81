'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { INTEREST_KIND_LABELS, type InterestKind } from '@/lib/core/inputs/interests';
import type { InterestView } from '@/lib/server/interests/interest-view';

type Choice = { id: string; label: string };

/** Declares one interest: what it is in (a boat or entrant of the meeting, or a named team) and a short statement. */
export function DeclareInterestForm({
  eventId,
  boats,
  entrants,
}: {
  eventId: string;
  boats: Choice[];
  entrants: Choice[];
}) {
  const router = useRouter();
  const [kind, setKind] = useState<InterestKind>('boat');
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const subjectField = kind === 'boat' ? 'boatId' : kind === 'entrant' ? 'entrantId' : 'teamName';
      const answer = await requestJson<InterestView>(`/api/events/${eventId}/interests`, {
        body: {
          kind,
          [subjectField]: String(data.get(subjectField) ?? ''),
          statement: String(data.get('statement') ?? ''),
        },
      });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true, message: `Declared: ${answer.data.subjectLabel}.` };
    },
    { ok: false },
    { resetOnSuccess: true },
  );
  const fieldErrors = state.fieldErrors ?? {};
  const err = (name: string) =>
    fieldErrors[name] ? { 'aria-invalid': true as const, 'aria-describedby': `interest-${name}-error` } : {};
  const errText = (name: string) => <FieldError id={`interest-${name}-error`} name={name} error={fieldErrors[name]} />;
  return (
    <form {...form} className="card space-y-4" aria-label="Declare an interest">
      <h2>Declare an interest</h2>
      <fieldset disabled={isPending} className="space-y-4">
        <fieldset {...err('kind')}>
          <legend className="field-label">The interest is in</legend>
          <div className="flex flex-wrap gap-4">
            {(Object.keys(INTEREST_KIND_LABELS) as InterestKind[]).map((k) => (
              <label key={k} className="flex min-h-touch items-center gap-2">
                <input
                  type="radio"
                  name="kind"
                  value={k}
                  checked={kind === k}
                  onChange={() => setKind(k)}
                  className="h-5 w-5"
                />
                {INTEREST_KIND_LABELS[k]}
              </label>
            ))}
          </div>
          {errText('kind')}
        </fieldset>
        {kind === 'boat' && (
          <div>
            <label htmlFor="interest-boatId" className="field-label">
              Boat
            </label>
            <select id="interest-boatId" name="boatId" className="field-input" defaultValue="" {...err('boatId')}>
              <option value="" disabled>
                Choose a boat
              </option>
              {boats.map((b) => (
                <option key={b.id} value={b.id}>
                  {b.label}
                </option>
              ))}
            </select>
            {errText('boatId')}
          </div>
        )}
        {kind === 'entrant' && (
          <div>
            <label htmlFor="interest-entrantId" className="field-label">
              Entrant
            </label>
            <select
              id="interest-entrantId"
              name="entrantId"
              className="field-input"
              defaultValue=""
              {...err('entrantId')}
            >
              <option value="" disabled>
                Choose an entrant
              </option>
              {entrants.map((b) => (
                <option key={b.id} value={b.id}>
                  {b.label}
                </option>
              ))}
            </select>
            {errText('entrantId')}
          </div>
        )}
        {kind === 'team' && (
          <div>
            <label htmlFor="interest-teamName" className="field-label">
              Team, club or sponsor
            </label>
            <input id="interest-teamName" name="teamName" className="field-input" {...err('teamName')} />
            {errText('teamName')}
          </div>
        )}
        <div>
          <label htmlFor="interest-statement" className="field-label">
            Statement
          </label>
          <textarea id="interest-statement" name="statement" rows={2} className="field-input" {...err('statement')} />
          <p className="field-hint">One sentence, for example “I am the crew chief of this boat”.</p>
          {errText('statement')}
        </div>
        <FormMessage state={state} />
        <button type="submit" className="btn-primary">
          Declare the interest
        </button>
      </fieldset>
    </form>
  );
}
