// Run times from the timing sheet, as a CSV file or typed in: one zod schema per row (SI units: seconds,
// m/s), a CSV reader that says each line's problem without throwing for it (the preview shows them all),
// and the JSON shape of the hand-entry form (speeds in km/h as typed). Shared by the form and the server.
import { z } from 'zod';
import { AppError } from '../errors';
import { NIST_SP811 } from '../engine/units';
import { readCsvRecords } from '../results/parse-results-csv';
import { findUnsafeText, isSingleLine } from './text-safety';

export const RUN_TIMES_CSV_MAX_BYTES = 256 * 1024;
export const RUN_TIMES_MAX_ROWS = 2000;

const speed = (label: string) =>
  z
    .number({ error: `Enter the ${label} as a number.` })
    .gt(0, `The ${label} must be above 0.`)
    .max(150, `The ${label} is above 150 m/s (540 km/h): check the unit.`)
    .nullable();

export const RunLabel = z
  .string()
  .trim()
  .min(1, 'Name the run or heat (for example 1, 2 or H3).')
  .max(20, 'A run or heat name has at most 20 characters.')
  .regex(
    /^[A-Za-z0-9][A-Za-z0-9 ._-]*$/,
    'A run or heat name uses letters, digits, spaces, dots, dashes or underscores.',
  );

export const RunTimeRow = z.strictObject({
  raceNumber: z
    .number({ error: 'Enter the race number.' })
    .int('Enter the race number as a whole number.')
    .min(1, 'Race numbers run from 1 to 9999.')
    .max(9999, 'Race numbers run from 1 to 9999.'),
  runLabel: RunLabel,
  elapsedS: z
    .number({ error: 'Enter the elapsed time in seconds.' })
    .gt(0, 'The elapsed time must be above 0 s.')
    .max(3600, 'The elapsed time is above an hour: check the unit (seconds).'),
  trapSpeedMs: speed('trap speed'),
  gpsTopSpeedMs: speed('GPS top speed'),
  rpm: z
    .number({ error: 'Enter the rpm as a whole number.' })
    .int('Enter the rpm as a whole number.')
    .min(1, 'The rpm must be above 0.')
    .max(30000, 'The rpm is above 30,000: check the column.')
    .nullable(),
  conditions: z
    .string()
    .trim()
    .max(200, 'Conditions take at most 200 characters.')
    .refine(isSingleLine, 'Conditions are one line.'),
});
export type RunTimeRow = z.infer<typeof RunTimeRow>;

export const CourseLengthM = z
  .number({ error: 'Enter the course length in metres.' })
  .min(10, 'The course is at least 10 m.')
  // Sprint and drag courses are well under a kilometre (common practice, no source); the bound also
  // keeps each view's integration short (a 20 km course held the server for most of a second per view).
  .max(3000, 'The course is at most 3000 m.');

/** What is sent for an import or a preview besides the file (multipart fields, read as text). */
export const RunTimesImportFields = z.strictObject({
  classId: z.uuid({ error: 'Choose the class.' }),
  courseLengthM: CourseLengthM,
});

/** The hand-entry form's body: speeds in km/h as typed, made SI by the schema. */
export const RunTimesFormInput = z.strictObject({
  classId: z.uuid({ error: 'Choose the class.' }),
  courseLengthM: CourseLengthM,
  rows: z
    .array(
      z
        .strictObject({
          raceNumber: RunTimeRow.shape.raceNumber,
          runLabel: RunLabel,
          elapsedS: RunTimeRow.shape.elapsedS,
          trapSpeedKmh: z.number({ error: 'Enter the trap speed as a number.' }).nullable().default(null),
          gpsTopSpeedKmh: z.number({ error: 'Enter the GPS top speed as a number.' }).nullable().default(null),
          rpm: RunTimeRow.shape.rpm.default(null),
          conditions: RunTimeRow.shape.conditions.default(''),
        })
        .transform((r, ctx) => {
          const row = {
            raceNumber: r.raceNumber,
            runLabel: r.runLabel,
            elapsedS: r.elapsedS,
            trapSpeedMs: r.trapSpeedKmh === null ? null : r.trapSpeedKmh / 3.6,
            gpsTopSpeedMs: r.gpsTopSpeedKmh === null ? null : r.gpsTopSpeedKmh / 3.6,
            rpm: r.rpm,
            conditions: r.conditions,
          };
          const checked = RunTimeRow.safeParse(row);
          if (!checked.success)
            for (const issue of checked.error.issues) {
              const key = String(issue.path[0]).replace('SpeedMs', 'SpeedKmh');
              ctx.addIssue({
                code: 'custom',
                path: [key],
                message: issue.message.replace(/150 m\/s \(540 km\/h\)/, '540 km/h'),
              });
            }
          return row;
        }),
    )
    .min(1, 'Enter at least one run.')
    .max(50, 'Type in at most 50 runs at once; import a CSV file for more.'),
});

