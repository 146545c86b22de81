'use client';

// The matched mode's inputs: the engine's power curve, the pump's characteristic, the nozzle, the
// losses and water, and optionally the inlet's suction. Each message sits beside the field it names;
// the text typed is kept as typed, whatever the message.

import type { ReactNode } from 'react';
import { WATER_TEMPERATURE_HINT } from './setup-model';
import { MAX_CURVE_ROWS } from './matched-model';
import type { EngineRow, MatchedDraft, MatchedFieldErrors, PumpRow } from './matched-model';

interface FieldProps {
  id: string;
  label: string;
  value: string;
  onChange: (value: string) => void;
  unit?: string;
  hint?: string;
  error?: string;
  /** Visible label hidden (rows of a curve have column headings); still read by screen readers. */
  hideLabel?: boolean;
}

function Field({ id, label, value, onChange, unit, hint, error, hideLabel }: FieldProps) {
  const describedBy = [hint && `${id}-hint`, error && `${id}-error`].filter(Boolean).join(' ') || undefined;
  return (
    <div className="min-w-0">
      <label htmlFor={id} className={hideLabel ? 'sr-only' : 'field-label'}>
        {label}
      </label>
      <div className="flex items-stretch gap-2">
        <input
          id={id}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          value={value}
          onChange={(e) => onChange(e.target.value)}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy}
          className={`field-input figure min-w-0 flex-1 ${hideLabel ? 'px-2' : ''} ${error ? 'border-fail-600' : ''}`}
        />
        {unit && (
          <span className="inline-flex min-h-touch w-16 shrink-0 items-center justify-center rounded-lg bg-paper-deep px-2 text-base text-ink-soft">
            {unit}
          </span>
        )}
      </div>
      {hint && (
        <p id={`${id}-hint`} className="field-hint">
          {hint}
        </p>
      )}
      <FieldError id={id} error={error} />
    </div>
  );
}

function FieldError({ id, error }: { id: string; error?: string }) {
  if (!error) return null;
  return (
    <p id={`${id}-error`} className="field-error" data-field-error={id}>
      {error}
    </p>
  );
}

interface Props {
  draft: MatchedDraft;
  errors: MatchedFieldErrors;
  onChange: (patch: Partial<MatchedDraft>) => void;
  newKey: (prefix: string) => string;
}

