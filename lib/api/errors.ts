/**
 * @deprecated The first shape of the error helpers, kept so code written against it keeps
 * working while it moves to lib/server (errors.ts, http.ts, route.ts). It answers through the
 * same mapping: every body carries a `code`, database errors go by SQLSTATE.
 */
import { unstable_rethrow } from 'next/navigation';
import { AppError, type ErrorKind, type FieldErrors } from '@/lib/server/errors';
import { errorResponse, fieldErrors, readJson, STATUS } from '@/lib/server/http';

export type { FieldErrors };
export { fieldErrors, readJson };

const KIND_OF: Record<number, ErrorKind> = Object.fromEntries(Object.entries(STATUS).map(([k, v]) => [v, k as ErrorKind]));
const CODE_OF: Partial<Record<ErrorKind, string>> = { invalid: 'invalid_input' };

/** @deprecated Throw an AppError from lib/server/errors instead. */
export class ApiError extends AppError {
  constructor(
    public readonly status: number,
    message: string,
    fields?: FieldErrors,
    extra?: Record<string, unknown>,
  ) {
    const kind = KIND_OF[status] ?? 'invalid';
    super(kind, (extra?.code as string | undefined) ?? CODE_OF[kind] ?? kind, message, { fields, details: extra });
    this.name = 'ApiError';
  }
}

export const unauthorized = () => new ApiError(401, 'Please sign in first.');
export const forbidden = (what = 'do that') => new ApiError(403, `Your role does not allow you to ${what}.`);
export const notFound = (what = 'That record') => new ApiError(404, `${what} was not found.`);

/** @deprecated Use errorResponse from lib/server/http. */
export const toErrorResponse = (err: unknown): Response => errorResponse(err);

type Handler<C> = (req: Request, ctx: C) => Promise<Response>;

/** @deprecated Use route() from lib/server/route, which also builds the request context. */
export function route<C = { params: Promise<Record<string, string>> }>(fn: Handler<C>): Handler<C> {
  return async (req, ctx) => {
    try {
      return await fn(req, ctx);
    } catch (err) {
      unstable_rethrow(err);
      return errorResponse(err);
    }
  };
}
