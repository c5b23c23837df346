import type { Request, Response } from 'express';
import multer, { MulterError } from 'multer';
import { apiError, badRequest, unreadableBody, validationFailed } from '../errors';

export interface MultipartUpload {
  /** The text fields, by name (the last value of a repeated field). */
  fields: Record<string, string>;
  file: { buffer: Buffer; originalName: string } | null;
}

/**
 * Reads a multipart/form-data request with one file part named `fileField`,
 * in memory (nothing touches the disk), refusing a file above `maxBytes`
 * with 413 file_too_large. Called by a handler after it has authorized.
 */
export async function readMultipart(
  req: Request,
  res: Response,
  options: { fileField: string; maxBytes: number; describeLimit: string },
): Promise<MultipartUpload> {
  if (!req.is('multipart/form-data'))
    throw badRequest('Send the file as multipart/form-data, in a part named “file”.', [
      { path: options.fileField, message: 'Choose a file to upload.' },
    ]);
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: options.maxBytes, files: 1, fields: 20, fieldSize: 64 * 1024, parts: 25 },
  }).single(options.fileField);
  try {
    await new Promise<void>((resolve, reject) =>
      upload(req, res, (error?: unknown) => (error ? reject(error) : resolve())),
    );
  } catch (error) {
    if (error instanceof MulterError) {
      switch (error.code) {
        case 'LIMIT_FILE_SIZE':
          throw apiError(
            'file_too_large',
            `The file is larger than ${options.describeLimit}, the most the server accepts. Export a shorter run or a lower sampling rate.`,
          );
        case 'LIMIT_UNEXPECTED_FILE':
        case 'LIMIT_FILE_COUNT':
          throw validationFailed([
            {
              path: error.field ?? options.fileField,
              message: `Send one file, in the part named “${options.fileField}”.`,
            },
          ]);
        default:
          throw badRequest('The upload has too many or too large form fields.');
      }
    }
    // busboy: a cut-off or malformed multipart body.
    throw unreadableBody();
  }
  const fields: Record<string, string> = {};
  for (const [name, value] of Object.entries((req.body ?? {}) as Record<string, unknown>))
    fields[name] = Array.isArray(value) ? String(value.at(-1)) : String(value);
  const file = req.file
    ? {
        buffer: req.file.buffer,
        // busboy reads the name as latin1; browsers send UTF-8.
        originalName: Buffer.from(req.file.originalname, 'latin1').toString('utf8'),
      }
    : null;
  return { fields, file };
}
