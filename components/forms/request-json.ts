// The one way browser code sends a request to the app's route handlers and reads the answer.
// The app answers errors in one shape, { error: { code, message, details?: [{ field, message }] } }
// (DEVELOPERS.md, Conventions); this turns it into { ok, message, fieldErrors }, the same shape a
// server action returns, so a form shows a route handler's refusal exactly as it shows an action's.

export type FieldErrors = Record<string, string>;

/** What a form's action returns and the form shows: the shape server actions return too. */
export type FormState = { ok: boolean; message?: string; fieldErrors?: FieldErrors };

export type JsonAnswer<T> =
  | { ok: true; status: number; data: T; headers: Headers }
  /** status 0: no answer at all (no connection); code is the error shape's code when the server gave one. */
  | { ok: false; status: number; code?: string; message: string; fieldErrors: FieldErrors; headers: Headers | null };

export const NO_CONNECTION_MESSAGE = 'No connection to the server: nothing was saved. Try again.';
const NO_CONNECTION_READING = 'No connection to the server: try again when the signal returns.';
/** The server took the request but the connection dropped while its answer arrived: it may have been saved. */
export const ANSWER_CUT_MESSAGE =
  'The connection dropped while the server answered: it may have been saved. Look before sending it again.';

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- the error shape is checked field by field below
function parseJson(text: string): any {
  if (!text) return null;
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}

/** The error shape's details as one message per field (the first one wins); anything else gives none. */
export function fieldErrorsFromDetails(details: unknown): FieldErrors {
  const out: FieldErrors = {};
  if (!Array.isArray(details)) return out;
  for (const d of details as { field?: unknown; message?: unknown }[]) {
    if (d && typeof d.field === 'string' && d.field) out[d.field] ??= String(d.message);
  }
  return out;
}

type Options = {
  method?: string;
  /** Sent as JSON, except FormData (multipart, for files); undefined sends no body at all. */
  body?: unknown;
  signal?: AbortSignal;
  /** As fetch's own option: 'no-store' for a screen that polls. */
  cache?: RequestCache;
  /** Said when the server gave no message of its own; with no answer at all, a string gives way to NO_CONNECTION_MESSAGE. */
  fallbackMessage?: string | ((status: number) => string);
};

/**
 * Sends one request and reads the JSON answer. Never throws for a refusal or a lost connection
 * (status 0); an abort asked for by the caller is thrown as fetch throws it.
 */
export async function requestJson<T = unknown>(
  url: string,
  { method = 'POST', body, signal, cache, fallbackMessage }: Options = {},
): Promise<JsonAnswer<T>> {
  const fallback = (status: number) =>
    typeof fallbackMessage === 'function'
      ? fallbackMessage(status)
      : status === 0
        ? method === 'GET'
          ? NO_CONNECTION_READING
          : NO_CONNECTION_MESSAGE
        : (fallbackMessage ?? `The request failed (${status}).`);
  const init: RequestInit = { method, signal, ...(cache && { cache }) };
  if (body instanceof FormData) init.body = body;
  else if (body !== undefined) {
    init.headers = { 'content-type': 'application/json' };
    init.body = JSON.stringify(body);
  }
  let res: Response;
  try {
    res = await fetch(url, init);
  } catch (err) {
    if (signal?.aborted) throw err;
    return { ok: false, status: 0, message: fallback(0), fieldErrors: {}, headers: null };
  }
  // The body is read apart from its parsing: an abort or a dropped connection while it arrives is not an empty
  // answer. Read as empty, an aborted 200 came back as { ok: true, data: undefined } and a caller that kept it
  // (the calculator remembers answers) later drew from nothing and fell over.
  let text: string;
  try {
    text = await res.text();
  } catch (err) {
    if (signal?.aborted) throw err;
    return {
      ok: false,
      status: 0,
      message: res.ok && method !== 'GET' ? ANSWER_CUT_MESSAGE : fallback(0),
      fieldErrors: {},
      headers: null,
    };
  }
  const json = parseJson(text);
  if (res.ok) return { ok: true, status: res.status, data: json?.data as T, headers: res.headers };
  const error = json?.error;
  return {
    ok: false,
    status: res.status,
    ...(typeof error?.code === 'string' && { code: error.code }),
    message: typeof error?.message === 'string' && error.message ? error.message : fallback(res.status),
    fieldErrors: fieldErrorsFromDetails(error?.details),
    headers: res.headers,
  };
}

// The general message sits above the button, under the fields: it points up to them.
export const CHECK_FIELDS_MESSAGE = 'Check the fields marked above: nothing was saved yet.';

/**
 * A refusal as a form shows it: each field's message beside its field and, above the button, a
 * pointer to them (the fields' own messages read better than the server's summary of them); a
 * refusal that names no field (or only the body as a whole, "(body)") shows its message there.
 */
export function refusalState(
  answer: { message: string; fieldErrors: FieldErrors },
  checkFieldsMessage = CHECK_FIELDS_MESSAGE,
): FormState {
  const { '(body)': aboutBody, ...perField } = answer.fieldErrors;
  const hasFieldErrors = Object.keys(perField).length > 0;
  return {
    ok: false,
    message: hasFieldErrors ? checkFieldsMessage : (aboutBody ?? answer.message),
    fieldErrors: answer.fieldErrors,
  };
}
