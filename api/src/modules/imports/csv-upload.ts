import type { Request, Response } from 'express';
import multer from 'multer';
import type { Readable } from 'node:stream';
import type { z } from 'zod';
import { AppError, badRequest } from '../../http/errors.js';

export interface IncomingCsv {
  stream: Readable;
  fileName: string;
  /** The text fields that came before the file part. */
  fields: Record<string, unknown>;
  /** True once the file passed the size limit (the stream then ends early). */
  truncated: () => boolean;
}

const tooLarge = (limitBytes: number) =>
  new AppError(
    413,
    'too_large',
    `The file is larger than ${Math.round(limitBytes / 1024 / 1024)} MB; split it into several files.`,
  );

function toUploadError(error: { code?: string; message?: string; status?: number }, limitBytes: number): Error {
  if (error instanceof AppError) return error;
  if (error.code === 'LIMIT_FILE_SIZE') return tooLarge(limitBytes);
  if (error.code?.startsWith('LIMIT_'))
    return badRequest('Send one CSV file as the "file" part, with the text fields before it.');
  return badRequest(
    `The upload could not be read (${error.message ?? 'malformed multipart body'}); send multipart/form-data.`,
  );
}

/**
 * Streams the one CSV file of a multipart request (part "file") into `handle` without buffering
 * it: a storage engine that hands the file stream over. Fields must precede the file part so that
 * `handle` sees them.
 */
export function receiveCsv<T>(
  req: Request,
  res: Response,
  limitBytes: number,
  handle: (csv: IncomingCsv) => Promise<T>,
): Promise<T> {
  if (Number(req.headers['content-length'] ?? 0) > limitBytes + 64 * 1024) return Promise.reject(tooLarge(limitBytes));
  let outcome: { value: T } | undefined;
  const storage: multer.StorageEngine = {
    _handleFile(request, file, done) {
      let limitHit = false;
      file.stream.once('limit', () => {
        limitHit = true;
      });
      handle({
        stream: file.stream,
        fileName: file.originalname,
        fields: { ...request.body },
        truncated: () => limitHit,
      }).then(
        (value) => {
          outcome = { value };
          done(null, {});
        },
        (error: Error) => {
          file.stream.resume();
          done(error);
        },
      );
    },
    _removeFile: (_request, _file, done) => done(null),
  };
  const upload = multer({ storage, limits: { fileSize: limitBytes, files: 1, fields: 5, parts: 6 } }).single('file');
  return new Promise((resolve, reject) => {
    upload(req, res, (error?: unknown) => {
      if (error) return reject(toUploadError(error as { code?: string }, limitBytes));
      if (!outcome)
        return reject(badRequest('No file arrived: send the CSV as the "file" part of multipart/form-data.'));
      resolve(outcome.value);
    });
  });
}

/**
 * The text fields of a multipart upload checked against `schema`; 400 naming each bad field
 * (`body.mapping: …`) after `what` (e.g. "The import fields are not valid (send them before the file)").
 */
export function parseUploadFields<T extends z.ZodType>(
  schema: T,
  fields: Record<string, unknown>,
  what: string,
): z.infer<T> {
  const parsed = schema.safeParse(fields);
  if (parsed.success) return parsed.data;
  const details = parsed.error.issues.map((i) => ({ path: ['body', ...i.path].join('.'), message: i.message }));
  throw badRequest(`${what}: ${details.map((d) => `${d.path}: ${d.message}`).join('; ')}`, details);
}
