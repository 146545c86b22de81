import type { InputHTMLAttributes } from 'react';

type Props = InputHTMLAttributes<HTMLInputElement> & {
  name: string;
  label: string;
  hint?: string;
  error?: string;
  unit?: string;
};

/** A labelled input with its hint and its error beside it (linked by aria-describedby). */
export function TextField({ name, label, hint, error, unit, id, className = '', ...rest }: Props) {
  const inputId = id ?? name;
  const describedBy = [hint && `${inputId}-hint`, error && `${inputId}-error`].filter(Boolean).join(' ') || undefined;
  return (
    <div className={className}>
      <label htmlFor={inputId} className="field-label">
        {label}
        {unit && <span className="ml-1 font-normal text-ink-mute">({unit})</span>}
      </label>
      <input
        id={inputId}
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className="field-input"
        {...rest}
      />
      {hint && (
        <p id={`${inputId}-hint`} className="field-hint">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${inputId}-error`} className="field-error" data-field-error={name}>
          {error}
        </p>
      )}
    </div>
  );
}
