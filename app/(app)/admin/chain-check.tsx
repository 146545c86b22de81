'use client';

import { useRouter } from 'next/navigation';
import { FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

/** The site administrator's button: re-verify every record chain against the live rows now. */
export function ChainCheckButton() {
  const router = useRouter();
  const check = useFormAction(
    async (): Promise<FormState> => {
      const answer = await requestJson('/api/admin/chain/check', { method: 'POST', body: {} });
      if (!answer.ok) return refusalState(answer);
      router.refresh();
      return { ok: true };
    },
    { ok: false },
  );
  return (
    <form {...check.form} className="space-y-1">
      <FormMessage state={check.state} />
      <button type="submit" className="btn-secondary min-h-touch px-3 text-sm" disabled={check.isPending}>
        {check.isPending ? 'Checking every chain…' : 'Check the record chains now'}
      </button>
    </form>
  );
}
