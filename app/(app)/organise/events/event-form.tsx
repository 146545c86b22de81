'use client';

import { useRouter } from 'next/navigation';
import { EventInput } from '@/lib/core/inputs/events';
import { fieldErrors as toFieldErrors } from '@/lib/core/errors';
import { CURRENCIES, EVENT_STATUSES } from '@/lib/core/constants';
import { TextField } from '@/components/ui/text-field';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { CHECK_FIELDS_MESSAGE, refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { numberOrNull } from '@/lib/core/inputs/form-values';
import type { EventDto } from '@/lib/server/events/event-dto';

const STATUS_LABEL: Record<string, string> = {
  draft: 'Draft (not visible to entrants)',
  entries_open: 'Entries open',
  entries_closed: 'Entries closed',
  racing: 'Racing',
  finished: 'Finished',
};
const TIME_ZONES = typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : ['UTC'];

type Props = { event?: EventDto; organisations?: { id: string; name: string }[] };

/** Create or edit a meeting. Fees are typed in currency units and sent in cents. */
export function EventForm({ event, organisations = [] }: Props) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, f: FormData): Promise<FormState> => {
      const fee = (name: string) => {
        const v = numberOrNull(f.get(name));
        return v === null ? NaN : Math.round(v * 100);
      };
      const body = {
        ...(event ? {} : { organisationId: f.get('organisationId') }),
        name: f.get('name'),
        venue: f.get('venue'),
        startsOn: f.get('startsOn'),
        endsOn: f.get('endsOn'),
        timeZone: f.get('timeZone'),
        status: f.get('status'),
        waterKind: f.get('waterKind'),
        waterTemperatureC: numberOrNull(f.get('waterTemperatureC')) ?? NaN,
        waterDensityKgM3: numberOrNull(f.get('waterDensityKgM3')),
        protestWindowMinutes: numberOrNull(f.get('protestWindowMinutes')) ?? NaN,
        appealNoticeMinutes: numberOrNull(f.get('appealNoticeMinutes')) ?? NaN,
        currency: f.get('currency'),
        entryFeeMinor: fee('entryFee'),
        protestFeeMinor: fee('protestFee'),
        severalClassesPerBoat: f.get('severalClassesPerBoat') === 'on',
        appealFeeMinor: fee('appealFee'),
      };
      const local = EventInput.safeParse(body);
      if (!local.success) return { ok: false, fieldErrors: toFieldErrors(local.error), message: CHECK_FIELDS_MESSAGE };
      const answer = await requestJson<EventDto>(event ? `/api/events/${event.id}` : '/api/events', {
        method: event ? 'PATCH' : 'POST',
        body,
      });
      if (!answer.ok) return refusalState(answer);
      if (!event) {
        router.push(`/organise/events/${answer.data.id}`);
        return { ok: true };
      }
      router.refresh();
      return { ok: true, message: 'Meeting saved.' };
    },
    { ok: false },
  );
  const fieldErrors = state.fieldErrors ?? {};

  const err = (k: string) => fieldErrors[k];
  return (
    <form {...form}>
      <fieldset disabled={isPending} className="grid gap-4 sm:grid-cols-2">
        {!event && (
          <div className="sm:col-span-2">
            <label htmlFor="organisationId" className="field-label">
              Organising club
            </label>
            <select id="organisationId" name="organisationId" className="field-input">
              {organisations.map((o) => (
                <option key={o.id} value={o.id}>
                  {o.name}
                </option>
              ))}
            </select>
          </div>
        )}
        <TextField
          name="name"
          label="Meeting name"
          defaultValue={event?.name}
          error={err('name')}
          className="sm:col-span-2"
        />
        <TextField
          name="venue"
          label="Venue"
          defaultValue={event?.venue}
          error={err('venue')}
          className="sm:col-span-2"
        />
        <TextField
          name="startsOn"
          label="First day"
          type="date"
          defaultValue={event?.startsOn}
          error={err('startsOn')}
        />
        <TextField name="endsOn" label="Last day" type="date" defaultValue={event?.endsOn} error={err('endsOn')} />
        <div>
          <label htmlFor="timeZone" className="field-label">
            Time zone
          </label>
          <select
            id="timeZone"
            name="timeZone"
            className="field-input"
            defaultValue={event?.timeZone ?? 'Pacific/Auckland'}
          >
            {TIME_ZONES.map((tz) => (
              <option key={tz} value={tz}>
                {tz}
              </option>
            ))}
          </select>
          <FieldError name="timeZone" error={err('timeZone')} />
        </div>
        <div>
          <label htmlFor="status" className="field-label">
            Status
          </label>
          <select id="status" name="status" className="field-input" defaultValue={event?.status ?? 'draft'}>
            {EVENT_STATUSES.map((s) => (
              <option key={s} value={s}>
                {STATUS_LABEL[s]}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="waterKind" className="field-label">
            Water
          </label>
          <select id="waterKind" name="waterKind" className="field-input" defaultValue={event?.waterKind ?? 'fresh'}>
            <option value="fresh">Fresh water</option>
            <option value="sea">Sea water</option>
          </select>
        </div>
        <TextField
          name="waterTemperatureC"
          label="Expected water temperature"
          unit="°C"
          inputMode="decimal"
          defaultValue={event?.waterTemperatureC ?? 15}
          error={err('waterTemperatureC')}
        />
        <TextField
          name="waterDensityKgM3"
          label="Water density override"
          unit="kg/m³"
          inputMode="decimal"
          hint="Leave empty to use the published table for the water and temperature."
          defaultValue={event?.waterDensityKgM3 ?? ''}
          error={err('waterDensityKgM3')}
        />
        <TextField
          name="protestWindowMinutes"
          label="Protest window after provisional results"
          unit="minutes"
          inputMode="numeric"
          defaultValue={event?.protestWindowMinutes ?? 30}
          error={err('protestWindowMinutes')}
        />
        <TextField
          name="appealNoticeMinutes"
          label="Notice of appeal after a stewards' decision"
          unit="minutes"
          inputMode="numeric"
          hint="As the governing body's rules set it."
          defaultValue={event?.appealNoticeMinutes ?? 60}
          error={err('appealNoticeMinutes')}
        />
        <div>
          <label htmlFor="currency" className="field-label">
            Currency
          </label>
          <select id="currency" name="currency" className="field-input" defaultValue={event?.currency ?? 'NZD'}>
            {CURRENCIES.map((c) => (
              <option key={c} value={c}>
                {c}
              </option>
            ))}
          </select>
        </div>
        <TextField
          name="entryFee"
          label="Entry fee"
          unit={event?.currency ?? 'currency units'}
          inputMode="decimal"
          defaultValue={event ? (event.entryFeeMinor / 100).toFixed(2) : '0.00'}
          error={err('entryFeeMinor')}
        />
        <TextField
          name="protestFee"
          label="Protest fee"
          unit={event?.currency ?? 'currency units'}
          inputMode="decimal"
          defaultValue={event ? (event.protestFeeMinor / 100).toFixed(2) : '0.00'}
          error={err('protestFeeMinor')}
        />
        <div className="sm:col-span-2">
          <label className="flex min-h-touch items-start gap-3">
            <input
              type="checkbox"
              name="severalClassesPerBoat"
              defaultChecked={event?.severalClassesPerBoat ?? false}
              aria-describedby="severalClassesPerBoat-hint"
              className="mt-1 h-6 w-6 shrink-0"
            />
            <span>
              A boat may enter several classes
              <span id="severalClassesPerBoat-hint" className="block text-sm text-ink-soft">
                It keeps one race number here and is inspected under each class&rsquo;s rules. Off: one class per boat.
              </span>
            </span>
          </label>
          <FieldError name="severalClassesPerBoat" error={err('severalClassesPerBoat')} />
        </div>
        <TextField
          name="appealFee"
          label="Appeal fee"
          unit={event?.currency ?? 'currency units'}
          inputMode="decimal"
          hint="Paid with a notice of appeal to the governing body's appeal body; its rules set the amount."
          defaultValue={event ? ((event.appealFeeMinor ?? 0) / 100).toFixed(2) : '0.00'}
          error={err('appealFeeMinor')}
        />
        <div className="sm:col-span-2 space-y-2">
          <FormMessage state={state} />
          <button type="submit" className="btn-primary">
            {isPending ? 'Saving…' : event ? 'Save meeting' : 'Create meeting'}
          </button>
        </div>
      </fieldset>
    </form>
  );
}
