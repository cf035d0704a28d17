/** The one error type routes and services throw; the error middleware turns it into JSON. */
export class AppError extends Error {
  readonly status: number;
  readonly code: string;
  readonly details: unknown;
  readonly expose: boolean;

  constructor(message: string, { status = 500, code = 'internal', details, expose = status < 500 }: {
    status?: number;
    code?: string;
    details?: unknown;
    expose?: boolean;
  } = {}) {
    super(message);
    this.name = 'AppError';
    this.status = status;
    this.code = code;
    this.details = details;
    this.expose = expose;
  }
}

export const notFound = (what: string) => new AppError(`${what} not found`, { status: 404, code: 'not_found' });
export const forbidden = (message = 'You are not allowed to do this') =>
  new AppError(message, { status: 403, code: 'forbidden' });
export const staleVersion = () =>
  new AppError('This record was changed by someone else; reload it and try again', { status: 409, code: 'stale_version' });
export const notAllowedNow = (message: string, details?: unknown) =>
  new AppError(message, { status: 422, code: 'not_allowed_now', details });
