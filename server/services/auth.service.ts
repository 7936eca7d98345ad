import crypto from 'node:crypto';
import bcrypt from 'bcryptjs';
import jwt from 'jsonwebtoken';
import { Op, QueryTypes, UniqueConstraintError } from 'sequelize';
import type { ChangePasswordInput, Me, ProfileAccessRole, Session, SignInInput, SignUpInput, User, UserRole } from '../../shared/schemas/auth';
import type { GrantPermission } from '../../shared/schemas/profile-actions';
import type { CarbBasis, CarbUnit } from '../../shared/schemas/units';
import { remember } from '../lib/request-cache';
import type { Config } from '../config';
import { passwordProblem, utf8Bytes, PASSWORD_MAX_BYTES } from '../lib/passwords';
import { AppError } from '../errors';
import { ProfileAccessModel, ProfileModel, RevokedTokenModel, UserModel } from '../models';

type TokenClaims = { sub: string; tv: number; jti: string; exp: number };

// A real hash of a random password, compared against when the email is unknown, so that
// an unknown email and a wrong password take the same time and give the same answer.
let dummyHash: string | undefined;
async function getDummyHash(cost: number) {
  dummyHash ??= await bcrypt.hash(crypto.randomBytes(16).toString('hex'), cost);
  return dummyHash;
}

// The signing key as a KeyObject, made once per secret: given a string, jsonwebtoken's verify first tries to read it
// as a PEM public key and builds the secret key from the thrown error, on every request (a few ms of CPU each).
const signingKeys = new Map<string, crypto.KeyObject>();
function signingKey(config: Config): crypto.KeyObject {
  let key = signingKeys.get(config.jwtSecret);
  if (!key) signingKeys.set(config.jwtSecret, (key = crypto.createSecretKey(Buffer.from(config.jwtSecret, 'utf8'))));
  return key;
}

function issueToken(config: Config, user: UserModel): { token: string; expiresAt: Date } {
  const jti = crypto.randomBytes(16).toString('hex');
  const token = jwt.sign({ tv: user.tokenVersion, jti }, signingKey(config), {
    algorithm: 'HS256',
    subject: String(user.id),
    expiresIn: Math.round(config.TOKEN_TTL_HOURS * 3600),
  });
  const { exp } = jwt.decode(token) as TokenClaims;
  return { token, expiresAt: new Date(exp * 1000) };
}

/** The signed-in person and the profiles they may open (`known`: the user row this request already read). */
export async function getMe(userId: number, known?: User): Promise<Me> {
  const user = known ?? (await UserModel.findByPk(userId))?.toUser();
  if (!user) throw AppError.unauthorized();
  // One plain query: the profiles are read, never changed, here.
  const rows = await UserModel.sequelize!.query<{ id: number; display_name: string; role: ProfileAccessRole; glucose_unit: Me['profiles'][number]['glucoseUnit']; carb_basis: Me['profiles'][number]['carbBasis']; carb_unit: Me['profiles'][number]['carbUnit']; preferred_food_table: Me['profiles'][number]['preferredFoodTable']; time_zone: string; permissions: GrantPermission[] | null; colour: Me['profiles'][number]['colour']; managed: boolean }>(
    `SELECT p.id, p.display_name, pa.role, pa.permissions, p.colour, p.managed, p.glucose_unit, p.carb_basis, p.carb_unit, p.preferred_food_table, p.time_zone
       FROM profile_access pa JOIN profiles p ON p.id = pa.profile_id
      WHERE pa.user_id = :userId
      ORDER BY pa.created_at ASC, pa.id ASC`,
    { replacements: { userId: user.id }, type: QueryTypes.SELECT },
  );
  const order = { owner: 0, carer: 1, clinician: 2 } as const;
  const profiles = rows
    .map((r) => ({
      id: r.id,
      displayName: r.display_name,
      access: r.role,
      permissions: r.permissions ?? [],
      colour: r.colour,
      managed: r.managed,
      glucoseUnit: r.glucose_unit,
      carbBasis: r.carb_basis,
      carbUnit: r.carb_unit,
      preferredFoodTable: r.preferred_food_table,
      timeZone: r.time_zone,
    }))
    .sort((a, b) => order[a.access] - order[b.access]);
  return { user, profiles };
}

