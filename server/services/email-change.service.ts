import bcrypt from 'bcryptjs';
import { Op, UniqueConstraintError } from 'sequelize';
import type { EmailChangeConfirmInput, EmailChangeInput, Session } from '../../shared/schemas/auth';
import type { Config } from '../config';
import { AppError } from '../errors';
import { UserModel } from '../models';
import { consumeAccountToken, invalidLink, issueAccountToken } from './account-tokens.service';
import { sessionFor } from './auth.service';
import { mailLink, queueMail } from './mail.service';

export const EMAIL_CHANGE_TTL_MINUTES = 60;

/** The one answer to a change request, whether or not another account already uses the new address. */
export function emailChangeRequestedMessage(newEmail: string, currentEmail: string): string {
  return `We have sent a link to ${newEmail}. Your address stays ${currentEmail} until you open that link and confirm; it works for one hour.`;
}

const takenMessage = 'Another account now uses that address, so yours stays as it was. Choose another address.';

/**
 * Checks the current password, then mails the new address: a single-use confirmation link, or, when another account
 * already uses it, a notice that nothing changed. The caller answers the same either way, so the request does not
 * tell whether an account exists. `mayMail` is the per-address mail throttle: past it nothing is sent.
 */
export async function requestEmailChange(userId: number, input: EmailChangeInput, mayMail: (email: string) => Promise<boolean>): Promise<void> {
  const user = await UserModel.findByPk(userId);
  if (!user) throw AppError.unauthorized();
  if (!(await bcrypt.compare(input.currentPassword, user.passwordHash))) {
    throw AppError.validation({ currentPassword: ['That is not your current password.'] });
  }
  if (input.newEmail === user.email) throw AppError.validation({ newEmail: ['That is already your address.'] });
  if (!(await mayMail(input.newEmail))) return;
  await UserModel.sequelize!.transaction(async () => {
    if (await UserModel.findOne({ where: { email: input.newEmail } })) {
      await queueMail('email_change_taken', input.newEmail, { newEmail: input.newEmail });
      return;
    }
    const token = await issueAccountToken(user.id, 'email_change', EMAIL_CHANGE_TTL_MINUTES, input.newEmail);
    await queueMail('email_change_confirm', input.newEmail, {
      newEmail: input.newEmail,
      link: mailLink('/confirm-email', { token }),
      expiresInMinutes: EMAIL_CHANGE_TTL_MINUTES,
    });
  });
}

/**
 * Uses a confirmation token once, for the signed-in account that asked for it: sets the new address, tells the old
 * address, ends every other session (as a password change does) and returns a fresh session for this device.
 */
export async function confirmEmailChange(config: Config, userId: number, input: EmailChangeConfirmInput): Promise<Session> {
  const sequelize = UserModel.sequelize!;
  try {
    const user = await sequelize.transaction(async () => {
      const token = await consumeAccountToken(input.token, 'email_change');
      // Thrown inside the transaction, so the token stays unused for the account it belongs to.
      if (token.userId !== userId) {
        const message = 'This link was sent for another account. Sign in with the account that asked for the change, then open it again.';
        throw AppError.validation({ token: [message] }, message);
      }
      const found = await UserModel.findByPk(userId, { lock: true });
      if (!found || !token.newEmail) throw invalidLink();
      if (await UserModel.findOne({ where: { email: token.newEmail, id: { [Op.ne]: userId } } })) throw AppError.conflict(takenMessage);
      const oldEmail = found.email;
      found.email = token.newEmail;
      found.tokenVersion += 1;
      await found.save();
      await queueMail('email_changed', oldEmail, { oldEmail, newEmail: found.email });
      return found;
    });
    return await sessionFor(config, user);
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw AppError.conflict(takenMessage);
    throw err;
  }
}
