// What busboy (under multer) throws for a body that is not well-formed
// multipart: a bad part header, no boundary, a body cut short. These are the
// client's fault, so they are a 400 that says so, never a 500.
import type { RequestHandler } from 'express';
import { AppError } from '../lib/app-error';

/** Marks a route's multipart parser, so the input fuzzing finds every multipart route. */
export const MULTIPART = Symbol.for('whorl.multipart');

export function markMultipart(handler: RequestHandler): RequestHandler {
  return Object.assign(handler, { [MULTIPART]: true });
}

const PARSE_ERRORS: [RegExp, string][] = [
  [/^Malformed part header/, 'a part header is malformed'],
  [/^Multipart: Boundary not found/, 'the Content-Type names no boundary'],
  [/^Malformed content type/, 'the Content-Type header is malformed'],
  [/^Missing Content-Type/, 'the Content-Type header is missing'],
  [/^Unsupported content type/, 'the Content-Type is not multipart/form-data'],
  [/^Unexpected end of (form|file)/, 'the body ends before its closing boundary (it was cut short)'],
  [/^Request (aborted|closed|error)/, 'the request ended before the upload was complete'],
];

/** A 400 for a multipart parse error, or null when the error is something else (storage, disk). */
export function multipartParseError(error: unknown): AppError | null {
  if (!(error instanceof Error)) return null;
  const match = PARSE_ERRORS.find(([pattern]) => pattern.test(error.message));
  if (!match) return null;
  return new AppError(`The upload could not be read: ${match[1]}. Send the file again from the form.`, {
    status: 400,
    code: 'malformed_upload',
    details: [{ path: 'file', message: match[1] }],
  });
}
