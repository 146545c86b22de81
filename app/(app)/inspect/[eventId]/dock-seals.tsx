'use client';

import { SEAL_CHECK_STATES, SEAL_CHECK_WORDS } from '@/lib/core/inputs/seal-terms';
import { DockField } from './dock-field';
import type { DockTarget, FormSeals } from './form-model';

const check = 'h-7 w-7 shrink-0 accent-tide-600';
const id = (path: string) => `f-${path.replace(/\./g, '-')}`;

/**
 * The seals part of the dock form: every register seal on the boat's components to be checked
 * (intact, broken or missing) and perhaps removed with a reason, and new seals applied from this
 * meeting's batches to one of the boat's components.
 */
export function DockSeals({
  target,
  seals,
  onChange,
  err,
  photos,
  onPhoto,
}: {
  target: DockTarget;
  seals: FormSeals;
  onChange: (s: FormSeals) => void;
  err: (path: string) => string | undefined;
  /** Photos of the applied seals, by row. */
  photos: Record<number, File>;
  onPhoto: (row: number, file: File | null) => void;
}) {
  const onBoat = target.card?.seals ?? [];
  const components = target.card?.components ?? [];
  const checkIndex = (n: string) =>
    Object.entries(seals.checks)
      .filter(([, v]) => v !== '')
      .findIndex(([k]) => k === n);
  const removeIndex = (n: string) => Object.keys(seals.removed).indexOf(n);
  return (
    <fieldset id="dock-seals" className="scroll-mt-4 space-y-3" data-testid="dock-seals">
      <legend className="text-xl font-bold">Seals</legend>
      {!target.card ? (
        <p className="text-ink-soft">Offline without the boat’s card: its seals cannot be listed here.</p>
      ) : onBoat.length === 0 ? (
        <p className="text-ink-soft">No register seals on this boat’s components.</p>
      ) : (
        onBoat.map((s) => {
          const removing = s.number in seals.removed;
          const ci = checkIndex(s.number);
          const ri = removeIndex(s.number);
          return (
            <fieldset
              key={s.sealId}
              className="space-y-2 rounded-lg border-2 border-paper-line bg-white p-3"
              data-seal={s.number}
            >
              <legend className="px-1 font-bold">
                Seal {s.number} on the {s.component}
                {s.position ? ` (${s.position})` : ''}
              </legend>
              <div className="flex flex-wrap gap-4" role="radiogroup" aria-label={`Seal ${s.number} found`}>
                {SEAL_CHECK_STATES.map((state) => (
                  <label key={state} className="flex min-h-touch items-center gap-2">
                    <input
                      type="radio"
                      className={check}
                      name={`seal-check-${s.number}`}
                      checked={seals.checks[s.number] === state}
                      onChange={() => onChange({ ...seals, checks: { ...seals.checks, [s.number]: state } })}
                    />
                    {SEAL_CHECK_WORDS[state]}
                  </label>
                ))}
              </div>
              {ci >= 0 && err(`seals.checks.${ci}.number`) && (
                <p className="field-error text-lg">{err(`seals.checks.${ci}.number`)}</p>
              )}
              <label className="flex min-h-touch items-center gap-3">
                <input
                  type="checkbox"
                  className={check}
                  checked={removing}
                  onChange={(e) => {
                    const removed = { ...seals.removed };
                    if (e.target.checked) removed[s.number] = '';
                    else delete removed[s.number];
                    onChange({ ...seals, removed });
                  }}
                />
                Remove seal {s.number}
              </label>
              {removing && (
                <DockField
                  id={id(`seals.removed.${s.number}.reason`)}
                  label={`Why seal ${s.number} is removed`}
                  value={seals.removed[s.number]}
                  error={ri >= 0 ? (err(`seals.removed.${ri}.reason`) ?? err(`seals.removed.${ri}.number`)) : undefined}
                  onChange={(e) => onChange({ ...seals, removed: { ...seals.removed, [s.number]: e.target.value } })}
                />
              )}
            </fieldset>
          );
        })
      )}
      {seals.applied.map((a, i) => {
        const setRow = (over: Partial<FormSeals['applied'][number]>) =>
          onChange({ ...seals, applied: seals.applied.map((x, j) => (j === i ? { ...x, ...over } : x)) });
        return (
          <div key={i} className="space-y-2 rounded-lg border-2 border-tide-600 bg-white p-3" data-applied-seal={i}>
            <DockField
              id={id(`seals.applied.${i}.number`)}
              label={`New seal ${i + 1} number`}
              value={a.number}
              autoComplete="off"
              error={err(`seals.applied.${i}.number`)}
              onChange={(e) => setRow({ number: e.target.value })}
            />
            <div>
              <label htmlFor={id(`seals.applied.${i}.componentId`)} className="field-label text-lg">
                New seal {i + 1} on
              </label>
              <select
                id={id(`seals.applied.${i}.componentId`)}
                className="field-input min-h-touch text-xl"
                value={a.componentId}
                onChange={(e) => setRow({ componentId: e.target.value })}
              >
                <option value="">Choose a component</option>
                {components.map((c) => (
                  <option key={c.id} value={c.id}>
                    {c.label}
                  </option>
                ))}
              </select>
              {err(`seals.applied.${i}.componentId`) && (
                <p className="field-error text-lg">{err(`seals.applied.${i}.componentId`)}</p>
              )}
            </div>
            <DockField
              id={id(`seals.applied.${i}.position`)}
              label={`New seal ${i + 1} position`}
              value={a.position}
              error={err(`seals.applied.${i}.position`)}
              onChange={(e) => setRow({ position: e.target.value })}
            />
            <div>
              <label htmlFor={id(`seals.applied.${i}.photo`)} className="field-label text-lg">
                New seal {i + 1} photo (optional)
              </label>
              <input
                id={id(`seals.applied.${i}.photo`)}
                type="file"
                accept="image/*"
                capture="environment"
                className="block min-h-touch w-full text-lg"
                onChange={(e) => onPhoto(i, e.target.files?.[0] ?? null)}
              />
              {photos[i] && <p className="text-ink-soft">Photo chosen: {photos[i].name}</p>}
            </div>
            <button
              type="button"
              className="btn-secondary text-lg"
              onClick={() => {
                // The rows after this one move up, and their photos with them.
                for (let j = i; j < seals.applied.length; j++) onPhoto(j, photos[j + 1] ?? null);
                onChange({ ...seals, applied: seals.applied.filter((_, j) => j !== i) });
              }}
            >
              Do not apply this seal
            </button>
          </div>
        );
      })}
      {components.length > 0 ? (
        <button
          type="button"
          className="btn-secondary text-lg"
          onClick={() =>
            onChange({
              ...seals,
              applied: [...seals.applied, { number: '', componentId: components[0].id, position: '' }],
            })
          }
        >
          Apply a new seal
        </button>
      ) : (
        target.card && (
          <p className="text-ink-soft">This boat has no registered components, so no seal can be applied here.</p>
        )
      )}
    </fieldset>
  );
}
