// multer 2 for evidence: files stream to a temporary folder on disk (never
// memory), hashed while written, with every limit set (multer's default is
// Infinity). Errors become AppErrors with the status the API promises.
import multer from 'multer';
import type { RequestHandler } from 'express';
import type { AppConfig } from '../config/env';
import { AppError } from '../lib/app-error';
import { markMultipart, multipartParseError } from './multipart-errors';
import { createHashingDiskEngine } from '../storage/hashing-disk-engine';
import { uploadTempDir } from '../storage';

function megabytes(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${(bytes / (1024 * 1024)).toFixed(bytes % (1024 * 1024) ? 1 : 0)} MB` : `${Math.ceil(bytes / 1024)} KB`;
}

export function createEvidenceUpload(config: AppConfig): RequestHandler {
  const { maxBytes, maxFiles } = config.uploads;
  const upload = multer({
    storage: createHashingDiskEngine(uploadTempDir(config)),
    // Browsers send UTF-8 file names; busboy's default (latin1) would garble “Prüfbericht.pdf”.
    defParamCharset: 'utf8',
    limits: {
      fileSize: maxBytes,
      files: maxFiles,
      fields: 4,
      fieldSize: 200,
      fieldNameSize: 32,
      parts: maxFiles + 4,
      headerPairs: 40,
      fieldNestingDepth: 0,
      fieldArrayIndexLimit: 0,
    },
  }).array('file', maxFiles);

  return markMultipart((req, res, next) => {
    if (!req.is('multipart/form-data')) {
      return next(new AppError('Send the file as multipart/form-data in a field named “file”', { status: 415, code: 'unsupported_media_type' }));
    }
    upload(req, res, (error: unknown) => {
      if (!error) return next();
      if (error instanceof multer.MulterError) {
        switch (error.code) {
          case 'LIMIT_FILE_SIZE':
          {
            const name = (error as { filename?: string }).filename;
            return next(new AppError(`${name ? `“${name}”` : 'The file'} is larger than the ${megabytes(maxBytes)} limit.`, { status: 413, code: 'file_too_large' }));
          }
          case 'LIMIT_FILE_COUNT':
          case 'LIMIT_PART_COUNT':
            return next(new AppError(`Send at most ${maxFiles} files at once.`, { status: 413, code: 'too_many_files' }));
          case 'LIMIT_UNEXPECTED_FILE':
            return next(new AppError('Send files in the field named “file”.', { status: 400, code: 'invalid_input', details: [{ path: error.field ?? 'file', message: 'unexpected file field' }] }));
          default:
            return next(new AppError(`The upload form is not valid (${error.code}).`, { status: 400, code: 'invalid_input' }));
        }
      }
      next(multipartParseError(error) ?? error);
    });
  });
}
