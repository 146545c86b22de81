'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { openCheckout } from '@/components/forms/checkout';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { formatMoney } from '@/lib/core/inputs/entries';
import { REQUESTED_CHECKS } from '@/lib/core/protests/protest-states';
import type { ProtestableEvent } from '@/lib/server/protests/list-protestable-entries';
import type { ProtestDetail } from '@/lib/server/protests/get-protest';
import { DeadlineCountdown } from './deadline-countdown';

type LodgeState = FormState & { isPaying?: boolean };

/** Lodge a protest against another entry of a meeting with published results, then pay the fee on the provider's page. */
export function LodgeProtestForm({ events }: { events: ProtestableEvent[] }) {
  const router = useRouter();
  const [eventId, setEventId] = useState(events[0]?.eventId ?? '');
  const [entryId, setEntryId] = useState('');
  const event = events.find((e) => e.eventId === eventId);
  const entry = event?.entries.find((e) => e.entryId === entryId);

  const { state, isPending, form } = useFormAction(
    async (_prev: LodgeState, data: FormData): Promise<LodgeState> => {
      const body = {
        againstEntryId: entryId || undefined,
        ruleReference: String(data.get('ruleReference') ?? ''),
        grounds: String(data.get('grounds') ?? ''),
        requestedChecks: data.getAll('requestedChecks').map(String),
      };
      const answer = await requestJson<ProtestDetail>(`/api/events/${eventId}/protests`, { body });
      if (!answer.ok) return refusalState(answer);
      const protest = answer.data;
      if (protest.status !== 'awaiting_fee') {
        router.push(`/protests/${protest.id}`);
        return { ok: true };
      }
      const paying = await openCheckout(`/api/protests/${protest.id}/checkout`, 'try again from the protest page.');
      if (paying.ok) return { ok: true, isPaying: true };
      router.push(`/protests/${protest.id}`);
      return { ok: false, message: `Your protest is saved, but the payment page did not open: ${paying.message}` };
    },
    { ok: false },
  );
  const fieldErrors = state.fieldErrors ?? {};

  const err = (f: string) => fieldErrors[f];
  const describedBy = (f: string) => (err(f) ? `${f}-error` : undefined);
  return (
    <form {...form} className="card space-y-4" aria-label="Lodge a protest">
      <h2>Lodge a protest</h2>
      <fieldset disabled={isPending || state.isPaying} className="space-y-4">
        <div>
          <label htmlFor="protest-event" className="field-label">
            Meeting
          </label>
          <select
            id="protest-event"
            className="field-input"
            value={eventId}
            onChange={(e) => {
              setEventId(e.target.value);
              setEntryId('');
            }}
          >
            {events.map((ev) => (
              <option key={ev.eventId} value={ev.eventId}>
                {ev.eventName}
              </option>
            ))}
          </select>
          {event && (
            <p className="field-hint">
              Fee: {event.feeMinor > 0 ? formatMoney(event.feeMinor, event.currency) : 'none'} — refunded if the protest
              is upheld, kept if it is dismissed. Window: {event.windowMinutes} minutes after the results that concern
              the boat.
            </p>
          )}
        </div>
        <div>
          <label htmlFor="protest-entry" className="field-label">
            Boat protested
          </label>
          <select
            id="protest-entry"
            name="againstEntryId"
            className="field-input"
            value={entryId}
            onChange={(e) => setEntryId(e.target.value)}
            aria-invalid={err('againstEntryId') ? true : undefined}
            aria-describedby={describedBy('againstEntryId')}
          >
            <option value="">Choose a boat…</option>
            {event?.entries.map((en) => (
              <option key={en.entryId} value={en.entryId}>
                #{en.raceNumber} {en.boatName} ({en.classCode})
              </option>
            ))}
          </select>
          <FieldError name="againstEntryId" error={err('againstEntryId')} />
        </div>
        {entry && (
          <DeadlineCountdown key={entry.entryId} deadline={entry.window.deadline} label={entry.window.deadlineLabel} />
        )}
        <div>
          <label htmlFor="protest-rule" className="field-label">
            Rule
          </label>
          <input
            id="protest-rule"
            name="ruleReference"
            className="field-input"
            placeholder="e.g. SS rules v1, nozzle exit diameter maximum"
            aria-invalid={err('ruleReference') ? true : undefined}
            aria-describedby={describedBy('ruleReference')}
          />
          <FieldError name="ruleReference" error={err('ruleReference')} />
        </div>
        <div>
          <label htmlFor="protest-grounds" className="field-label">
            Grounds
          </label>
          <textarea
            id="protest-grounds"
            name="grounds"
            rows={5}
            className="field-input"
            aria-invalid={err('grounds') ? true : undefined}
            aria-describedby={describedBy('grounds')}
          />
          <p className="field-hint">What you saw or measured, when and where, and why it breaks the rule.</p>
          <FieldError name="grounds" error={err('grounds')} />
        </div>
        <fieldset>
          <legend className="field-label">What to check</legend>
          <div className="grid gap-2 sm:grid-cols-2">
            {Object.entries(REQUESTED_CHECKS).map(([k, label]) => (
              <label
                key={k}
                className="flex min-h-touch cursor-pointer items-center gap-3 rounded-lg border-2 border-paper-line bg-white px-3"
                data-testid="requested-check"
              >
                <input type="checkbox" name="requestedChecks" value={k} className="h-7 w-7 shrink-0 accent-tide-600" />
                {label}
              </label>
            ))}
          </div>
        </fieldset>
        <FormMessage state={state} />
        <button type="submit" className="btn-primary" disabled={!entry || !entry.window.isOpen}>
          {state.isPaying
            ? 'Opening the payment page…'
            : event && event.feeMinor > 0
              ? 'Lodge and pay the fee'
              : 'Lodge the protest'}
        </button>
      </fieldset>
    </form>
  );
}
