'use client';

import { startTransition, useActionState, useEffect, useRef, type FormEvent } from 'react';
import type { FormState } from './request-json';

/**
 * The one form pattern: a native <form> whose action runs through React's useActionState and
 * returns { ok, message?, fieldErrors? } (a server action, or a client function that calls
 * requestJson). Spread `form` on the <form>; disable the button (or fieldset) with `isPending`.
 *
 * The form submits through onSubmit inside a transition rather than through the `action` prop:
 * React resets every field once an `action` prop's transition ends, refused or not, and a refused
 * form must keep what was typed. A second submit while the first is on its way does nothing.
 */
export function useFormAction<S extends FormState | null>(
  action: (previous: S, form: FormData) => Promise<S>,
  initial: S,
  { resetOnSuccess = false }: { resetOnSuccess?: boolean } = {},
) {
  const ref = useRef<HTMLFormElement>(null);
  const isSending = useRef(false);
  const [state, dispatch, isPending] = useActionState<S, FormData>(async (previous: S, form: FormData) => {
    try {
      return await action(previous, form);
    } finally {
      isSending.current = false;
    }
  }, initial as Awaited<S>);
  useEffect(() => {
    if (resetOnSuccess && state?.ok) ref.current?.reset();
  }, [state, resetOnSuccess]);
  function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    if (isSending.current) return;
    isSending.current = true;
    // The button that submitted is part of the form's data, as in a native submission.
    const data = new FormData(e.currentTarget, (e.nativeEvent as SubmitEvent).submitter);
    startTransition(() => dispatch(data));
  }
  return { state, isPending, form: { ref, onSubmit, noValidate: true } };
}
