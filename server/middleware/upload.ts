import multer from 'multer';
import type { RequestHandler } from 'express';
import { AppError } from '../errors/app-error.js';
import { MAX_UPLOAD_BYTES } from '../kernel/files/stored-files.js';

const parser = multer({
  storage: multer.memoryStorage(),
  // Keep the name as sent, so a name that tries to climb folders is seen and refused, not trimmed.
  preservePath: true,
  // File names are UTF-8 (busboy reads them as latin1 by default: "Prüfbericht" came out garbled).
  defParamCharset: 'utf8',
  limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 10, fieldSize: 2 * 1024 * 1024 },
});

/** One file under `file`, in memory (stored in PostgreSQL afterwards); multer's errors become the one error shape. */
export function singleUpload(): RequestHandler {
  const handle = parser.single('file');
  return (req, res, next) => {
    if (!req.is('multipart/form-data')) return next();
    handle(req, res, (error: unknown) => {
      if (!error) return next();
      if (error instanceof multer.MulterError) {
        if (error.code === 'LIMIT_FILE_SIZE') {
          return next(new AppError(413, 'too_large', 'The file is larger than 20 MB', { file: 'Larger than 20 MB' }));
        }
        return next(new AppError(400, 'invalid_upload', error.message, { [error.field ?? 'file']: error.message }));
      }
      // Anything else here is the multipart parser refusing a malformed body.
      next(new AppError(400, 'invalid_upload', 'The upload is malformed', { file: (error as Error).message }));
    });
  };
}

/** A JSON document sent as a multipart field (next to the file), or the plain JSON body. */
export function jsonPart(field: string): RequestHandler {
  return (req, _res, next) => {
    if (!req.is('multipart/form-data')) return next();
    const raw = req.body?.[field];
    if (typeof raw !== 'string') return next(new AppError(400, 'invalid_input', `Send the ${field} as JSON`, { [field]: 'Missing' }));
    try {
      req.body = JSON.parse(raw);
      next();
    } catch {
      next(new AppError(400, 'invalid_json', `The ${field} field is not valid JSON`, { [field]: 'Not JSON' }));
    }
  };
}
