'use client';

import { JsonStepForm } from '@/components/forms/json-step-form';

/** A technical delegate's report to the stewards, without a protest. */
export function ReportForm({ eventId, entries }: { eventId: string; entries: Record<string, string> }) {
  return (
    <JsonStepForm
      title="Report to the stewards"
      url={`/api/events/${eventId}/technical-reports`}
      button="Send the report"
      fields={[
        { name: 'entryId', label: 'Entry', kind: 'select', options: { '': 'Choose…', ...entries } },
        { name: 'ruleReference', label: 'Rule concerned', kind: 'text' },
        { name: 'facts', label: 'What was found', kind: 'textarea' },
      ]}
    />
  );
}
