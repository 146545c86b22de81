import { ZodError } from 'zod';
import { EngineInputError, EngineOperatingPointError } from '@/lib/core/engine/engine-input-error';

// One error type for expected failures, with a safe message for people.
export class AppError extends Error {
  constructor(
    public readonly code: string,
    public readonly status: number,
    message: string,
    public readonly details?: unknown,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export type ErrorBody = { error: { code: string; message: string; details?: unknown; requestId?: string } };

export type FieldIssue = { field: string; message: string };

/** A refusal about one field of the input, shown beside that field (400 unless said otherwise). */
export const fieldError = (field: string, message: string, status = 400) =>
  new AppError('invalid_input', status, `${field}: ${message}`, [{ field, message }]);

/** Zod issues as { field, message } with dotted paths ("water.temperatureC", "readingsMm.2"). */
export function fieldIssues(err: ZodError): FieldIssue[] {
  return err.issues.map((i) => ({ field: i.path.map(String).join('.') || '(body)', message: i.message }));
}

/** Zod issues as a map field -> first message, for forms. */
export function fieldErrors(err: ZodError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const { field, message } of fieldIssues(err)) out[field] ??= message;
  return out;
}

/** A connection-level failure: the database is down or restarting (not a bad query). */
export function isDatabaseDown(err: unknown): boolean {
  const name = (err as { name?: string })?.name ?? '';
  const code = (err as { parent?: { code?: string }; original?: { code?: string } })?.parent?.code;
  const message = String((err as { message?: string })?.message ?? '');
  return (
    /^Sequelize(Connection\w*Error|HostNotReachableError|ConnectionAcquireTimeoutError)$/.test(name) ||
    ['ECONNREFUSED', 'ECONNRESET', '57P01', '57P02', '57P03', '08000', '08003', '08006', '08001'].includes(
      code ?? '',
    ) ||
    // A pooled connection that died with the server surfaces as a plain error with one of these texts.
    /Connection terminated|connection is closed|Client has encountered a connection error|the database system is (starting up|shutting down)/i.test(
      message,
    )
  );
}

/**
 * Two writers crossed and PostgreSQL gave way on one of them (deadlock_detected 40P01, serialization_failure
 * 40001; PostgreSQL's error codes, Appendix A): nothing of that request was stored, and sending it again works.
 */
export function isCrossedWrite(err: unknown): boolean {
  const e = err as { parent?: { code?: string }; original?: { code?: string }; code?: string } | null;
  return ['40P01', '40001'].includes(e?.parent?.code ?? e?.original?.code ?? e?.code ?? '');
}

export type ErrorAnswerOptions = {
  /** The request's id (scripts/server.mjs): carried in the answer, so a report can be matched to the log. */
  requestId?: string | null;
  /** Told about an unexpected error (the server's structured log); console.error when left out. */
  onUnexpected?: (err: unknown) => void;
};

/** Maps any thrown value to the one JSON error shape with an honest status. */
export function toErrorResponse(err: unknown, options: ErrorAnswerOptions = {}): Response {
  let status = 500;
  let body: ErrorBody;
  const headers: Record<string, string> = {};
  if (err instanceof AppError) {
    status = err.status;
    body = {
      error: { code: err.code, message: err.message, ...(err.details !== undefined && { details: err.details }) },
    };
    // Node closes a connection at once when it answers before the request body has arrived, and a
    // client still sending then gets a reset that can destroy this 413 before it reads it. Keeping
    // the connection open lets the body reader close it after a short linger instead
    // (lib/server/http/read-body.ts, LINGER); a refusal by Content-Length lets Node discard the body.
    if (err.status === 413) headers.Connection = 'keep-alive';
    if (err.status === 429 && typeof err.details === 'object' && err.details && 'retryAfterS' in err.details) {
      headers['Retry-After'] = String((err.details as { retryAfterS: number }).retryAfterS);
    }
  } else if (err instanceof ZodError) {
    status = 400;
    const issues = fieldIssues(err);
    body = {
      error: {
        code: 'invalid_input',
        message: issues.map((i) => `${i.field}: ${i.message}`).join('; '),
        details: issues,
      },
    };
  } else if (err instanceof EngineInputError) {
    status = 400;
    body = {
      error: {
        code: 'invalid_input',
        message: `${err.field}: ${err.message}`,
        details: [{ field: err.field, message: err.message }],
      },
    };
  } else if (err instanceof EngineOperatingPointError) {
    status = 422;
    body = {
      error: {
        code: 'no_operating_point',
        message: `${err.curve}: ${err.message}`,
        details: [{ field: err.curve, message: err.message, speedMs: err.speedMs }],
      },
    };
  } else if (err instanceof SyntaxError) {
    status = 400;
    body = { error: { code: 'invalid_json', message: 'The request body is not valid JSON.' } };
  } else if (isCrossedWrite(err)) {
    status = 409;
    headers['Retry-After'] = '1';
    body = {
      error: {
        code: 'crossed_write',
        message: 'Another change to the same record crossed this one, so nothing was stored: send it again.',
      },
    };
  } else if (isDatabaseDown(err)) {
    status = 503;
    headers['Retry-After'] = '5';
    body = { error: { code: 'unavailable', message: 'The database is not answering; try again shortly.' } };
  } else {
    if (options.onUnexpected) options.onUnexpected(err);
    else console.error('[boreline] unexpected error', err);
    body = { error: { code: 'internal', message: 'Something went wrong on our side.' } };
  }
  if (options.requestId) body.error.requestId = options.requestId;
  return Response.json(body, { status, headers });
}
