'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { FormMessage } from '@/components/forms/form-message';
import { requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

/** Reissue the QR tag, after a confirmation that says what happens to the old sticker. */
export function ReissueTagButton({ boatId }: { boatId: string }) {
  const router = useRouter();
  const [isAsking, setAsking] = useState(false);
  const [dismissed, setDismissed] = useState<FormState | null>(null);
  const { state, isPending, form } = useFormAction(async (): Promise<FormState> => {
    const answer = await requestJson(`/api/boats/${boatId}/tag`, {
      fallbackMessage: 'The tag could not be reissued. Try again.',
    });
    setAsking(false);
    if (!answer.ok) return { ok: false, message: answer.message };
    router.refresh();
    return { ok: true, message: 'New tag issued. Download it, print it and replace the old sticker.' };
  }, null);

  return (
    <div className="space-y-2">
      {!isAsking ? (
        <button
          type="button"
          className="btn-secondary"
          onClick={() => {
            setDismissed(state);
            setAsking(true);
          }}
        >
          Reissue tag
        </button>
      ) : (
        <div
          role="alertdialog"
          aria-labelledby="reissue-title"
          aria-describedby="reissue-text"
          className="rounded-lg border-2 border-flare-500 bg-flare-100 p-4 space-y-3"
        >
          <p id="reissue-title" className="font-bold">
            Reissue this boat&apos;s tag?
          </p>
          <p id="reissue-text">
            The old sticker stops working at once: anyone who scans it is told it was replaced. Do this only if the tag
            is lost or damaged, and fix the new one before inspection.
          </p>
          <form {...form} className="flex flex-wrap gap-2">
            <button type="submit" className="btn-danger" disabled={isPending}>
              {isPending ? 'Reissuing…' : 'Yes, reissue the tag'}
            </button>
            <button type="button" className="btn-secondary" onClick={() => setAsking(false)} disabled={isPending}>
              Keep the current tag
            </button>
          </form>
        </div>
      )}
      <FormMessage state={dismissed === state ? null : state} testId="reissue-message" />
    </div>
  );
}
