/**
 * Domain errors: what went wrong, in words a person can act on, with a stable machine-readable
 * `code`. No HTTP and no Next here; lib/server/http.ts maps `kind` to a status.
 */

export type FieldErrors = Record<string, string>;

/** What kind of failure it is; the HTTP layer turns each into one status. */
export type ErrorKind =
  | 'bad_request' // 400: the request itself is malformed (not JSON, unreadable query)
  | 'unauthenticated' // 401
  | 'forbidden' // 403
  | 'not_found' // 404
  | 'conflict' // 409
  | 'too_large' // 413
  | 'unsupported' // 415
  | 'invalid' // 422: well-formed, but a value breaks a rule
  | 'rate_limited' // 429
  | 'unavailable'; // 503

export interface AppErrorOptions {
  fields?: FieldErrors;
  /** Extra members of the error body, e.g. the slot in the way of a booking. */
  details?: Record<string, unknown>;
  cause?: unknown;
}

export class AppError extends Error {
  readonly kind: ErrorKind;
  readonly code: string;
  readonly fields?: FieldErrors;
  readonly details?: Record<string, unknown>;

  constructor(kind: ErrorKind, code: string, message: string, opts: AppErrorOptions = {}) {
    super(message, opts.cause === undefined ? undefined : { cause: opts.cause });
    this.name = 'AppError';
    this.kind = kind;
    this.code = code;
    if (opts.fields && Object.keys(opts.fields).length) this.fields = opts.fields;
    if (opts.details) this.details = opts.details;
  }
}

export const isAppError = (e: unknown): e is AppError => e instanceof AppError;

// Short constructors. `code` defaults to the kind; pass a more precise one where a client may branch on it.
export const badRequest = (message: string, code = 'bad_request', opts?: AppErrorOptions) =>
  new AppError('bad_request', code, message, opts);
export const unauthenticated = (message = 'Please sign in first.', code = 'unauthenticated') =>
  new AppError('unauthenticated', code, message);
export const forbidden = (message = 'Your role does not allow you to do that.', code = 'forbidden') =>
  new AppError('forbidden', code, message);
export const notFound = (what = 'That record', code = 'not_found') =>
  new AppError('not_found', code, `${what} was not found.`);
export const conflict = (message: string, code = 'conflict', opts?: AppErrorOptions) =>
  new AppError('conflict', code, message, opts);
export const tooLarge = (message: string, code = 'too_large') => new AppError('too_large', code, message);
export const unsupported = (message: string, code = 'unsupported') => new AppError('unsupported', code, message);
export const rateLimited = (message = 'Too many requests; wait a moment and try again.', code = 'rate_limited', opts?: AppErrorOptions) =>
  new AppError('rate_limited', code, message, opts);
/** A value breaks a rule; name the field at fault. */
export const invalid = (message: string, fields?: FieldErrors, code = 'invalid', opts?: Omit<AppErrorOptions, 'fields'>) =>
  new AppError('invalid', code, message, { ...opts, fields });
/** One field at fault, with the usual summary message. */
export const invalidField = (field: string, message: string, code = 'invalid') =>
  new AppError('invalid', code, 'Some fields need another look.', { fields: { [field]: message } });
