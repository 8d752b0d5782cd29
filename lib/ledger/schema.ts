import { z } from 'zod';

/** Client-safe request schemas of the season ledger (the forms and the route handlers share them). */

export const PaymentInput = z.strictObject({
  amountCents: z.number({ message: 'Give the amount in cents.' }).int('Give the amount in whole cents.').positive('The amount must be more than 0.').max(100_000_000, 'That amount is too large.'),
  method: z.enum(['cheque', 'cash'], { message: 'Choose cheque or cash.' }),
  reference: z.string().trim().max(120, 'Keep the reference under 120 characters.').nullable().optional(),
  paidOn: z.iso.date({ message: 'Give the day as YYYY-MM-DD.' }).nullable().optional(),
});
export type PaymentInput = z.infer<typeof PaymentInput>;

export const ReopenInput = z.strictObject({
  reason: z.string({ message: 'Say why the run is reopened.' }).trim().min(1, 'Say why the run is reopened.').max(500, 'Keep the reason under 500 characters.'),
});
export type ReopenInput = z.infer<typeof ReopenInput>;

export const FeeInput = z.strictObject({
  householdId: z.uuid('Choose a household.'),
  feeCents: z.number({ message: 'Give the fee in cents.' }).int('Give the fee in whole cents.').min(0, 'The fee cannot be negative.').max(100_000_000, 'That fee is too large.'),
});
export type FeeInput = z.infer<typeof FeeInput>;

export const LedgerFormat = z.enum(['json', 'csv', 'pdf']).default('json');
