'use client';

import type { ClassRules } from '@/lib/core/inputs/class-rules';
import { CHECK_METHOD_WORDS, ownValue } from '@/lib/core/inputs/measured-item-terms';
import { FORMULA_INPUTS } from '@/lib/core/engine/measured-item';
import { INSTRUMENT_TYPE_LABELS, type InstrumentType } from '@/lib/core/inputs/instrument-types';
import type { InstrumentView } from '@/lib/server/inspections/list-instruments';
import { DockField } from './dock-field';
import { RefusedInstruments } from './refused-instruments';
import { NO_GAUGE, blankItems, type FormGauge, type FormItem } from './form-model';

const select = 'field-input min-h-touch text-xl';
const id = (path: string) => `f-${path.replace(/\./g, '-')}`;

type ItemsProps = {
  rules: ClassRules;
  items: Record<string, FormItem>;
  /** Where each item sits in the record sent (errors come back by that index). */
  sentIndex: Record<string, number>;
  instruments: InstrumentView[];
  onChange: (items: Record<string, FormItem>) => void;
  err: (path: string) => string | undefined;
};

/** The class's own measured items: the reading fields its rules ask for, in its unit, and the instrument used. */
export function DockItems({ rules, items, sentIndex, instruments, onChange, err }: ItemsProps) {
  const defined = rules.measuredItems ?? [];
  if (defined.length === 0) return null;
  return (
    <fieldset id="dock-items" className="scroll-mt-4 space-y-4" data-testid="dock-items">
      <legend className="text-xl font-bold">The class’s own measured items</legend>
      {defined.map((m) => {
        const item = ownValue(items, m.key) ?? ownValue(blankItems(rules), m.key)!;
        const at = ownValue(sentIndex, m.key);
        const e = (path: string) => (at == null ? undefined : err(`measuredItems.${at}.${path}`));
        const allowed = instruments.filter((i) =>
          m.instrumentTypes.includes((i.instrumentType ?? '') as InstrumentType),
        );
        const update = (patch: Partial<FormItem>) => onChange({ ...items, [m.key]: { ...item, ...patch } });
        const limits = [
          m.minimum != null ? `minimum ${m.minimum} ${m.unit}` : null,
          m.maximum != null ? `maximum ${m.maximum} ${m.unit}` : null,
        ]
          .filter(Boolean)
          .join(', ');
        return (
          <fieldset
            key={m.key}
            className="space-y-3 rounded-lg border-2 border-paper-line bg-white p-3"
            data-testid="dock-item"
            data-item={m.key}
          >
            <legend className="px-1 font-bold">
              {m.label}
              {m.note ? ` (${m.note})` : ''}
            </legend>
            <p className="text-ink-soft">
              {limits}; {m.readings} reading{m.readings === 1 ? '' : 's'}
              {m.formula.kind === 'engine_capacity'
                ? `; capacity = ${m.formula.cylinders} · π/4 · bore² · stroke, worked out when recorded.`
                : '.'}
            </p>
            {item.readings.map((r, i) => (
              <div key={i} className="grid grid-cols-2 items-end gap-3">
                {FORMULA_INPUTS[m.formula.kind].map((x) => (
                  <DockField
                    key={x.name}
                    id={id(`item.${m.key}.${i}.${x.name}`)}
                    label={`${x.name === 'value' ? 'Reading' : x.label} ${i + 1}`}
                    unit={x.unit === 'item' ? m.unit : x.unit}
                    inputMode="decimal"
                    autoComplete="off"
                    value={r[x.name] ?? ''}
                    error={e(`readings.${i}.${x.name}`) ?? (i === 0 ? e('readings') : undefined)}
                    onChange={(ev) =>
                      update({
                        readings: item.readings.map((row, j) =>
                          j === i ? { ...row, [x.name]: ev.target.value } : row,
                        ),
                      })
                    }
                  />
                ))}
              </div>
            ))}
            <div>
              <label htmlFor={id(`item.${m.key}.instrumentId`)} className="field-label text-lg">
                Instrument used
              </label>
              <select
                id={id(`item.${m.key}.instrumentId`)}
                className={select}
                value={item.instrumentId}
                onChange={(ev) => update({ instrumentId: ev.target.value })}
              >
                <option value="">
                  None on the list (class default U {m.defaultUncertainty} {m.unit})
                </option>
                {allowed.map((i) => (
                  <option key={i.id} value={i.id} disabled={!i.calibration.usable}>
                    {i.name}
                    {i.calibration.usable ? '' : ' (cannot be chosen)'}
                  </option>
                ))}
              </select>
              <p className="field-hint">
                Allowed: {m.instrumentTypes.map((t) => INSTRUMENT_TYPE_LABELS[t]).join(', ')}.
              </p>
              <RefusedInstruments instruments={allowed} testId={`refused-item-${m.key}`} />
              {(e('instrumentId') ?? e('key')) && (
                <p className="field-error text-lg" data-field-error={`measuredItems.${m.key}`}>
                  {e('instrumentId') ?? e('key')}
                </p>
              )}
            </div>
          </fieldset>
        );
      })}
    </fieldset>
  );
}

