'use client';

import { JsonStepForm } from '@/components/forms/json-step-form';

/** The appeal body's two steps: the hearing, and the decision (an amendment names the replacing penalty). */
export function AppealBodyActions({ appealId, catalogue }: { appealId: string; catalogue: Record<string, string> }) {
  return (
    <div className="space-y-4">
      <JsonStepForm
        title="Set the hearing"
        url={`/api/appeals/${appealId}/hearing`}
        button="Set the hearing"
        fields={[
          { name: 'hearingAt', label: 'Date and time (your device’s time zone)', kind: 'datetime' },
          { name: 'place', label: 'Place', kind: 'text' },
        ]}
      />
      <JsonStepForm
        title="Decide the appeal"
        url={`/api/appeals/${appealId}/decision`}
        button="Record the decision"
        danger
        fields={[
          {
            name: 'outcome',
            label: "The stewards' decision is",
            kind: 'select',
            options: {
              '': 'Choose…',
              confirmed: 'Confirmed',
              amended: 'Amended',
              annulled: 'Annulled',
              superseded: 'Already ended by another appeal (close this one, refund the fee)',
            },
          },
          { name: 'reasons', label: 'Reasons', kind: 'textarea' },
          {
            name: 'catalogueItemId',
            label: 'Replacing penalty (amended only)',
            kind: 'select',
            options: { '': 'None', ...catalogue },
            optional: true,
          },
          {
            name: 'runLabel',
            label: 'Run struck out (a replacing run disqualification only)',
            kind: 'text',
            optional: true,
          },
        ]}
      />
    </div>
  );
}
