// The form's general message, above its button: the result when it worked, or what went wrong
// that no single field can show. Announced politely; always in the page, so the announcement fires.
export function FormMessage({
  state,
  testId = 'form-message',
  className = '',
}: {
  state?: { ok: boolean; message?: string } | null;
  testId?: string;
  className?: string;
}) {
  return (
    <p
      aria-live="polite"
      role="status"
      data-testid={testId}
      className={`${state?.ok ? 'font-bold text-pass-600' : 'field-error'} ${className}`.trim()}
    >
      {state?.message}
    </p>
  );
}

/** A field's own error, under it; its id is what the field's aria-describedby names. */
export function FieldError({
  id,
  name,
  error,
  className = '',
}: {
  id?: string;
  name: string;
  error?: string;
  className?: string;
}) {
  if (!error) return null;
  return (
    <p id={id ?? `${name}-error`} className={`field-error ${className}`.trim()} data-field-error={name}>
      {error}
    </p>
  );
}
