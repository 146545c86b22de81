'use client';

// One set-up's inputs, each with its unit and the API's error beside it, and its static figures.

import type { ReactNode } from 'react';
import { POWER_UNIT_OPTIONS, UNIT_LABELS } from '@/lib/core/engine/units';
import type { UnitOption } from '@/lib/core/engine/units';
import type { JetPerformanceData } from '@/lib/core/engine/calculation-api';
import { formatForce, formatPower, formatSpeed, toModelBody, WATER_TEMPERATURE_HINT } from './setup-model';
import type { DisplayUnits, FieldErrors, InputLengthUnit, InputPowerUnit, SetupDraft, SetupField } from './setup-model';
import { SERIES_STYLES } from './thrust-chart';

const INPUT_POWER_UNITS = POWER_UNIT_OPTIONS.filter((o): o is UnitOption<InputPowerUnit> => o.value !== 'W');
const INPUT_LENGTH_UNITS: readonly InputLengthUnit[] = ['mm', 'in'];

interface FieldProps {
  id: string;
  label: string;
  value: string;
  onChange: (value: string) => void;
  /** A fixed unit shown beside the input, or a picker. */
  unit: ReactNode;
  hint?: string;
  error?: string;
}

/** A numeric field: decimal keypad on phones, its unit beside it, hint and error linked for screen readers. */
function NumberField({ id, label, value, onChange, unit, hint, error }: FieldProps) {
  const describedBy = [hint && `${id}-hint`, error && `${id}-error`].filter(Boolean).join(' ') || undefined;
  return (
    <div>
      <label htmlFor={id} className="field-label">
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
          className={`field-input figure min-w-0 flex-1 ${error ? 'border-fail-600' : ''}`}
        />
        {unit}
      </div>
      {hint && (
        <p id={`${id}-hint`} className="field-hint">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="field-error" data-field-error={id}>
          {error}
        </p>
      )}
    </div>
  );
}

const FixedUnit = ({ children }: { children: ReactNode }) => (
  <span className="inline-flex min-h-touch w-24 shrink-0 items-center justify-center rounded-lg bg-paper-deep px-2 text-base text-ink-soft">
    {children}
  </span>
);

function UnitPicker<U extends string>({
  id,
  label,
  value,
  options,
  onChange,
}: {
  id: string;
  label: string;
  value: U;
  options: readonly { value: U; label: string }[];
  onChange: (u: U) => void;
}) {
  return (
    <select
      id={id}
      aria-label={label}
      value={value}
      onChange={(e) => onChange(e.target.value as U)}
      className="field-input w-24 shrink-0"
    >
      {options.map((o) => (
        <option key={o.value} value={o.value}>
          {o.label}
        </option>
      ))}
    </select>
  );
}

interface Props {
  index: number;
  setup: SetupDraft;
  errors: FieldErrors;
  data?: JetPerformanceData;
  units: DisplayUnits;
  canRemove: boolean;
  onChange: (patch: Partial<SetupDraft>) => void;
  onRemove: () => void;
}

