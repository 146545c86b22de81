'use client';

import { useMemo, useState } from 'react';
import { format, parseISO } from 'date-fns';
import {
  checkDeclaration,
  formatFigure,
  DECLARATION_STATUS_WORDS,
  type DeclarationStatus,
} from '@/lib/core/entries/check-declaration';
import { SubmitEntryInput, formatMoney } from '@/lib/core/inputs/entries';
import { fieldErrors } from '@/lib/core/errors';
import { SafetyNote } from '@/components/safety-note';
import { TextField } from '@/components/ui/text-field';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { CHECK_FIELDS_MESSAGE, refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { numberOrNull } from '@/lib/core/inputs/form-values';
import type { BoatView } from '@/lib/server/boats/boat-view';
import type { OpenEvent } from '@/lib/server/entries/list-open-events';
import type { MyEntry } from '@/lib/server/entries/list-my-entries';
import { PayButton } from '@/components/forms/pay-button';

// Colour is never alone: each row also carries a mark and the word (tailwind.config.ts verdict colours).
const STATUS_STYLE: Record<DeclarationStatus, { box: string; mark: string }> = {
  within: { box: 'border-pass-600 bg-pass-100 text-pass-800', mark: '✓' },
  too_close: { box: 'border-doubt-600 bg-doubt-100 text-doubt-800', mark: '?' },
  outside: { box: 'border-fail-600 bg-fail-100 text-fail-800', mark: '✗' },
};

type Submitted = { entry: MyEntry; gotRequestedNumber: boolean; raceNumberNote: string };
type EnterState = FormState & { done?: Submitted };

export function EnterForm({
  boat,
  events,
  entered,
}: {
  boat: BoatView;
  events: OpenEvent[];
  /** The boat's live entries at meetings not yet over. */
  entered: { eventId: string; classId: string; classCode: string; raceNumber: number }[];
}) {
  const [eventId, setEventId] = useState(events[0].id);
  const event = events.find((e) => e.id === eventId) ?? events[0];
  const [classId, setClassId] = useState(event.classes[0]?.id ?? '');
  const raceClass = event.classes.find((c) => c.id === classId);
  const check = useMemo(() => (raceClass ? checkDeclaration(boat, raceClass.rules) : null), [boat, raceClass]);
  const { state, isPending, form } = useFormAction(
    async (_prev: EnterState, data: FormData): Promise<EnterState> => {
      const requested = numberOrNull(data.get('requestedRaceNumber'));
      const body = {
        boatId: boat.id,
        eventId: event.id,
        classId,
        requestedRaceNumber: requested === null || Number.isNaN(requested) ? null : requested,
      };
      const parsed = SubmitEntryInput.safeParse(body);
      if (!parsed.success) return { ok: false, fieldErrors: fieldErrors(parsed.error), message: CHECK_FIELDS_MESSAGE };
      const answer = await requestJson<Submitted>('/api/entries', {
        body: parsed.data,
        fallbackMessage: 'The entry could not be made. Try again.',
      });
      if (!answer.ok) return refusalState(answer);
      const { entry, gotRequestedNumber, raceNumberNote } = answer.data;
      return { ok: true, done: { entry, gotRequestedNumber, raceNumberNote } };
    },
    { ok: false },
  );
  // The general message was about the meeting it was sent for: choosing another meeting hides it.
  const [dismissed, setDismissed] = useState<EnterState | null>(null);
  const errors = state.fieldErrors ?? {};
  const done = state.done;
  const enteredHere = entered.filter((e) => e.eventId === event.id);
  // Refused before sending: the same class twice, or a second class where the meeting takes one per boat.
  const isAlreadyEntered =
    enteredHere.some((e) => e.classId === classId) || (enteredHere.length > 0 && !event.severalClassesPerBoat);
  const keptNumber = enteredHere[0]?.raceNumber ?? null;

  function chooseEvent(id: string) {
    setEventId(id);
    setClassId(events.find((e) => e.id === id)?.classes[0]?.id ?? '');
    setDismissed(state);
  }

  if (done) {
    const { entry } = done;
    return (
      <section className="card space-y-3" aria-labelledby="entry-made" data-testid="entry-made">
        <h2 id="entry-made" className="text-xl">
          Entry made: race number <span className="figure">{entry.raceNumber}</span>
        </h2>
        <p
          data-testid="race-number-note"
          data-got-requested={done.gotRequestedNumber}
          className={done.gotRequestedNumber ? '' : 'rounded-lg bg-doubt-100 p-3 font-bold text-doubt-800'}
        >
          {done.raceNumberNote}
        </p>
        <p>
          {entry.boatName} in {entry.classCode} {entry.className} at {entry.eventName}.{' '}
          {entry.feeMinor > 0 ? (
            <>
              The entry fee is <strong>{formatMoney(entry.feeMinor, entry.currency)}</strong>; the entry counts once it
              is paid.
            </>
          ) : (
            'This meeting charges no entry fee.'
          )}
        </p>
        <PayButton
          checkoutUrl={`/api/entries/${entry.id}/checkout`}
          label={entry.feeMinor > 0 ? 'Pay entry fee' : 'Confirm the entry'}
        />
        <p className="text-sm text-ink-mute">
          You can also pay later from <a href="/entries">My entries</a>.
        </p>
      </section>
    );
  }

  return (
    <form {...form} className="space-y-5" aria-label="Enter a meeting">
      <fieldset disabled={isPending} className="card space-y-4">
        <div>
          <label htmlFor="eventId" className="field-label">
            Meeting
          </label>
          <select
            id="eventId"
            name="eventId"
            value={event.id}
            onChange={(e) => chooseEvent(e.target.value)}
            className="field-input"
          >
            {events.map((ev) => (
              <option key={ev.id} value={ev.id}>
                {ev.name} · {format(parseISO(ev.startsOn), 'd MMM yyyy')}
              </option>
            ))}
          </select>
          <p className="field-hint">
            {event.venue} · entry fee{' '}
            {event.entryFeeMinor > 0 ? formatMoney(event.entryFeeMinor, event.currency) : 'none'}
          </p>
          <FieldError name="eventId" error={errors.eventId} />
        </div>
        {event.classes.length === 0 ? (
          <p className="field-error">This meeting has no class with published rules yet.</p>
        ) : (
          <div>
            <label htmlFor="classId" className="field-label">
              Class
            </label>
            <select
              id="classId"
              name="classId"
              value={classId}
              onChange={(e) => setClassId(e.target.value)}
              className="field-input"
            >
              {event.classes.map((c) => (
                <option key={c.id} value={c.id}>
                  {c.code} · {c.name}
                </option>
              ))}
            </select>
            {raceClass && (
              <p className="field-hint">
                Rules version {raceClass.rulesVersion}
                {raceClass.description ? ` · ${raceClass.description}` : ''}
              </p>
            )}
            <FieldError name="classId" error={errors.classId} />
          </div>
        )}
        {keptNumber == null && (
          <TextField
            name="requestedRaceNumber"
            label="Race number you would like"
            type="number"
            inputMode="numeric"
            min={1}
            max={9999}
            step={1}
            defaultValue={
              /^\d{1,4}$/.test(boat.hullNumber) && Number(boat.hullNumber) > 0 ? Number(boat.hullNumber) : undefined
            }
            hint="Optional. If it is taken at this meeting you get the next free number after it, and we say which."
            error={errors.requestedRaceNumber}
          />
        )}
      </fieldset>

      {check && (
        <section className="card space-y-3" aria-labelledby="declaration-check" data-testid="declaration-check">
          <h2 id="declaration-check" className="text-xl">
            Your declaration against the class rules
          </h2>
          <p className="text-ink-soft">
            A warning before you enter, not a verdict: scrutineers measure the boat at inspection and the officials
            decide. “Too close to call” means the figure is within its uncertainty of a limit.
          </p>
          {check.rows.length === 0 && <p>This class sets no limit on what you declared.</p>}
          <ul className="space-y-2">
            {check.rows.map((r) => (
              <li
                key={r.key}
                className={`rounded-lg border-l-8 p-3 ${STATUS_STYLE[r.status].box}`}
                data-status={r.status}
              >
                <p className="flex flex-wrap items-baseline justify-between gap-2">
                  <span className="font-bold">{r.label}</span>
                  <span className="font-bold uppercase tracking-wide">
                    <span aria-hidden="true">{STATUS_STYLE[r.status].mark} </span>
                    {DECLARATION_STATUS_WORDS[r.status]}
                  </span>
                </p>
                <p className="figure text-sm">
                  declared {formatFigure(r.declared, r.unit === 'mm' ? 2 : 0)} {r.unit} · limit{' '}
                  {formatFigure(r.limit, r.unit === 'mm' ? 2 : 0)} {r.unit} · U{' '}
                  {formatFigure(r.uncertainty, r.unit === 'mm' ? 2 : 0)} {r.unit}
                </p>
                <p className="mt-1">{r.explanation}</p>
              </li>
            ))}
          </ul>
          {check.notes.map((n) => (
            <p key={n} className="text-ink-soft">
              {n}
            </p>
          ))}
          <SafetyNote />
        </section>
      )}

      <FormMessage state={dismissed === state ? null : state} testId="enter-message" />
      {keptNumber != null && !isAlreadyEntered && (
        <p data-testid="kept-number-note">
          {boat.name} is entered here in {enteredHere.map((e) => e.classCode).join(' and ')} already: this meeting
          allows several classes per boat, so it keeps race number <span className="figure">{keptNumber}</span> and is
          inspected under each class&rsquo;s rules.
        </p>
      )}
      {isAlreadyEntered ? (
        <p className="font-bold">
          {enteredHere.some((e) => e.classId === classId)
            ? `${boat.name} is already entered in this class here`
            : `${boat.name} is already entered at this meeting, which takes one class per boat`}
          : see <a href="/entries">My entries</a>.
        </p>
      ) : (
        <button type="submit" className="btn-primary w-full sm:w-auto" disabled={isPending || !raceClass}>
          {isPending ? 'Entering…' : raceClass ? `Enter ${boat.name} in ${raceClass.code}` : 'Enter'}
        </button>
      )}
    </form>
  );
}
