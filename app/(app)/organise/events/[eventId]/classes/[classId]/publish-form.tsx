'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { TextField } from '@/components/ui/text-field';
import { FormMessage } from '@/components/forms/form-message';
import { requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { instantFromWallClock } from '@/lib/core/protests/protest-window';

type Props = { eventId: string; classId: string; version: number; timeZone: string };

export function PublishForm({ eventId, classId, version, timeZone }: Props) {
  const router = useRouter();
  const needsNote = version >= 2;
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, f: FormData): Promise<FormState> => {
      const note = String(f.get('changeNote') ?? '').trim();
      const when = String(f.get('effectiveFrom') ?? '');
      // Checked here for a quick answer; the server checks the same and is the one that decides.
      if (needsNote && !note) {
        return {
          ok: false,
          fieldErrors: {
            changeNote: `Say what changed from version ${version - 1} and why: from version 2 on, every published version carries a change note.`,
          },
          message: 'Nothing was published: write the change note first.',
        };
      }
      const effectiveFrom = when ? instantFromWallClock(when, timeZone) : null;
      if (when && !effectiveFrom)
        return { ok: false, fieldErrors: { effectiveFrom: 'Give the time as a date and a time of day.' } };
      if (!window.confirm(`Publish version ${version}? A published version can never be changed.`))
        return { ok: false };
      const answer = await requestJson(`/api/events/${eventId}/classes/${classId}/rules/publish`, {
        body: { changeNote: note, effectiveFrom: effectiveFrom ? effectiveFrom.toISOString() : null },
      });
      if (!answer.ok)
        return {
          ok: false,
          fieldErrors: answer.fieldErrors,
          message: `Nothing was published. ${answer.fieldErrors.rules ? '' : answer.message}`.trim(),
        };
      router.refresh();
      return { ok: true, message: `Version ${version} published.` };
    },
    { ok: false },
  );
  // Typing a change note takes its error away at once (the rest stays until the next try).
  const [noteEditedFor, setNoteEditedFor] = useState<FormState | null>(null);
  const fieldErrors = state.fieldErrors ?? {};
  const rulesError = fieldErrors.rules ?? Object.entries(fieldErrors).find(([k]) => k.startsWith('rules.'))?.[1];
  return (
    <form {...form} className="rounded-lg border-2 border-tide-600 p-4" data-testid="publish-form">
      <fieldset disabled={isPending} className="space-y-3">
        <legend className="mb-2 text-lg font-bold">Publish draft v{version}</legend>
        {rulesError && (
          <p className="field-error" data-field-error="rules" role="alert">
            {rulesError}
          </p>
        )}
        <TextField
          name="changeNote"
          label={needsNote ? 'What changed and why (required)' : 'What changed and why (optional for version 1)'}
          required={needsNote}
          error={noteEditedFor === state ? undefined : fieldErrors.changeNote}
          onInput={() => fieldErrors.changeNote && setNoteEditedFor(state)}
        />
        <TextField
          name="effectiveFrom"
          label={`In force from (meeting time, ${timeZone}; empty = now)`}
          type="datetime-local"
          error={fieldErrors.effectiveFrom}
        />
        <FormMessage state={state} />
        <button type="submit" className="btn-primary">
          {isPending ? 'Publishing…' : `Publish version ${version}`}
        </button>
      </fieldset>
    </form>
  );
}
