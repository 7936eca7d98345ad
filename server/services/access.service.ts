import crypto from 'node:crypto';
import { Op } from 'sequelize';
import type { AccessAuditEntry } from '../../shared/schemas/accounts-admin';
import type { AccessChangeInput, AccessPerson, AuditEntry, InvitationInput, InvitationPreview, ManagedProfileInput, OpenInvitation, ProfileAccessList } from '../../shared/schemas/access';
import { PERMISSIONS_FOR_ROLE } from '../../shared/schemas/access';
import { PROFILE_COLOURS, type ProfileAccessRole, type ProfileColour } from '../../shared/schemas/auth';
import type { GrantPermission } from '../../shared/schemas/profile-actions';
import { AppError } from '../errors';
import { AccessEventModel, InvitationModel, ProfileAccessModel, ProfileModel, UserModel } from '../models';
import { mailLink, queueMail } from './mail.service';
import { listChanges } from './settings-history.service';

/** How long an invitation link stays good. */
export const INVITATION_DAYS = 7;

const hashToken = (token: string) => crypto.createHash('sha256').update(token).digest('hex');

async function record(event: Pick<AccessEventModel, 'profileId' | 'actorUserId' | 'kind'> & Partial<Pick<AccessEventModel, 'subjectUserId' | 'subjectEmail' | 'role' | 'permissions'>>) {
  await AccessEventModel.create({ subjectUserId: null, subjectEmail: null, role: null, ...event });
}

/** The next colour for someone's new profile: one their other profiles do not wear yet, where possible. */
export async function nextColour(userId: number): Promise<ProfileColour> {
  const rows = await ProfileAccessModel.findAll({ where: { userId }, include: [{ model: ProfileModel, as: 'profile', attributes: ['colour'] }] });
  const used = new Set(rows.map((r) => (r as ProfileAccessModel & { profile: ProfileModel }).profile.colour));
  return PROFILE_COLOURS.find((c) => !used.has(c)) ?? PROFILE_COLOURS[rows.length % PROFILE_COLOURS.length];
}

/** Creates a profile a carer keeps for someone without an account; the carer holds it as owner until it is handed over. */
export async function createManagedProfile(userId: number, input: ManagedProfileInput): Promise<{ id: number }> {
  const colour = input.colour ?? (await nextColour(userId));
  return ProfileModel.sequelize!.transaction(async () => {
    const creator = await UserModel.findByPk(userId);
    const home = await ProfileModel.findOne({ where: { ownerUserId: userId }, order: [['id', 'ASC']] });
    const profile = await ProfileModel.create({
      displayName: input.displayName!,
      ownerUserId: userId,
      managed: true,
      colour,
      preferredFoodTable: home?.preferredFoodTable ?? 'usda_sr28',
      timeZone: input.timeZone ?? home?.timeZone ?? 'UTC',
    });
    await ProfileAccessModel.create({ profileId: profile.id, userId, role: 'owner', grantedByUserId: userId, permissions: [] });
    await record({ profileId: profile.id, actorUserId: userId, kind: 'granted', subjectUserId: userId, subjectEmail: creator?.email ?? null, role: 'owner' });
    return { id: profile.id };
  });
}

function toInvitation(i: InvitationModel): OpenInvitation {
  return { id: i.id, email: i.email, role: i.role, permissions: i.permissions, expiresAt: i.expiresAt.toISOString(), createdAt: i.createdAt.toISOString() };
}

/** Everyone with access to the profile (owner first), with role, permissions and since when, and the open invitations. */
export async function listAccess(profileId: number, now = new Date()): Promise<ProfileAccessList> {
  const rows = await ProfileAccessModel.findAll({ where: { profileId }, include: [{ model: UserModel, as: 'user' }], order: [['createdAt', 'ASC'], ['id', 'ASC']] });
  const order = { owner: 0, carer: 1, clinician: 2 } as const;
  const people: AccessPerson[] = rows
    .map((r) => {
      const user = (r as ProfileAccessModel & { user: UserModel }).user;
      return { userId: r.userId, displayName: user.displayName, email: user.email, role: r.role, permissions: r.permissions, since: r.createdAt.toISOString() };
    })
    .sort((a, b) => order[a.role] - order[b.role]);
  const open = await InvitationModel.findAll({
    where: { profileId, acceptedAt: null, cancelledAt: null, expiresAt: { [Op.gt]: now } },
    order: [['createdAt', 'DESC']],
  });
  return { people, invitations: open.map(toInvitation) };
}

/**
 * Invites an address to the profile as carer, clinician or (for a managed profile only) owner, and mails the
 * single-use link; only the token's hash is kept. Returns the open invitation.
 */
