import { z } from 'zod';
import { CLARITIES, CONTAMINATIONS, DECISIONS, LIMITS, STATUSES } from './options';

/** Client-safe: the form and the route handlers validate with these same schemas (SI units). */

export { CLARITIES, CONTAMINATIONS, DECISIONS, LIMITS, STATUSES };
export type { Clarity, Contamination, Decision, DeliveryStatus } from './options';

const isoDay = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Give the day as YYYY-MM-DD.').refine((d) => !Number.isNaN(Date.parse(`${d}T00:00:00Z`)), 'That is not a calendar day.');

const volumeL = z
  .number({ message: 'Enter the metered volume.' })
  .refine(Number.isFinite, 'Enter the metered volume.')
  .refine((v) => v > 0, 'The volume must be more than zero.')
  .refine((v) => v <= LIMITS.maxVolumeL, 'That is more sap than one drop-off can hold.');
const brix = z
  .number({ message: 'Enter the refractometer reading in °Brix.' })
  .refine(Number.isFinite, 'Enter the refractometer reading in °Brix.')
  .refine((v) => v >= 0 && v <= LIMITS.maxBrix, `°Brix is between 0 and ${LIMITS.maxBrix}.`);
const sapTempC = z
  .number({ message: 'Enter the sap temperature.' })
  .refine(Number.isFinite, 'Enter the sap temperature.')
  .refine((v) => v >= LIMITS.minSapTempC && v <= LIMITS.maxSapTempC, 'That sap temperature is outside what a thermometer at the tank reads.');

const pct = z.number().int('Whole percent only.').min(0, 'From 0 to 100 %.').max(100, 'From 0 to 100 %.');
export const SugarbushMix = z
  .object({ sugarMaple: pct, redMaple: pct, other: pct })
  .refine((m) => m.sugarMaple + m.redMaple + m.other === 100, { message: 'The sugarbush mix must add up to 100 %.', path: ['sugarMaple'] });
export type SugarbushMix = z.infer<typeof SugarbushMix>;

const reason = z.string().trim().max(LIMITS.reason, `Keep the reason under ${LIMITS.reason} characters.`);
const note = z.string().trim().max(LIMITS.note, `Keep the note under ${LIMITS.note} characters.`);
const photoKey = z.string().min(1).max(300, 'That photo key is too long.');

/** `POST /api/deliveries`. */
export const DeliveryInput = z.object({
  householdId: z.string({ message: 'Choose the household.' }).uuid('Choose the household.'),
  volumeL,
  brix,
  sapTempC,
  collectedOn: isoDay,
  clarity: z.enum(CLARITIES, { message: 'Say whether the sap is clear or cloudy.' }),
  contamination: z.enum(CONTAMINATIONS, { message: 'Say what, if anything, is in the sap.' }),
  decision: z.enum(DECISIONS).optional(),
  reason: reason.optional().nullable(),
  photoKey: photoKey.optional().nullable(),
  mix: SugarbushMix.optional().nullable(),
  note: note.optional().nullable(),
  idempotencyKey: z.string({ message: 'The form lost its key; reload the page.' }).min(8).max(100),
});
export type DeliveryInput = z.infer<typeof DeliveryInput>;

/** `PATCH /api/deliveries/:id`: the fields to change and why. `statusReason` is the lot's own reason. */
export const DeliveryPatch = z
  .object({
    householdId: z.string().uuid('Choose the household.').optional(),
    volumeL: volumeL.optional(),
    brix: brix.optional(),
    sapTempC: sapTempC.optional(),
    collectedOn: isoDay.optional(),
    clarity: z.enum(CLARITIES).optional(),
    contamination: z.enum(CONTAMINATIONS).optional(),
    status: z.enum(STATUSES).optional(),
    statusReason: reason.optional().nullable(),
    photoKey: photoKey.optional().nullable(),
    mix: SugarbushMix.optional().nullable(),
    note: note.optional().nullable(),
    reason: z.string({ message: 'Say why the lot is corrected.' }).trim().min(1, 'Say why the lot is corrected.').max(LIMITS.reason),
  })
  .strict();
export type DeliveryPatch = z.infer<typeof DeliveryPatch>;

/** `GET /api/deliveries` query. Days are the co-op's calendar days, inclusive. */
export const DeliveryQuery = z.object({
  householdId: z.string().uuid('Unknown household.').optional(),
  seasonId: z.string().uuid('Unknown season.').optional(),
  status: z.enum(STATUSES).optional(),
  from: isoDay.optional(),
  to: isoDay.optional(),
});
export type DeliveryQuery = z.infer<typeof DeliveryQuery>;
