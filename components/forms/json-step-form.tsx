'use client';

import { useRouter } from 'next/navigation';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

export type StepField = {
  name: string;
  label: string;
  kind: 'text' | 'textarea' | 'select' | 'number' | 'datetime';
  options?: Record<string, string>; // select: value -> label ('' for "none")
  hint?: string;
  optional?: boolean; // an empty value is sent as null
};

/** Turns the form's values into the JSON body: numbers as numbers, an empty optional field as null. */
function bodyOf(fields: StepField[], data: FormData, fixed: Record<string, unknown>) {
  const body: Record<string, unknown> = { ...fixed };
  for (const f of fields) {
    const raw = String(data.get(f.name) ?? '').trim();
    if (raw === '' && f.optional) body[f.name] = null;
    else if (f.kind === 'number') body[f.name] = raw === '' ? null : Number(raw);
    else if (f.kind === 'datetime') body[f.name] = raw ? new Date(raw).toISOString() : raw;
    else body[f.name] = raw;
  }
  return body;
}

/**
 * One step on a penalty or appeal screen as a small JSON form: fields, the server's error beside each, the
 * fieldset disabled while sending, the page refreshed when it worked. `fixed` values go into every body.
 */
export function JsonStepForm({
  title,
  url,
  fields,
  button,
  fixed = {},
  danger,
}: {
  title: string;
  url: string;
  fields: StepField[];
  button: string;
  fixed?: Record<string, unknown>;
  danger?: boolean;
}) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const answer = await requestJson<unknown>(url, { body: bodyOf(fields, data, fixed) });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true, message: `${title}: done.` };
    },
    { ok: false },
    { resetOnSuccess: true },
  );
  const errors = state.fieldErrors ?? {};
  const base = title.toLowerCase().replace(/[^a-z0-9]+/g, '-');
  return (
    <form {...form} className="space-y-3 rounded-lg bg-paper-deep p-4" aria-label={title}>
      <h3>{title}</h3>
      <fieldset disabled={isPending} className="space-y-3">
        {fields.map((f) => {
          const id = `${base}-${f.name}`;
          const err = errors[f.name];
          const aria = {
            'aria-invalid': err ? true : undefined,
            'aria-describedby': [f.hint && `${id}-hint`, err && `${id}-error`].filter(Boolean).join(' ') || undefined,
          };
          return (
            <div key={f.name}>
              <label htmlFor={id} className="field-label">
                {f.label}
                {f.optional && <span className="ml-1 font-normal text-ink-mute">(optional)</span>}
              </label>
              {f.kind === 'textarea' && <textarea id={id} name={f.name} rows={3} className="field-input" {...aria} />}
              {f.kind === 'text' && <input id={id} name={f.name} className="field-input" {...aria} />}
              {f.kind === 'number' && (
                <input id={id} name={f.name} type="number" inputMode="numeric" className="field-input" {...aria} />
              )}
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
              {f.hint && (
                <p id={`${id}-hint`} className="field-hint">
                  {f.hint}
                </p>
              )}
              <FieldError id={`${id}-error`} name={f.name} error={err} />
            </div>
          );
        })}
        <FormMessage state={state} />
        <button type="submit" className={danger ? 'btn-danger' : 'btn-primary'}>
          {button}
        </button>
      </fieldset>
    </form>
  );
}