export async function invite(profileId: number, actorId: number, input: InvitationInput, now = new Date()): Promise<OpenInvitation> {
  const { email, role, permissions } = input as { email: string; role: ProfileAccessRole; permissions: GrantPermission[] };
  return ProfileModel.sequelize!.transaction(async () => {
    const profile = await ProfileModel.findByPk(profileId, { lock: true });
    if (!profile) throw AppError.notFound('profile');
    if (role === 'owner' && !profile.managed) throw AppError.validation({ role: ['Only a profile you keep for someone else can be handed over to a new owner.'] });
    const existing = await ProfileAccessModel.findOne({ where: { profileId }, include: [{ model: UserModel, as: 'user', where: { email }, required: true }] });
    if (existing && role !== 'owner') throw AppError.conflict('That person already has access to this profile.', { email: ['That person already has access to this profile.'] });
    const token = crypto.randomBytes(32).toString('base64url');
    const expiresAt = new Date(now.getTime() + INVITATION_DAYS * 24 * 3600 * 1000);
    const row = await InvitationModel.create({ profileId, email, role, permissions, tokenHash: hashToken(token), invitedByUserId: actorId, expiresAt });
    await record({ profileId, actorUserId: actorId, kind: 'invited', subjectEmail: email, role, permissions });
    const inviter = await UserModel.findByPk(actorId);
    await queueMail('invitation', email, {
      inviterName: inviter?.displayName ?? 'Someone',
      profileName: profile.displayName,
      role,
      link: mailLink('/invitation', { token }),
      expiresAt,
    });
    return toInvitation(row);
  });
}

/** Withdraws an open invitation (its link stops working). */
export async function cancelInvitation(profileId: number, invitationId: number, actorId: number): Promise<void> {
  const row = await InvitationModel.findOne({ where: { id: invitationId, profileId, acceptedAt: null, cancelledAt: null } });
  if (!row) throw AppError.notFound('invitation');
  await ProfileModel.sequelize!.transaction(async () => {
    await row.update({ cancelledAt: new Date() });
    await record({ profileId, actorUserId: actorId, kind: 'invitation_cancelled', subjectEmail: row.email, role: row.role, permissions: row.permissions });
  });
}

async function findInvitation(token: string) {
  const row = await InvitationModel.findOne({
    where: { tokenHash: hashToken(token) },
    include: [{ model: ProfileModel, as: 'profile' }, { model: UserModel, as: 'invitedBy' }],
  });
  if (!row || row.cancelledAt) throw AppError.notFound('invitation');
  return row;
}

const statusOf = (row: InvitationModel, now: Date): InvitationPreview['status'] => (row.acceptedAt ? 'used' : row.expiresAt <= now ? 'expired' : 'open');

/** What an invitation offers, for the page the link opens (404 for an unknown or withdrawn link). */
export async function previewInvitation(token: string, now = new Date()): Promise<InvitationPreview> {
  const row = await findInvitation(token);
  return {
    profileName: row.profile!.displayName,
    inviterName: row.invitedBy?.displayName ?? 'Someone',
    role: row.role,
    permissions: row.permissions,
    email: row.email,
    status: statusOf(row, now),
  };
}

/**
 * Accepts an invitation for the signed-in account, which must use the invited address. Single use: a second accept,
 * an expired link or another account is refused. As owner it hands a managed profile over: the new owner holds it
 * and the people who kept it stay on as carers who may edit settings.
 */
export async function acceptInvitation(token: string, userId: number, now = new Date()): Promise<{ profileId: number }> {
  const row = await findInvitation(token);
  const user = await UserModel.findByPk(userId);
  if (!user) throw AppError.unauthorized();
  const status = statusOf(row, now);
  if (status === 'used') throw AppError.conflict('This invitation has already been used.');
  if (status === 'expired') throw AppError.conflict('This invitation has expired. Ask for a new one.');
  if (user.email !== row.email) throw AppError.forbidden(`This invitation was sent to ${row.email}. Sign in with that address to accept it.`);
  await ProfileModel.sequelize!.transaction(async () => {
    const [claimed] = await InvitationModel.update({ acceptedAt: now, acceptedByUserId: userId }, { where: { id: row.id, acceptedAt: null } });
    if (!claimed) throw AppError.conflict('This invitation has already been used.');
    const profileId = row.profileId;
    const mine = await ProfileAccessModel.findOne({ where: { profileId, userId } });
    if (row.role === 'owner') {
      const keepers = await ProfileAccessModel.findAll({ where: { profileId, role: 'owner', userId: { [Op.ne]: userId } } });
      for (const k of keepers) await k.update({ role: 'carer', permissions: ['settings'] });
      await ProfileModel.update({ ownerUserId: userId, managed: false }, { where: { id: profileId } });
      await record({ profileId, actorUserId: userId, kind: 'handed_over', subjectUserId: userId, subjectEmail: user.email, role: 'owner' });
    } else if (mine?.role === 'owner') {
      throw AppError.conflict('You already own this profile.');
    }
    if (mine) await mine.update({ role: row.role, permissions: row.permissions });
    else await ProfileAccessModel.create({ profileId, userId, role: row.role, permissions: row.permissions, grantedByUserId: row.invitedByUserId });
    await record({ profileId, actorUserId: userId, kind: 'granted', subjectUserId: userId, subjectEmail: user.email, role: row.role, permissions: row.permissions });
  });
  return { profileId: row.profileId };
}

