import { NextResponse } from 'next/server';
import { ZodError } from 'zod';
import { DatabaseError, ForeignKeyConstraintError, UniqueConstraintError, ValidationError } from 'sequelize';

export type FieldErrors = Record<string, string>;

/** An error a person can act on; `toResponse()` gives the API's one error shape. */
export class ApiError extends Error {
  constructor(
    public readonly status: number,
    message: string,
    public readonly fields?: FieldErrors,
    public readonly extra?: Record<string, unknown>,
  ) {
    super(message);
    this.name = 'ApiError';
  }

  toResponse() {
    return NextResponse.json(
      { error: { message: this.message, ...(this.fields ? { fields: this.fields } : {}), ...(this.extra ?? {}) } },
      { status: this.status },
    );
  }
}

export const unauthorized = () => new ApiError(401, 'Please sign in first.');
export const forbidden = (what = 'do that') => new ApiError(403, `Your role does not allow you to ${what}.`);
export const notFound = (what = 'That record') => new ApiError(404, `${what} was not found.`);

/** One message per field from a zod error, keyed by the dotted path. */
export function fieldErrors(error: ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

/** Maps anything thrown in a handler to the uniform error response; database detail never leaks. */
export function toErrorResponse(err: unknown): Response {
  if (err instanceof ApiError) return err.toResponse();
  if (err instanceof ZodError) {
    const fields = fieldErrors(err);
    return new ApiError(422, 'Some fields need another look.', fields).toResponse();
  }
  if (err instanceof UniqueConstraintError) {
    const constraint = (err.parent as { constraint?: string } | undefined)?.constraint;
    if (constraint === 'users_email_unique') {
      return new ApiError(409, 'That e-mail address already has an account.', { email: 'This e-mail address is already in use.' }).toResponse();
    }
    return new ApiError(409, 'That already exists.').toResponse();
  }
  if (err instanceof ForeignKeyConstraintError) {
    return new ApiError(422, 'A record this refers to does not exist.').toResponse();
  }
  if (err instanceof ValidationError) {
    return new ApiError(422, 'Some fields need another look.').toResponse();
  }
  if (err instanceof DatabaseError && /violates check constraint/.test(err.message)) {
    return new ApiError(422, 'A value is outside what the co-op allows.').toResponse();
  }
  console.error(err);
  return NextResponse.json({ error: { message: 'Something went wrong on our side. Please try again.' } }, { status: 500 });
}

/** Reads a JSON body, answering 400 when it is not JSON. */
export async function readJson(req: Request): Promise<unknown> {
  try {
    return await req.json();
  } catch {
    throw new ApiError(400, 'The request body must be JSON.');
  }
}

type Handler<C> = (req: Request, ctx: C) => Promise<Response>;

/** Wraps a route handler so every failure answers in the API's error shape. */
export function route<C = { params: Promise<Record<string, string>> }>(fn: Handler<C>): Handler<C> {
  return async (req, ctx) => {
    try {
      return await fn(req, ctx);
    } catch (err) {
      return toErrorResponse(err);
    }
  };
}
