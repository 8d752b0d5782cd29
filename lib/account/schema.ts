import { z } from 'zod';

/** bcrypt reads at most 72 bytes of a password; a longer one would count only in part. */
export const PASSWORD_MAX_BYTES = 72;
export const PASSWORD_MIN_CHARS = 10;

export const passwordBytes = (s: string) => new TextEncoder().encode(s).length;

/** A password a person chooses: long enough, and counted in full by the hash. */
export const NewPassword = z
  .string({ error: 'Choose a password.' })
  .min(PASSWORD_MIN_CHARS, `Use at least ${PASSWORD_MIN_CHARS} characters.`)
  .refine((s) => passwordBytes(s) <= PASSWORD_MAX_BYTES, {
    message: `Keep it to ${PASSWORD_MAX_BYTES} bytes (72 plain letters; accented letters and symbols take 2–4 each).`,
  });

const Email = z.string({ error: 'Enter your e-mail address.' }).trim().toLowerCase().max(254).email('Enter an e-mail address like name@example.org.');
const Token = z.string().regex(/^[A-Za-z0-9_-]{20,100}$/, 'This link is not complete: open it from the e-mail again.');

export const ForgotPasswordInput = z.strictObject({ email: Email });
export type ForgotPasswordInput = z.infer<typeof ForgotPasswordInput>;

export const ResetPasswordInput = z.strictObject({ token: Token, password: NewPassword });
export type ResetPasswordInput = z.infer<typeof ResetPasswordInput>;

export const ChangeNameInput = z.strictObject({
  name: z.string({ error: 'Enter your name.' }).trim().min(1, 'Enter your name.').max(120, 'Keep it under 120 characters.'),
});
export type ChangeNameInput = z.infer<typeof ChangeNameInput>;

export const ChangePasswordInput = z.strictObject({
  currentPassword: z.string({ error: 'Enter your current password.' }).min(1, 'Enter your current password.').max(200),
  newPassword: NewPassword,
});
export type ChangePasswordInput = z.infer<typeof ChangePasswordInput>;
