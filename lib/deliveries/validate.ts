import type { ZodType } from 'zod';
import { ApiError, fieldErrors } from '@/lib/api/errors';

/** Parses with a shared schema; a failure is 422 `invalid_input` with one message per field. */
export function parseOr422<T>(schema: ZodType<T>, value: unknown): T {
  const parsed = schema.safeParse(value);
  if (!parsed.success) throw new ApiError(422, 'Some fields need another look.', fieldErrors(parsed.error), { code: 'invalid_input' });
  return parsed.data;
}