/** A fresh session (token and /me) for a user who has just proved who they are. */
export async function sessionFor(config: Config, user: UserModel): Promise<Session> {
  const { token, expiresAt } = issueToken(config, user);
  return { token, expiresAt: expiresAt.toISOString(), me: await getMe(user.id) };
}

/** Creates an account; members also get their own profile. Throws 409 on a taken email. */
export async function signUp(config: Config, input: SignUpInput, role: UserRole = 'member'): Promise<Session> {
  const passwordHash = await bcrypt.hash(input.password, config.BCRYPT_COST);
  const sequelize = UserModel.sequelize!;
  try {
    const user = await sequelize.transaction(async (transaction) => {
      const created = await UserModel.create(
        { email: input.email, displayName: input.displayName, passwordHash, role },
        { transaction },
      );
      if (role === 'member') {
        const profile = await ProfileModel.create(
          { displayName: input.displayName, ownerUserId: created.id, preferredFoodTable: input.preferredFoodTable ?? 'usda_sr28', timeZone: input.timeZone ?? 'UTC' },
          { transaction },
        );
        await ProfileAccessModel.create(
          { profileId: profile.id, userId: created.id, role: 'owner', grantedByUserId: created.id },
          { transaction },
        );
      }
      return created;
    });
    return sessionFor(config, user);
  } catch (err) {
    if (err instanceof UniqueConstraintError) {
      throw AppError.conflict('An account with that email already exists.', {
        email: ['An account with that email already exists.'],
      });
    }
    throw err;
  }
}

/** Checks email and password; the same 401 whether the email is unknown or the password wrong. */
export async function signIn(config: Config, input: SignInInput): Promise<Session> {
  const user = await UserModel.findOne({ where: { email: input.email } });
  const ok = await bcrypt.compare(input.password, user?.passwordHash ?? (await getDummyHash(config.BCRYPT_COST)));
  // bcrypt reads only 72 bytes: a longer password is never the right one, however it starts.
  const fits = utf8Bytes(input.password) <= PASSWORD_MAX_BYTES;
  if (!user || !ok || !fits) throw AppError.unauthorized('Email or password is not right.');
  // Only after the right password, so the answer tells nothing to someone guessing.
  if (user.disabledAt) throw AppError.forbidden('This account is disabled. Ask the person who runs your Carbwright.');
  return sessionFor(config, user);
}

/** The signed-in user as one request sees it (never the password hash). */
export type SignedInUser = User & { tokenVersion: number };

/** A profile the signed-in user may open, read with the sign-in check: the access role and the profile's units. */
export type ProfileAccess = {
  profileId: number;
  role: ProfileAccessRole;
  /** A grant's extra permissions, when the access table carries them (shared/schemas/profile-actions.ts). */
  permissions?: GrantPermission[] | null;
  profile: { displayName: string; carbBasis: CarbBasis; carbUnit: CarbUnit };
};

type AuthRow = {
  id: number; email: string; display_name: string; role: UserRole; token_version: number; created_at: Date; revoked: boolean; disabled_at: Date | null;
  access_role: ProfileAccessRole | null; access_permissions: GrantPermission[] | null; profile_name: string | null; carb_basis: CarbBasis | null; carb_unit: CarbUnit | null;
};

/**
 * Verifies a bearer token against its signature, expiry, the user's token version and sign-outs, in one query that
 * also reads the user's access to `profileId` when given (null access: none).
 */
