'use client';

import { useState } from 'react';
import type { ClassRules } from '@/lib/core/inputs/class-rules';
import {
  CHECK_METHOD_EXPLANATION,
  CHECK_METHOD_WORDS,
  CHECK_METHODS,
  MAX_MEASURED_ITEMS,
  type MeasuredItemRule,
} from '@/lib/core/inputs/measured-item-rules';
import { INSTRUMENT_TYPES, INSTRUMENT_TYPE_LABELS } from '@/lib/core/inputs/instrument-calibration';
import { ITEM_UNITS, ITEM_UNIT_FACTS } from '@/lib/core/engine/measured-item';
import { numberOrNull } from '@/lib/core/inputs/form-values';
import { TextField } from '@/components/ui/text-field';
import { FieldError } from '@/components/forms/form-message';

/** One item as typed: numbers stay text until the form is sent. */
type Draft = {
  uid: number;
  key: string;
  label: string;
  unit: string;
  minimum: string;
  maximum: string;
  readings: string;
  instrumentTypes: string[];
  decisionRule: string;
  defaultUncertainty: string;
  note: string;
  formula: string;
  cylinders: string;
};

const text = (x: number | null | undefined) => (x == null ? '' : String(x));
let nextUid = 1;
const toDraft = (m: MeasuredItemRule): Draft => ({
  uid: nextUid++,
  key: m.key,
  label: m.label,
  unit: m.unit,
  minimum: text(m.minimum),
  maximum: text(m.maximum),
  readings: String(m.readings),
  instrumentTypes: [...m.instrumentTypes],
  decisionRule: m.decisionRule ?? '',
  defaultUncertainty: String(m.defaultUncertainty),
  note: m.note,
  formula: m.formula.kind,
  cylinders: m.formula.kind === 'engine_capacity' ? String(m.formula.cylinders) : '4',
});
const blank = (): Draft => ({
  uid: nextUid++,
  key: '',
  label: '',
  unit: 'kg',
  minimum: '',
  maximum: '',
  readings: '1',
  instrumentTypes: [],
  decisionRule: '',
  defaultUncertainty: '',
  note: '',
  formula: 'direct',
  cylinders: '4',
});

// A number for the schema; text that is not a number is sent as typed so the server names it (never read as "empty").
const num = (v: string) => {
  const n = numberOrNull(v);
  return n != null && Number.isNaN(n) ? v : n;
};

/** The items as the rules document takes them (the server checks every field and answers per field). */
export function itemsForRules(drafts: Draft[]) {
  return drafts.map((d) => ({
    key: d.key.trim(),
    label: d.label,
    unit: d.unit,
    minimum: num(d.minimum),
    maximum: num(d.maximum),
    readings: num(d.readings),
    instrumentTypes: d.instrumentTypes,
    decisionRule: d.decisionRule || null,
    defaultUncertainty: num(d.defaultUncertainty),
    note: d.note,
    formula:
      d.formula === 'engine_capacity' ? { kind: 'engine_capacity', cylinders: num(d.cylinders) } : { kind: 'direct' },
  }));
}

type Err = (path: string) => string | undefined;

