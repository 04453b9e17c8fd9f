import type { Request, Response } from 'express';
import multer from 'multer';
import { AppError } from '../errors/app-error';

// The one multipart reader. Files are held in memory (never written anywhere) until the
// route's content check has passed: a route cannot get the bytes without naming a check, so
// every upload is checked by content before it is stored. A test keeps multer out of every
// other server file.

export interface UploadRule<T> {
  /** The multipart part holding the file. */
  field: string;
  maxBytes: number;
  /** What the file should be, for messages ("a PNG or JPEG image"). */
  what: string;
  /** Reads the bytes and throws an AppError (415/400) naming the field when they are not acceptable. */
  check(buffer: Buffer): T;
}

export interface CheckedUpload<T> {
  buffer: Buffer;
  originalName: string | undefined;
  /** What the content check found. */
  content: T;
}

function readMultipart(req: Request, res: Response, rule: UploadRule<unknown>): Promise<void> {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: rule.maxBytes, files: 1, fields: 5, fieldSize: 1024, parts: 8 },
  });
  const mb = Math.round((rule.maxBytes / (1024 * 1024)) * 10) / 10;
  return new Promise((resolve, reject) => {
    upload.single(rule.field)(req, res, (err: unknown) => {
      if (!err) return resolve();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          return reject(
            new AppError(413, 'payload_too_large', `The file is larger than ${mb} MB. Reduce its resolution or size and try again.`, {
              fields: { [rule.field]: `At most ${mb} MB` },
            }),
          );
        }
        if (err.code === 'LIMIT_UNEXPECTED_FILE') {
          return reject(
            AppError.badRequest(`Send one file, ${rule.what}, in the multipart part named "${rule.field}" (got "${err.field ?? ''}").`, {
              [rule.field]: `Send one file as "${rule.field}"`,
            }),
          );
        }
        return reject(AppError.badRequest(`The upload could not be read: ${err.message}.`, { [rule.field]: `Send one file as "${rule.field}"` }));
      }
      // The multipart parser's own errors (a truncated or malformed body) are the client's.
      if (err instanceof Error && !(err instanceof AppError)) {
        return reject(AppError.badRequest(`The upload could not be read: ${err.message}.`, { [rule.field]: 'Send a complete multipart/form-data body' }));
      }
      reject(err);
    });
  });
}

/**
 * Reads a multipart body and checks the file part's content with rule.check. Resolves null
 * when no file (or an empty one) was sent; text fields are left on req.body for validation.
 */
export async function receiveCheckedUpload<T>(req: Request, res: Response, rule: UploadRule<T>): Promise<CheckedUpload<T> | null> {
  await readMultipart(req, res, rule);
  const file = req.file;
  if (!file || file.buffer.length === 0) return null;
  return { buffer: file.buffer, originalName: file.originalname, content: rule.check(file.buffer) };
}
