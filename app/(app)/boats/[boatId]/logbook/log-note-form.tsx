'use client';

import { useRouter } from 'next/navigation';
import { TextField } from '@/components/ui/text-field';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { LOG_NOTE_CATEGORIES, LOG_NOTE_CATEGORY_LABELS, LOG_NOTE_MAX_CHARS } from '@/lib/core/inputs/logbook';

/** An official's dated note (damage, repair, observation) for one of their meetings; kept for good once added. */
export function LogNoteForm({
  boatId,
  meetings,
  today,
}: {
  boatId: string;
  meetings: { id: string; name: string }[];
  today: string;
}) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, f: FormData): Promise<FormState> => {
      const answer = await requestJson(`/api/boats/${boatId}/log-notes`, {
        body: {
          eventId: f.get('eventId'),
          category: f.get('category'),
          notedOn: f.get('notedOn'),
          body: f.get('body'),
        },
      });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true, message: 'Note added to the logbook.' };
    },
    { ok: false },
    { resetOnSuccess: true },
  );
  const errors = state.fieldErrors ?? {};
  return (
    <form {...form} className="card space-y-3" aria-labelledby="note-heading" data-testid="log-note-form">
      <h2 id="note-heading" className="text-xl">
        Add an official&apos;s note
      </h2>
      <p className="text-sm text-ink-soft">
        Notes are kept for good: nothing is edited or removed. To correct a note, add another one.
      </p>
      <div>
        <label htmlFor="eventId" className="field-label">
          Meeting
        </label>
        <select
          id="eventId"
          name="eventId"
          className="field-input min-h-touch"
          defaultValue={meetings[meetings.length - 1]?.id}
          aria-invalid={errors.eventId ? true : undefined}
          aria-describedby={errors.eventId ? 'eventId-error' : undefined}
        >
          {meetings.map((m) => (
            <option key={m.id} value={m.id}>
              {m.name}
            </option>
          ))}
        </select>
        <FieldError name="eventId" error={errors.eventId} />
      </div>
      <fieldset>
        <legend className="field-label">Kind of note</legend>
        <div className="flex flex-wrap gap-x-4">
          {LOG_NOTE_CATEGORIES.map((c) => (
            <label key={c} className="flex min-h-touch items-center gap-2">
              <input type="radio" name="category" value={c} defaultChecked={c === 'observation'} className="h-5 w-5" />
              {LOG_NOTE_CATEGORY_LABELS[c]}
            </label>
          ))}
        </div>
        <FieldError name="category" error={errors.category} />
      </fieldset>
      <TextField name="notedOn" label="Day it happened" type="date" defaultValue={today} error={errors.notedOn} />
      <div>
        <label htmlFor="body" className="field-label">
          Note
        </label>
        <textarea
          id="body"
          name="body"
          rows={4}
          className="field-input"
          aria-invalid={errors.body ? true : undefined}
          aria-describedby={['body-hint', errors.body && 'body-error'].filter(Boolean).join(' ')}
        />
        <p id="body-hint" className="field-hint">
          What was seen or done, up to {LOG_NOTE_MAX_CHARS} characters.
        </p>
        <FieldError name="body" error={errors.body} />
      </div>
      <FormMessage state={state} testId="log-note-message" />
      <button type="submit" className="btn-primary" disabled={isPending}>
        {isPending ? 'Adding…' : 'Add the note'}
      </button>
    </form>
  );
}