export function MatchedFields({ draft, errors, onChange, newKey }: Props) {
  const field = (key: keyof MatchedDraft & string, errorKey: string, label: string, unit?: string, hint?: string) => (
    <Field
      id={`m-${key}`}
      label={label}
      value={String(draft[key])}
      onChange={(v) => onChange({ [key]: v })}
      unit={unit}
      hint={hint}
      error={errors[errorKey]}
    />
  );

  const setEngineRow = (i: number, patch: Partial<EngineRow>) =>
    onChange({ engineRows: draft.engineRows.map((r, j) => (j === i ? { ...r, ...patch } : r)) });
  const setPumpRow = (i: number, patch: Partial<PumpRow>) =>
    onChange({ pumpRows: draft.pumpRows.map((r, j) => (j === i ? { ...r, ...patch } : r)) });
  // A new row continues the curve past its last point, so the rows stay increasing.
  const addEngineRow = () => {
    const last = draft.engineRows[draft.engineRows.length - 1];
    const rpm = last && Number.isFinite(Number(last.rpm)) ? String(Number(last.rpm) + 500) : '';
    onChange({ engineRows: [...draft.engineRows, { key: newKey('e'), rpm, powerKw: last?.powerKw ?? '' }] });
  };
  const addPumpRow = () => {
    const last = draft.pumpRows[draft.pumpRows.length - 1];
    const phi =
      last && Number.isFinite(Number(last.flowCoefficient)) ? String(Number(last.flowCoefficient) + 0.05) : '';
    onChange({
      pumpRows: [
        ...draft.pumpRows,
        { key: newKey('p'), flowCoefficient: phi, headCoefficient: last?.headCoefficient ?? '', efficiency: '' },
      ],
    });
  };

  return (
    <div className="space-y-4">
      <fieldset aria-label="Engine power curve" className="card min-w-0 space-y-3" data-testid="matched-engine">
        <h3>Engine power curve</h3>
        <p className="field-hint">Shaft power at each engine speed, rpm increasing; at least two points.</p>
        <div className="grid grid-cols-[1rem_1fr_1fr_auto] items-start gap-2">
          <span aria-hidden="true" />
          <span className="text-sm font-bold text-ink-soft">Speed (rpm)</span>
          <span className="text-sm font-bold text-ink-soft">Power (kW)</span>
          <span aria-hidden="true" />
          {draft.engineRows.map((r, i) => (
            <EngineRowFields
              key={r.key}
              index={i}
              row={r}
              errors={errors}
              canRemove={draft.engineRows.length > 2}
              onChange={(patch) => setEngineRow(i, patch)}
              onRemove={() => onChange({ engineRows: draft.engineRows.filter((_, j) => j !== i) })}
            />
          ))}
        </div>
        <FieldError id="m-engine-curve" error={errors['engine.curve']} />
        <button
          type="button"
          className="btn-secondary"
          onClick={addEngineRow}
          disabled={draft.engineRows.length >= MAX_CURVE_ROWS}
        >
          Add an engine point
        </button>
        {field('limiterRpm', 'engine.limiterRpm', 'Rev limiter', 'rpm', 'Blank: no limiter.')}
      </fieldset>

      <fieldset aria-label="Pump" className="card min-w-0 space-y-3" data-testid="matched-pump">
        <h3>Pump</h3>
        {field('impellerMm', 'pump.impellerDiameterMm', 'Impeller diameter', 'mm')}
        <p className="field-hint">
          The pump&apos;s characteristic in dimensionless form: flow coefficient φ = Q/(nD³), head coefficient ψ =
          gH/(n²D²), n in revolutions per second; φ increasing, at least two points.
        </p>
        <div className="grid grid-cols-[1rem_1fr_1fr_1fr_auto] items-start gap-1.5">
          <span aria-hidden="true" />
          <span className="text-sm font-bold text-ink-soft">Flow φ</span>
          <span className="text-sm font-bold text-ink-soft">Head ψ</span>
          <span className="text-sm font-bold text-ink-soft">Efficiency</span>
          <span aria-hidden="true" />
          {draft.pumpRows.map((r, i) => (
            <PumpRowFields
              key={r.key}
              index={i}
              row={r}
              errors={errors}
              canRemove={draft.pumpRows.length > 2}
              onChange={(patch) => setPumpRow(i, patch)}
              onRemove={() => onChange({ pumpRows: draft.pumpRows.filter((_, j) => j !== i) })}
            />
          ))}
        </div>
        <FieldError id="m-pump-curve" error={errors['pump.curve']} />
        <button
          type="button"
          className="btn-secondary"
          onClick={addPumpRow}
          disabled={draft.pumpRows.length >= MAX_CURVE_ROWS}
        >
          Add a pump point
        </button>
      </fieldset>

      <fieldset aria-label="Nozzle, losses and water" className="card min-w-0 space-y-3">
        <h3>Nozzle, losses and water</h3>
        <div className="grid gap-4 sm:grid-cols-2">
          {field('nozzleMm', 'nozzleDiameterMm', 'Nozzle exit diameter', 'mm')}
          {field(
            'inletLoss',
            'inletLossCoefficient',
            'Inlet loss coefficient Kᵢ',
            '–',
            'Blank: 0. A flush inlet is about 0.1–0.3.',
          )}
          {field(
            'nozzleLoss',
            'nozzleLossCoefficient',
            'Nozzle loss coefficient Kₙ',
            '–',
            'Blank: 0. Typically 0.01–0.05.',
          )}
          {field('wakeFraction', 'wakeFraction', 'Wake fraction', '–', 'Blank: 0 (the inflow at boat speed).')}
          <div>
            <label htmlFor="m-waterKind" className="field-label">
              Water
            </label>
            <select
              id="m-waterKind"
              value={draft.waterKind}
              onChange={(e) => onChange({ waterKind: e.target.value as MatchedDraft['waterKind'] })}
              className="field-input"
            >
              <option value="fresh">Fresh water</option>
              <option value="sea">Sea water</option>
            </select>
            <FieldError id="m-waterKind" error={errors['water.kind'] ?? errors.water} />
          </div>
          {field('temperatureC', 'water.temperatureC', 'Water temperature', '°C', WATER_TEMPERATURE_HINT)}
        </div>
      </fieldset>

      <fieldset aria-label="Cavitation check" className="card min-w-0 space-y-3">
        <h3>Cavitation check</h3>
        <label className="flex min-h-touch items-center gap-3">
          <input
            type="checkbox"
            checked={draft.withCavitation}
            onChange={(e) => onChange({ withCavitation: e.target.checked })}
            className="h-6 w-6"
          />
          <span>Flag the speeds where the pump inlet cavitates</span>
        </label>
        {draft.withCavitation && (
          <div className="grid gap-4 sm:grid-cols-2">
            {field('inletDepthM', 'cavitation.inletDepthM', 'Inlet depth below the surface', 'm')}
            <div>
              <label htmlFor="m-npshBasis" className="field-label">
                Required NPSH from
              </label>
              <select
                id="m-npshBasis"
                value={draft.npshBasis}
                onChange={(e) => onChange({ npshBasis: e.target.value as MatchedDraft['npshBasis'] })}
                className="field-input"
              >
                <option value="suction">Suction specific speed</option>
                <option value="rated">A maker&apos;s required NPSH at a rated point</option>
              </select>
              <FieldError id="m-npshBasis" error={errors.cavitation} />
            </div>
            {draft.npshBasis === 'suction' ? (
              field(
                'suctionSpecificSpeed',
                'cavitation.suctionSpecificSpeed',
                'Suction specific speed S',
                '–',
                'Dimensionless (ω in rad/s, Q in m³/s, gNPSH in J/kg).',
              )
            ) : (
              <>
                {field('ratedNpshM', 'cavitation.requiredNpshAtRated.npshM', 'Required NPSH at the rated point', 'm')}
                {field('ratedRpm', 'cavitation.requiredNpshAtRated.rpm', 'Rated speed', 'rpm')}
                {field('ratedFlowM3s', 'cavitation.requiredNpshAtRated.flowM3s', 'Rated flow', 'm³/s')}
              </>
            )}
          </div>
        )}
      </fieldset>
    </div>
  );
}

