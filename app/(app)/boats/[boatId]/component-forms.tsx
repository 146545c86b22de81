'use client';

import { useRouter } from 'next/navigation';
import { COMPONENT_KIND_LABELS, EditComponentInput, RegisterComponentInput } from '@/lib/core/inputs/components';
import { fieldErrors } from '@/lib/core/errors';
import { TextField } from '@/components/ui/text-field';
import { FieldError, FormMessage } from '@/components/forms/form-message';
import { CHECK_FIELDS_MESSAGE, refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

// The boat page's component forms: register one fitted to this boat, edit one, move it or take it
// off. Each checks with the shared schema first (errors beside their fields, nothing lost), then
// sends through requestJson; the server's refusal (a serial already registered, a component that has
// moved since the page loaded) shows the same way.

const DECLARES =
  'Fitting, taking off or changing maker, model, serial or trim code makes a new version of the declaration; after an inspection the scrutineers will ask to inspect the boat again.';

const textOf = (data: FormData, names: string[]) =>
  Object.fromEntries(names.map((n) => [n, String(data.get(n) ?? '')]));

function NotesField({ id, defaultValue, error }: { id: string; defaultValue?: string; error?: string }) {
  return (
    <div className="sm:col-span-2">
      <label htmlFor={id} className="field-label">
        Notes
      </label>
      <textarea
        id={id}
        name="notes"
        rows={2}
        defaultValue={defaultValue}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        className="field-input"
      />
      <FieldError id={`${id}-error`} name="notes" error={error} />
    </div>
  );
}

/** Register an engine, pump or impeller fitted to this boat. */
export function RegisterComponentForm({ boatId }: { boatId: string }) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const body = textOf(data, ['kind', 'maker', 'model', 'serialNumber', 'trimCode', 'notes']);
      const parsed = RegisterComponentInput.safeParse(body);
      if (!parsed.success) return { ok: false, fieldErrors: fieldErrors(parsed.error), message: CHECK_FIELDS_MESSAGE };
      const answer = await requestJson<{ serialNumber: string }>(`/api/boats/${boatId}/components`, {
        body: parsed.data,
        fallbackMessage: 'The component could not be registered. Try again.',
      });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true, message: `Registered serial ${answer.data.serialNumber}; the declaration has a new version.` };
    },
    { ok: false },
    { resetOnSuccess: true },
  );
  const errors = state.fieldErrors ?? {};
  const id = (n: string) => `component-new-${n}`;
  return (
    <form {...form} aria-label="Register a component">
      <fieldset disabled={isPending} className="grid gap-3 sm:grid-cols-2">
        <div>
          <label htmlFor={id('kind')} className="field-label">
            Kind
          </label>
          <select
            id={id('kind')}
            name="kind"
            defaultValue="impeller"
            className="field-input"
            aria-invalid={errors.kind ? true : undefined}
            aria-describedby={errors.kind ? `${id('kind')}-error` : undefined}
          >
            {Object.entries(COMPONENT_KIND_LABELS).map(([v, label]) => (
              <option key={v} value={v}>
                {label}
              </option>
            ))}
          </select>
          <FieldError id={`${id('kind')}-error`} name="kind" error={errors.kind} />
        </div>
        <TextField
          id={id('serialNumber')}
          name="serialNumber"
          label="Serial number"
          autoComplete="off"
          autoCapitalize="characters"
          hint="As stamped on the part. It is the part's identity and cannot be changed later."
          error={errors.serialNumber}
        />
        <TextField id={id('maker')} name="maker" label="Maker" autoComplete="off" error={errors.maker} />
        <TextField id={id('model')} name="model" label="Model" autoComplete="off" error={errors.model} />
        <TextField
          id={id('trimCode')}
          name="trimCode"
          label="Trim code"
          autoComplete="off"
          hint="For an impeller: the trim or pitch code stamped on it."
          error={errors.trimCode}
        />
        <NotesField id={id('notes')} error={errors.notes} />
        <p className="text-sm text-ink-soft sm:col-span-2">{DECLARES}</p>
        <FormMessage state={state} testId="component-register-message" className="sm:col-span-2" />
        <button type="submit" className="btn-primary sm:col-span-2 sm:justify-self-start">
          {isPending ? 'Registering…' : 'Register the component'}
        </button>
      </fieldset>
    </form>
  );
}

