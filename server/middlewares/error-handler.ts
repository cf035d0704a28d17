import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { ForbiddenError } from '@casl/ability';
import { ForeignKeyConstraintError, OptimisticLockError, UniqueConstraintError, ValidationError as SequelizeValidationError } from 'sequelize';
import { AppError } from '../lib/app-error';
import { isDatabaseUnavailable } from '../lib/database-errors';
import type { Logger } from '../lib/logger';

export interface ErrorBody {
  error: { code: string; message: string; details?: unknown };
}

export function zodIssuesToDetails(error: ZodError) {
  return error.issues.map((issue) => ({
    path: issue.path.map(String).join('.') || '(body)',
    message: issue.message,
  }));
}

function toAppError(error: unknown): AppError {
  if (error instanceof AppError) return error;
  if (error instanceof ZodError) {
    return new AppError('Some fields are not valid', { status: 400, code: 'invalid_input', details: zodIssuesToDetails(error) });
  }
  if (error instanceof ForbiddenError) {
    return new AppError(error.message || 'You are not allowed to do this', { status: 403, code: 'forbidden' });
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
      details: (fields.length ? fields : ['(body)']).map((path) => ({ path, message: 'no such record' })),
    });
  }
  if (error instanceof UniqueConstraintError) {
    const fields = Object.keys(error.fields ?? {});
    return new AppError('A record with this value already exists', { status: 409, code: 'duplicate', details: fields });
  }
  if (error instanceof SequelizeValidationError) {
    return new AppError('Some fields are not valid', {
      status: 400,
      code: 'invalid_input',
      details: error.errors.map((item) => ({ path: item.path ?? '(body)', message: item.message })),
    });
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
    const body: ErrorBody = {
      error: {
        code: appError.code,
        message: appError.expose || appError.status < 500 ? appError.message : 'Something went wrong on the server',
        ...(appError.details !== undefined ? { details: appError.details } : {}),
      },
    };
    if (appError.status === 503) res.setHeader('Retry-After', '5');
    res.status(appError.status).json(body);
  };
}

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError(`No API route for ${req.method} ${req.path}`, { status: 404, code: 'not_found' }));
};
