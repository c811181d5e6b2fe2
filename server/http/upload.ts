import type { RequestHandler } from 'express';
import multer from 'multer';
import { HttpError } from './errors';

/**
 * One file in memory under field `file`, at most `maxBytes`. Over the limit → 413 with the limit in
 * words; any other multipart problem → 400. The bytes are checked and stored by the service.
 */
export function singleFile(maxBytes: number, advice = 'Split it into several pick files.'): RequestHandler {
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: maxBytes, files: 1, fields: 10 } }).single('file');
  return (req, res, next) =>
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE') {
        return next(new HttpError(413, 'too_large', `The file is larger than the limit of ${Math.round(maxBytes / 1048576)} MB. ${advice}`));
      }
      if (err instanceof multer.MulterError) return next(new HttpError(400, 'bad_upload', `The upload could not be read: ${err.message}. Send one file in the form field "file".`));
      // The multipart parser fails only on the request itself (e.g. control characters in a file name).
      next(new HttpError(400, 'bad_upload', `The upload could not be read (${(err as Error).message}). Check the file name for unusual characters and send one file in the form field "file".`));
    });
}

export const isMultipart: (ct: string | undefined) => boolean = (ct) => (ct ?? '').toLowerCase().startsWith('multipart/form-data');
