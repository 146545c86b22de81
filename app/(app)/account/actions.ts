'use server';

import { ZodError } from 'zod';
import { getActor } from '@/lib/server/auth/actor';
import { changeName } from '@/lib/server/accounts/change-name';
import { changePassword, signOutEverywhere } from '@/lib/server/accounts/change-password';
import { resendAddressProof } from '@/lib/server/accounts/prove-address';
import { AppError, fieldErrors } from '@/lib/core/errors';

export type ActionResult = { ok: boolean; message?: string; fieldErrors?: Record<string, string> };

function toResult(err: unknown): ActionResult {
  if (err instanceof ZodError) return { ok: false, fieldErrors: fieldErrors(err) };
  if (err instanceof AppError) {
    const details = Array.isArray(err.details) ? (err.details as { field: string; message: string }[]) : [];
    return {
      ok: false,
      message: err.message,
      ...(details.length > 0 && { fieldErrors: Object.fromEntries(details.map((d) => [d.field, d.message])) }),
    };
  }
  throw err;
}

export async function changeNameAction(_prev: ActionResult | null, form: FormData): Promise<ActionResult> {
  try {
    const { name } = await changeName(await getActor(), { name: form.get('name') });
    return { ok: true, message: `Saved: you are ${name}.` };
  } catch (err) {
    return toResult(err);
  }
}

export async function changePasswordAction(_prev: ActionResult | null, form: FormData): Promise<ActionResult> {
  try {
    await changePassword(await getActor(), {
      currentPassword: form.get('currentPassword') ?? '',
      password: form.get('password'),
    });
    return { ok: true, message: 'Password changed. Every session on every device has ended.' };
  } catch (err) {
    return toResult(err);
  }
}

/** Ends every session of the person; the form must say so explicitly (confirm=everywhere). */
export async function signOutEverywhereAction(_prev: ActionResult | null, form: FormData): Promise<ActionResult> {
  try {
    const actor = await getActor();
    if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
    if (form.get('confirm') !== 'everywhere')
      return {
        ok: false,
        message: 'Confirm that every session should end.',
        fieldErrors: { confirm: 'Confirm that every session should end.' },
      };
    await signOutEverywhere(actor);
    return { ok: true, message: 'Every session has ended, this one too.' };
  } catch (err) {
    return toResult(err);
  }
}

export async function resendAddressProofAction(_prev: ActionResult | null, form: FormData): Promise<ActionResult> {
  try {
    const actor = await getActor();
    if (!actor) throw new AppError('unauthenticated', 401, 'Sign in to do this.');
    if (form.get('confirm') !== 'send')
      return {
        ok: false,
        message: 'Confirm that a new link should be sent.',
        fieldErrors: { confirm: 'Confirm that a new link should be sent.' },
      };
    const { email } = await resendAddressProof(actor);
    return { ok: true, message: `A new link is on its way to ${email}.` };
  } catch (err) {
    return toResult(err);
  }
}