/** The nozzle's check method with the difference between a gauge and two-point readings explained. */
export function NozzleMethodFields({ rules, err }: { rules: ClassRules; err: Err }) {
  const [method, setMethod] = useState(rules.nozzle.checkMethod ?? 'two_point');
  return (
    <fieldset className="space-y-3 sm:col-span-2" data-testid="nozzle-method">
      <legend className="mb-2 font-bold">How the diameter limits are checked</legend>
      {CHECK_METHODS.map((m) => (
        <label key={m} className="flex min-h-touch items-start gap-3 rounded-lg border border-paper-line p-3">
          <input
            type="radio"
            name="nozzle.checkMethod"
            value={m}
            checked={method === m}
            onChange={() => setMethod(m)}
            className="mt-1 h-6 w-6"
          />
          <span>{CHECK_METHOD_WORDS[m]}</span>
        </label>
      ))}
      <p className="rounded-lg bg-paper-deep p-3 text-ink-soft" data-testid="gauge-explanation">
        {CHECK_METHOD_EXPLANATION}
      </p>
      {method !== 'two_point' && (
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField
            name="nozzle.gaugeNoGoMm"
            label="No-go plug gauge (against the maximum)"
            unit="mm"
            inputMode="decimal"
            defaultValue={rules.nozzle.gaugeNoGoMm ?? rules.nozzle.maxMm ?? ''}
            error={err('nozzle.gaugeNoGoMm')}
          />
          <TextField
            name="nozzle.gaugeGoMm"
            label="Go plug gauge (against the minimum)"
            unit="mm"
            inputMode="decimal"
            defaultValue={rules.nozzle.gaugeGoMm ?? rules.nozzle.minMm ?? ''}
            error={err('nozzle.gaugeGoMm')}
          />
        </div>
      )}
    </fieldset>
  );
}