/** One line of a CSV file as read: its cells as text, the row when it is valid, and its problems. */
export type CsvRunLine = {
  line: number;
  cells: { raceNumber: string; run: string; elapsed: string; trapSpeed: string; gpsTopSpeed: string; rpm: string };
  row: RunTimeRow | null;
  problems: string[];
};

const fileError = (message: string) =>
  new AppError('invalid_input', 400, `file: ${message}`, [{ field: 'file', message }]);

const SPEED_UNITS: Record<string, { factor: number; label: string }> = {
  kmh: { factor: 1 / 3.6, label: 'km/h' },
  mph: { factor: NIST_SP811.milePerHourMs, label: 'mph' },
  ms: { factor: 1, label: 'm/s' },
  kn: { factor: NIST_SP811.knotMs, label: 'kn' },
};
const norm = (h: string) =>
  h
    .trim()
    .toLowerCase()
    .replace(/[\s/-]+/g, '_');
const NUMBER_HEADERS = new Set(['race_number', 'racenumber', 'number', 'no', 'no.']);
const RUN_HEADERS = new Set(['run', 'heat', 'run_heat', 'run_or_heat']);
const ELAPSED_HEADERS = new Set(['elapsed_s', 'time_s', 'elapsed', 'time']);

/** The speed column named prefix_<unit>, with its factor to m/s; an unknown unit is refused by name. */
function speedColumn(header: string[], prefixes: string[], label: string) {
  for (const [i, h] of header.entries()) {
    const prefix = prefixes.find((p) => h.startsWith(`${p}_`));
    if (!prefix) continue;
    const unit = SPEED_UNITS[h.slice(prefix.length + 1)];
    if (!unit)
      throw fileError(
        `The column "${h}" does not say its unit: name the ${label} column ${prefixes[0]}_kmh, ${prefixes[0]}_mph, ${prefixes[0]}_ms or ${prefixes[0]}_kn.`,
      );
    return { index: i, ...unit };
  }
  return null;
}

/** "41.237" or "1:02.5" (minutes and seconds) as seconds; NaN otherwise. */
export function parseElapsedS(text: string): number {
  const t = text.trim();
  const m = /^(\d{1,2}):([0-5]?\d(?:\.\d+)?)$/.exec(t);
  if (m) return Number(m[1]) * 60 + Number(m[2]);
  return /^\d+(\.\d+)?$/.test(t) ? Number(t) : NaN;
}

const optionalNumber = (text: string) =>
  text.trim() === '' ? null : /^-?\d+(\.\d+)?$/.test(text.trim()) ? Number(text) : NaN;

/**
 * Every line of a timing CSV with its problems (a header problem refuses the file). Columns: race_number, run
 * (or heat), elapsed_s (seconds or m:ss.s), optional trap_speed_<unit>, gps_top_speed_<unit>, rpm, conditions.
 */
