import { requestJson, type FormState } from './request-json';

/**
 * Opens the payment provider's page for a checkout route (an entry's fee, a protest's fee): asks the
 * app for the session (the same one again when reopened) and sends the browser there.
 */
export async function openCheckout(
  checkoutUrl: string,
  fallbackMessage = 'The payment page could not be opened. Try again.',
): Promise<FormState> {
  const answer = await requestJson<{ url?: string } | null>(checkoutUrl, { method: 'POST', fallbackMessage });
  if (!answer.ok) return { ok: false, message: answer.message };
  if (!answer.data?.url) return { ok: false, message: fallbackMessage };
  window.location.assign(answer.data.url);
  return { ok: true };
}
