'use client';

import { useRouter } from 'next/navigation';
import { useJsonSubmit } from '@/components/ui/use-json-submit';
import type { EventEntryRow } from '@/lib/server/entries/list-event-entries';

export function CancelEntryButton({ eventId, entry }: { eventId: string; entry: EventEntryRow }) {
  const router = useRouter();
  const { submit, isBusy, message } = useJsonSubmit();
  if (entry.status === 'cancelled' || entry.status === 'withdrawn') return null;
  async function onClick() {
    const reason = window.prompt(`Cancel entry #${entry.raceNumber} (${entry.boatName})? ${entry.paidAt ? 'The fee will be refunded. ' : ''}Reason for the entrant:`);
    if (!reason) return;
    const res = await submit(`/api/events/${eventId}/entries/${entry.id}/cancel`, { reason });
    if (res.ok) router.refresh();
  }
  return (
    <span>
      <button type="button" className="btn-danger min-h-touch px-3 text-sm" disabled={isBusy} onClick={onClick}>Cancel</button>
      {message && <span className="field-error block text-sm">{message.text}</span>}
    </span>
  );
}
