import { z } from 'zod';

/**
 * Strict building blocks for the features' zod schemas (client-safe). Nothing is coerced
 * silently: `true`, `"0x10"`, `"1e3"`, `[60]` and `""` are not numbers.
 */

const DECIMAL = /^[+-]?(\d+(\.\d*)?|\.\d+)$/;

/** A plain decimal in a string ("12", "-3.5"), as query strings and form inputs carry numbers. */
export const decimalString = (message = 'Enter a number.') =>
  z
    .string({ message })
    .trim()
    .regex(DECIMAL, message)
    .transform((s) => Number(s))
    .pipe(z.number().finite(message));

/** A JSON number (finite), or a plain decimal string; never a boolean, array or hex. */
export const strictNumber = (message = 'Enter a number.') =>
  z.union([z.number({ message }).finite(message), decimalString(message)], { message });

/** A whole number, same strictness. */
export const strictInt = (message = 'Enter a whole number.') => strictNumber(message).pipe(z.number().int(message));

// Characters PostgreSQL text cannot hold (NUL) or that have no business in a name.
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/;

/** Text a person typed: trimmed, no control characters (a NUL cannot be stored), bounded. */
export const text = ({ min = 0, max, label = 'This' }: { min?: number; max: number; label?: string }) =>
  z
    .string({ message: `${label} must be text.` })
    .trim()
    .min(min, min <= 1 ? `${label} cannot be empty.` : `${label} needs at least ${min} characters.`)
    .max(max, `Keep it under ${max} characters.`)
    .refine((s) => !CONTROL.test(s), `${label} holds a control character; type it again.`);

/** Single-line text, as for names: also no line breaks. */
export const line = (opts: { min?: number; max: number; label?: string }) =>
  text(opts).refine((s) => !/[\r\n]/.test(s), `${opts.label ?? 'This'} must be one line.`);

/** A name: one line holding at least one letter or digit (a lone "\\" or "-" names nobody). */
export const name = (opts: { min?: number; max: number; label?: string }) =>
  line(opts).refine((s) => /[\p{L}\p{N}]/u.test(s), `${opts.label ?? 'The name'} needs at least one letter or digit.`);

/** Years the calendar deals with; PostgreSQL and people both choke on year 0. */
const MIN_YEAR = 1900;
const MAX_YEAR = 2200;
const yearOk = (s: string) => {
  const y = Number(s.slice(0, 4));
  return y >= MIN_YEAR && y <= MAX_YEAR;
};

/** An instant with its offset, e.g. 2027-03-14T09:00:00-04:00, in years 1900–2200. */
export const instant = (message = 'Give a date and time with its offset, e.g. 2027-03-14T09:00:00-04:00.') =>
  z.iso.datetime({ offset: true, message }).refine(yearOk, `Give a year between ${MIN_YEAR} and ${MAX_YEAR}.`);

/** A day, YYYY-MM-DD, that exists, in years 1900–2200. */
export const day = (message = 'Give a day as YYYY-MM-DD.') =>
  z.iso.date({ message }).refine(yearOk, `Give a year between ${MIN_YEAR} and ${MAX_YEAR}.`);

/** A record id (UUID). */
export const id = (message = 'Choose one from the list.') => z.uuid({ message });
