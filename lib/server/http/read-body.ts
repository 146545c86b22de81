// The one reader for request bodies (JSON, forms, uploads, signed webhooks, next-auth's POSTs):
// nothing else in the app reads or counts a request's bytes. A body is refused by its
// declared Content-Length before a byte is read, then counted while it streams and refused the
// moment the count passes the cap, so a chunked body with no length never costs the server more
// than the cap in memory. Framework-free: runs in route handlers and unit tests.
import { AppError, fieldError } from '../../core/errors';
import { findUnsafeText } from '../../core/inputs/text-safety';

export const DEFAULT_JSON_MAX_BYTES = 256 * 1024;

const bodyTooLarge = (maxBytes: number) => new AppError('too_large', 413, `The body is larger than ${maxBytes} bytes.`);

// After a refusal the connection stays open for a moment before it is closed ("lingering close", as
// web servers do): closing at once, while the client is still sending, resets the connection, and
// the reset can destroy the 413 before the client reads it. Meanwhile at most LINGER.bytes more are
// read and thrown away (a body only a little over the cap then ends normally); past that nothing is
// read and TCP flow control holds the client back. The stream is cancelled after LINGER.ms; in
// Node the socket closes then or, at the latest, when the idle connection meets the server's
// keep-alive timeout (about 5 s after the answer in the tests).
export const LINGER = { bytes: 1024 * 1024, ms: 2000 };

function lingerThenCancel(reader: ReadableStreamDefaultReader<Uint8Array>, budget: { bytes: number; ms: number }) {
  const timer = setTimeout(() => void reader.cancel().catch(() => undefined), budget.ms);
  void (async () => {
    let drained = 0;
    try {
      while (drained <= budget.bytes) {
        const { done, value } = await reader.read();
        if (done) return clearTimeout(timer); // the body ended within the budget: nothing to cut
        drained += value.byteLength;
      }
    } catch {
      clearTimeout(timer);
    }
  })();
}

/**
 * The body's bytes, at most maxBytes of them; more (declared or sent) throws tooLarge() (a 413 by
 * default). A request without a body reads as no bytes. A declared length over the cap is refused
 * before a byte is read (Node then discards that body as it arrives, holding none of it); a body
 * that passes the cap while streaming is refused at once, and the connection is closed after a
 * short linger (LINGER), so the rest of a 200 MB chunked body is never read.
 */
export async function readCappedBytes(
  req: Request,
  maxBytes: number,
  tooLarge: () => AppError = () => bodyTooLarge(maxBytes),
  linger = LINGER,
): Promise<Uint8Array> {
  const declared = req.headers.get('content-length');
  if (declared !== null && Number(declared) > maxBytes) throw tooLarge();
  if (!req.body) return new Uint8Array();
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      chunks.length = 0;
      lingerThenCancel(reader, linger);
      throw tooLarge();
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks, total);
}

/** The body as text, exactly as received (a signature over the raw bytes can be checked against it). */
export async function readRawText(req: Request, maxBytes: number, tooLarge?: () => AppError): Promise<string> {
  return new TextDecoder('utf-8').decode(await readCappedBytes(req, maxBytes, tooLarge));
}

/** A JSON body: 415 unless sent as application/json, 413 past the cap, 400 (invalid_json) when it does not parse. */
export async function readJsonBody(req: Request, maxBytes = DEFAULT_JSON_MAX_BYTES): Promise<unknown> {
  const type = req.headers.get('content-type') ?? '';
  if (!type.toLowerCase().includes('application/json')) {
    throw new AppError('unsupported_media_type', 415, 'Send the body as application/json.');
  }
  // A SyntaxError from JSON.parse is answered 400 invalid_json by toErrorResponse.
  const value: unknown = JSON.parse(await readRawText(req, maxBytes));
  const unsafe = findUnsafeText(value);
  if (unsafe)
    throw fieldError(
      unsafe.field,
      `This text holds a control or text-direction character (${unsafe.codePoint}) that Boreline does not store: type it again without it.`,
    );
  return value;
}

/** A JSON body that may be left out: a request that declares Content-Length 0 reads as {}. */
export async function readOptionalJsonBody(req: Request, maxBytes = DEFAULT_JSON_MAX_BYTES): Promise<unknown> {
  return req.headers.get('content-length') === '0' ? {} : readJsonBody(req, maxBytes);
}

/**
 * The same request with its body already read through the capped reader, for code we do not own
 * that reads a body whole (next-auth's POST endpoints call req.text() / req.json()). Built with the
 * request's own class (a NextRequest stays one). Throws the reader's 413 past maxBytes.
 */
export async function withCappedBody<R extends Request>(req: R, maxBytes: number): Promise<R> {
  if (req.method !== 'POST' || !req.body) return req;
  const body = (await readCappedBytes(req, maxBytes)) as BodyInit;
  return new (req.constructor as new (url: string, init: RequestInit) => R)(req.url, {
    method: req.method,
    headers: req.headers,
    body,
  });
}

/** What a form upload's refusals say, and which field they are shown beside. */
export type FormRefusals = {
  field: string;
  /** 415: the body is not multipart/form-data (overall, and beside the field). */
  wrongType: string;
  wrongTypeField?: string;
  /** 413: the overall message and the one shown beside the field. */
  tooLarge: string;
  tooLargeField: string;
  /** 400: the body is multipart but cannot be parsed. */
  unreadable: string;
};

/** A multipart/form-data body, read with the cap before it is parsed. */
export async function readFormBody(req: Request, maxBytes: number, say: FormRefusals): Promise<FormData> {
  const type = req.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data\s*;/i.test(type)) {
    throw new AppError('unsupported_media_type', 415, say.wrongType, [
      { field: say.field, message: say.wrongTypeField ?? 'Send the file as a form upload.' },
    ]);
  }
  const bytes = await readCappedBytes(
    req,
    maxBytes,
    () => new AppError('too_large', 413, say.tooLarge, [{ field: say.field, message: say.tooLargeField }]),
  );
  try {
    return await new Response(bytes as BodyInit, { headers: { 'content-type': type } }).formData();
  } catch {
    throw new AppError('invalid_input', 400, say.unreadable, [
      { field: say.field, message: 'The upload could not be read; try again.' },
    ]);
  }
}

/** A multipart upload with its file in the field "file": 415 unless multipart, 413 past maxBodyBytes, 400 when it does not parse. */
export function readMultipartUpload(req: Request, maxBodyBytes: number, limitLabel: string): Promise<FormData> {
  return readFormBody(req, maxBodyBytes, {
    field: 'file',
    wrongType: 'Send the upload as multipart/form-data with the file in the field "file".',
    tooLarge: `The upload is larger than ${limitLabel}.`,
    tooLargeField: `The file is larger than ${limitLabel}.`,
    unreadable: 'The upload could not be read as a form.',
  });
}