function RemoveButton({ label, onClick, disabled }: { label: string; onClick: () => void; disabled: boolean }) {
  return (
    <button
      type="button"
      className="btn-secondary min-h-touch min-w-touch px-2"
      aria-label={label}
      onClick={onClick}
      disabled={disabled}
    >
      ×
    </button>
  );
}

function EngineRowFields({
  index,
  row,
  errors,
  canRemove,
  onChange,
  onRemove,
}: {
  index: number;
  row: EngineRow;
  errors: MatchedFieldErrors;
  canRemove: boolean;
  onChange: (patch: Partial<EngineRow>) => void;
  onRemove: () => void;
}) {
  const n = index + 1;
  return (
    <>
      <span className="pt-3 text-sm text-ink-mute">{n}</span>
      <Field
        id={`m-engine-${index}-rpm`}
        label={`Engine point ${n} speed (rpm)`}
        hideLabel
        value={row.rpm}
        onChange={(rpm) => onChange({ rpm })}
        error={errors[`engine.curve.${index}.rpm`]}
      />
      <Field
        id={`m-engine-${index}-power`}
        label={`Engine point ${n} power (kW)`}
        hideLabel
        value={row.powerKw}
        onChange={(powerKw) => onChange({ powerKw })}
        error={errors[`engine.curve.${index}.powerKw`] ?? errors[`engine.curve.${index}`]}
      />
      <RemoveButton label={`Remove engine point ${n}`} onClick={onRemove} disabled={!canRemove} />
    </>
  );
}

function PumpRowFields({
  index,
  row,
  errors,
  canRemove,
  onChange,
  onRemove,
}: {
  index: number;
  row: PumpRow;
  errors: MatchedFieldErrors;
  canRemove: boolean;
  onChange: (patch: Partial<PumpRow>) => void;
  onRemove: () => void;
}): ReactNode {
  const n = index + 1;
  const key = `pump.curve.${index}`;
  return (
    <>
      <span className="pt-3 text-sm text-ink-mute">{n}</span>
      <Field
        id={`m-pump-${index}-flow`}
        label={`Pump point ${n} flow coefficient`}
        hideLabel
        value={row.flowCoefficient}
        onChange={(flowCoefficient) => onChange({ flowCoefficient })}
        error={errors[`${key}.flowCoefficient`] ?? errors[key]}
      />
      <Field
        id={`m-pump-${index}-head`}
        label={`Pump point ${n} head coefficient`}
        hideLabel
        value={row.headCoefficient}
        onChange={(headCoefficient) => onChange({ headCoefficient })}
        error={errors[`${key}.headCoefficient`]}
      />
      <Field
        id={`m-pump-${index}-efficiency`}
        label={`Pump point ${n} efficiency`}
        hideLabel
        value={row.efficiency}
        onChange={(efficiency) => onChange({ efficiency })}
        error={errors[`${key}.efficiency`]}
      />
      <RemoveButton label={`Remove pump point ${n}`} onClick={onRemove} disabled={!canRemove} />
    </>
  );
}
