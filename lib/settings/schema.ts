import { z } from 'zod';
import { strictInt, strictNumber } from '@/lib/validation/fields';

const clock = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d(:[0-5]\d)?$/, 'Use a 24-hour time like 06:00.');

/** The co-op's booking and sap rules a coordinator may change. */
export const SettingsInput = z
  .object({
    opensAt: clock,
    closesAt: clock,
    slotMinMinutes: strictInt('Whole minutes only.').pipe(z.number().min(15, 'At least 15 minutes.').max(2880, 'At most 48 hours.')),
    slotMaxMinutes: strictInt('Whole minutes only.').pipe(z.number().min(15, 'At least 15 minutes.').max(2880, 'At most 48 hours.')),
    cancelNoticeHours: strictInt('Whole hours only.').pipe(z.number().min(0, 'Cannot be negative.').max(336, 'At most 14 days.')),
    syrupBrix: strictNumber().pipe(z.number().min(66, 'Syrup must be at least 66.0 °Bx (USDA grade standard).').max(68.9, 'Grade A syrup is at most 68.9 °Bx.')),
    shelfDays: strictNumber().pipe(z.number().gt(0, 'More than 0 days.').max(30, 'At most 30 days.')),
    warmAboveC: strictNumber().pipe(z.number().min(0, 'At least 0 °C.').max(30, 'At most 30 °C.')),
    warmShelfDays: strictNumber().pipe(z.number().gt(0, 'More than 0 days.').max(30, 'At most 30 days.')),
  })
  .refine((s) => s.closesAt > s.opensAt, { path: ['closesAt'], message: 'Closing must come after opening.' })
  .refine((s) => s.slotMaxMinutes >= s.slotMinMinutes, { path: ['slotMaxMinutes'], message: 'The longest slot cannot be shorter than the shortest.' })
  .refine((s) => s.warmShelfDays <= s.shelfDays, { path: ['warmShelfDays'], message: 'Warm sap cannot keep longer than cold sap.' });
export type SettingsInput = z.infer<typeof SettingsInput>;
