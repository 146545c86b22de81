'use client';

import { useState } from 'react';

export type SubmitResult<T> = { ok: true; data: T } | { ok: false; message: string; fieldErrors: Record<string, string> };

/**
 * Sends JSON to a route handler and turns the one error shape into per-field messages, so every
 * form shows the server's error beside the field it names.
 */
export function useJsonSubmit<T = unknown>() {
  const [isBusy, setBusy] = useState(false);
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ tone: 'ok' | 'error'; text: string }>();

  async function submit(url: string, body: unknown, method = 'POST'): Promise<SubmitResult<T>> {
    setBusy(true);
    setMessage(undefined);
    setFieldErrors({});
    try {
      const res = await fetch(url, { method, headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
      const json = await res.json().catch(() => null);
      if (res.ok) return { ok: true, data: json?.data as T };
      const errors: Record<string, string> = {};
      for (const d of json?.error?.details ?? []) if (d?.field) errors[d.field] ??= d.message;
      const text = json?.error?.message ?? `The request failed (${res.status}).`;
      setFieldErrors(errors);
      setMessage({ tone: 'error', text: Object.keys(errors).length ? 'Check the fields that show a message: nothing was saved yet.' : text });
      return { ok: false, message: text, fieldErrors: errors };
    } catch {
      const text = 'No connection to the server: nothing was saved. Try again.';
      setMessage({ tone: 'error', text });
      return { ok: false, message: text, fieldErrors: {} };
    } finally {
      setBusy(false);
    }
  }

  return { submit, isBusy, fieldErrors, setFieldErrors, message, setMessage };
}

/** A number from a form field, or null when empty; NaN stays NaN so the schema reports it. */
export function numberOrNull(value: FormDataEntryValue | null): number | null {
  if (value === null || String(value).trim() === '') return null;
  return Number(String(value).replace(',', '.'));
}

export function FormMessage({ message }: { message?: { tone: 'ok' | 'error'; text: string } }) {
  return (
    <p aria-live="polite" role="status" className={message?.tone === 'ok' ? 'font-bold text-pass-600' : 'field-error'} data-testid="form-message">
      {message?.text}
    </p>
  );
}
