'use server';

import { ZodError } from 'zod';
import { getActor } from '@/lib/auth/actor';
import { changePassword } from '@/lib/accounts/change-password';
import { AppError, fieldErrors } from '@/lib/http/errors';

export type ActionResult = { ok: boolean; message?: string; fieldErrors?: Record<string, string> };

export async function changePasswordAction(_prev: ActionResult | null, form: FormData): Promise<ActionResult> {
  try {
    await changePassword(await getActor(), { password: form.get('password') });
    return { ok: true, message: 'Password changed.' };
  } catch (err) {
    if (err instanceof ZodError) return { ok: false, fieldErrors: fieldErrors(err) };
    if (err instanceof AppError) return { ok: false, message: err.message };
    throw err;
  }
}
