import { Op } from 'sequelize';
import type { AdminAuditEntry, AdminUser, ChangeRoleInput } from '../../shared/schemas/accounts-admin';
import { AppError } from '../errors';
import { AccountAuditModel, UserModel } from '../models';
import { listAccessEvents } from './access.service';

function toAdminUser(u: UserModel): AdminUser {
  return { ...u.toUser(), disabledAt: u.disabledAt?.toISOString() ?? null, disabledReason: u.disabledReason ?? null };
}

/** Accounts for the admin, oldest first; `q` matches part of the e-mail address or name (at most 200). */
export async function listUsers(q?: string): Promise<AdminUser[]> {
  const like = q ? `%${q.replace(/[%_\\]/g, '\\$&')}%` : undefined;
  const users = await UserModel.findAll({
    where: like ? { [Op.or]: [{ email: { [Op.iLike]: like } }, { displayName: { [Op.iLike]: like } }] } : {},
    order: [['id', 'ASC']],
    limit: 200,
  });
  return users.map(toAdminUser);
}

async function otherAccount(actorId: number, userId: number): Promise<UserModel> {
  const user = await UserModel.findByPk(userId, { lock: true });
  if (!user) throw AppError.notFound('account');
  if (user.id === actorId) throw AppError.conflict('You cannot change your own account here; ask another admin.');
  return user;
}

/** Changes an account's role (member, clinician or admin) with the reason recorded in the audit. */
export async function changeUserRole(actorId: number, userId: number, input: ChangeRoleInput): Promise<AdminUser> {
  return UserModel.sequelize!.transaction(async () => {
    const user = await otherAccount(actorId, userId);
    if (user.role !== input.role) {
      await AccountAuditModel.create({ userId, actorUserId: actorId, action: 'role_changed', oldValue: user.role, newValue: input.role, reason: input.reason });
      user.role = input.role;
      await user.save();
    }
    return toAdminUser(user);
  });
}

/** Disables or re-enables an account, with the reason recorded. A disabled account cannot sign in, and its sessions end. */
export async function setUserDisabled(actorId: number, userId: number, disabled: boolean, reason: string | null): Promise<AdminUser> {
  return UserModel.sequelize!.transaction(async () => {
    const user = await otherAccount(actorId, userId);
    if (!!user.disabledAt !== disabled) {
      await AccountAuditModel.create({ userId, actorUserId: actorId, action: disabled ? 'disabled' : 'enabled', oldValue: null, newValue: null, reason });
      user.disabledAt = disabled ? new Date() : null;
      user.disabledReason = disabled ? reason : null;
      if (disabled) user.tokenVersion += 1;
      await user.save();
    }
    return toAdminUser(user);
  });
}

/** What admins changed on accounts and who was given or lost access to which profile, newest first (at most `limit`). */
export async function listAdminAudit(limit = 200): Promise<AdminAuditEntry[]> {
  const rows = await AccountAuditModel.findAll({
    include: [
      { model: UserModel, as: 'user', attributes: ['id', 'email'] },
      { model: UserModel, as: 'actor', attributes: ['id', 'email'] },
    ],
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    limit,
  });
  const accounts: AdminAuditEntry[] = rows.map((r) => {
    const { user, actor } = r as AccountAuditModel & { user: UserModel; actor: UserModel | null };
    return {
      source: 'account',
      id: r.id,
      action: r.action,
      user: { id: user.id, email: user.email },
      actor: actor ? { id: actor.id, email: actor.email } : null,
      oldValue: r.oldValue,
      newValue: r.newValue,
      reason: r.reason,
      createdAt: r.createdAt.toISOString(),
    };
  });
  const access = await listAccessEvents(limit);
  // Newest first across both (the sort is stable, so each table keeps its own order within one instant).
  return [...accounts, ...access].sort((a, b) => b.createdAt.localeCompare(a.createdAt)).slice(0, limit);
}
