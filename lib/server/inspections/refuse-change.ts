import 'server-only';
import { AppError, toErrorResponse } from '@/lib/core/errors';

/**
 * The answer to PUT, PATCH or DELETE on inspection records: 405 with the methods that exist.
 * Records are append-only (the database refuses changes too); a correction is a new record.
 */
export function refuseChange(allow: string) {
  return async () => {
    const res = toErrorResponse(
      new AppError(
        'method_not_allowed',
        405,
        'Inspection records are never edited or deleted: record a correction that supersedes the record instead.',
      ),
    );
    res.headers.set('Allow', allow);
    return res;
  };
}
