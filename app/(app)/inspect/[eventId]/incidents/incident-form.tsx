'use client';

import { useRouter } from 'next/navigation';
import { TextField } from '@/components/ui/text-field';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { slotInstant } from '@/lib/core/schedule/slot-times';

/** Record an incident (time in the meeting's zone, boat, what happened, damage, photos); or correct one. */
export function IncidentForm({
  eventId,
  timeZone,
  entries,
  correcting,
}: {
  eventId: string;
  timeZone: string;
  entries: { id: string; label: string }[];
  correcting?: { id: string; entryId: string; label: string };
}) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, f: FormData): Promise<FormState> => {
      const local = String(f.get('occurredAt') ?? '');
      const at = slotInstant(local, timeZone);
      if (!at) return { ok: false, fieldErrors: { occurredAt: `Enter the date and time in ${timeZone}.` } };
      const answer = await requestJson<{ id: string; reinspection: { id: string } | null }>(
        `/api/events/${eventId}/incidents`,
        {
          body: {
            entryId: correcting?.entryId ?? f.get('entryId'),
            occurredAt: at.toISOString(),
            description: f.get('description'),
            damage: f.get('damage') === 'yes',
            ...(correcting ? { supersedesId: correcting.id, correctionReason: f.get('correctionReason') } : {}),
          },
        },
      );
      if (!answer.ok) return refusalState(answer);
      // Photos one per request (as the dock sends them); a refused photo leaves the incident stored.
      const photos = f.getAll('photo').filter((p): p is File => p instanceof File && p.size > 0);
      for (const photo of photos) {
        const body = new FormData();
        body.append('photo', photo, photo.name);
        const up = await requestJson(`/api/events/${eventId}/incidents/${answer.data.id}/photos`, { body });
        if (!up.ok)
          return { ok: false, message: `The incident is stored, but photo ${photo.name} was refused: ${up.message}` };
      }
      router.refresh();
      return {
        ok: true,
        message: answer.data.reinspection
          ? 'Incident recorded. The boat must be inspected again before its next run.'
          : 'Incident recorded.',
      };
    },
    { ok: false },
    { resetOnSuccess: true },
  );
  const fe = state.fieldErrors ?? {};
  const idp = correcting ? `fix-${correcting.id}-` : '';
  return (
    <form
      {...form}
      className="card space-y-3"
      aria-label={correcting ? `Correct the incident of ${correcting.label}` : 'Record an incident'}
    >
      {!correcting && <h2 className="text-xl">Record an incident</h2>}
      {correcting ? (
        <p className="text-base">Boat: {correcting.label}</p>
      ) : (
        <div>
          <label htmlFor="entryId" className="field-label">
            Boat
          </label>
          <select id="entryId" name="entryId" className="field-input min-h-touch">
            {entries.map((e) => (
              <option key={e.id} value={e.id}>
                {e.label}
              </option>
            ))}
          </select>
          <FieldError name="entryId" error={fe.entryId} />
        </div>
      )}
      <TextField
        id={`${idp}occurredAt`}
        name="occurredAt"
        type="datetime-local"
        label={`When (${timeZone})`}
        error={fe.occurredAt}
      />
      <div>
        <label htmlFor={`${idp}description`} className="field-label">
          What happened
        </label>
        <textarea
          id={`${idp}description`}
          name="description"
          rows={3}
          className="field-input"
          aria-invalid={fe.description ? true : undefined}
          aria-describedby={fe.description ? `${idp}description-error` : undefined}
        />
        <FieldError name={`${idp}description`} error={fe.description} />
      </div>
      <fieldset>
        <legend className="field-label">Damage to the boat</legend>
        <label className="mr-4">
          <input type="radio" name="damage" value="no" defaultChecked /> No damage
        </label>
        <label>
          <input type="radio" name="damage" value="yes" /> Damaged: inspect again before its next run
        </label>
      </fieldset>
      {correcting && (
        <TextField
          id={`${idp}correctionReason`}
          name="correctionReason"
          label="Why the record is corrected"
          error={fe.correctionReason}
        />
      )}
      {!correcting && (
        <div>
          <label htmlFor="photo" className="field-label">
            Photos
          </label>
          <input
            id="photo"
            name="photo"
            type="file"
            accept="image/jpeg,image/png,image/webp"
            multiple
            className="field-input"
          />
        </div>
      )}
      <FormMessage state={state} />
      <button type="submit" className="btn-primary text-lg" disabled={isPending}>
        {isPending ? 'Saving…' : correcting ? 'Record the correction' : 'Record the incident'}
      </button>
    </form>
  );
}
