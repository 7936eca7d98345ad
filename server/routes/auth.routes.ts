import {
  changePasswordInputSchema,
  emailChangeConfirmInputSchema,
  emailChangeInputSchema,
  emailChangeRequestedSchema,
  meSchema,
  passwordResetInputSchema,
  passwordResetRequestedSchema,
  passwordResetRequestInputSchema,
  sessionSchema,
  signInInputSchema,
  signUpInputSchema,
} from '../../shared/schemas/auth';
import { authLimits } from '../middleware/rate-limit';
import { clearSessionCookies, sendSession } from '../middleware/session-cookie';
import { changePassword, getMe, signIn, signOut, signUp } from '../services/auth.service';
import { confirmEmailChange, emailChangeRequestedMessage, requestEmailChange } from '../services/email-change.service';
import { requestPasswordReset, resetPassword, RESET_REQUESTED_MESSAGE } from '../services/password-reset.service';
import { access, defineRoute, type AnyRoute, type AppDeps } from './registry';

/** Sign-up, sign-in, sign-out, password change and reset, e-mail change and /me. */
export function authRoutes({ config, sequelize }: AppDeps): AnyRoute[] {
  const limits = authLimits(config, sequelize);
  const limiter = limits.perAddress;
  return [
    defineRoute({
      method: 'post', path: '/auth/sign-up', access: access.public, before: [limiter], body: signUpInputSchema, status: 201, response: sessionSchema,
      summary: 'Create an account (rate-limited): a member also gets their own profile. 409 when the email is taken.',
      handler: async ({ body }, req, res) => sendSession(config, req, res, await signUp(config, body), 201),
    }),
    defineRoute({
      method: 'post', path: '/auth/sign-in', access: access.public, before: [limiter], body: signInInputSchema, response: sessionSchema,
      summary: 'Sign in (rate-limited per address, and per account after ACCOUNT_RATE_LIMIT failures); the same 401 for an unknown email or a wrong password.',
      handler: async ({ body }, req, res) => sendSession(config, req, res, await limits.guardAccount(body.email, res, () => signIn(config, body))),
    }),
    defineRoute({
      method: 'post', path: '/auth/sign-out', access: access.signedIn, status: 204, summary: 'Revoke this token and clear the session cookies.',
      handler: async ({ auth }, req, res) => {
        await signOut(auth.jti, auth.expiresAt);
        clearSessionCookies(req, res);
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'post', path: '/auth/password', access: access.signedIn, before: [limiter], body: changePasswordInputSchema, response: sessionSchema,
      summary: 'Change the password (rate-limited) and get a new session; older tokens stop working.',
      handler: async ({ user, body }, req, res) => sendSession(config, req, res, await changePassword(config, user.id, body)),
    }),
    defineRoute({
      method: 'post', path: '/auth/password-reset', access: access.public, before: [limiter], body: passwordResetRequestInputSchema, status: 202, response: passwordResetRequestedSchema,
      summary: 'Ask for a password reset link by e-mail (rate-limited). The same 202 whether or not an account uses the address.',
      handler: async ({ body }, _req, res) => {
        // Past MAIL_RATE_LIMIT mails an hour to one address, nothing more is sent, and the answer stays the same.
        if (await limits.mayMail(body.email)) await requestPasswordReset(body.email);
        res.status(202).json({ message: RESET_REQUESTED_MESSAGE });
      },
    }),
    defineRoute({
      method: 'post', path: '/auth/password-reset/confirm', access: access.public, before: [limiter], body: passwordResetInputSchema, response: sessionSchema,
      summary: 'Set a new password with the token from the reset link (single use, one hour); ends every other session and signs in.',
      handler: async ({ body }, req, res) => sendSession(config, req, res, await resetPassword(config, body)),
    }),
    defineRoute({
      method: 'post', path: '/auth/email', access: access.signedIn, before: [limiter], body: emailChangeInputSchema, status: 202, response: emailChangeRequestedSchema,
      summary: 'Ask to change the e-mail address (current password required, rate-limited): a single-use link goes to the new address. The same 202 whether or not another account uses it.',
      handler: async ({ auth, body }, _req, res) => {
        await requestEmailChange(auth.user.id, body, limits.mayMail);
        res.status(202).json({ message: emailChangeRequestedMessage(body.newEmail, auth.user.email) });
      },
    }),
    defineRoute({
      method: 'post', path: '/auth/email/confirm', access: access.signedIn, before: [limiter], body: emailChangeConfirmInputSchema, response: sessionSchema,
      summary: 'Confirm the new address with the token from its link (single use, one hour, same account): the old address is told, other sessions end.',
      handler: async ({ user, body }, req, res) => sendSession(config, req, res, await confirmEmailChange(config, user.id, body)),
    }),
    defineRoute({
      method: 'get', path: '/me', access: access.signedIn, response: meSchema, summary: 'The signed-in account and the profiles it may open.',
      handler: async ({ auth }, _req, res) => {
        const { tokenVersion: _tv, ...user } = auth.user;
        res.json(await getMe(user.id, user));
      },
    }),
  ];
}
