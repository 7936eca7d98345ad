import bcrypt from 'bcryptjs';
import { passwordProblem } from '../lib/passwords';
import type { PasswordResetInput, Session } from '../../shared/schemas/auth';
import type { Config } from '../config';
import { AppError } from '../errors';
import { UserModel } from '../models';
import { consumeAccountToken, invalidLink, issueAccountToken } from './account-tokens.service';
import { sessionFor } from './auth.service';
import { mailLink, queueMail } from './mail.service';

export const RESET_TTL_MINUTES = 60;

/** The one answer to a reset request, whether or not an account uses the address. */
export const RESET_REQUESTED_MESSAGE = 'If an account uses that address, we have sent it a link to choose a new password. It works for one hour.';

/**
 * Sends a reset link when an active account uses the address; does nothing otherwise. The caller answers the same
 * either way, so the request does not tell whether an account exists.
 */
export async function requestPasswordReset(email: string): Promise<void> {
  await UserModel.sequelize!.transaction(async () => {
    const user = await UserModel.findOne({ where: { email } });
    if (!user || user.disabledAt) return;
    const token = await issueAccountToken(user.id, 'password_reset', RESET_TTL_MINUTES);
    await queueMail('password_reset', user.email, { link: mailLink('/reset-password', { token }), expiresInMinutes: RESET_TTL_MINUTES });
  });
}

/** Uses a reset token once: sets the new password, ends every other session, and signs this device in. */
export async function resetPassword(config: Config, input: PasswordResetInput): Promise<Session> {
  const user = await UserModel.sequelize!.transaction(async () => {
    const token = await consumeAccountToken(input.token, 'password_reset');
    const found = await UserModel.findByPk(token.userId, { lock: true });
    if (!found || found.disabledAt) throw invalidLink();
    const problem = passwordProblem(input.password, [found.email, found.displayName]);
    if (problem) throw AppError.validation({ password: [problem] });
    found.passwordHash = await bcrypt.hash(input.password, config.BCRYPT_COST);
    found.tokenVersion += 1;
    await found.save();
    return found;
  });
  return sessionFor(config, user);
}
