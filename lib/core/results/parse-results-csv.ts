// Results from a CSV file: an RFC 4180 reader (quoted fields, doubled quotes, CRLF or LF, a BOM)
// and the mapping of its header to positions and race numbers. Framework-free for unit tests.
import { AppError } from '@/lib/core/errors';

/** RFC 4180 records; throws on an unterminated quoted field. */
export function readCsvRecords(text: string): string[][] {
  const src = text.replace(/^\uFEFF/, '');
  const records: string[][] = [];
  let record: string[] = [];
  let field = '';
  let quoted = false;
  let i = 0;
  while (i < src.length) {
    const c = src[i];
    if (quoted) {
      if (c === '"' && src[i + 1] === '"') {
        field += '"';
        i += 2;
        continue;
      }
      if (c === '"') {
        quoted = false;
        i++;
        continue;
      }
      field += c;
      i++;
      continue;
    }
    if (c === '"' && field === '') {
      quoted = true;
      i++;
      continue;
    }
    if (c === ',') {
      record.push(field);
      field = '';
      i++;
      continue;
    }
    if (c === '\r' || c === '\n') {
      record.push(field);
      records.push(record);
      record = [];
      field = '';
      i += c === '\r' && src[i + 1] === '\n' ? 2 : 1;
      continue;
    }
    field += c;
    i++;
  }
  if (quoted) throw new Error('a quoted field is not closed');
  if (field !== '' || record.length) {
    record.push(field);
    records.push(record);
  }
  return records.filter((r) => !(r.length === 1 && r[0].trim() === ''));
}

const POSITION = new Set(['position', 'pos', 'place']);
const NUMBER = new Set(['racenumber', 'race_number', 'race number', 'number', 'no', 'no.']);
const bad = (message: string) => new AppError('invalid_input', 400, `file: ${message}`, [{ field: 'file', message }]);

/** Rows of { position, raceNumber } with the file's line named in every refusal. */
export function parseResultsCsv(text: string): { position: number; raceNumber: number }[] {
  let records: string[][];
  try {
    records = readCsvRecords(text);
  } catch {
    throw bad('The file is not valid CSV: a quoted field is not closed.');
  }
  if (records.length < 2) throw bad('The file needs a header line (position,race_number) and at least one finisher.');
  const header = records[0].map((h) => h.trim().toLowerCase());
  const pi = header.findIndex((h) => POSITION.has(h));
  const ni = header.findIndex((h) => NUMBER.has(h));
  if (pi < 0 || ni < 0) throw bad('The header line must name the columns "position" and "race_number".');
  return records.slice(1).map((r, k) => {
    const line = k + 2;
    const position = Number((r[pi] ?? '').trim());
    const raceNumber = Number((r[ni] ?? '').trim());
    if (!Number.isInteger(position) || position < 1)
      throw bad(`Line ${line}: the position "${r[pi] ?? ''}" is not a whole number from 1.`);
    if (!Number.isInteger(raceNumber) || raceNumber < 1)
      throw bad(`Line ${line}: the race number "${r[ni] ?? ''}" is not a whole number from 1.`);
    return { position, raceNumber };
  });
}
