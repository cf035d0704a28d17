import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { ForbiddenError } from '@casl/ability';
import { ForeignKeyConstraintError, OptimisticLockError, UniqueConstraintError, ValidationError as SequelizeValidationError } from 'sequelize';
import { AppError } from '../lib/app-error';
import { isDatabaseUnavailable } from '../lib/database-errors';
import type { Logger } from '../lib/logger';
import { fieldLabel, fieldPathLabel, rowIssueText } from '../../shared/labels/fields';
import { forbiddenMessage } from '../../shared/labels/permissions';

export interface ErrorBody {
  error: { code: string; message: string; details?: unknown };
}

/** One entry per issue: `path` for the client to place the message at its field, `label` and `message` in words. */
export function zodIssuesToDetails(error: ZodError) {
  return error.issues.map((issue) => {
    const path = issue.path.filter((segment): segment is string | number => typeof segment !== 'symbol');
    return {
      path: path.map(String).join('.') || '(body)',
      label: fieldPathLabel(path) || 'The request',
      message: issueMessage(issue),
    };
  });
}

/** zod's own wording for a missing value reads as code ("expected number, received undefined"). */
function issueMessage(issue: ZodError['issues'][number]): string {
  if (issue.code === 'invalid_type' && /received undefined/.test(issue.message)) return 'is required';
  return issue.message;
}

/**
 * The 400's message in words, naming each field by its label:
 * "Calibration due: the due date must be after the calibration date".
 */
export function invalidInputMessage(details: { label: string; message: string }[], where = ''): string {
  if (!details.length) return `Some ${where ? `${where} ` : ''}fields are not valid`;
  const shown = details.slice(0, 3).map((detail) => `${detail.label}: ${detail.message}`);
  const more = details.length > 3 ? `; and ${details.length - 3} more` : '';
  return details.length === 1 ? shown[0] : `${details.length} fields are not valid. ${shown.join('; ')}${more}`;
}

function toAppError(error: unknown): AppError {
  if (error instanceof AppError) return error;
  if (error instanceof ZodError) {
    const details = zodIssuesToDetails(error);
    return new AppError(invalidInputMessage(details), { status: 400, code: 'invalid_input', details });
  }
  if (error instanceof ForbiddenError) {
    // CASL's own message ("Cannot execute …") names codes; a message set by the service is already in words.
    const own = error.message && !/^Cannot execute/.test(error.message) ? error.message : null;
    const subject = typeof error.subjectType === 'string' ? error.subjectType : 'all';
    return new AppError(own ?? forbiddenMessage(String(error.action), subject), { status: 403, code: 'forbidden' });
  }
  if (error instanceof OptimisticLockError) {
    return new AppError('This record was changed by someone else; reload it and try again', { status: 409, code: 'stale_version' });
  }
  if (error instanceof ForeignKeyConstraintError) {
    // A reference to a record that does not exist: the client's input, not the server, is at fault.
    const fields = Array.isArray(error.fields) ? error.fields : Object.keys(error.fields ?? {});
    return new AppError('A referenced record does not exist', {
      status: 400,
      code: 'invalid_input',
      details: (fields.length ? fields : ['(body)']).map((path) => ({ path, label: fieldLabel(path), message: 'no such record' })),
    });
  }
  if (error instanceof UniqueConstraintError) {
    const fields = Object.keys(error.fields ?? {});
    return new AppError('A record with this value already exists', { status: 409, code: 'duplicate', details: fields });
  }
  if (error instanceof SequelizeValidationError) {
    const details = error.errors.map((item) => ({ path: item.path ?? '(body)', label: item.path ? fieldLabel(item.path) : 'The request', message: item.message }));
    return new AppError(invalidInputMessage(details), { status: 400, code: 'invalid_input', details });
  }
  if (isDatabaseUnavailable(error)) {
    return new AppError('The database is not reachable right now; try again shortly', { status: 503, code: 'database_unavailable' });
  }
  const httpError = error as { status?: number; statusCode?: number; type?: string; code?: string; expose?: boolean; message?: string };
  const status = httpError.status ?? httpError.statusCode;
  if (httpError.code === 'EBADCSRFTOKEN') {
    return new AppError('Missing or invalid CSRF token; reload the page and try again', { status: 403, code: 'csrf_invalid' });
  }
  if (httpError.type === 'entity.too.large') {
    return new AppError('The request body is too large', { status: 413, code: 'payload_too_large' });
  }
  if (httpError.type === 'entity.parse.failed') {
    return new AppError('The request body is not valid JSON', { status: 400, code: 'invalid_json' });
  }
  if (typeof status === 'number' && status >= 400 && status < 500 && httpError.expose !== false) {
    return new AppError(httpError.message ?? 'Bad request', { status, code: httpError.code?.toLowerCase() ?? 'bad_request' });
  }
  return new AppError('Something went wrong on the server', { status: 500, code: 'internal', expose: false });
}

const isFieldIssue = (value: unknown): value is { path: string; message: string; label?: string } =>
  typeof value === 'object' && value !== null && typeof (value as { path?: unknown }).path === 'string' && typeof (value as { message?: unknown }).message === 'string';

/**
 * Field issues thrown by services (AppError with `details: [{ path, message }]`)
 * get their labels here too, and the generic "Some body fields are not valid"
 * becomes the fields' own words: every 400 reads the same, wherever it was thrown.
 */
function inWords(error: AppError): { message: string; details: unknown } {
  if (error.code !== 'invalid_input' || !Array.isArray(error.details) || !error.details.every(isFieldIssue)) return { message: error.message, details: error.details };
  const details = error.details.map((item) => ({
    ...item,
    label: item.label ?? (item.path === '(body)' ? 'The request' : fieldPathLabel(item.path.split('.').map((part) => (/^\d+$/.test(part) ? Number(part) : part)))),
  }));
  const generic = /^Some (\w+ )?fields are not valid$/.test(error.message);
  return { message: generic ? invalidInputMessage(details) : error.message, details };
}

const isRowIssue = (value: unknown): value is { row: number; field: string; message: string } =>
  typeof value === 'object' && value !== null && typeof (value as { row?: unknown }).row === 'number' && typeof (value as { message?: unknown }).message === 'string';

/** Row issues of a file (CSV import) also carry their sentence in words: "Row 7, Work order: …". */
function withRowText(details: unknown): unknown {
  if (Array.isArray(details)) return details.map((item) => (isRowIssue(item) ? { ...item, text: rowIssueText(item) } : item));
  if (details && typeof details === 'object' && Array.isArray((details as { errors?: unknown }).errors)) {
    return { ...details, errors: withRowText((details as { errors: unknown[] }).errors) };
  }
  return details;
}

export function createErrorHandler(logger: Logger): ErrorRequestHandler {
  return (error, req, res, next) => {
    if (res.headersSent) {
      next(error);
      return;
    }
    const appError = toAppError(error);
    if (appError.status >= 500) {
      logger.error(`${req.method} ${req.path} → ${appError.status}`, appError.status === 500 ? error : appError.message);
    }
    res.locals.requirement = res.locals.requirement ?? 'error';
    const invalid = inWords(appError);
    const details = withRowText(invalid.details);
    const body: ErrorBody = {
      error: {
        code: appError.code,
        message: appError.expose || appError.status < 500 ? invalid.message : 'Something went wrong on the server',
        ...(details !== undefined ? { details } : {}),
      },
    };
    if (appError.status === 503) res.setHeader('Retry-After', '5');
    res.status(appError.status).json(body);
  };
}

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError(`No API route for ${req.method} ${req.path}`, { status: 404, code: 'not_found' }));
};
