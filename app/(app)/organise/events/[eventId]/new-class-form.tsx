'use client';

import { useRouter } from 'next/navigation';
import { TextField } from '@/components/ui/text-field';
import { useJsonSubmit, FormMessage } from '@/components/ui/use-json-submit';

export function NewClassForm({ eventId, copyable }: { eventId: string; copyable: { id: string; label: string }[] }) {
  const router = useRouter();
  const { submit, isBusy, fieldErrors, message } = useJsonSubmit<{ id: string }>();

  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const f = new FormData(e.currentTarget);
    const copy = String(f.get('copyFromClassId') ?? '');
    const res = await submit(`/api/events/${eventId}/classes`, {
      name: f.get('name'),
      code: f.get('code'),
      description: f.get('description') ?? '',
      copyFromClassId: copy || null,
    });
    if (res.ok) router.push(`/organise/events/${eventId}/classes/${res.data.id}`);
  }

  return (
    <form onSubmit={onSubmit} noValidate className="rounded-lg bg-paper-deep p-4">
      <fieldset disabled={isBusy} className="grid gap-3 sm:grid-cols-2">
        <legend className="mb-2 font-bold">Add a class</legend>
        <TextField name="name" label="Class name" error={fieldErrors.name} />
        <TextField name="code" label="Short code" hint="For example SS or GP-400." error={fieldErrors.code} />
        <TextField name="description" label="Description" className="sm:col-span-2" error={fieldErrors.description} />
        {copyable.length > 0 && (
          <div className="sm:col-span-2">
            <label htmlFor="copyFromClassId" className="field-label">Start from the rules of an earlier class (optional)</label>
            <select id="copyFromClassId" name="copyFromClassId" className="field-input" defaultValue="">
              <option value="">No: start from the defaults</option>
              {copyable.map((c) => <option key={c.id} value={c.id}>{c.label}</option>)}
            </select>
            {fieldErrors.copyFromClassId && <p className="field-error">{fieldErrors.copyFromClassId}</p>}
          </div>
        )}
        <div className="sm:col-span-2 space-y-2">
          <FormMessage message={message} />
          <button type="submit" className="btn-primary">{isBusy ? 'Adding…' : 'Add class'}</button>
        </div>
      </fieldset>
    </form>
  );
}
