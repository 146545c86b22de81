'use client';

import { JsonStepForm } from '@/components/forms/json-step-form';

/** The stewards' form: one penalty from the catalogue, on one entry, from an upheld protest or a technical report. */
export function ImposePenaltyForm({
  eventId,
  entries,
  catalogue,
  reports,
  protests,
}: {
  eventId: string;
  entries: Record<string, string>;
  catalogue: Record<string, string>;
  reports: Record<string, string>;
  protests: Record<string, string>;
}) {
  return (
    <JsonStepForm
      title="Impose a penalty"
      url={`/api/events/${eventId}/penalties`}
      button="Impose the penalty"
      danger
      fields={[
        { name: 'entryId', label: 'Entry', kind: 'select', options: { '': 'Choose…', ...entries } },
        { name: 'catalogueItemId', label: 'Penalty', kind: 'select', options: { '': 'Choose…', ...catalogue } },
        {
          name: 'technicalReportId',
          label: 'From the technical report',
          kind: 'select',
          options: { '': 'None', ...reports },
          optional: true,
        },
        {
          name: 'protestId',
          label: 'Or from the upheld protest',
          kind: 'select',
          options: { '': 'None', ...protests },
          optional: true,
        },
        {
          name: 'runLabel',
          label: 'Run struck out',
          kind: 'text',
          optional: true,
          hint: 'Only for a disqualification from one run: the run as on the timing sheet (for example R2).',
        },
        { name: 'reason', label: 'Reason (shown beside the results row)', kind: 'textarea' },
      ]}
    />
  );
}
