'use client';

import { useRouter } from 'next/navigation';
import { TextField } from '@/components/ui/text-field';
import { useJsonSubmit, FormMessage } from '@/components/ui/use-json-submit';

export function PublishForm({ eventId, classId, version }: { eventId: string; classId: string; version: number }) {
  const router = useRouter();
  const { submit, isBusy, fieldErrors, message, setMessage } = useJsonSubmit();
  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const f = new FormData(e.currentTarget);
    const when = String(f.get('effectiveFrom') ?? '');
    if (!window.confirm(`Publish version ${version}? A published version can never be changed.`)) return;
    const res = await submit(`/api/events/${eventId}/classes/${classId}/rules/publish`, {
      changeNote: f.get('changeNote') ?? '',
      effectiveFrom: when ? new Date(when).toISOString() : null,
    });
    if (res.ok) {
      setMessage({ tone: 'ok', text: `Version ${version} published.` });
      router.refresh();
    }
  }
  return (
    <form onSubmit={onSubmit} noValidate className="rounded-lg border-2 border-tide-600 p-4">
      <fieldset disabled={isBusy} className="space-y-3">
        <legend className="mb-2 text-lg font-bold">Publish draft v{version}</legend>
        <TextField name="changeNote" label="What changed and why" error={fieldErrors.changeNote} />
        <TextField name="effectiveFrom" label="In force from (your local time; empty = now)" type="datetime-local" error={fieldErrors.effectiveFrom} />
        <FormMessage message={message} />
        <button type="submit" className="btn-primary">{isBusy ? 'Publishing…' : `Publish version ${version}`}</button>
      </fieldset>
    </form>
  );
}