/** Add, edit and remove the class's own measured items; their JSON travels in one hidden field. */
export function MeasuredItemsEditor({ items, err }: { items: MeasuredItemRule[]; err: Err }) {
  const [drafts, setDrafts] = useState<Draft[]>(() => items.map(toDraft));
  const set = (uid: number, patch: Partial<Draft>) =>
    setDrafts((ds) => ds.map((d) => (d.uid === uid ? { ...d, ...patch } : d)));
  return (
    <fieldset className="space-y-4" data-testid="measured-items">
      <legend className="mb-2 text-lg font-bold">The class’s own measured items</legend>
      <p className="text-ink-soft">
        Anything else the class limits: engine capacity from bore and stroke, ballast, noise at a stated distance, fuel
        density. A size in mm is decided on its largest or smallest reading (each is a local size, ISO 14405-1:2016);
        any other quantity on the mean of its readings, with their spread in U (JCGM 100:2008, 4.2). Each item is
        decided like the nozzle, under its own decision rule or the class’s.
      </p>
      <input type="hidden" name="measuredItemsJson" value={JSON.stringify(itemsForRules(drafts))} />
      <FieldError name="rules.measuredItems" id="measuredItems-error" error={err('measuredItems')} />
      {drafts.map((d, i) => {
        const e = (f: string) => err(`measuredItems.${i}.${f}`);
        const id = (f: string) => `item-${d.uid}-${f}`;
        return (
          <fieldset
            key={d.uid}
            className="grid gap-3 rounded-lg border border-paper-line p-3 sm:grid-cols-2"
            data-testid="measured-item"
          >
            <legend className="px-1 font-bold">{d.label || `Item ${i + 1}`}</legend>
            <TextField
              name={id('label')}
              label="Name"
              value={d.label}
              onChange={(ev) => set(d.uid, { label: ev.target.value })}
              error={e('label')}
            />
            <TextField
              name={id('key')}
              label="Key"
              hint="Lower-case letters, digits, underscores; fixed once boats are inspected."
              value={d.key}
              onChange={(ev) => set(d.uid, { key: ev.target.value })}
              error={e('key')}
            />
            <div>
              <label htmlFor={id('formula')} className="field-label">
                Value from
              </label>
              <select
                id={id('formula')}
                className="field-input"
                value={d.formula}
                onChange={(ev) =>
                  set(d.uid, {
                    formula: ev.target.value,
                    ...(ev.target.value === 'engine_capacity' ? { unit: 'cm³' } : {}),
                  })
                }
              >
                <option value="direct">The reading itself</option>
                <option value="engine_capacity">Engine capacity from bore and stroke</option>
              </select>
              <FieldError name={id('formula')} id={`${id('formula')}-error`} error={e('formula')} />
            </div>
            {d.formula === 'engine_capacity' ? (
              <TextField
                name={id('cylinders')}
                label="Cylinders"
                inputMode="numeric"
                hint="V = cylinders · π/4 · bore² · stroke (the geometric cylinder volume)."
                value={d.cylinders}
                onChange={(ev) => set(d.uid, { cylinders: ev.target.value })}
                error={e('formula.cylinders')}
              />
            ) : (
              <div />
            )}
            <div>
              <label htmlFor={id('unit')} className="field-label">
                Unit
              </label>
              <select
                id={id('unit')}
                className="field-input"
                value={d.unit}
                onChange={(ev) => set(d.uid, { unit: ev.target.value })}
              >
                {ITEM_UNITS.map((u) => (
                  <option key={u} value={u}>
                    {u} — {ITEM_UNIT_FACTS[u].quantity}
                  </option>
                ))}
              </select>
              <FieldError name={id('unit')} id={`${id('unit')}-error`} error={e('unit')} />
            </div>
            <TextField
              name={id('readings')}
              label="Readings required"
              unit="count"
              inputMode="numeric"
              value={d.readings}
              onChange={(ev) => set(d.uid, { readings: ev.target.value })}
              error={e('readings')}
            />
            <TextField
              name={id('minimum')}
              label="Minimum"
              unit={d.unit}
              inputMode="decimal"
              value={d.minimum}
              onChange={(ev) => set(d.uid, { minimum: ev.target.value })}
              error={e('minimum')}
            />
            <TextField
              name={id('maximum')}
              label="Maximum"
              unit={d.unit}
              inputMode="decimal"
              value={d.maximum}
              onChange={(ev) => set(d.uid, { maximum: ev.target.value })}
              error={e('maximum')}
            />
            <TextField
              name={id('defaultUncertainty')}
              label="Default expanded uncertainty U (k = 2)"
              unit={d.unit}
              inputMode="decimal"
              value={d.defaultUncertainty}
              onChange={(ev) => set(d.uid, { defaultUncertainty: ev.target.value })}
              error={e('defaultUncertainty')}
            />
            <div>
              <label htmlFor={id('decisionRule')} className="field-label">
                Decision rule
              </label>
              <select
                id={id('decisionRule')}
                className="field-input"
                value={d.decisionRule}
                onChange={(ev) => set(d.uid, { decisionRule: ev.target.value })}
              >
                <option value="">The class’s decision rule</option>
                <option value="simple">Simple acceptance</option>
                <option value="guarded">Guarded acceptance</option>
                <option value="iso14253">ISO 14253-1 three-way</option>
              </select>
            </div>
            <TextField
              name={id('note')}
              label="Note (conditions)"
              hint="For example “at 0.5 m, engine at full throttle”."
              value={d.note}
              onChange={(ev) => set(d.uid, { note: ev.target.value })}
              error={e('note')}
              className="sm:col-span-2"
            />
            <fieldset className="sm:col-span-2">
              <legend className="field-label">Instruments that may be used</legend>
              <div className="grid gap-1 sm:grid-cols-3">
                {INSTRUMENT_TYPES.map((t) => (
                  <label key={t} className="flex min-h-touch items-center gap-2">
                    <input
                      type="checkbox"
                      className="h-6 w-6"
                      checked={d.instrumentTypes.includes(t)}
                      onChange={(ev) =>
                        set(d.uid, {
                          instrumentTypes: ev.target.checked
                            ? [...d.instrumentTypes, t]
                            : d.instrumentTypes.filter((x) => x !== t),
                        })
                      }
                    />
                    {INSTRUMENT_TYPE_LABELS[t]}
                  </label>
                ))}
              </div>
              <FieldError
                name={id('instrumentTypes')}
                id={`${id('instrumentTypes')}-error`}
                error={e('instrumentTypes')}
              />
            </fieldset>
            <button
              type="button"
              className="btn-secondary sm:col-span-2"
              onClick={() => setDrafts((ds) => ds.filter((x) => x.uid !== d.uid))}
            >
              Remove {d.label || `item ${i + 1}`}
            </button>
          </fieldset>
        );
      })}
      {drafts.length < MAX_MEASURED_ITEMS && (
        <button type="button" className="btn-secondary" onClick={() => setDrafts((ds) => [...ds, blank()])}>
          Add a measured item
        </button>
      )}
    </fieldset>
  );
}