export function readRunTimesCsv(text: string): CsvRunLine[] {
  let records: string[][];
  try {
    records = readCsvRecords(text);
  } catch {
    throw fileError('The file is not valid CSV: a quoted field is not closed.');
  }
  if (records.length < 2)
    throw fileError('The file needs a header line (race_number,run,elapsed_s) and at least one run.');
  if (records.length - 1 > RUN_TIMES_MAX_ROWS)
    throw fileError(`The file has more than ${RUN_TIMES_MAX_ROWS} runs: split it.`);
  const header = records[0].map(norm);
  const ni = header.findIndex((h) => NUMBER_HEADERS.has(h));
  const ri = header.findIndex((h) => RUN_HEADERS.has(h));
  const ei = header.findIndex((h) => ELAPSED_HEADERS.has(h));
  if (ni < 0 || ri < 0 || ei < 0)
    throw fileError('The header line must name the columns "race_number", "run" (or "heat") and "elapsed_s".');
  const trap = speedColumn(header, ['trap_speed', 'trap'], 'trap speed');
  const gps = speedColumn(header, ['gps_top_speed', 'gps_speed', 'top_speed'], 'GPS top speed');
  const rpmI = header.indexOf('rpm');
  const ci = header.findIndex((h) => h === 'conditions' || h === 'notes');
  return records.slice(1).map((r, k) => {
    const cell = (i: number) => (i >= 0 ? (r[i] ?? '') : '');
    const cells = {
      raceNumber: cell(ni).trim(),
      run: cell(ri).trim(),
      elapsed: cell(ei).trim(),
      trapSpeed: trap ? cell(trap.index).trim() : '',
      gpsTopSpeed: gps ? cell(gps.index).trim() : '',
      rpm: cell(rpmI).trim(),
    };
    const problems: string[] = [];
    if (r.length !== records[0].length)
      problems.push(
        `This line has ${r.length} field${r.length === 1 ? '' : 's'}; the header has ${records[0].length}.`,
      );
    const conditions = cell(ci).trim();
    const unsafe = findUnsafeText(conditions);
    if (unsafe || findUnsafeText(cells.run))
      problems.push(
        `A control or text-direction character (${(unsafe ?? findUnsafeText(cells.run))!.codePoint}) is not stored.`,
      );
    const trapRaw = optionalNumber(cells.trapSpeed);
    const gpsRaw = optionalNumber(cells.gpsTopSpeed);
    const candidate = {
      raceNumber: /^\d+$/.test(cells.raceNumber) ? Number(cells.raceNumber) : NaN,
      runLabel: cells.run,
      elapsedS: parseElapsedS(cells.elapsed),
      trapSpeedMs: trapRaw === null ? null : trapRaw * trap!.factor,
      gpsTopSpeedMs: gpsRaw === null ? null : gpsRaw * gps!.factor,
      rpm: optionalNumber(cells.rpm),
      conditions,
    };
    if (Number.isNaN(candidate.raceNumber))
      problems.push(`The race number "${cells.raceNumber}" is not a whole number.`);
    if (Number.isNaN(candidate.elapsedS))
      problems.push(`The elapsed time "${cells.elapsed}" is not seconds (41.25) or minutes and seconds (1:02.5).`);
    if (Number.isNaN(trapRaw)) problems.push(`The trap speed "${cells.trapSpeed}" is not a number.`);
    if (Number.isNaN(gpsRaw)) problems.push(`The GPS top speed "${cells.gpsTopSpeed}" is not a number.`);
    if (Number.isNaN(candidate.rpm)) problems.push(`The rpm "${cells.rpm}" is not a number.`);
    if (problems.length) return { line: k + 2, cells, row: null, problems };
    const parsed = RunTimeRow.safeParse(candidate);
    if (!parsed.success) {
      const speedUnit = (path: unknown) => (path === 'trapSpeedMs' ? trap : path === 'gpsTopSpeedMs' ? gps : null);
      for (const issue of parsed.error.issues) {
        const unit = speedUnit(issue.path[0]);
        problems.push(unit ? issue.message.replace(/ \(540 km\/h\)/, '') + ` (read in ${unit.label})` : issue.message);
      }
      return { line: k + 2, cells, row: null, problems };
    }
    return { line: k + 2, cells, row: parsed.data, problems };
  });
}
