// multer 2 for CSV imports: one small file held in memory (it is parsed whole
// anyway), with every limit set (multer's default is Infinity). Errors become
// AppErrors: over the size limit is a 413 that says the limit.
import multer from 'multer';
import type { RequestHandler } from 'express';
import { AppError } from '../lib/app-error';
import { markMultipart, multipartParseError } from './multipart-errors';

const sizeText = (bytes: number) => (bytes >= 1024 * 1024 ? `${Math.round((bytes / (1024 * 1024)) * 10) / 10} MB` : `${Math.ceil(bytes / 1024)} KB`);

export function createCsvUpload({ maxBytes, maxRowsHint }: { maxBytes: number; maxRowsHint: number }): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    defParamCharset: 'utf8',
    limits: { fileSize: maxBytes, files: 1, fields: 0, fieldSize: 0, fieldNameSize: 32, parts: 1, headerPairs: 20, fieldNestingDepth: 0, fieldArrayIndexLimit: 0 },
  }).single('file');

  return markMultipart((req, res, next) => {
    if (!req.is('multipart/form-data')) {
      return next(new AppError('Send the CSV file as multipart/form-data in a field named “file”', { status: 415, code: 'unsupported_media_type' }));
    }
    upload(req, res, (error: unknown) => {
      if (!error) {
        if (!req.file) return next(new AppError('Choose a CSV file to import', { status: 400, code: 'invalid_input', details: [{ path: 'file', message: 'no file was sent' }] }));
        return next();
      }
      if (error instanceof multer.MulterError) {
        if (error.code === 'LIMIT_FILE_SIZE') {
          return next(
            new AppError(`The file is larger than the ${sizeText(maxBytes)} limit; split it into smaller files of at most ${maxRowsHint} rows.`, {
              status: 413,
              code: 'file_too_large',
            }),
          );
        }
        if (error.code === 'LIMIT_FILE_COUNT' || error.code === 'LIMIT_PART_COUNT' || error.code === 'LIMIT_FIELD_COUNT') {
          return next(new AppError('Send one CSV file in the field named “file” and nothing else.', { status: 400, code: 'invalid_input', details: [{ path: 'file', message: 'one file only' }] }));
        }
        if (error.code === 'LIMIT_UNEXPECTED_FILE') {
          return next(new AppError('Send the CSV file in the field named “file”.', { status: 400, code: 'invalid_input', details: [{ path: error.field ?? 'file', message: 'unexpected file field' }] }));
        }
        return next(new AppError(`The upload form is not valid (${error.code}).`, { status: 400, code: 'invalid_input' }));
      }
      next(multipartParseError(error) ?? error);
    });
  });
}
