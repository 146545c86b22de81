'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { REJECTION_LABELS } from '@/lib/core/protests/protest-states';
import type { ProtestDetail } from '@/lib/server/protests/get-protest';

type Field = {
  name: string;
  label: string;
  kind: 'text' | 'textarea' | 'datetime' | 'select' | 'radio';
  options?: Record<string, string>;
  hint?: string;
};

/** One steward step as a small form: fields, the server's error beside each, the fieldset disabled while sending. */
function ActionForm({
  title,
  url,
  fields,
  button,
  danger,
  confirmFirst,
}: {
  title: string;
  url: string;
  fields: Field[];
  button: string;
  danger?: boolean;
  confirmFirst?: { when: () => boolean; text: string; button: string }; // asked once before sending
}) {
  const router = useRouter();
  const [isConfirming, setConfirming] = useState(false);
  const { state, isPending, form } = useFormAction(
    async (prev: FormState, data: FormData): Promise<FormState> => {
      if (confirmFirst && !isConfirming && confirmFirst.when()) {
        setConfirming(true);
        return prev;
      }
      setConfirming(false);
      const body = Object.fromEntries(fields.map((f) => [f.name, String(data.get(f.name) ?? '')]));
      const answer = await requestJson<ProtestDetail>(url, { body });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true, message: `${title}: done.` };
    },
    { ok: false },
  );
  const fieldErrors = state.fieldErrors ?? {};
  return (
    <form {...form} className="space-y-3 rounded-lg bg-paper-deep p-4" aria-label={title}>
      <h3>{title}</h3>
      <fieldset disabled={isPending} className="space-y-3">
        {fields.map((f) => {
          const id = `${url.split('/').pop()}-${f.name}`;
          const err = fieldErrors[f.name];
          const aria = { 'aria-invalid': err ? true : undefined, 'aria-describedby': err ? `${id}-error` : undefined };
          return (
            <div key={f.name}>
              {f.kind === 'radio' ? (
                <fieldset {...aria}>
                  <legend className="field-label">{f.label}</legend>
                  <div className="flex flex-wrap gap-4">
                    {Object.entries(f.options ?? {}).map(([v, l]) => (
                      <label key={v} className="flex min-h-touch items-center gap-2">
                        <input type="radio" name={f.name} value={v} className="h-5 w-5" />
                        {l}
                      </label>
                    ))}
                  </div>
                </fieldset>
              ) : (
                <>
                  <label htmlFor={id} className="field-label">
                    {f.label}
                  </label>
                  {f.kind === 'textarea' && (
                    <textarea id={id} name={f.name} rows={4} className="field-input" {...aria} />
                  )}
                  {f.kind === 'text' && <input id={id} name={f.name} className="field-input" {...aria} />}
                  {f.kind === 'datetime' && (
                    <input id={id} name={f.name} type="datetime-local" className="field-input" {...aria} />
                  )}
                  {f.kind === 'select' && (
                    <select id={id} name={f.name} className="field-input" {...aria}>
                      {Object.entries(f.options ?? {}).map(([v, l]) => (
                        <option key={v} value={v}>
                          {l}
                        </option>
                      ))}
                    </select>
                  )}
                </>
              )}
              {f.hint && <p className="field-hint">{f.hint}</p>}
              <FieldError id={`${id}-error`} name={f.name} error={err} />
            </div>
          );
        })}
        {isConfirming && confirmFirst && (
          <p
            role="alert"
            className="rounded-lg border-2 border-doubt-600 bg-doubt-100 p-3 font-bold text-doubt-800"
            data-testid="confirm-first"
          >
            {confirmFirst.text}
          </p>
        )}
        <FormMessage state={state} />
        <button type="submit" className={danger ? 'btn-danger' : 'btn-primary'}>
          {isConfirming && confirmFirst ? confirmFirst.button : button}
        </button>
        {isConfirming && (
          <button type="button" className="btn-secondary ml-2" onClick={() => setConfirming(false)}>
            Not yet
          </button>
        )}
      </fieldset>
    </form>
  );
}

export function StewardActions({ p }: { p: ProtestDetail }) {
  const base = `/api/protests/${p.id}`;
  const anyAction = p.can.accept || p.can.reject || p.can.orderReinspection || p.can.scheduleHearing || p.can.decide;
  if (!anyAction) return null;
  return (
    <section aria-labelledby="steward-actions" className="card space-y-4">
      <h2 id="steward-actions">Stewards&apos; steps</h2>
      <div className="grid gap-4 lg:grid-cols-2">
        {p.can.accept && (
          <ActionForm
            title="Accept for a hearing"
            url={`${base}/accept`}
            fields={[{ name: 'note', label: 'Note (optional)', kind: 'text' }]}
            button="Accept the protest"
          />
        )}
        {p.can.reject && (
          <ActionForm
            title="Reject as invalid"
            url={`${base}/reject`}
            danger
            button="Reject the protest"
            fields={[
              { name: 'code', label: 'Why it is invalid', kind: 'select', options: REJECTION_LABELS },
              { name: 'reasons', label: 'Reasons', kind: 'textarea' },
            ]}
          />
        )}
        {p.can.orderReinspection && (
          <ActionForm
            title="Order a re-inspection"
            url={`${base}/reinspection`}
            button="Order the re-inspection"
            fields={[
              {
                name: 'reason',
                label: 'What the scrutineers should check',
                kind: 'textarea',
                hint: 'The boat appears on the scrutineers’ re-inspection list; their record is linked here.',
              },
            ]}
          />
        )}
        {p.can.scheduleHearing && (
          <ActionForm
            title="Schedule the hearing"
            url={`${base}/hearing`}
            button="Schedule and tell the parties"
            fields={[
              { name: 'hearingAt', label: `Date and time (${p.timeZone})`, kind: 'datetime' },
              { name: 'place', label: 'Place', kind: 'text' },
            ]}
          />
        )}
        {p.can.decide && (
          <ActionForm
            title="Decide"
            url={`${base}/decision`}
            button="Record the decision"
            confirmFirst={
              p.hearingAt
                ? {
                    when: () => Date.now() < Date.parse(p.hearingAt!),
                    text: `The hearing is set for ${p.hearingAtLabel ?? p.hearingAt}, which has not come yet. Record the decision before it only if the hearing has really taken place or the parties agreed.`,
                    button: 'Record it before the hearing time',
                  }
                : undefined
            }
            fields={[
              {
                name: 'outcome',
                label: 'Decision',
                kind: 'radio',
                options:
                  p.status === 'lodged'
                    ? { withdrawn: 'Withdrawn' }
                    : {
                        upheld: 'Upheld (fee refunded)',
                        dismissed: 'Dismissed (fee kept)',
                        withdrawn: 'Withdrawn (fee kept)',
                      },
              },
              { name: 'reasons', label: 'Reasons', kind: 'textarea' },
              {
                name: 'penalty',
                label: 'Penalty (upheld only)',
                kind: 'text',
                hint: 'Change the results by publishing a new provisional version.',
              },
            ]}
          />
        )}
      </div>
    </section>
  );
}
