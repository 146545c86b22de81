'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { TextField } from '@/components/ui/text-field';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { numberOrNull } from '@/lib/core/inputs/form-values';

/** Add a calibration certificate with its file (PDF or a photo of it). Certificates are never edited: a newer one follows. */
export function AddCertificateForm({
  eventId,
  instrumentId,
  name,
}: {
  eventId: string;
  instrumentId: string;
  name: string;
}) {
  const router = useRouter();
  const [isOpen, setOpen] = useState(false);
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, f: FormData): Promise<FormState> => {
      const answer = await requestJson(`/api/events/${eventId}/instruments/${instrumentId}/certificates`, { body: f });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true, message: 'Certificate added.' };
    },
    { ok: false },
    { resetOnSuccess: true },
  );
  const fe = state.fieldErrors ?? {};
  const p = `cert-${instrumentId}`;
  if (!isOpen)
    return (
      <button type="button" className="btn-secondary min-h-touch text-base" onClick={() => setOpen(true)}>
        Add a certificate…
      </button>
    );
  return (
    <form
      {...form}
      className="space-y-3 rounded-lg border-2 border-paper-line p-3"
      aria-label={`Certificate of ${name}`}
    >
      <fieldset disabled={isPending} className="space-y-3">
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField id={`${p}-number`} name="number" label="Certificate number" error={fe.number} autoComplete="off" />
          <TextField id={`${p}-lab`} name="laboratory" label="Laboratory" error={fe.laboratory} autoComplete="off" />
          <TextField id={`${p}-on`} name="calibratedOn" type="date" label="Calibrated on" error={fe.calibratedOn} />
          <TextField id={`${p}-due`} name="dueOn" type="date" label="Due on" error={fe.dueOn} />
          <TextField
            id={`${p}-u`}
            name="expandedUncertainty"
            label="Stated expanded uncertainty U (mm or kg)"
            inputMode="decimal"
            autoComplete="off"
            error={fe.expandedUncertainty}
          />
          <TextField
            id={`${p}-k`}
            name="coverageFactor"
            label="Coverage factor k"
            inputMode="decimal"
            defaultValue="2"
            autoComplete="off"
            error={fe.coverageFactor}
          />
        </div>
        <div>
          <label htmlFor={`${p}-file`} className="field-label">
            The certificate (PDF or a photo, up to 8 MB)
          </label>
          <input id={`${p}-file`} name="file" type="file" accept="application/pdf,image/*" className="field-input" />
          <FieldError name="file" error={fe.file} />
        </div>
        <FormMessage state={state} />
        <div className="flex flex-wrap gap-2">
          <button type="submit" className="btn-primary min-h-touch text-base">
            {isPending ? 'Adding…' : 'Add the certificate'}
          </button>
          <button type="button" className="btn-secondary min-h-touch text-base" onClick={() => setOpen(false)}>
            Close
          </button>
        </div>
      </fieldset>
    </form>
  );
}

/** Record today's check against a reference: a failed check takes the instrument out of use for the day. */
export function RecordCheckForm({
  eventId,
  instrumentId,
  name,
  errorLimit,
  unit,
}: {
  eventId: string;
  instrumentId: string;
  name: string;
  /** The instrument's error limit: with one, the server decides the result from the figures. */
  errorLimit: number | null;
  unit: string;
}) {
  const router = useRouter();
  const [isOpen, setOpen] = useState(false);
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, f: FormData): Promise<FormState> => {
      const result = f.get('passed');
      const answer = await requestJson<{ passed: boolean }>(
        `/api/events/${eventId}/instruments/${instrumentId}/checks`,
        {
          body: {
            reference: f.get('reference'),
            nominalValue: numberOrNull(f.get('nominalValue')),
            reading: numberOrNull(f.get('reading')),
            passed: result === 'yes' ? true : result === 'no' ? false : undefined,
          },
        },
      );
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return {
        ok: true,
        message: answer.data.passed ? 'Check recorded: passed.' : 'Check recorded: failed, out of use today.',
      };
    },
    { ok: false },
    { resetOnSuccess: true },
  );
  const fe = state.fieldErrors ?? {};
  const p = `check-${instrumentId}`;
  if (!isOpen)
    return (
      <button type="button" className="btn-secondary min-h-touch text-base" onClick={() => setOpen(true)}>
        Record today’s check…
      </button>
    );
  return (
    <form
      {...form}
      className="space-y-3 rounded-lg border-2 border-paper-line p-3"
      aria-label={`Today’s check of ${name}`}
    >
      <fieldset disabled={isPending} className="space-y-3">
        <TextField
          id={`${p}-ref`}
          name="reference"
          label="Reference used"
          hint="The gauge block or check weight, with its identity: “gauge block 100 mm, set B”."
          error={fe.reference}
          autoComplete="off"
        />
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField
            id={`${p}-nominal`}
            name="nominalValue"
            label="Its nominal value"
            inputMode="decimal"
            error={fe.nominalValue}
            autoComplete="off"
          />
          <TextField
            id={`${p}-reading`}
            name="reading"
            label="Instrument reading"
            inputMode="decimal"
            error={fe.reading}
            autoComplete="off"
          />
        </div>
        <div>
          <label htmlFor={`${p}-passed`} className="field-label">
            Result
          </label>
          <select
            id={`${p}-passed`}
            name="passed"
            className="field-input min-h-touch"
            defaultValue={errorLimit == null ? 'yes' : 'decide'}
            aria-describedby={errorLimit == null ? undefined : `${p}-passed-hint`}
          >
            {errorLimit != null && (
              <option value="decide">
                From the figures (error limit ±{errorLimit} {unit})
              </option>
            )}
            <option value="yes">Passed: within its limits</option>
            <option value="no">Failed: take it out of use today</option>
          </select>
          {errorLimit != null && (
            <p id={`${p}-passed-hint`} className="field-hint">
              Boreline decides from the reading and the nominal value: within ±{errorLimit} {unit} passes. “Passed”
              chosen here when the figures fail is refused; a failure can always be recorded.
            </p>
          )}
          <FieldError name="passed" error={fe.passed} />
        </div>
        <FormMessage state={state} />
        <div className="flex flex-wrap gap-2">
          <button type="submit" className="btn-primary min-h-touch text-base">
            {isPending ? 'Recording…' : 'Record the check'}
          </button>
          <button type="button" className="btn-secondary min-h-touch text-base" onClick={() => setOpen(false)}>
            Close
          </button>
        </div>
      </fieldset>
    </form>
  );
}
