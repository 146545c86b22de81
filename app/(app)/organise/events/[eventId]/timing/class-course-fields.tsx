import { FieldError } from '@/components/forms/form-message';

export type ClassOption = { classId: string; label: string };

/** The class and course length both run-time forms ask first (ids prefixed so two forms share a page). */
export function ClassAndCourseFields({
  idPrefix,
  classes,
  errors,
  isCourseRequired = false,
}: {
  idPrefix: string;
  classes: ClassOption[];
  errors: Record<string, string | undefined>;
  isCourseRequired?: boolean;
}) {
  return (
    <>
      <div>
        <label htmlFor={`${idPrefix}-class`} className="field-label">
          Class
        </label>
        <select id={`${idPrefix}-class`} name="classId" className="field-input">
          {classes.map((c) => (
            <option key={c.classId} value={c.classId}>
              {c.label}
            </option>
          ))}
        </select>
        <FieldError name="classId" error={errors.classId} />
      </div>
      <div>
        <label htmlFor={`${idPrefix}-course`} className="field-label">
          Course length (m)
        </label>
        <input
          id={`${idPrefix}-course`}
          name="courseLengthM"
          inputMode="decimal"
          className="field-input"
          required={isCourseRequired}
        />
        <FieldError name="courseLengthM" error={errors.courseLengthM} />
      </div>
    </>
  );
}