export async function verifyToken(config: Config, token: string, profileId?: number) {
  let claims: TokenClaims;
  try {
    claims = jwt.verify(token, signingKey(config), { algorithms: ['HS256'] }) as TokenClaims;
  } catch (err) {
    const expired = err instanceof jwt.TokenExpiredError;
    throw AppError.unauthorized(expired ? 'Your session has expired. Please sign in again.' : 'Please sign in.');
  }
  const id = Number(claims.sub);
  if (!Number.isSafeInteger(id) || id <= 0) throw AppError.unauthorized('Please sign in again.');
  const [row] = await UserModel.sequelize!.query<AuthRow>(
    `SELECT u.id, u.email, u.display_name, u.role, u.token_version, u.created_at, u.disabled_at,
            EXISTS (SELECT 1 FROM revoked_tokens r WHERE r.jti = :jti) AS revoked,
            pa.role AS access_role, to_jsonb(pa) -> 'permissions' AS access_permissions, p.display_name AS profile_name, p.carb_basis, p.carb_unit
       FROM users u
       LEFT JOIN profile_access pa ON pa.user_id = u.id AND pa.profile_id = CAST(:profileId AS int)
       LEFT JOIN profiles p ON p.id = pa.profile_id
      WHERE u.id = :id`,
    { replacements: { id, jti: String(claims.jti), profileId: profileId ?? null }, type: QueryTypes.SELECT },
  );
  if (!row || row.token_version !== claims.tv || row.revoked || row.disabled_at) throw AppError.unauthorized('Please sign in again.');
  const user: SignedInUser = {
    id: row.id, email: row.email, displayName: row.display_name, role: row.role, createdAt: new Date(row.created_at).toISOString(), tokenVersion: row.token_version,
  };
  const access: ProfileAccess | null =
    profileId !== undefined && row.access_role
      ? { profileId, role: row.access_role, permissions: row.access_permissions, profile: { displayName: row.profile_name!, carbBasis: row.carb_basis!, carbUnit: row.carb_unit! } }
      : null;
  return { auth: { user, jti: claims.jti, expiresAt: new Date(claims.exp * 1000) }, access };
}

/** Signs this one token out (other devices stay signed in). */
export async function signOut(jti: string, expiresAt: Date): Promise<void> {
  await RevokedTokenModel.upsert({ jti, expiresAt });
  await RevokedTokenModel.destroy({ where: { expiresAt: { [Op.lt]: new Date() } } });
}

/** Changes the password and invalidates every token issued before; returns a fresh session. */
export async function changePassword(config: Config, userId: number, input: ChangePasswordInput): Promise<Session> {
  const user = await UserModel.findByPk(userId);
  if (!user) throw AppError.unauthorized();
  if (!(await bcrypt.compare(input.currentPassword, user.passwordHash))) {
    throw AppError.validation({ currentPassword: ['That is not your current password.'] });
  }
  const problem = passwordProblem(input.newPassword, [user.email, user.displayName]);
  if (problem) throw AppError.validation({ newPassword: [problem] });
  user.passwordHash = await bcrypt.hash(input.newPassword, config.BCRYPT_COST);
  user.tokenVersion += 1;
  await user.save();
  return sessionFor(config, user);
}

/** The access row that lets a user reach a profile, or null (once per request). */
export async function findProfileAccess(userId: number, profileId: number): Promise<ProfileAccessModel | null> {
  return remember(`access:${userId}:${profileId}`, () => ProfileAccessModel.findOne({ where: { userId, profileId }, raw: true }) as Promise<ProfileAccessModel | null>);
}

/** Creates an admin account, or promotes an existing account to admin (command line and first start). */
export async function ensureAdmin(config: Config, email: string, password: string, displayName = 'Administrator') {
  const existing = await UserModel.findOne({ where: { email: email.trim().toLowerCase() } });
  if (existing) {
    existing.role = 'admin';
    existing.passwordHash = await bcrypt.hash(password, config.BCRYPT_COST);
    existing.tokenVersion += 1;
    await existing.save();
    return { user: existing, created: false };
  }
  const session = await signUp(config, { email: email.trim().toLowerCase(), displayName, password }, 'admin');
  return { user: (await UserModel.findByPk(session.me.user.id))!, created: true };
}
