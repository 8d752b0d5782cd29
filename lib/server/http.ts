import { NextResponse } from 'next/server';
import { ZodError, type ZodType, type z } from 'zod';
import { AppError, badRequest, type ErrorKind, type FieldErrors } from './errors';
import { fromDatabaseError } from './db-errors';
import { BodyTooLargeError, JSON_BODY_LIMIT, readBodyLimited } from '@/lib/security/limits';

/** The one status for each kind of domain error. */
export const STATUS: Record<ErrorKind, number> = {
  bad_request: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  too_large: 413,
  unsupported: 415,
  invalid: 422,
  rate_limited: 429,
  unavailable: 503,
};

/** One message per field from a zod error, keyed by the dotted path. */
export function fieldErrors(error: ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

export interface MapContext {
  /** The request's path carried ids (a malformed one means "no such record"). */
  idsInPath?: boolean;
}

/** Anything thrown as a domain error, or null when nobody but us can act on it (a 500). */
export function toAppError(err: unknown, ctx: MapContext = {}): AppError | null {
  if (err instanceof AppError) return err;
  if (err instanceof ZodError) return new AppError('invalid', 'invalid_input', 'Some fields need another look.', { fields: fieldErrors(err) });
  const fromDb = fromDatabaseError(err, ctx);
  if (fromDb) return fromDb;
  // Sequelize's own model validation (before any SQL ran).
  if ((err as { name?: string })?.name === 'SequelizeValidationError') {
    const items = (err as { errors?: { path?: string; message?: string }[] }).errors ?? [];
    const fields = Object.fromEntries(items.filter((i) => i.path).map((i) => [i.path!, i.message ?? 'Not valid.']));
    return new AppError('invalid', 'invalid_input', 'Some fields need another look.', { fields });
  }
  return null;
}

/** The API's one error body: `{ error: { code, message, fields?, ...details } }`. */
export function appErrorResponse(e: AppError, init?: ResponseInit): Response {
  const headers = new Headers(init?.headers);
  // A limit that lifts at a known time says when (sign-in limits).
  const retry = e.details?.retryAfterSeconds;
  if (e.kind === 'rate_limited' && typeof retry === 'number') headers.set('Retry-After', String(retry));
  return NextResponse.json(
    { error: { code: e.code, message: e.message, ...(e.fields ? { fields: e.fields } : {}), ...(e.details ?? {}) } },
    { ...init, headers, status: STATUS[e.kind] },
  );
}

/** Maps anything thrown in a handler to the uniform error response; database detail never leaks. */
export function errorResponse(err: unknown, ctx: MapContext = {}): Response {
  const e = toAppError(err, ctx);
  if (e) return appErrorResponse(e);
  console.error(err);
  return NextResponse.json(
    { error: { code: 'internal', message: 'Something went wrong on our side. Please try again.' } },
    { status: 500 },
  );
}

/** A JSON answer. */
export const json = (data: unknown, status = 200) => NextResponse.json(data, { status });

/** A JSON answer whose text is already made (a kept answer, sent as it is). */
export const jsonText = (text: string) => new Response(text, { headers: { 'content-type': 'application/json' } });

/**
 * Reads a JSON body (400 `invalid_json` when it is not JSON) and, given a schema, parses it (422).
 * A body past the JSON limit answers 413, also when it arrives in chunks with no Content-Length.
 */
export async function readJson(req: Request): Promise<unknown>;
export async function readJson<S extends ZodType>(req: Request, schema: S): Promise<z.output<S>>;
export async function readJson(req: Request, schema?: ZodType): Promise<unknown> {
  let bytes: Uint8Array;
  try {
    bytes = await readBodyLimited(req, JSON_BODY_LIMIT);
  } catch (err) {
    if (err instanceof BodyTooLargeError) throw new AppError('too_large', 'body_too_large', err.message);
    throw badRequest('The request body could not be read.', 'unreadable_body');
  }
  let body: unknown;
  try {
    body = JSON.parse(new TextDecoder().decode(bytes));
  } catch {
    throw badRequest('The request body must be JSON.', 'invalid_json');
  }
  return schema ? schema.parse(body) : body;
}

/**
 * Parses the query string with `schema` (422 with fields). A name given twice is refused
 * rather than silently taking one of them.
 */
export function readQuery<S extends ZodType>(req: Request, schema: S): z.output<S> {
  const params = new URL(req.url).searchParams;
  const out: Record<string, string> = {};
  for (const [k, v] of params) {
    if (k in out) throw new AppError('invalid', 'invalid_input', 'Some fields need another look.', { fields: { [k]: 'Give this only once.' } });
    out[k] = v;
  }
  return schema.parse(out);
}
