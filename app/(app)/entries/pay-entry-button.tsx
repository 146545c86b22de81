'use client';

import { PayButton } from '@/components/forms/pay-button';

/** Opens the payment page for an unpaid entry (the provider's hosted page) and sends the browser there. */
export function PayEntryButton({ entryId, label = 'Pay entry fee' }: { entryId: string; label?: string }) {
  return <PayButton checkoutUrl={`/api/entries/${entryId}/checkout`} label={label} />;
}
