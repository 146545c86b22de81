'use client';

import { useState } from 'react';
import { SAFETY_ITEMS, type SafetyItem } from '@/lib/core/constants';
import { MATERIAL_OPTIONS } from '@/lib/core/engine/measurement';
import { EngineInputError } from '@/lib/core/engine/engine-input-error';
import {
  INSPECTION_KINDS,
  INSPECTION_KIND_LABELS,
  POWER_EVIDENCE_KINDS,
  POWER_EVIDENCE_KIND_WORDS,
} from '@/lib/core/inputs/inspection-terms';
import type { RecordInspectionDraft } from '@/lib/core/inputs/inspections';
import { checkInspectionDraft } from '@/lib/core/inputs/check-inspection-draft';
import {
  CHECK_AREA_LABELS,
  decideInspection,
  describeScope,
  type InspectionDecision,
} from '@/lib/core/inspections/decide-inspection';
import type { InstrumentView } from '@/lib/server/inspections/list-instruments';
import { RefusedInstruments } from './refused-instruments';
import { useIsStarted } from './use-is-started';
import { SafetyNote } from '@/components/safety-note';
import { formatFigure } from '@/lib/core/format/figures';
import type { FormState as ActionState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';
import { DockField } from './dock-field';
import { DockSeals } from './dock-seals';
import {
  draftFromForm,
  itemsToSend,
  resizeReadings,
  sealFindingsFromForm,
  type DockTarget,
  type FormState,
} from './form-model';
import { DockGauge, DockItems } from './dock-items';
import { useScreenAwake } from './use-screen-awake';
import { deviceName } from './phone-identity';

export type FormSubmission = {
  draft: RecordInspectionDraft;
  photos: File[];
  /** Photos of seals applied here, each with its seal's number. */
  sealPhotos?: { number: string; file: File }[];
  provisional: InspectionDecision | null;
};
type Props = {
  target: DockTarget;
  instruments: InstrumentView[];
  initial: FormState;
  idempotencyKey: string;
  serverErrors: Record<string, string>;
  onSubmit: (s: FormSubmission) => Promise<void>;
};

const id = (path: string) => `f-${path.replace(/\./g, '-')}`;
const select = 'field-input min-h-touch text-xl';
const check = 'h-7 w-7 shrink-0 accent-tide-600';

/**
 * The form's fields, shut (inert: no focus, typing or tap) until the page has started (useIsStarted). Before then a typed reading would be lost at the next render and a tap on Record would
 * post the page itself. Inert, not disabled: opening a disabled fieldset restyled every field of the form (about
 * 450 ms of Lighthouse's blocking time on the boat card), inert changes nothing drawn. Its own component, so opening
 * it changes one attribute and React does not draw the form again. Tests wait for data-started="yes".
 */
function ShutUntilStarted({ isPending, children }: { isPending: boolean; children: React.ReactNode }) {
  const isStarted = useIsStarted();
  return (
    <fieldset disabled={isPending} inert={!isStarted} data-started={isStarted ? 'yes' : 'no'} className="space-y-6">
      {children}
    </fieldset>
  );
}

/** The record form for one boat. Checks the input as the server's schema does before anything is queued. */
export function InspectionForm({ target, instruments, initial, idempotencyKey, serverErrors, onSubmit }: Props) {
  // The screen stays on while this record is open (released when the form closes).
  useScreenAwake();
  const [f, setF] = useState<FormState>(initial);
  const [photos, setPhotos] = useState<File[]>([]);
  // By the applied seal's row; kept beside the form state (files do not go into a queued draft).
  const [sealPhotos, setSealPhotos] = useState<Record<number, File>>({});
  const set = <K extends keyof FormState>(k: K, v: FormState[K]) => setF((s) => ({ ...s, [k]: v }));
  const lengthInstruments = instruments.filter((i) => i.quantity === 'length');
  const scales = instruments.filter((i) => i.quantity === 'mass');
  const rules = target.rules;
  // A protest's re-inspection decides only what it was ordered to check.
  const task = target.card?.openReinspections.find((t) => t.id === f.reinspectionId) ?? null;
  const scope = task?.checks ?? null;
  const scopeWords = describeScope(scope);

  // The record is checked here as the server will check it, then handed to the dock (saved on the phone first, then sent).
  const { state, isPending, form } = useFormAction(
    async (): Promise<ActionState> => {
      const draft = draftFromForm(f, target, {
        idempotencyKey,
        capturedAt: new Date().toISOString(),
        device: deviceName(),
      });
      // The server's schema without zod on the phone (the same fields and messages: see check-inspection-draft.ts).
      const parsed = checkInspectionDraft(draft);
      if (!parsed.success) return { ok: false, fieldErrors: parsed.fieldErrors };
      let provisional: InspectionDecision | null = null;
      if (rules) {
        try {
          const pick = (iid: string | null) => instruments.find((i) => i.id === iid) ?? null;
          provisional = decideInspection({
            input: parsed.data,
            rules,
            nozzleInstrument: pick(parsed.data.nozzle.instrumentId),
            weightInstrument: pick(parsed.data.weight?.instrumentId ?? null),
            itemInstruments: Object.fromEntries(parsed.data.measuredItems.map((m) => [m.key, pick(m.instrumentId)])),
            gaugeInstrument: pick(parsed.data.gaugeChecks[0]?.instrumentId ?? null),
            scope,
            sealFindings: sealFindingsFromForm(parsed.data.seals.checks, target),
          });
        } catch (x) {
          if (x instanceof EngineInputError) return { ok: false, fieldErrors: { [x.field]: x.message } };
          throw x;
        }
      }
      const withSeal = Object.entries(sealPhotos)
        .map(([i, file]) => ({ number: (f.seals.applied[Number(i)]?.number ?? '').trim().toUpperCase(), file }))
        .filter((p) => p.number !== '');
      await onSubmit({ draft, photos, sealPhotos: withSeal, provisional });
      return { ok: true };
    },
    { ok: false },
  );
  const errors = state.fieldErrors ?? {};
  const err = (path: string) => errors[path] ?? serverErrors[path];

  const readingsError = err('nozzle.readings');
  const hasWeight = !rules || rules.weight.minKg != null;
  const hasSafety = !!rules && rules.safetyItems.length > 0;
  const hasItems = !!rules && (rules.measuredItems?.length ?? 0) > 0;
  const hasGauge = !!rules && (rules.nozzle.checkMethod ?? 'two_point') !== 'two_point';
  // Errors on items come back by their place in the record sent (items with nothing typed are not sent).
  const sentIndex = Object.fromEntries(itemsToSend(f, rules).map((x, i) => [x.key, i]));
  // The in-page index: the form is long on a phone, so each section is one tap away.
  const sections = [
    { id: 'dock-nozzle', label: 'Nozzle' },
    ...(hasGauge ? [{ id: 'dock-gauge', label: 'Gauge' }] : []),
    ...(hasWeight ? [{ id: 'dock-weight', label: 'Weight' }] : []),
    { id: 'dock-power', label: 'Power' },
    ...(hasItems ? [{ id: 'dock-items', label: 'Class items' }] : []),
    ...(hasSafety ? [{ id: 'dock-safety', label: 'Safety items' }] : []),
    { id: 'dock-seals', label: 'Seals' },
    { id: 'dock-notes', label: 'Photos and notes' },
  ];
  const section = 'scroll-mt-4 space-y-3';
  return (
    <form
      {...form}
      className="space-y-6 text-lg"
      data-testid="inspection-form"
      aria-label={`Inspection of ${target.boatName}`}
    >
      <ShutUntilStarted isPending={isPending}>
        {f.supersedesId && (
          <div className="rounded-lg border-2 border-flare-500 bg-flare-100 p-4">
            <p className="font-bold">Correcting an earlier record. The original is kept; this one supersedes it.</p>
            <label htmlFor={id('correctionReason')} className="field-label mt-2 text-lg">
              Why is it corrected?
            </label>
            <textarea
              id={id('correctionReason')}
              className="field-input text-xl"
              rows={2}
              value={f.correctionReason}
              onChange={(e) => set('correctionReason', e.target.value)}
              aria-invalid={err('correctionReason') ? true : undefined}
            />
            {err('correctionReason') && <p className="field-error text-lg">{err('correctionReason')}</p>}
            <button
              type="button"
              className="btn-secondary mt-2 text-lg"
              onClick={() => setF((s) => ({ ...s, supersedesId: null, correctionReason: '' }))}
            >
              Not a correction
            </button>
          </div>
        )}
        <nav aria-label="Sections of the form" id="dock-sections" className="scroll-mt-4" data-testid="dock-sections">
          <ul className="flex flex-wrap gap-2">
            {sections.map((x) => (
              <li key={x.id}>
                <a href={`#${x.id}`} className="btn-secondary px-3 text-base">
                  {x.label}
                </a>
              </li>
            ))}
          </ul>
        </nav>
        <div>
          <label htmlFor={id('kind')} className="field-label text-lg">
            Kind of inspection
          </label>
          <select
            id={id('kind')}
            className={select}
            value={f.kind}
            onChange={(e) => set('kind', e.target.value as FormState['kind'])}
          >
            {INSPECTION_KINDS.filter(
              // "Protest" puts the burden of proof on the protester: only for a protest's re-inspection (or
              // a correction of a protest record, or a form already on it); the server refuses it otherwise.
              (k) => k !== 'protest' || task?.protestId || f.supersedesId || f.kind === 'protest',
            ).map((k) => (
              <option key={k} value={k}>
                {INSPECTION_KIND_LABELS[k]}
              </option>
            ))}
          </select>
        </div>

        {scopeWords && (
          <p
            className="rounded-lg border-2 border-flare-500 bg-flare-100 p-3 font-bold"
            data-testid="reinspection-scope"
          >
            {scopeWords}
          </p>
        )}
        <fieldset
          id="dock-nozzle"
          className={section}
          aria-describedby={readingsError ? id('nozzle.readings') : undefined}
        >
          <legend className="text-xl font-bold">Nozzle exit: two-point diameters</legend>
          <p className="text-ink-soft">
            {rules
              ? `At least ${rules.nozzle.minReadings} readings, spread around the exit.`
              : 'Spread the readings around the exit.'}{' '}
            Angles start spread evenly over half a turn, 180°/n apart for n readings (
            {Math.round((180 / f.readings.length) * 10) / 10}° now); change them if you measured elsewhere.
          </p>
          {f.readings.map((r, i) => (
            <div key={i} className="grid grid-cols-[2fr_1fr] items-end gap-3">
              <DockField
                id={id(`nozzle.readings.${i}.diameterMm`)}
                label={`Reading ${i + 1} diameter`}
                unit="mm"
                inputMode="decimal"
                autoComplete="off"
                value={r.diameter}
                error={err(`nozzle.readings.${i}.diameterMm`)}
                onChange={(e) =>
                  set(
                    'readings',
                    f.readings.map((x, j) => (j === i ? { ...x, diameter: e.target.value } : x)),
                  )
                }
              />
              <DockField
                id={id(`nozzle.readings.${i}.angleDeg`)}
                label={`Reading ${i + 1} angle`}
                unit="°"
                inputMode="numeric"
                autoComplete="off"
                value={r.angle}
                error={err(`nozzle.readings.${i}.angleDeg`)}
                onChange={(e) =>
                  set(
                    'readings',
                    f.readings.map((x, j) => (j === i ? { ...x, angle: e.target.value } : x)),
                  )
                }
              />
            </div>
          ))}
          {readingsError && (
            <p id={id('nozzle.readings')} className="field-error text-lg" data-field-error="nozzle.readings">
              {readingsError}
            </p>
          )}
          <div className="flex flex-wrap gap-3">
            <button
              type="button"
              className="btn-secondary text-lg"
              onClick={() => set('readings', resizeReadings(f.readings, f.readings.length + 1))}
            >
              Add a reading
            </button>
            {f.readings.length > 1 && (
              <button
                type="button"
                className="btn-secondary text-lg"
                onClick={() => set('readings', resizeReadings(f.readings, f.readings.length - 1))}
              >
                Remove the last reading
              </button>
            )}
          </div>

          <div role="radiogroup" aria-label="Uncertainty of the readings" className="space-y-2">
            <p className="font-bold">Uncertainty of the readings</p>
            {(['instrument', 'typed', 'class'] as const).map((src) => (
              <label key={src} className="flex min-h-touch items-center gap-3">
                <input
                  type="radio"
                  name="uncertaintySource"
                  className={check}
                  checked={f.uncertaintySource === src}
                  onChange={() => set('uncertaintySource', src)}
                  disabled={src === 'instrument' && lengthInstruments.length === 0}
                />
                {src === 'instrument'
                  ? 'From the instrument used'
                  : src === 'typed'
                    ? 'I know U (type it)'
                    : `Class default${rules ? ` (U ${rules.nozzle.defaultUncertaintyMm} mm)` : ''}`}
              </label>
            ))}
          </div>
          {lengthInstruments.length === 0 && (
            <p className="text-ink-soft" data-testid="no-instruments">
              No length instrument is on this meeting’s list yet: the chief scrutineer adds them under Instruments.
            </p>
          )}
          {f.uncertaintySource === 'instrument' && (
            <div>
              <label htmlFor={id('nozzle.instrumentId')} className="field-label text-lg">
                Instrument used
              </label>
              <select
                id={id('nozzle.instrumentId')}
                className={select}
                value={f.instrumentId}
                onChange={(e) => set('instrumentId', e.target.value)}
                aria-invalid={err('nozzle.instrumentId') ? true : undefined}
              >
                <option value="">Choose…</option>
                {lengthInstruments.map((i) => (
                  <option key={i.id} value={i.id} disabled={!i.calibration.usable}>
                    {i.name} (U{' '}
                    {formatFigure(i.appliedExpandedUncertainty, i.quantity === 'length' ? 'uncertaintyMm' : 'massKg')})
                    {i.calibration.usable ? '' : ' (cannot be chosen)'}
                  </option>
                ))}
              </select>
              <RefusedInstruments instruments={lengthInstruments} testId="refused-length-instruments" />
              {err('nozzle.instrumentId') && (
                <p className="field-error text-lg" data-field-error="nozzle.instrumentId">
                  {err('nozzle.instrumentId')}
                </p>
              )}
            </div>
          )}
          {f.uncertaintySource === 'typed' && (
            <DockField
              id={id('nozzle.expandedUncertaintyMm')}
              label="Expanded uncertainty U (k = 2)"
              unit="mm"
              inputMode="decimal"
              value={f.typedU}
              error={err('nozzle.expandedUncertaintyMm')}
              onChange={(e) => set('typedU', e.target.value)}
            />
          )}
          <div className="grid grid-cols-2 items-end gap-3">
            <DockField
              id={id('nozzle.partTemperatureC')}
              label="Nozzle temperature"
              unit="°C"
              inputMode="decimal"
              value={f.temperature}
              error={err('nozzle.partTemperatureC') ?? err('nozzle.temperatureC')}
              onChange={(e) => set('temperature', e.target.value)}
            />
            <div>
              <label htmlFor={id('nozzle.material')} className="field-label text-lg">
                Nozzle material
              </label>
              <select
                id={id('nozzle.material')}
                className={select}
                value={f.material}
                onChange={(e) => set('material', e.target.value as FormState['material'])}
              >
                <option value="">Not known</option>
                {MATERIAL_OPTIONS.map((m) => (
                  <option key={m.value} value={m.value}>
                    {m.label}
                  </option>
                ))}
              </select>
            </div>
          </div>
          <label className="flex min-h-[3rem] items-center gap-3">
            <input
              type="checkbox"
              className="h-7 w-7"
              checked={f.instrumentSameAsPart}
              onChange={(e) => set('instrumentSameAsPart', e.target.checked)}
              data-testid="instrument-same-temperature"
            />
            <span>Instrument at the same temperature as the nozzle</span>
          </label>
          <div className="grid grid-cols-2 items-end gap-3">
            {!f.instrumentSameAsPart ? (
              <DockField
                id={id('nozzle.instrumentTemperatureC')}
                label="Instrument temperature"
                unit="°C"
                inputMode="decimal"
                value={f.instrumentTemperature}
                error={err('nozzle.instrumentTemperatureC')}
                onChange={(e) => set('instrumentTemperature', e.target.value)}
              />
            ) : (
              <span />
            )}
            <div>
              <label htmlFor={id('nozzle.instrumentMaterial')} className="field-label text-lg">
                Instrument material
              </label>
              <select
                id={id('nozzle.instrumentMaterial')}
                className={select}
                value={f.instrumentMaterial}
                onChange={(e) => set('instrumentMaterial', e.target.value as FormState['instrumentMaterial'])}
              >
                <option value="">Steel (assumed)</option>
                {MATERIAL_OPTIONS.map((m) => (
                  <option key={m.value} value={m.value}>
                    {m.label}
                  </option>
                ))}
              </select>
              {err('nozzle.instrumentMaterial') && <p className="field-error">{err('nozzle.instrumentMaterial')}</p>}
            </div>
          </div>
          <p className="text-ink-soft">
            With the nozzle’s temperature and material, the readings are corrected to 20 °C (ISO 1:2022) for the
            expansion of both the nozzle and the instrument; left empty, the instrument is taken as at 20 °C. The
            temperatures’ uncertainty joins U.
          </p>
        </fieldset>

        {rules && (
          <DockGauge
            rules={rules}
            gauge={f.gauge}
            instruments={instruments}
            onChange={(g) => set('gauge', g)}
            err={err}
          />
        )}

        {hasWeight && (
          <fieldset id="dock-weight" className={section}>
            <legend className="text-xl font-bold">
              Weight
              {rules?.weight.minKg != null
                ? ` (minimum ${rules.weight.minKg} kg, ${rules.weight.includesDriver ? 'with' : 'without'} driver)`
                : ''}
            </legend>
            <div className="grid grid-cols-2 items-end gap-3">
              {f.weighings.map((w, i) => (
                <DockField
                  key={i}
                  id={id(`weight.readingsKg.${i}`)}
                  label={`Weighing ${i + 1}`}
                  unit="kg"
                  inputMode="decimal"
                  value={w}
                  error={err(`weight.readingsKg.${i}`)}
                  onChange={(e) =>
                    set(
                      'weighings',
                      f.weighings.map((x, j) => (j === i ? e.target.value : x)),
                    )
                  }
                />
              ))}
            </div>
            <div>
              <label htmlFor={id('weight.instrumentId')} className="field-label text-lg">
                Scale used
              </label>
              <select
                id={id('weight.instrumentId')}
                className={select}
                value={f.scaleId}
                onChange={(e) => set('scaleId', e.target.value)}
              >
                <option value="">Class default uncertainty</option>
                {scales.map((i) => (
                  <option key={i.id} value={i.id} disabled={!i.calibration.usable}>
                    {i.name}
                    {i.calibration.usable ? '' : ' (cannot be chosen)'}
                  </option>
                ))}
              </select>
              <RefusedInstruments instruments={scales} testId="refused-scales" />
              {err('weight.instrumentId') && <p className="field-error text-lg">{err('weight.instrumentId')}</p>}
            </div>
          </fieldset>
        )}

        <fieldset id="dock-power" className={section}>
          <legend className="text-xl font-bold">Engine power</legend>
          <DockField
            id={id('power.declaredKw')}
            label="Power, as declared or as the evidence shows"
            unit="kW"
            inputMode="decimal"
            value={f.powerKw}
            error={err('power.declaredKw')}
            onChange={(e) => set('powerKw', e.target.value)}
            hint={`Declared by the entrant: ${formatFigure(target.declaredPowerKw, 'powerKw')} (${target.powerEvidence.replace('_', ' ')}).`}
          />
          <div>
            <label htmlFor={id('power.evidenceKind')} className="field-label text-lg">
              Power evidence seen
            </label>
            <select
              id={id('power.evidenceKind')}
              className={select}
              value={f.evidenceKind}
              onChange={(e) => {
                const kind = e.target.value as FormState['evidenceKind'];
                setF((s) => ({
                  ...s,
                  evidenceKind: kind,
                  evidenceSeen: kind === 'dyno_sheet' || kind === 'maker_rating',
                }));
              }}
            >
              <option value="">Choose what you saw</option>
              {POWER_EVIDENCE_KINDS.map((k) => (
                <option key={k} value={k}>
                  {POWER_EVIDENCE_KIND_WORDS[k]}
                </option>
              ))}
            </select>
            {err('power.evidenceKind') && <p className="field-error text-lg">{err('power.evidenceKind')}</p>}
          </div>
          {f.evidenceKind === 'dyno_sheet' && (
            <div>
              <label htmlFor={id('power.dynoDocumentId')} className="field-label text-lg">
                Which of the boat’s documents is the dyno sheet
              </label>
              <select
                id={id('power.dynoDocumentId')}
                className={select}
                value={f.dynoDocumentId}
                onChange={(e) => set('dynoDocumentId', e.target.value)}
              >
                <option value="">A paper sheet (not uploaded)</option>
                {(target.card?.documents ?? []).map((d) => (
                  <option key={d.id} value={d.id}>
                    {d.fileName} ({d.kind.replace('_', ' ')})
                  </option>
                ))}
              </select>
              {err('power.dynoDocumentId') && <p className="field-error text-lg">{err('power.dynoDocumentId')}</p>}
            </div>
          )}
          <DockField
            id={id('power.note')}
            label="Power note"
            value={f.powerNote}
            error={err('power.note')}
            onChange={(e) => set('powerNote', e.target.value)}
          />
        </fieldset>

        {rules && (
          <DockItems
            rules={rules}
            items={f.items ?? {}}
            sentIndex={sentIndex}
            instruments={instruments}
            onChange={(items) => set('items', items)}
            err={err}
          />
        )}

        {rules && hasSafety && (
          <fieldset id="dock-safety" className="scroll-mt-4 space-y-2">
            <legend className="text-xl font-bold">Safety items required by the class</legend>
            {rules.safetyItems.map((k) => (
              <label
                key={k}
                className="flex min-h-touch items-center gap-3 rounded-lg border-2 border-paper-line bg-white px-3"
              >
                <input
                  type="checkbox"
                  className={check}
                  checked={f.safety[k] === true}
                  onChange={(e) => set('safety', { ...f.safety, [k]: e.target.checked })}
                />
                {SAFETY_ITEMS[k as SafetyItem] ?? k} — present and working
              </label>
            ))}
            <SafetyNote className="text-lg" />
          </fieldset>
        )}

        <DockSeals
          target={target}
          seals={f.seals}
          onChange={(v) => set('seals', v)}
          err={err}
          photos={sealPhotos}
          onPhoto={(i, file) =>
            setSealPhotos((p) => {
              const next = { ...p };
              if (file) next[i] = file;
              else delete next[i];
              return next;
            })
          }
        />

        <div id="dock-notes" className="scroll-mt-4 space-y-6">
          {target.card && target.card.openReinspections.length > 0 && (
            <div>
              <label htmlFor={id('reinspectionId')} className="field-label text-lg">
                Re-inspection task this completes
              </label>
              <select
                id={id('reinspectionId')}
                className={select}
                value={f.reinspectionId}
                onChange={(e) => set('reinspectionId', e.target.value)}
              >
                <option value="">None</option>
                {target.card.openReinspections.map((t) => (
                  <option key={t.id} value={t.id}>
                    {t.reason}
                    {t.checks ? ` (checks the ${t.checks.map((c) => CHECK_AREA_LABELS[c]).join(', ')} only)` : ''}
                  </option>
                ))}
              </select>
            </div>
          )}

          <div>
            <label htmlFor={id('photo')} className="field-label text-lg">
              Photos (optional, up to 4, 8 MB each)
            </label>
            <input
              id={id('photo')}
              type="file"
              accept="image/*"
              capture="environment"
              multiple
              className="block min-h-touch w-full text-lg"
              onChange={(e) => setPhotos(Array.from(e.target.files ?? []).slice(0, 4))}
            />
            {err('photo') && <p className="field-error text-lg">{err('photo')}</p>}
          </div>
          <div>
            <label htmlFor={id('notes')} className="field-label text-lg">
              Notes
            </label>
            <textarea
              id={id('notes')}
              className="field-input text-xl"
              rows={3}
              value={f.notes}
              onChange={(e) => set('notes', e.target.value)}
            />
            {err('notes') && <p className="field-error text-lg">{err('notes')}</p>}
          </div>
        </div>
        {Object.keys(errors).length + Object.keys(serverErrors).length > 0 && (
          <p role="alert" className="field-error text-lg" data-testid="form-errors">
            Check the fields marked above: nothing was recorded yet.
          </p>
        )}
        {/* The record action stays in reach on a phone: a bar stuck to the bottom of the screen while the form is in view. */}
        <div
          className="sticky bottom-0 z-10 -mx-4 flex gap-2 border-t-2 border-paper-line bg-paper/95 px-4 py-2 lg:static lg:mx-0 lg:border-0 lg:bg-transparent lg:p-0"
          data-testid="record-bar"
        >
          <a href="#dock-sections" className="btn-secondary shrink-0 px-3 text-base lg:hidden">
            Sections
          </a>
          <button type="submit" className="btn-primary min-h-[3.5rem] w-full text-xl" data-testid="record-inspection">
            {isPending ? 'Recording…' : 'Record inspection'}
          </button>
        </div>
      </ShutUntilStarted>
    </form>
  );
}
