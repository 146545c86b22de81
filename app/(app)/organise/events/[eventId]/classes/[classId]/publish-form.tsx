'use client';

import { useRouter } from 'next/navigation';
import { TextField } from '@/components/ui/text-field';
import { useJsonSubmit, FormMessage } from '@/components/ui/use-json-submit';
import { instantFromWallClock } from '@/lib/core/protests/protest-window';

type Props = { eventId: string; classId: string; version: number; timeZone: string };

export function PublishForm({ eventId, classId, version, timeZone }: Props) {
  const router = useRouter();
  const { submit, isBusy, fieldErrors, setFieldErrors, message, setMessage } = useJsonSubmit();
  const needsNote = version >= 2;
  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    setFieldErrors({});
    setMessage(undefined);
    const f = new FormData(e.currentTarget);
    const note = String(f.get('changeNote') ?? '').trim();
    const when = String(f.get('effectiveFrom') ?? '');
    // Checked here for a quick answer; the server checks the same and is the one that decides.
    if (needsNote && !note) {
      setFieldErrors({ changeNote: `Say what changed from version ${version - 1} and why: from version 2 on, every published version carries a change note.` });
      setMessage({ tone: 'error', text: 'Nothing was published: write the change note first.' });
      return;
    }
    const effectiveFrom = when ? instantFromWallClock(when, timeZone) : null;
    if (when && !effectiveFrom) {
      setFieldErrors({ effectiveFrom: 'Give the time as a date and a time of day.' });
      return;
    }
    if (!window.confirm(`Publish version ${version}? A published version can never be changed.`)) return;
    const res = await submit(`/api/events/${eventId}/classes/${classId}/rules/publish`, { changeNote: note, effectiveFrom: effectiveFrom ? effectiveFrom.toISOString() : null });
    if (res.ok) {
      setMessage({ tone: 'ok', text: `Version ${version} published.` });
      router.refresh();
    } else {
      setMessage({ tone: 'error', text: `Nothing was published. ${res.fieldErrors.rules ? '' : res.message}`.trim() });
    }
  }
  const rulesError = fieldErrors.rules ?? Object.entries(fieldErrors).find(([k]) => k.startsWith('rules.'))?.[1];
  return (
    <form onSubmit={onSubmit} noValidate className="rounded-lg border-2 border-tide-600 p-4" data-testid="publish-form">
      <fieldset disabled={isBusy} className="space-y-3">
        <legend className="mb-2 text-lg font-bold">Publish draft v{version}</legend>
        {rulesError && <p className="field-error" data-field-error="rules" role="alert">{rulesError}</p>}
        <TextField
          name="changeNote" label={needsNote ? 'What changed and why (required)' : 'What changed and why (optional for version 1)'}
          required={needsNote} error={fieldErrors.changeNote}
          onInput={() => fieldErrors.changeNote && setFieldErrors(({ changeNote: _, ...rest }) => rest)}
        />
        <TextField name="effectiveFrom" label={`In force from (meeting time, ${timeZone}; empty = now)`} type="datetime-local" error={fieldErrors.effectiveFrom} />
        <FormMessage message={message} />
        <button type="submit" className="btn-primary">{isBusy ? 'Publishing…' : `Publish version ${version}`}</button>
      </fieldset>
    </form>
  );
}