export function SetupFields({ index, setup, errors, data, units, canRemove, onChange, onRemove }: Props) {
  const id = (f: SetupField | 'label') => `${setup.id}-${f}`;
  const number = (field: SetupField & keyof SetupDraft, label: string, unit: ReactNode, hint?: string) => (
    <NumberField
      id={id(field)}
      label={label}
      value={setup[field]}
      onChange={(v) => onChange({ [field]: v })}
      unit={unit}
      hint={hint}
      error={errors[field]}
    />
  );
  const style = SERIES_STYLES[index % SERIES_STYLES.length];
  const hasDensity = setup.densityKgM3.trim() !== '';
  const staticPoint = data?.points[0]?.speedMs === 0 ? data.points[0] : undefined;
  const powerKw = toModelBody(setup).powerKw;

  return (
    <fieldset aria-label={`Set-up ${index + 1}`} className="card min-w-0 space-y-4" data-testid={`setup-${index + 1}`}>
      <div className="flex items-center justify-between gap-3">
        <h3 className="flex items-center gap-2">
          <svg width="36" height="12" aria-hidden="true">
            <line x1="0" y1="6" x2="36" y2="6" stroke={style.color} strokeWidth="4" strokeDasharray={style.dash} />
          </svg>
          Set-up {index + 1}
        </h3>
        {canRemove && (
          <button type="button" className="btn-secondary" onClick={onRemove} aria-label={`Remove set-up ${index + 1}`}>
            Remove
          </button>
        )}
      </div>
      <dl className="grid grid-cols-2 gap-3 rounded-lg bg-tide-50 p-3" aria-live="polite">
        <Figure
          label="Static thrust"
          testId="static-thrust"
          value={staticPoint && formatForce(staticPoint.thrustN, units.force)}
        />
        <Figure
          label="Static jet velocity"
          testId="static-jet-velocity"
          value={staticPoint && formatSpeed(staticPoint.jetVelocityMs, units.speed)}
        />
        <Figure
          label="Shaft power"
          testId="shaft-power"
          value={
            typeof powerKw === 'number' && Number.isFinite(powerKw) ? formatPower(powerKw, units.power) : undefined
          }
        />
        <Figure label="Water density" testId="density" value={data && `${data.densityKgM3.toFixed(1)} kg/m³`} />
      </dl>
      <div>
        <label htmlFor={id('label')} className="field-label">
          Label
        </label>
        <input
          id={id('label')}
          value={setup.label}
          maxLength={40}
          onChange={(e) => onChange({ label: e.target.value })}
          className="field-input"
        />
      </div>
      <div className="grid gap-4 sm:grid-cols-2">
        {number(
          'power',
          'Shaft power',
          <UnitPicker
            id={id('power') + '-unit'}
            label="Power unit"
            value={setup.powerUnit}
            options={INPUT_POWER_UNITS}
            onChange={(u: InputPowerUnit) => onChange({ powerUnit: u })}
          />,
        )}
        {number(
          'nozzle',
          'Nozzle exit diameter',
          <UnitPicker
            id={id('nozzle') + '-unit'}
            label="Nozzle diameter unit"
            value={setup.nozzleUnit}
            options={INPUT_LENGTH_UNITS.map((u) => ({ value: u, label: UNIT_LABELS[u] }))}
            onChange={(u: InputLengthUnit) => onChange({ nozzleUnit: u })}
          />,
        )}
        {number(
          'pumpEfficiency',
          'Pump efficiency',
          <FixedUnit>0–1</FixedUnit>,
          'Blank: 1 (a perfect pump). Typical 0.85–0.92.',
        )}
        {number(
          'inletLoss',
          'Inlet loss coefficient Kᵢ',
          <FixedUnit>–</FixedUnit>,
          'Blank: 0. A flush inlet is about 0.1–0.3.',
        )}
        {number('nozzleLoss', 'Nozzle loss coefficient Kₙ', <FixedUnit>–</FixedUnit>, 'Blank: 0. Typically 0.01–0.05.')}
        <div>
          <label htmlFor={id('waterKind')} className="field-label">
            Water
          </label>
          <select
            id={id('waterKind')}
            value={setup.waterKind}
            disabled={hasDensity}
            onChange={(e) => onChange({ waterKind: e.target.value as SetupDraft['waterKind'] })}
            aria-invalid={errors.waterKind ? true : undefined}
            className="field-input"
          >
            <option value="fresh">Fresh water</option>
            <option value="sea">Sea water</option>
          </select>
          {errors.waterKind && (
            <p className="field-error" data-field-error={id('waterKind')}>
              {errors.waterKind}
            </p>
          )}
        </div>
        {!hasDensity && number('temperatureC', 'Water temperature', <FixedUnit>°C</FixedUnit>, WATER_TEMPERATURE_HINT)}
        {number('densityKgM3', 'Density override', <FixedUnit>kg/m³</FixedUnit>, 'Blank: from water and temperature.')}
      </div>
    </fieldset>
  );
}

function Figure({ label, value, testId }: { label: string; value?: string; testId: string }) {
  return (
    <div>
      <dt className="text-sm text-ink-soft">{label}</dt>
      <dd className="figure text-lg font-semibold" data-testid={testId}>
        {value ?? '—'}
      </dd>
    </div>
  );
}
