// Curve points typed one a line (the boat page's engine and pump form, the organiser's pump catalogue)
// become numbers for the request body, and the server's field errors ("engine.curve.1.rpm") are shown
// beside the box they came from. Pure: runs in the browser and in tests.

type FieldErrors = Record<string, string>;

export type CurveText = { ok: true; points: number[][] } | { ok: false; message: string };

/** "7000 310" or "7000, 310" per line; blank lines are skipped. Each line needs exactly `columns` numbers. */
export function parseCurveText(text: string, columns: number, what: string): CurveText {
  const points: number[][] = [];
  const lines = text.split(/\r?\n/);
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i].trim();
    if (line === '') continue;
    const cells = line.split(/[\s,;]+/);
    const values = cells.map((c) => Number(c));
    if (cells.length !== columns || values.some((v) => !Number.isFinite(v)))
      return { ok: false, message: `Line ${i + 1}: give ${what} as ${columns} numbers.` };
    points.push(values);
  }
  return { ok: true, points };
}

export const curveToText = (points: number[][]) => points.map((p) => p.join(' ')).join('\n');

/** Which box shows a server field error: the longest matching prefix among the boxes. */
export function fieldErrorsByBox(errors: FieldErrors, boxes: readonly string[]): FieldErrors {
  const out: FieldErrors = {};
  const sorted = [...boxes].sort((a, b) => b.length - a.length);
  for (const [field, message] of Object.entries(errors)) {
    const box = sorted.find((b) => field === b || field.startsWith(`${b}.`));
    const key = box ?? 'form';
    // "engine.curve.1.rpm" reads "Point 2: rpm must increase…" beside the engine curve box.
    const point = box && /^\.(\d+)/.exec(field.slice(box.length));
    out[key] ??= point ? `Point ${Number(point[1]) + 1}: ${message}` : message;
  }
  return out;
}
