'use client';

import { PayButton } from '@/components/forms/pay-button';

/** Opens (or reopens: the same session) the payment page for the appeal fee. */
export function PayAppealFeeButton({ appealId, label }: { appealId: string; label: string }) {
  return <PayButton checkoutUrl={`/api/appeals/${appealId}/checkout`} label={label} />;
}
