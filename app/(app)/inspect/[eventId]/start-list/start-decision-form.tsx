'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { requestJson } from '@/components/forms/request-json';

/** The organiser's decision on one boat's start that day: let it start or hold it, always with the reason. */
export function StartDecisionForm({
  eventId,
  day,
  entries,
}: {
  eventId: string;
  day: string;
  entries: { id: string; label: string }[];
}) {
  const router = useRouter();
  const [entryId, setEntryId] = useState(entries[0]?.id ?? '');
  const [mayStart, setMayStart] = useState('yes');
  const [reason, setReason] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [isSending, setSending] = useState(false);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setSending(true);
    const answer = await requestJson(`/api/events/${eventId}/start-list/decisions`, {
      method: 'POST',
      body: { entryId, day, mayStart: mayStart === 'yes', reason },
      fallbackMessage: (status) => `The decision was not recorded (${status}).`,
    });
    setSending(false);
    if (!answer.ok) {
      setErrors(answer.fieldErrors);
      return setMessage(answer.message);
    }
    setErrors({});
    setReason('');
    setMessage('Recorded. The list below shows it.');
    router.refresh();
  }

  return (
    <form
      onSubmit={(e) => void submit(e)}
      className="space-y-3 rounded-lg border border-paper-line p-3 print:hidden"
      noValidate
    >
      <h2 className="text-xl">Organiser’s decision for this day</h2>
      <p className="text-base text-ink-soft">
        Let a held boat start, or hold a boat the list lets start. The reason is kept with your name and the time.
      </p>
      <div>
        <label htmlFor="decision-entry" className="field-label">
          Boat
        </label>
        <select
          id="decision-entry"
          className="field-input min-h-touch"
          value={entryId}
          onChange={(e) => setEntryId(e.target.value)}
        >
          {entries.map((x) => (
            <option key={x.id} value={x.id}>
              {x.label}
            </option>
          ))}
        </select>
        {errors.entryId && <p className="field-error">{errors.entryId}</p>}
      </div>
      <fieldset>
        <legend className="field-label">Decision</legend>
        <label className="mr-4 inline-flex min-h-touch items-center gap-2">
          <input
            type="radio"
            name="mayStart"
            value="yes"
            checked={mayStart === 'yes'}
            onChange={() => setMayStart('yes')}
          />
          May start
        </label>
        <label className="inline-flex min-h-touch items-center gap-2">
          <input
            type="radio"
            name="mayStart"
            value="no"
            checked={mayStart === 'no'}
            onChange={() => setMayStart('no')}
          />
          Held
        </label>
      </fieldset>
      <div>
        <label htmlFor="decision-reason" className="field-label">
          Reason
        </label>
        <textarea
          id="decision-reason"
          className="field-input"
          rows={2}
          maxLength={500}
          value={reason}
          onChange={(e) => setReason(e.target.value)}
          aria-invalid={Boolean(errors.reason)}
          aria-describedby={errors.reason ? 'decision-reason-error' : undefined}
        />
        {errors.reason && (
          <p id="decision-reason-error" className="field-error">
            {errors.reason}
          </p>
        )}
      </div>
      <button type="submit" className="btn-primary" disabled={isSending}>
        {isSending ? 'Recording…' : 'Record the decision'}
      </button>
      {message && (
        <p role="status" className="text-base">
          {message}
        </p>
      )}
    </form>
  );
}
