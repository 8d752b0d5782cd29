import { z } from 'zod';
import { day, instant as instantField, line, text } from '@/lib/validation/fields';

const instant = instantField();
const crew = z
  .array(line({ min: 1, max: 60, label: 'A crew name' }))
  .max(12, 'At most 12 people in a crew.');
const expectedSapL = z
  .number({ message: 'Expected sap is a number of litres.' })
  .min(0, 'Expected sap cannot be negative.')
  .max(100_000, 'That is more sap than an evaporator boils in a slot.')
  .nullable();
const note = text({ max: 500, label: 'The note' }).nullable();

// Only compared when both are valid instants; a bad one already has its own message.
const endsAfterStart = (s: { startsAt?: string; endsAt?: string }) => {
  const start = Date.parse(s.startsAt ?? '');
  const end = Date.parse(s.endsAt ?? '');
  return Number.isNaN(start) || Number.isNaN(end) || end > start;
};
const endMessage = { path: ['endsAt'], message: 'The slot must end after it starts.' };

export const SlotInput = z
  .object({
    evaporatorId: z.string().uuid('Choose an evaporator.'),
    startsAt: instant,
    endsAt: instant,
    householdId: z.string().uuid('Choose a household.').optional(),
    crew: crew.optional(),
    expectedSapL: expectedSapL.optional(),
    note: note.optional(),
  })
  .refine(endsAfterStart, endMessage);
export type SlotInput = z.infer<typeof SlotInput>;

/** A move (new start and end), a crew or a note. */
export const SlotPatch = z
  .object({
    startsAt: instant.optional(),
    endsAt: instant.optional(),
    crew: crew.optional(),
    expectedSapL: expectedSapL.optional(),
    note: note.optional(),
  })
  .refine((p) => (p.startsAt === undefined) === (p.endsAt === undefined), {
    path: ['endsAt'],
    message: 'Moving a slot needs both a new start and a new end.',
  })
  .refine(endsAfterStart, endMessage);
export type SlotPatch = z.infer<typeof SlotPatch>;

const boundary = z.union([instant, day()], {
  message: 'Give a day (YYYY-MM-DD) or a date and time with its offset.',
});

export const SlotQuery = z
  .object({ from: boundary, to: boundary })
  .refine((q) => Date.parse(q.to) > Date.parse(q.from), { path: ['to'], message: '“to” must come after “from”.' })
  .refine((q) => Date.parse(q.to) - Date.parse(q.from) <= 120 * 86_400_000, {
    path: ['to'],
    message: 'Ask for at most 120 days at a time.',
  });
