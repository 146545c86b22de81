'use client';

import { useRouter } from 'next/navigation';
import { useJsonSubmit, FormMessage } from '@/components/ui/use-json-submit';

export function PublishReportForm({ eventId, classId, nextNumber, canPublish }: { eventId: string; classId: string; nextNumber: number; canPublish: boolean }) {
  const router = useRouter();
  const { submit, isBusy, fieldErrors, message, setMessage } = useJsonSubmit<{ publicId: string; number: number }>();
  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    if (isBusy) return;
    const note = String(new FormData(e.currentTarget).get('note') ?? '');
    const res = await submit(`/api/events/${eventId}/classes/${classId}/report/publish`, { note });
    if (res.ok) {
      setMessage({ tone: 'ok', text: `Version ${res.data.number} published; the class's entrants were e-mailed the link.` });
      router.refresh();
    }
  }
  return (
    <form onSubmit={onSubmit} noValidate aria-busy={isBusy}>
      <fieldset disabled={isBusy || !canPublish} className="space-y-3">
        <label htmlFor="note" className="field-label">Note for readers (optional)</label>
        <textarea id="note" name="note" rows={3} className="field-input" />
        {fieldErrors.note && <p className="field-error">{fieldErrors.note}</p>}
        {/* Publishing computes the figures, draws the PDF and e-mails the class: several seconds, so say so while it runs. */}
        <div role="status" aria-live="polite" data-testid="publish-progress">
          {isBusy && (
            <div className="space-y-2 rounded-lg bg-tide-50 p-3 text-tide-700">
              <p className="font-bold">Publishing version {nextNumber}: computing the figures, making the PDF and e-mailing the class. This takes a few seconds; keep this page open.</p>
              <progress className="h-3 w-full" aria-label="Publishing the report">Publishing…</progress>
            </div>
          )}
        </div>
        <FormMessage message={message} />
        <button type="submit" className="btn-primary">{isBusy ? 'Publishing…' : `Publish as version ${nextNumber}`}</button>
        {!canPublish && <p className="field-hint">No boat has a conforming inspection yet.</p>}
      </fieldset>
    </form>
  );
}
