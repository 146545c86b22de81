import 'server-only';
import { AppError } from '../../core/errors';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[1-8][0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/i;

/** A path id that is not a UUID cannot name anything: answer 404, never a database error. */
export function parseId(value: string | undefined, what = 'record'): string {
  if (!value || !UUID.test(value)) throw new AppError('not_found', 404, `No such ${what}.`);
  return value.toLowerCase();
}
