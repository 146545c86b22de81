import 'server-only';
import { readFormBody } from '@/lib/server/http/read-body';

/**
 * A multipart upload with its file in the field "file", read through the one capped body reader
 * (lib/server/http/read-body.ts): 415 unless multipart, 413 past maxBodyBytes, 400 when it does not parse.
 */
export function readMultipartUpload(req: Request, maxBodyBytes: number, limitLabel: string): Promise<FormData> {
  return readFormBody(req, maxBodyBytes, {
    field: 'file',
    wrongType: 'Send the upload as multipart/form-data with the file in the field "file".',
    tooLarge: `The upload is larger than ${limitLabel}.`,
    tooLargeField: `The file is larger than ${limitLabel}.`,
    unreadable: 'The upload could not be read as a form.',
  });
}
