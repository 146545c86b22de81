// Reading typed form values for a schema: the same rules in every form and in the server's CSV reader.

/** A number typed into a field, or null when it is empty; a decimal comma is read as a point; NaN stays NaN so the schema reports it. */
export function numberOrNull(value: unknown): number | null {
  if (value === null || value === undefined || String(value).trim() === '') return null;
  return Number(String(value).trim().replace(',', '.'));
}
