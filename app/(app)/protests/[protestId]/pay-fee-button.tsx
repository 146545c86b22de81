'use client';

import { PayButton } from '@/components/forms/pay-button';

/** Opens (or reopens: the same session) the payment page for the protest fee. */
export function PayFeeButton({ protestId, label }: { protestId: string; label: string }) {
  return <PayButton checkoutUrl={`/api/protests/${protestId}/checkout`} label={label} />;
}
