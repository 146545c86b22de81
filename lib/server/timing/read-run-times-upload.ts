import 'server-only';
import { AppError } from '@/lib/core/errors';
import { RUN_TIMES_CSV_MAX_BYTES } from '@/lib/core/inputs/run-times';
import { readMultipartUpload } from '@/lib/server/http/read-body';
import { readImportFields } from './record-run-times';

/** A timing CSV upload (after the caller's permission check): 413 past 256 KB, the fields checked, the file as text. */
export async function readRunTimesUpload(req: Request) {
  const form = await readMultipartUpload(req, RUN_TIMES_CSV_MAX_BYTES + 16 * 1024, '256 KB');
  const fields = readImportFields(form);
  const file = form.get('file');
  if (!(file instanceof File) || file.size === 0)
    throw new AppError('invalid_input', 400, 'file: choose a CSV file.', [
      { field: 'file', message: 'Choose a CSV file.' },
    ]);
  if (file.size > RUN_TIMES_CSV_MAX_BYTES)
    throw new AppError('too_large', 413, 'The file is larger than 256 KB.', [
      { field: 'file', message: 'The file is larger than 256 KB.' },
    ]);
  const bytes = new Uint8Array(await file.arrayBuffer());
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw new AppError('invalid_input', 400, 'file: the file is not UTF-8 text.', [
      { field: 'file', message: 'The file is not UTF-8 text: save it as CSV (UTF-8).' },
    ]);
  }
  return { fields, text };
}
