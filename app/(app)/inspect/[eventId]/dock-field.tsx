import type { InputHTMLAttributes } from 'react';

type Props = InputHTMLAttributes<HTMLInputElement> & {
  id: string;
  label: string;
  unit?: string;
  error?: string;
  hint?: string;
};

/** A dock input: large text, a 48 px target, the unit in the label and the error right beside it. */
export function DockField({ id, label, unit, error, hint, className = '', ...rest }: Props) {
  const describedBy = [hint && `${id}-hint`, error && `${id}-error`].filter(Boolean).join(' ') || undefined;
  return (
    <div className={className}>
      <label htmlFor={id} className="field-label text-lg">
        {label}
        {unit && <span className="ml-1 font-normal text-ink-soft">({unit})</span>}
      </label>
      <input
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className="field-input min-h-touch text-xl"
        {...rest}
      />
      {hint && (
        <p id={`${id}-hint`} className="mt-1 text-lg text-ink-soft">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="field-error text-lg" data-field-error={id}>
          {error}
        </p>
      )}
    </div>
  );
}