type GaugeProps = {
  rules: ClassRules;
  gauge: FormGauge | undefined;
  instruments: InstrumentView[];
  onChange: (g: FormGauge) => void;
  err: (path: string) => string | undefined;
};

/** The nozzle's go/no-go gauge check, shown when the class's rule uses a gauge. */
export function DockGauge({ rules, gauge = NO_GAUGE, instruments, onChange, err }: GaugeProps) {
  const method = rules.nozzle.checkMethod ?? 'two_point';
  if (method === 'two_point') return null;
  const gauges = instruments.filter((i) => i.instrumentType === 'plug_gauge');
  const sizes = [
    rules.nozzle.maxMm != null && rules.nozzle.gaugeNoGoMm != null
      ? `no-go plug ${rules.nozzle.gaugeNoGoMm} mm must not enter`
      : null,
    rules.nozzle.minMm != null && rules.nozzle.gaugeGoMm != null
      ? `go plug ${rules.nozzle.gaugeGoMm} mm must enter`
      : null,
  ]
    .filter(Boolean)
    .join('; ');
  const error = err('gaugeChecks.0.gauge') ?? err('gaugeChecks.0.instrumentId') ?? err('gaugeChecks.0.rule');
  return (
    <fieldset id="dock-gauge" className="scroll-mt-4 space-y-3" data-testid="dock-gauge">
      <legend className="text-xl font-bold">Nozzle exit: go/no-go gauge</legend>
      <p className="text-ink-soft">
        {sizes}. {CHECK_METHOD_WORDS[method]}
      </p>
      {gauges.length > 0 && (
        <div>
          <label htmlFor={id('gauge.instrumentId')} className="field-label text-lg">
            Gauge from the list
          </label>
          <select
            id={id('gauge.instrumentId')}
            className={select}
            value={gauge.instrumentId}
            onChange={(ev) => onChange({ ...gauge, instrumentId: ev.target.value })}
          >
            <option value="">Not on the list (type its marking below)</option>
            {gauges.map((i) => (
              <option key={i.id} value={i.id} disabled={!i.calibration.usable}>
                {i.name}
                {i.calibration.usable ? '' : ' (cannot be chosen)'}
              </option>
            ))}
          </select>
        </div>
      )}
      <DockField
        id={id('gauge.identity')}
        label="Gauge’s marking or serial"
        value={gauge.identity}
        onChange={(ev) => onChange({ ...gauge, identity: ev.target.value })}
      />
      <div role="radiogroup" aria-label="Gauge result" className="flex flex-wrap gap-3">
        {(
          [
            ['passed', 'Passed'],
            ['failed', 'Failed'],
            ['', 'Not checked'],
          ] as const
        ).map(([v, words]) => (
          <label key={v || 'none'} className="flex min-h-touch items-center gap-2">
            <input
              type="radio"
              name="gaugeResult"
              className="h-7 w-7"
              checked={gauge.result === v}
              onChange={() => onChange({ ...gauge, result: v })}
            />
            {words}
          </label>
        ))}
      </div>
      {error && (
        <p className="field-error text-lg" data-field-error="gaugeChecks">
          {error}
        </p>
      )}
    </fieldset>
  );
}
