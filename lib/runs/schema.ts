import { z } from 'zod';

// Client-safe: the Runs screen's forms and the route handlers share these. SI units throughout.

const instant = z.iso.datetime({ offset: true, message: 'Give a date and time with its offset, e.g. 2027-03-14T09:00:00-04:00.' });
const id = (message: string) => z.string().uuid(message);

/** Start a run on an evaporator; `slotId` omitted attaches the booked slot under way, null runs outside any slot. */
export const StartRunInput = z.object({
  evaporatorId: id('Choose an evaporator.'),
  slotId: id('Choose a booked slot.').nullable().optional(),
  startedAt: instant.optional(),
  note: z.string().trim().max(500, 'Keep the note under 500 characters.').nullable().optional(),
});
export type StartRunInput = z.infer<typeof StartRunInput>;

const oneInput = z.object({
  deliveryId: id('Choose a lot from the queue.'),
  /** Litres to take; omitted takes all that is left of the lot. */
  litres: z
    .number({ message: 'Litres is a number.' })
    .positive('Take more than 0 litres.')
    .max(100_000, 'That is more sap than any lot holds.')
    .optional(),
});

/** Lots taken into a run: one (`{ deliveryId, litres? }`) or several (`{ inputs: [...] }`). */
export const RunInputsInput = z.union([
  z.object({ inputs: z.array(oneInput).min(1, 'Take at least one lot.').max(50, 'Take at most 50 lots at once.') }),
  oneInput.transform((one) => ({ inputs: [one] })),
]);
export type RunInputsInput = z.infer<typeof RunInputsInput>;

export const GRADE_CLASS_VALUES = ['golden', 'amber', 'dark', 'very-dark'] as const;

/** A draw-off: volume, density, and the colour from a transmittance reading or judged against the standard. */
export const DrawInput = z
  .object({
    litres: z.number({ message: 'Litres is a number.' }).positive('Draw more than 0 litres.').max(10_000, 'That is more syrup than one draw-off.'),
    brix: z.number({ message: '°Brix is a number.' }).min(55, 'Syrup under 55 °Bx is not finished: boil it further.').max(75, 'Syrup over 75 °Bx is beyond any grade: check the reading.'),
    transmittancePct: z.number({ message: 'Transmittance is a number.' }).min(0, 'Transmittance is 0–100 %.').max(100, 'Transmittance is 0–100 %.').nullable().optional(),
    gradeClass: z.enum(GRADE_CLASS_VALUES, { message: 'Choose a colour class.' }).nullable().optional(),
    temperatureC: z.number({ message: 'Temperature is a number.' }).min(60, 'A draw-off is hotter than 60 °C.').max(130, 'Check the thermometer: over 130 °C.').nullable().optional(),
    drawnAt: instant.optional(),
  })
  .refine((d) => d.transmittancePct != null || d.gradeClass != null, {
    path: ['transmittancePct'],
    message: 'Give the light transmittance (%Tc) or choose the colour class.',
  });
export type DrawInput = z.infer<typeof DrawInput>;

export const FUEL_KINDS = ['wood', 'oil', 'propane', 'natural-gas', 'pellets'] as const;

/** Fuel burned; kind defaults to the evaporator's, unit to cords for wood and litres otherwise. */
export const FuelInput = z.object({
  quantity: z.number({ message: 'Quantity is a number.' }).positive('Give more than 0.').max(1000, 'That is more fuel than a run burns.'),
  kind: z.enum(FUEL_KINDS, { message: 'Choose a fuel.' }).optional(),
  unit: z.enum(['cord', 'litre'], { message: 'The unit is cord or litre.' }).optional(),
});
export type FuelInput = z.infer<typeof FuelInput>;

export const FinishInput = z.object({ finishedAt: instant.optional() }).default({});
export type FinishInput = z.infer<typeof FinishInput>;

export const RunsQuery = z.object({ seasonId: id('Unknown season.').optional() });