async function findGrant(profileId: number, userId: number) {
  const grant = await ProfileAccessModel.findOne({ where: { profileId, userId }, include: [{ model: UserModel, as: 'user' }] });
  if (!grant) throw AppError.notFound('access');
  if (grant.role === 'owner') throw AppError.conflict('The owner keeps their access; hand the profile over or delete it instead.');
  return grant as ProfileAccessModel & { user: UserModel };
}

/** Changes a carer's or clinician's extra permissions (a carer may get settings, a clinician ratios). */
export async function changePermissions(profileId: number, userId: number, actorId: number, input: AccessChangeInput): Promise<AccessPerson> {
  const grant = await findGrant(profileId, userId);
  const permissions = [...new Set(input.permissions)] as GrantPermission[];
  const allowed = PERMISSIONS_FOR_ROLE[grant.role] as readonly string[];
  if (permissions.some((p) => !allowed.includes(p))) throw AppError.validation({ permissions: [`A ${grant.role} can only be given: ${allowed.join(', ') || 'nothing extra'}.`] });
  await ProfileModel.sequelize!.transaction(async () => {
    await grant.update({ permissions });
    await record({ profileId, actorUserId: actorId, kind: 'changed', subjectUserId: userId, subjectEmail: grant.user.email, role: grant.role, permissions });
  });
  return { userId, displayName: grant.user.displayName, email: grant.user.email, role: grant.role, permissions, since: grant.createdAt.toISOString() };
}

/** Takes a carer's or clinician's access away; from their next request the profile answers 404, as for a stranger. */
export async function revokeAccess(profileId: number, userId: number, actorId: number): Promise<void> {
  const grant = await findGrant(profileId, userId);
  await ProfileModel.sequelize!.transaction(async () => {
    const profile = await ProfileModel.findByPk(profileId);
    const actor = await UserModel.findByPk(actorId);
    await grant.destroy();
    await record({ profileId, actorUserId: actorId, kind: 'revoked', subjectUserId: userId, subjectEmail: grant.user.email, role: grant.role, permissions: grant.permissions });
    await queueMail('access_revoked', grant.user.email, { profileName: profile!.displayName, revokedByName: actor?.displayName ?? 'The owner', role: grant.role });
  });
}

/** The profile's audit for its owner: access events and settings changes together, newest first. */
export async function listAudit(profileId: number, limit = 200): Promise<AuditEntry[]> {
  const events = await AccessEventModel.findAll({
    where: { profileId },
    include: [{ model: UserModel, as: 'actor', attributes: ['displayName'] }, { model: UserModel, as: 'subject', attributes: ['displayName'] }],
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    limit,
  });
  const access: AuditEntry[] = events.map((e) => ({
    at: e.createdAt.toISOString(),
    kind: e.kind,
    actorName: e.actor?.displayName ?? null,
    about: e.subject?.displayName ?? e.subjectEmail,
    role: e.role,
    permissions: e.permissions,
  }));
  const settings: AuditEntry[] = (await listChanges(profileId, limit)).map((c) => ({
    at: c.createdAt,
    kind: 'settings',
    actorName: c.changedBy.displayName,
    about: `${c.subjectName} (${c.action})`,
    role: null,
    permissions: [],
  }));
  return [...access, ...settings].sort((a, b) => b.at.localeCompare(a.at)).slice(0, limit);
}

/** Every profile's access events for the admin's audit, newest first (at most `limit`). */
export async function listAccessEvents(limit = 200): Promise<AccessAuditEntry[]> {
  const events = await AccessEventModel.findAll({
    include: [
      { model: UserModel, as: 'actor', attributes: ['id', 'email'] },
      { model: UserModel, as: 'subject', attributes: ['id', 'email'] },
      { model: ProfileModel, as: 'profile', attributes: ['id', 'displayName'] },
    ],
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    limit,
  });
  return events.map((e) => {
    const profile = (e as AccessEventModel & { profile: ProfileModel }).profile;
    return {
      source: 'access',
      id: e.id,
      action: e.kind,
      profile: { id: profile.id, displayName: profile.displayName },
      user: e.subject ? { id: e.subject.id, email: e.subject.email } : null,
      email: e.subjectEmail,
      actor: e.actor ? { id: e.actor.id, email: e.actor.email } : null,
      role: e.role,
      permissions: e.permissions,
      createdAt: e.createdAt.toISOString(),
    };
  });
}
