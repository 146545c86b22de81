'use client';

import { useCallback, useEffect, useId, useState } from 'react';
import type { EntryCrewView } from '@/lib/server/crew/crew-data';
import {
  CREW_ROLE_LABELS,
  GEAR_CHECK_OUTCOME_LABELS,
  GEAR_CHECK_OUTCOMES,
  GEAR_DATE_KIND_LABELS,
  type GearCheckOutcome,
} from '@/lib/core/crew/crew-terms';
import { formatCalendarDate } from '@/lib/core/format/time';
import { SafetyNote } from '@/components/safety-note';
import { FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { CrewFindings } from './crew-findings';

const DOCK_WORDS = {
  confirmed: '✓ seen today',
  not_presented: '✕ not presented today',
  not_as_declared: '✕ not as declared today',
  unchecked: 'not checked today',
  changed_since_check: 'changed since today’s check',
} as const;

/**
 * At the dock, beside the boat card: the people and dated gear of the boat with what is not in order,
 * and the scrutineer's confirmation of each item for today. Its own request, apart from the inspection
 * record; it needs a signal (the record form keeps working offline without it).
 */
export function GearDockPanel({
  eventId,
  entryId,
  canRecord,
}: {
  eventId: string;
  entryId: string;
  canRecord: boolean;
}) {
  const uid = useId();
  const [view, setView] = useState<EntryCrewView | null>(null);
  const [loadError, setLoadError] = useState<string | null>(null);
  const [picked, setPicked] = useState<Record<string, GearCheckOutcome>>({});
  const [signOnError, setSignOnError] = useState<string | null>(null);
  // Each person signs on once a meeting day; the server refuses one whose licence, medical or consent is not in order.
  const signOn = async (crewMemberId: string) => {
    const answer = await requestJson<EntryCrewView>(`/api/events/${eventId}/crew-sign-ons`, {
      method: 'POST',
      body: { entryId, crewMemberIds: [crewMemberId] },
    });
    if (answer.ok) {
      setView(answer.data);
      setSignOnError(null);
    } else setSignOnError(answer.message);
  };
  const load = useCallback(async () => {
    const answer = await requestJson<EntryCrewView>(
      `/api/events/${eventId}/gear-checks?entryId=${encodeURIComponent(entryId)}`,
      { method: 'GET', cache: 'no-store' },
    );
    if (answer.ok) {
      setView(answer.data);
      setLoadError(null);
    } else setLoadError(answer.message);
  }, [eventId, entryId]);
  useEffect(() => {
    // A new boat remounts the panel (keyed by its entry at the dock); loaded after the first paint.
    const first = window.setTimeout(() => void load(), 0);
    return () => window.clearTimeout(first);
  }, [load]);
  const { state, isPending, form } = useFormAction<FormState | null>(async () => {
    const items = Object.entries(picked).map(([gearItemId, outcome]) => ({ gearItemId, outcome }));
    if (items.length === 0) return { ok: false, message: 'Choose what you saw of at least one item.' };
    const answer = await requestJson<EntryCrewView>(`/api/events/${eventId}/gear-checks`, {
      method: 'POST',
      body: { entryId, items },
    });
    if (!answer.ok) return refusalState(answer);
    setView(answer.data);
    setPicked({});
    return { ok: true, message: `Gear check recorded for ${formatCalendarDate(answer.data.assessment.day)}.` };
  }, null);

  if (loadError)
    return (
      <p className="rounded-lg bg-doubt-100 p-3 text-doubt-800" data-testid="gear-dock-error">
        Crew and gear: {loadError}
      </p>
    );
  if (!view) return <p data-testid="gear-dock-loading">Loading the crew and gear…</p>;
  const { assessment } = view;
  return (
    <section className="card space-y-3 text-lg" aria-labelledby={`${uid}-h`} data-testid="gear-dock">
      <h2 id={`${uid}-h`} className="text-xl">
        Crew and dated gear
      </h2>
      <CrewFindings findings={assessment.findings} day={assessment.day} testId="gear-dock-findings" />
      {view.members.length > 0 && (
        <ul className="space-y-1">
          {view.members.map((m) => (
            <li key={m.id} data-testid="crew-sign-on" data-member-id={m.id}>
              {CREW_ROLE_LABELS[m.role]} {m.name}
              {m.licence ? ` · ${m.licence.grade} ${m.licence.number}` : ' · no licence'} ·{' '}
              {assessment.signedOn.includes(m.id) ? (
                <strong className="text-pass-800">✓ signed on today</strong>
              ) : canRecord ? (
                <button type="button" className="btn-secondary" onClick={() => void signOn(m.id)}>
                  Sign {m.name} on for today
                </button>
              ) : (
                'not signed on today'
              )}
            </li>
          ))}
        </ul>
      )}
      {signOnError && (
        <p role="alert" className="field-error" data-testid="sign-on-error">
          {signOnError}
        </p>
      )}
      {assessment.gear.length > 0 && (
        <form {...form} className="space-y-2" data-testid="gear-check-form">
          {assessment.gear.map((g) => (
            <fieldset
              key={g.id}
              className="rounded border border-paper-deep p-2"
              data-testid="gear-check-item"
              data-serial={g.serial}
            >
              <legend className="px-1 font-bold">
                {g.wornBy ?? 'Boat'}: {g.label} {g.serial}
              </legend>
              <p>
                {g.standard} · {GEAR_DATE_KIND_LABELS[g.dateKind].toLowerCase()} {formatCalendarDate(g.dueOn)}
                {!g.isValidOnDay && <strong className="text-fail-800"> · expired</strong>} ·{' '}
                <span data-testid="gear-dock-state">{DOCK_WORDS[g.dock]}</span>
              </p>
              {canRecord && (
                <div className="flex flex-wrap gap-3">
                  {GEAR_CHECK_OUTCOMES.map((o) => (
                    <label key={o} className="flex items-center gap-1">
                      <input
                        type="radio"
                        name={`${uid}-${g.id}`}
                        value={o}
                        checked={picked[g.id] === o}
                        onChange={() => setPicked({ ...picked, [g.id]: o })}
                      />
                      {GEAR_CHECK_OUTCOME_LABELS[o]}
                    </label>
                  ))}
                </div>
              )}
            </fieldset>
          ))}
          {canRecord && (
            <>
              <FormMessage state={state} testId="gear-check-message" />
              <button type="submit" className="btn-primary text-lg" disabled={isPending}>
                {isPending ? 'Recording…' : 'Record the gear check'}
              </button>
            </>
          )}
        </form>
      )}
      <p className="text-base text-ink-soft" data-testid="gear-dock-caution">
        Expired or missing items are findings for the officials: the local rulebook and licensed officials decide
        whether the boat goes on the water.
      </p>
      {/* One caution per screen: the record form (or the verdict) carries it; without the form, this panel does. */}
      {!canRecord && <SafetyNote />}
    </section>
  );
}
