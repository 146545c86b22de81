import 'server-only';
import { AppError } from '@/lib/http/errors';

/**
 * Reads a multipart upload with a cap: refused by the declared Content-Length before a byte is read
 * (413), then counted while reading, so a request without a length cannot stream past the limit.
 */
export async function readMultipartUpload(req: Request, maxBodyBytes: number, limitLabel: string): Promise<FormData> {
  const tooLarge = () => new AppError('too_large', 413, `The upload is larger than ${limitLabel}.`, [{ field: 'file', message: `The file is larger than ${limitLabel}.` }]);
  const type = req.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data\s*;/i.test(type)) {
    throw new AppError('unsupported_media_type', 415, 'Send the upload as multipart/form-data with the file in the field "file".', [{ field: 'file', message: 'Send the file as a form upload.' }]);
  }
  const declared = Number(req.headers.get('content-length'));
  if (Number.isFinite(declared) && declared > maxBodyBytes) throw tooLarge();
  const reader = req.body?.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  if (reader) {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      total += value.byteLength;
      if (total > maxBodyBytes) {
        await reader.cancel();
        throw tooLarge();
      }
      chunks.push(value);
    }
  }
  try {
    return await new Response(Buffer.concat(chunks) as BodyInit, { headers: { 'content-type': type } }).formData();
  } catch {
    throw new AppError('invalid_input', 400, 'The upload could not be read as a form.', [{ field: 'file', message: 'The upload could not be read; try again.' }]);
  }
}
