import 'server-only';
import crypto from 'node:crypto';
import bcrypt from 'bcryptjs';
import { Op } from 'sequelize';
import { db } from '@/db/models';
import type { PersonCtx } from '@/lib/server/context';
import { AppError, conflict, invalidField, notFound } from '@/lib/server/errors';
import { withTransaction } from '@/lib/server/tx';
import { enqueueMail } from '@/lib/mail/outbox';
import { recordChange } from '@/lib/events';
import { endSessions } from '@/lib/households/service';
import { resetMail, RESET_MINUTES } from './mail';
import type { ChangeNameInput, ChangePasswordInput, ForgotPasswordInput, ResetPasswordInput } from './schema';

const BCRYPT_ROUNDS = 10;
/** Reset e-mails one account may be sent in an hour, so the form cannot be used to flood an inbox. */
const RESETS_PER_HOUR = 5;

export const tokenHash = (token: string) => crypto.createHash('sha256').update(token).digest('hex');
export const hashPassword = (password: string) => bcrypt.hash(password, BCRYPT_ROUNDS);

export const linkGone = () =>
  new AppError('not_found', 'link_expired', 'This link has expired or was already used. Ask for a new one from the sign-in page.');

/**
 * Sends a one-time reset link when the address has an account; answers the same either way,
 * so the form never tells whether an address is known.
 */
export async function requestPasswordReset(input: ForgotPasswordInput): Promise<void> {
  const { User, PasswordReset } = db();
  await withTransaction(async (transaction) => {
    const user = await User.findOne({ where: { email: input.email }, transaction, lock: transaction.LOCK.UPDATE });
    if (!user) return;
    const recent = await PasswordReset.count({
      where: { userId: user.id, createdAt: { [Op.gt]: new Date(Date.now() - 3_600_000) } },
      transaction,
    });
    if (recent >= RESETS_PER_HOUR) return;
    const token = crypto.randomBytes(32).toString('base64url');
    await PasswordReset.create(
      { cooperativeId: user.cooperativeId, userId: user.id, tokenHash: tokenHash(token), expiresAt: new Date(Date.now() + RESET_MINUTES * 60_000) },
      { transaction },
    );
    await enqueueMail(resetMail({ to: user.email, name: user.name, token }), transaction);
  });
}

/** Throws 404 unless the reset link is still good (checked before any password is hashed). */
export async function assertUsableReset(token: string): Promise<void> {
  const { PasswordReset } = db();
  const reset = await PasswordReset.findOne({ where: { tokenHash: tokenHash(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } } });
  if (!reset) throw linkGone();
}

/**
 * Sets a new password from a reset link, once: this link and every other open link of the
 * account are used up, and every session of the account ends, in one transaction.
 */
export async function resetPassword(input: ResetPasswordInput, passwordHash: string): Promise<{ email: string }> {
  const { User, PasswordReset } = db();
  return withTransaction(async (transaction) => {
    const reset = await PasswordReset.findOne({ where: { tokenHash: tokenHash(input.token) }, transaction, lock: transaction.LOCK.UPDATE });
    if (!reset || reset.usedAt || reset.expiresAt <= new Date()) throw linkGone();
    const user = await User.findOne({ where: { id: reset.userId, cooperativeId: reset.cooperativeId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw linkGone();
    await PasswordReset.update({ usedAt: new Date() }, { where: { userId: user.id, usedAt: null }, transaction });
    // An invitation still open is answered by this password as well.
    await user.update({ passwordHash, inviteTokenHash: null, inviteExpiresAt: null }, { transaction });
    await endSessions(user.id, transaction);
    return { email: user.email };
  });
}

/** Changes the name the acting person goes by. */
export async function changeName(ctx: PersonCtx, input: ChangeNameInput): Promise<{ name: string }> {
  const { User } = db();
  return withTransaction(ctx, async ({ transaction, cooperativeId, actor }) => {
    const [count] = await User.update({ name: input.name }, { where: { id: actor.userId, cooperativeId }, transaction });
    if (count !== 1) throw notFound('Your account');
    // Lists show who logged each lot: screens and kept answers follow the new name.
    await recordChange({ cooperativeId, transaction }, { type: 'person.renamed', userId: actor.userId });
    return { name: input.name };
  });
}

/** The current password given was wrong (counted by the sign-in limits). */
export const wrongPassword = () => invalidField('currentPassword', 'That is not your current password.', 'wrong_password');
export const isWrongPassword = (err: unknown) => err instanceof AppError && err.code === 'wrong_password';

/** Changes the acting person's password (the current one must be right) and ends their sessions. */
export async function changePassword(ctx: PersonCtx, input: ChangePasswordInput): Promise<void> {
  const { User } = db();
  const user = await User.findOne({ where: { id: ctx.actor.userId, cooperativeId: ctx.cooperativeId } });
  if (!user?.passwordHash) throw notFound('Your account');
  if (!(await bcrypt.compare(input.currentPassword, user.passwordHash))) throw wrongPassword();
  const passwordHash = await hashPassword(input.newPassword);
  await withTransaction(async (transaction) => {
    const locked = await User.findOne({ where: { id: user.id }, transaction, lock: transaction.LOCK.UPDATE });
    if (!locked || locked.passwordHash !== user.passwordHash) throw conflict('Your password was changed meanwhile. Sign in again and retry.');
    await locked.update({ passwordHash }, { transaction });
    await endSessions(user.id, transaction);
  });
}
