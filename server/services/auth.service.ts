import crypto from 'node:crypto';
import bcrypt from 'bcryptjs';
import jwt from 'jsonwebtoken';
import { Op, UniqueConstraintError } from 'sequelize';
import type { ChangePasswordInput, Me, Session, SignInInput, SignUpInput, UserRole } from '../../shared/schemas/auth';
import type { Config } from '../config';
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

function issueToken(config: Config, user: UserModel): { token: string; expiresAt: Date } {
  const jti = crypto.randomBytes(16).toString('hex');
  const token = jwt.sign({ tv: user.tokenVersion, jti }, config.jwtSecret, {
    algorithm: 'HS256',
    subject: String(user.id),
    expiresIn: Math.round(config.TOKEN_TTL_HOURS * 3600),
  });
  const { exp } = jwt.decode(token) as TokenClaims;
  return { token, expiresAt: new Date(exp * 1000) };
}

/** The signed-in person and the profiles they may open. */
export async function getMe(userId: number): Promise<Me> {
  const user = await UserModel.findByPk(userId);
  if (!user) throw AppError.unauthorized();
  const accesses = await ProfileAccessModel.findAll({
    where: { userId: user.id },
    include: [{ model: ProfileModel, as: 'profile' }],
    order: [['createdAt', 'ASC']],
  });
  const order = { owner: 0, carer: 1, clinician: 2 } as const;
  const profiles = accesses
    .map((a) => {
      const profile = (a as ProfileAccessModel & { profile: ProfileModel }).profile;
      return {
        id: profile.id,
        displayName: profile.displayName,
        access: a.role,
        permissions: a.permissions,
        colour: profile.colour,
        managed: profile.managed,
        glucoseUnit: profile.glucoseUnit,
        carbBasis: profile.carbBasis,
        carbUnit: profile.carbUnit,
        preferredFoodTable: profile.preferredFoodTable,
      };
    })
    .sort((a, b) => order[a.access] - order[b.access]);
  return { user: user.toUser(), profiles };
}

async function sessionFor(config: Config, user: UserModel): Promise<Session> {
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
          { displayName: input.displayName, ownerUserId: created.id, preferredFoodTable: input.preferredFoodTable ?? 'usda_sr28' },
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
  if (!user || !ok) throw AppError.unauthorized('Email or password is not right.');
  return sessionFor(config, user);
}

/** Verifies a bearer token against its signature, expiry, the user's token version and sign-outs. */
export async function verifyToken(config: Config, token: string) {
  let claims: TokenClaims;
  try {
    claims = jwt.verify(token, config.jwtSecret, { algorithms: ['HS256'] }) as TokenClaims;
  } catch (err) {
    const expired = err instanceof jwt.TokenExpiredError;
    throw AppError.unauthorized(expired ? 'Your session has expired. Please sign in again.' : 'Please sign in.');
  }
  // A subject that is not a user id (a token signed for something else) is a bad session, not a server fault.
  const userId = Number(claims.sub);
  if (!Number.isSafeInteger(userId) || userId <= 0) throw AppError.unauthorized('Please sign in again.');
  const user = await UserModel.findByPk(userId);
  if (!user || user.tokenVersion !== claims.tv) throw AppError.unauthorized('Please sign in again.');
  if (await RevokedTokenModel.findByPk(claims.jti)) throw AppError.unauthorized('Please sign in again.');
  return { user, jti: claims.jti, expiresAt: new Date(claims.exp * 1000) };
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
  user.passwordHash = await bcrypt.hash(input.newPassword, config.BCRYPT_COST);
  user.tokenVersion += 1;
  await user.save();
  return sessionFor(config, user);
}

/** The access row that lets a user reach a profile, or null. */
export async function findProfileAccess(userId: number, profileId: number) {
  return ProfileAccessModel.findOne({ where: { userId, profileId } });
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
