import { z } from 'zod';
import { decimalString } from '@/lib/validation/fields';

const num = (name: string, min: number, max: number, unit: string) =>
  decimalString(`${name} must be a number.`).pipe(
    z.number().min(min, `${name} must be at least ${min} ${unit}.`).max(max, `${name} must be at most ${max} ${unit}.`),
  );

export const EstimateQuery = z.object({
  volumeL: num('volumeL', 0, 1_000_000, 'L'),
  brix: num('brix', 0.1, 85, '°Bx'),
  syrupBrix: num('syrupBrix', 60, 70, '°Bx').optional(),
});
