'use client';

import { useFormAction } from './use-form-action';
import { openCheckout } from './checkout';
import { FormMessage } from './form-message';

/** Pays a fee on the provider's hosted page; stays busy while the browser leaves for it. */
export function PayButton({ checkoutUrl, label }: { checkoutUrl: string; label: string }) {
  const { state, isPending, form } = useFormAction(async () => openCheckout(checkoutUrl), null);
  const isLeaving = isPending || state?.ok === true;
  return (
    <form {...form} className="space-y-1">
      <FormMessage state={state} testId="pay-message" />
      <button type="submit" className="btn-primary" disabled={isLeaving}>
        {isLeaving ? 'Opening the payment page…' : label}
      </button>
    </form>
  );
}