export type EditableComponent = {
  id: string;
  kind: keyof typeof COMPONENT_KIND_LABELS;
  maker: string;
  model: string;
  serialNumber: string;
  trimCode: string;
  notes: string;
  boatId: string | null;
};

/** Edit maker, model, trim code and notes; kind and serial are shown, never editable. */
export function EditComponentForm({ component }: { component: EditableComponent }) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const body = textOf(data, ['maker', 'model', 'trimCode', 'notes']);
      const parsed = EditComponentInput.safeParse(body);
      if (!parsed.success) return { ok: false, fieldErrors: fieldErrors(parsed.error), message: CHECK_FIELDS_MESSAGE };
      const answer = await requestJson(`/api/components/${component.id}`, {
        method: 'PATCH',
        body: parsed.data,
        fallbackMessage: 'The component could not be saved. Try again.',
      });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true, message: 'Saved.' };
    },
    { ok: false },
  );
  const errors = state.fieldErrors ?? {};
  const id = (n: string) => `component-${component.id}-${n}`;
  return (
    <form {...form} aria-label={`Edit ${component.serialNumber}`} className="mt-3">
      <fieldset disabled={isPending} className="grid gap-3 sm:grid-cols-2">
        <TextField id={id('maker')} name="maker" label="Maker" defaultValue={component.maker} error={errors.maker} />
        <TextField id={id('model')} name="model" label="Model" defaultValue={component.model} error={errors.model} />
        <TextField
          id={id('trimCode')}
          name="trimCode"
          label="Trim code"
          defaultValue={component.trimCode}
          error={errors.trimCode}
        />
        <NotesField id={id('notes')} defaultValue={component.notes} error={errors.notes} />
        <FormMessage state={state} testId="component-edit-message" className="sm:col-span-2" />
        <button type="submit" className="btn-primary sm:col-span-2 sm:justify-self-start">
          {isPending ? 'Saving…' : 'Save'}
        </button>
      </fieldset>
    </form>
  );
}

/**
 * Move to another of the owner's boats or take off (a select), or fit to this boat (`fitTo`: a
 * single button for a component on no boat). Sends where the page saw it, so a move made meanwhile
 * in another tab is refused rather than repeated.
 */
export function MoveComponentForm({
  component,
  boats,
  fitTo,
}: {
  component: EditableComponent;
  boats: { id: string; name: string }[];
  fitTo?: { id: string; name: string };
}) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction(
    async (_prev: FormState, data: FormData): Promise<FormState> => {
      const target = fitTo ? fitTo.id : String(data.get('boatId') ?? '');
      if (!fitTo && target === '') return { ok: false, fieldErrors: { boatId: 'Choose where it goes.' } };
      const answer = await requestJson(`/api/components/${component.id}/move`, {
        body: { boatId: target === 'none' ? null : target, fromBoatId: component.boatId },
        fallbackMessage: 'The component could not be moved. Try again.',
      });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true, message: 'Moved; each boat’s declaration has a new version.' };
    },
    { ok: false },
  );
  const error = state.fieldErrors?.boatId;
  const selectId = `component-${component.id}-move`;
  if (fitTo)
    return (
      <form {...form} aria-label={`Fit ${component.serialNumber} to ${fitTo.name}`} className="space-y-2">
        <button type="submit" className="btn-secondary" disabled={isPending}>
          {isPending ? 'Fitting…' : `Fit to ${fitTo.name}`}
        </button>
        <FieldError name="boatId" error={error} />
        <FormMessage state={state} testId="component-move-message" />
      </form>
    );
  return (
    <form {...form} aria-label={`Move ${component.serialNumber}`} className="mt-3">
      <fieldset disabled={isPending} className="flex flex-wrap items-end gap-3">
        <div className="min-w-0 flex-1">
          <label htmlFor={selectId} className="field-label">
            Move to
          </label>
          <select
            id={selectId}
            name="boatId"
            defaultValue=""
            className="field-input"
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? `${selectId}-error` : undefined}
          >
            <option value="" disabled>
              Choose…
            </option>
            {boats.map((b) => (
              <option key={b.id} value={b.id}>
                {b.name}
              </option>
            ))}
            <option value="none">On no boat (take it off)</option>
          </select>
          <FieldError id={`${selectId}-error`} name="boatId" error={error} />
        </div>
        <button type="submit" className="btn-secondary">
          {isPending ? 'Moving…' : 'Move'}
        </button>
        <FormMessage state={state} testId="component-move-message" className="basis-full" />
      </fieldset>
    </form>
  );
}
