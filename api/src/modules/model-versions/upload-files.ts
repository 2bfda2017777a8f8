import type { Request, Response } from 'express';
import multer from 'multer';
import { UPLOAD_LIMITS } from '../../contracts/registry.js';
import { AppError, badRequest } from '../../http/errors.js';

export interface UploadedFile {
  name: string;
  text: string;
}

const receive = multer({
  storage: multer.memoryStorage(),
  limits: {
    fileSize: UPLOAD_LIMITS.maxFileBytes,
    files: UPLOAD_LIMITS.maxFiles,
    fields: 10,
    parts: UPLOAD_LIMITS.maxFiles + 10,
  },
}).any();

function toUploadError(error: { code?: string; filename?: string; message?: string }): AppError {
  if (error.code === 'LIMIT_FILE_SIZE') {
    return new AppError(
      413,
      'too_large',
      `${error.filename ?? 'A file'} is larger than ${UPLOAD_LIMITS.maxFileBytes / 1024 / 1024} MB; a model file is far smaller.`,
    );
  }
  if (error.code === 'LIMIT_FILE_COUNT' || error.code === 'LIMIT_PART_COUNT') {
    return badRequest(`Send at most ${UPLOAD_LIMITS.maxFiles} files: one JSON file, or one CSV per matrix.`);
  }
  return badRequest(
    `The upload could not be read (${error.message ?? 'malformed multipart body'}); send the files as multipart/form-data.`,
  );
}

/** The files of a multipart request, read into memory (nothing is written to disk or stored). */
export function receiveFiles(req: Request, res: Response): Promise<UploadedFile[]> {
  return new Promise((resolve, reject) => {
    receive(req, res, (error?: unknown) => {
      if (error) return reject(toUploadError(error as { code?: string }));
      const files = (req.files as Express.Multer.File[] | undefined) ?? [];
      if (files.length === 0)
        return reject(badRequest('No files arrived: send one JSON file or one CSV per matrix as multipart/form-data.'));
      resolve(
        files.map((file) => ({ name: file.originalname, text: file.buffer.toString('utf8').replace(/^\uFEFF/, '') })),
      );
    });
  });
}
