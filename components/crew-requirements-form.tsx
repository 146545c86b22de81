'use client';

import { useRouter } from 'next/navigation';
import { FormMessage } from '@/components/forms/form-message';
import { refusalState, requestJson, type FormState } from '@/components/forms/request-json';
import { useFormAction } from '@/components/forms/use-form-action';

/** The organiser sets the licence grades this class accepts (comma-separated; empty: any) and whether it needs a navigator. */
export function CrewRequirementsForm({
  eventId,
  classId,
  grades,
  navigatorRequired,
}: {
  eventId: string;
  classId: string;
  grades: string[];
  navigatorRequired: boolean;
}) {
  const router = useRouter();
  const { state, isPending, form } = useFormAction<FormState | null>(async (_prev, data) => {
    const text = String(data.get('grades') ?? '');
    const answer = await requestJson(`/api/events/${eventId}/crew-requirements`, {
      method: 'PUT',
      body: {
        classId,
        acceptedLicenceGrades: text
          .split(',')
          .map((g) => g.trim())
          .filter(Boolean),
        navigatorRequired: data.get('navigatorRequired') === 'on',
      },
    });
    if (!answer.ok) {
      const refused = refusalState(answer);
      const gradeError = Object.entries(answer.fieldErrors).find(([k]) => k.startsWith('acceptedLicenceGrades'));
      return gradeError ? { ...refused, fieldErrors: { grades: gradeError[1] } } : refused;
    }
    router.refresh();
    return { ok: true, message: 'Saved: entries of this class are judged against it now.' };
  }, null);
  const error = state?.fieldErrors?.grades;
  return (
    <form {...form} className="space-y-3" data-testid="crew-requirements-form">
      <div>
        <label htmlFor="crew-grades" className="field-label">
          Licence grades accepted (comma-separated; empty accepts any)
        </label>
        <input
          id="crew-grades"
          name="grades"
          defaultValue={grades.join(', ')}
          className="field-input"
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? 'crew-grades-error' : undefined}
        />
        {error && (
          <p id="crew-grades-error" className="field-error">
            {error}
          </p>
        )}
      </div>
      <label className="flex items-center gap-2">
        <input type="checkbox" name="navigatorRequired" defaultChecked={navigatorRequired} />A navigator is required
      </label>
      <FormMessage state={state} testId="crew-requirements-message" />
      <button type="submit" className="btn-primary" disabled={isPending}>
        {isPending ? 'Saving…' : 'Save the crew requirements'}
      </button>
    </form>
  );
}
