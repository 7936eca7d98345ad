import crypto from 'node:crypto';
import { Op } from 'sequelize';
import { AppError } from '../errors';
import { AccountTokenModel, type AccountTokenPurpose } from '../models/account-token.model';

/** The one answer to an unknown, used or expired link (400 on the field `token`). */
export function invalidLink(): AppError {
  const message = 'This link has expired or has already been used. Ask for a new one.';
  return AppError.validation({ token: [message] }, message);
}

/** The SHA-256 of a token, as stored (a token is 32 random bytes, so a fast hash is enough). */
export function hashToken(token: string): string {
  return crypto.createHash('sha256').update(token).digest('hex');
}

/**
 * Issues a single-use token for a user and purpose, valid for `ttlMinutes`; earlier unused tokens of the same purpose
 * stop working, so only the newest link does. Returns the token itself (for the link); only its hash is stored.
 */
export async function issueAccountToken(userId: number, purpose: AccountTokenPurpose, ttlMinutes: number, newEmail: string | null = null): Promise<string> {
  const token = crypto.randomBytes(32).toString('base64url');
  await AccountTokenModel.destroy({ where: { userId, purpose, usedAt: null } });
  await AccountTokenModel.create({ userId, purpose, tokenHash: hashToken(token), newEmail, expiresAt: new Date(Date.now() + ttlMinutes * 60_000) });
  return token;
}

/**
 * Uses a token once (call inside the transaction that acts on it: the row is locked and marked used there).
 * An unknown, used or expired token is a 400 on the field `token` with one message for all three.
 */
export async function consumeAccountToken(token: string, purpose: AccountTokenPurpose): Promise<AccountTokenModel> {
  const row = await AccountTokenModel.findOne({ where: { tokenHash: hashToken(token), purpose }, lock: true });
  if (!row || row.usedAt || row.expiresAt.getTime() <= Date.now()) {
    throw invalidLink();
  }
  row.usedAt = new Date();
  await row.save();
  await AccountTokenModel.destroy({ where: { expiresAt: { [Op.lt]: new Date(Date.now() - 7 * 86_400_000) } } });
  return row;
}
