'use client';

import { JsonStepForm } from '@/components/forms/json-step-form';
import { PENALTY_KIND_LABELS } from '@/lib/core/penalties/penalty-kinds';

/** The organiser adds one item to the meeting's penalty catalogue. */
export function CatalogueForm({ eventId }: { eventId: string }) {
  return (
    <JsonStepForm
      title="Add a penalty"
      url={`/api/events/${eventId}/penalty-catalogue`}
      button="Add to the catalogue"
      fields={[
        { name: 'code', label: 'Code', kind: 'text', hint: 'Short, unique at this meeting (for example T5).' },
        { name: 'kind', label: 'Kind', kind: 'select', options: { '': 'Choose…', ...PENALTY_KIND_LABELS } },
        {
          name: 'amount',
          label: 'Amount',
          kind: 'number',
          optional: true,
          hint: 'Seconds added, places or points deducted, or a fine in cents; empty for the other kinds.',
        },
        { name: 'label', label: 'Description', kind: 'text' },
        { name: 'ruleReference', label: 'Rule', kind: 'text', optional: true },
      ]}
    />
  );
}
