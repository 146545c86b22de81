'use client';

import { useRouter } from 'next/navigation';
import { TextField } from '@/components/ui/text-field';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

export function NewClassForm({ eventId, copyable }: { eventId: string; copyable: { id: string; label: string }[] }) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, f: FormData): Promise<FormState> => {
      const copy = String(f.get('copyFromClassId') ?? '');
      const answer = await requestJson<{ id: string }>(`/api/events/${eventId}/classes`, {
        body: {
          name: f.get('name'),
          code: f.get('code'),
          description: f.get('description') ?? '',
          copyFromClassId: copy || null,
        },
      });
      if (!answer.ok) return refusalState(answer);
      router.push(`/organise/events/${eventId}/classes/${answer.data.id}`);
      return { ok: true };
    },
    { ok: false },
  );
  const fieldErrors = state.fieldErrors ?? {};

  return (
    <form {...form} className="rounded-lg bg-paper-deep p-4">
      <fieldset disabled={isPending} className="grid gap-3 sm:grid-cols-2">
        <legend className="mb-2 font-bold">Add a class</legend>
        <TextField name="name" label="Class name" error={fieldErrors.name} />
        <TextField name="code" label="Short code" hint="For example SS or GP-400." error={fieldErrors.code} />
        <TextField name="description" label="Description" className="sm:col-span-2" error={fieldErrors.description} />
        {copyable.length > 0 && (
          <div className="sm:col-span-2">
            <label htmlFor="copyFromClassId" className="field-label">
              Start from the rules of an earlier class (optional)
            </label>
            <select id="copyFromClassId" name="copyFromClassId" className="field-input" defaultValue="">
              <option value="">No: start from the defaults</option>
              {copyable.map((c) => (
                <option key={c.id} value={c.id}>
                  {c.label}
                </option>
              ))}
            </select>
            <FieldError name="copyFromClassId" error={fieldErrors.copyFromClassId} />
          </div>
        )}
        <div className="sm:col-span-2 space-y-2">
          <FormMessage state={state} />
          <button type="submit" className="btn-primary">
            {isPending ? 'Adding…' : 'Add class'}
          </button>
        </div>
      </fieldset>
    </form>
  );
}
