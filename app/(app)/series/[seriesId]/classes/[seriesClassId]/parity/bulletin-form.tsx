'use client';

import { useRouter } from 'next/navigation';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

/** The series secretary publishes a technical bulletin of the class: numbered, append-only, e-mailed to every entrant. */
export function BulletinForm({ seriesId, seriesClassId }: { seriesId: string; seriesClassId: string }) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const answer = await requestJson<{ number: number; recipientCount: number }>(
        `/api/series/${seriesId}/classes/${seriesClassId}/bulletins`,
        {
          body: {
            title: String(data.get('title') ?? ''),
            body: String(data.get('body') ?? ''),
            effectiveFrom: String(data.get('effectiveFrom') ?? ''),
          },
        },
      );
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return {
        ok: true,
        message: `Bulletin ${answer.data.number} published and sent to ${answer.data.recipientCount} entrant(s).`,
      };
    },
    { ok: false },
  );
  const errors = state.fieldErrors ?? {};
  const field = (name: string) => ({
    name,
    id: `bulletin-${name}`,
    className: 'field-input',
    'aria-invalid': errors[name] ? true : undefined,
    'aria-describedby': errors[name] ? `bulletin-${name}-error` : undefined,
  });
  return (
    <form {...form} className="card space-y-3" aria-label="Publish a technical bulletin">
      <h2>Publish a technical bulletin</h2>
      <p className="text-sm text-ink-soft">
        A published bulletin cannot be changed or withdrawn: publish a later one to amend it.
      </p>
      <fieldset disabled={isPending} className="space-y-3">
        <div>
          <label htmlFor="bulletin-title" className="field-label">
            Title
          </label>
          <input {...field('title')} />
          <FieldError id="bulletin-title-error" name="title" error={errors.title} />
        </div>
        <div>
          <label htmlFor="bulletin-body" className="field-label">
            Text
          </label>
          <textarea {...field('body')} rows={5} />
          <FieldError id="bulletin-body-error" name="body" error={errors.body} />
        </div>
        <div>
          <label htmlFor="bulletin-effectiveFrom" className="field-label">
            In effect from
          </label>
          <input {...field('effectiveFrom')} type="date" />
          <FieldError id="bulletin-effectiveFrom-error" name="effectiveFrom" error={errors.effectiveFrom} />
        </div>
        <FormMessage state={state} />
        <button type="submit" className="btn-primary">
          Publish and send
        </button>
      </fieldset>
    </form>
  );
}
