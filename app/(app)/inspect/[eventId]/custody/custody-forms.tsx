'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { TextField } from '@/components/ui/text-field';
import { FormMessage, numberOrNull, useJsonSubmit } from '@/components/ui/use-json-submit';

/** At the dock: which boat, what part, the seal or bag number, and (for stewards) the protest it is kept for. */
export function TakeIntoCustodyForm({ eventId, protests }: { eventId: string; protests: { id: string; label: string }[] }) {
  const router = useRouter();
  const { submit, isBusy, fieldErrors, message, setMessage } = useJsonSubmit();
  const [formKey, setFormKey] = useState(0);
  return (
    <form key={formKey} className="card space-y-3" aria-labelledby="take-heading" noValidate onSubmit={async (e) => {
      e.preventDefault();
      const f = new FormData(e.currentTarget);
      const res = await submit(`/api/events/${eventId}/custody`, {
        raceNumber: numberOrNull(f.get('raceNumber')) ?? NaN, description: f.get('description'), sealNumber: f.get('sealNumber') || null,
        ...(protests.length ? { protestId: f.get('protestId') || null } : {}),
      });
      if (res.ok) { setFormKey((k) => k + 1); setMessage({ tone: 'ok', text: 'Taken into custody.' }); router.refresh(); }
    }}>
      <h2 id="take-heading" className="text-xl">Take a part into custody</h2>
      <TextField name="raceNumber" label="Race number" inputMode="numeric" error={fieldErrors.raceNumber} />
      <TextField name="description" label="Part" hint="For example: impeller, nozzle insert, cracked ride plate." error={fieldErrors.description} />
      <TextField name="sealNumber" label="Seal or bag number" hint="Leave empty if the part is not bagged." error={fieldErrors.sealNumber} />
      {protests.length > 0 && (
        <div>
          <label htmlFor="protestId" className="field-label">Kept for a protest</label>
          <select id="protestId" name="protestId" className="field-input min-h-touch" defaultValue="">
            <option value="">No protest</option>
            {protests.map((p) => <option key={p.id} value={p.id}>{p.label}</option>)}
          </select>
          {fieldErrors.protestId && <p className="field-error" data-field-error="protestId">{fieldErrors.protestId}</p>}
        </div>
      )}
      <button type="submit" className="btn-primary text-lg" disabled={isBusy}>{isBusy ? 'Saving…' : 'Take into custody'}</button>
      <FormMessage message={message} />
    </form>
  );
}

/** Hand a part back: to whom, and why; refused by the server while its protest is open. */
export function ReleaseForm({ eventId, itemId, pendingProtest }: { eventId: string; itemId: string; pendingProtest: boolean }) {
  const router = useRouter();
  const { submit, isBusy, fieldErrors, message } = useJsonSubmit();
  const [open, setOpen] = useState(false);
  if (!open) return <button type="button" className="btn-secondary min-h-touch text-base" onClick={() => setOpen(true)}>Release…</button>;
  return (
    <form className="space-y-2 pt-2" noValidate onSubmit={async (e) => {
      e.preventDefault();
      const f = new FormData(e.currentTarget);
      if ((await submit(`/api/events/${eventId}/custody/${itemId}/release`, { releasedTo: f.get('releasedTo'), note: f.get('note') ?? '' })).ok) router.refresh();
    }}>
      {pendingProtest && <p className="text-base text-doubt-800">Its protest is not decided yet: the part stays in custody until it is.</p>}
      <TextField id={`releasedTo-${itemId}`} name="releasedTo" label="Released to" hint="Who receives it: the entrant, a named crew member." error={fieldErrors.releasedTo} />
      <TextField id={`note-${itemId}`} name="note" label="Note" error={fieldErrors.note} />
      <button type="submit" className="btn-primary text-base" disabled={isBusy}>{isBusy ? 'Releasing…' : 'Release the part'}</button>
      <FormMessage message={message} />
    </form>
  );
}
