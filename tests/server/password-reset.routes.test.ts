import request from 'supertest';
import { AccountTokenModel } from '../../server/models';
import { hashToken } from '../../server/services/account-tokens.service';
import { bearer, signUpUser, useTestApp } from '../helpers/api';
import { lastCapturedId, linkIn, waitForMail } from '../helpers/mail';

const ctx = useTestApp();
const NEW_PASSWORD = 'tangerine kettle harbour';

async function askForReset(email: string) {
  const after = await lastCapturedId(ctx.sequelize);
  const res = await request(ctx.app).post('/api/auth/password-reset').send({ email });
  return { res, after };
}

describe('POST /api/auth/password-reset', () => {
  it('answers the same for an unknown address and sends nothing', async () => {
    const known = await signUpUser(ctx.app, 'Known');
    const a = await request(ctx.app).post('/api/auth/password-reset').send({ email: known.email });
    const b = await request(ctx.app).post('/api/auth/password-reset').send({ email: 'nobody-here@example.test' });

    expect(a.status).toBe(202);
    expect(b.status).toBe(202);
    expect(b.body).toEqual(a.body);
    const [rows] = await ctx.sequelize.query("SELECT count(*)::int AS n FROM mail_outbox WHERE to_address = 'nobody-here@example.test'");
    expect((rows as { n: number }[])[0].n).toBe(0);
  });

  it('stores only the hash of the token it mails', async () => {
    const user = await signUpUser(ctx.app, 'Hashed');
    const { after } = await askForReset(user.email);
    const token = linkIn(await waitForMail(ctx.sequelize, user.email, { after }), '/reset-password').searchParams.get('token')!;

    const rows = await AccountTokenModel.findAll({ where: { userId: user.me.user.id } });
    expect(rows).toHaveLength(1);
    expect(rows[0].tokenHash).toBe(hashToken(token));
    expect(rows[0].tokenHash).not.toContain(token);
    // one hour (the rule)
    expect(rows[0].expiresAt.getTime() - rows[0].createdAt.getTime()).toBeGreaterThan(59 * 60_000);
    expect(rows[0].expiresAt.getTime() - rows[0].createdAt.getTime()).toBeLessThanOrEqual(60 * 60_000 + 1000);
  });
});

describe('POST /api/auth/password-reset/confirm', () => {
  it('sets the new password, signs this device in, ends every other session, and refuses the link a second time', async () => {
    const user = await signUpUser(ctx.app, 'Resetter');
    const { after } = await askForReset(user.email);
    const link = linkIn(await waitForMail(ctx.sequelize, user.email, { after }), '/reset-password');

    const res = await request(ctx.app).post('/api/auth/password-reset/confirm').send({ token: link.searchParams.get('token'), password: NEW_PASSWORD });

    expect(res.status).toBe(200);
    expect((await request(ctx.app).get('/api/me').set(bearer(res.body.token))).status).toBe(200);
    expect((await request(ctx.app).get('/api/me').set(bearer(user.token))).status).toBe(401);
    expect((await request(ctx.app).post('/api/auth/sign-in').send({ email: user.email, password: user.password })).status).toBe(401);
    expect((await request(ctx.app).post('/api/auth/sign-in').send({ email: user.email, password: NEW_PASSWORD })).status).toBe(200);
    const again = await request(ctx.app).post('/api/auth/password-reset/confirm').send({ token: link.searchParams.get('token'), password: 'another fine password here' });
    expect(again.status).toBe(400);
    expect(again.body.error.fieldErrors.token[0]).toMatch(/expired or has already been used/);
  });

  it('refuses an expired link', async () => {
    const user = await signUpUser(ctx.app, 'Late');
    const { after } = await askForReset(user.email);
    const token = linkIn(await waitForMail(ctx.sequelize, user.email, { after }), '/reset-password').searchParams.get('token')!;
    await AccountTokenModel.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { tokenHash: hashToken(token) } });

    const res = await request(ctx.app).post('/api/auth/password-reset/confirm').send({ token, password: NEW_PASSWORD });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.token).toBeDefined();
    expect((await request(ctx.app).post('/api/auth/sign-in').send({ email: user.email, password: user.password })).status).toBe(200);
  });

  it('only the newest link works', async () => {
    const user = await signUpUser(ctx.app, 'Twice');
    const first = await askForReset(user.email);
    const oldToken = linkIn(await waitForMail(ctx.sequelize, user.email, { after: first.after }), '/reset-password').searchParams.get('token');
    await askForReset(user.email);

    const res = await request(ctx.app).post('/api/auth/password-reset/confirm').send({ token: oldToken, password: NEW_PASSWORD });

    expect(res.status).toBe(400);
  });

  it('refuses a weak password with a clear message and keeps the link usable', async () => {
    const user = await signUpUser(ctx.app, 'Weak');
    const { after } = await askForReset(user.email);
    const token = linkIn(await waitForMail(ctx.sequelize, user.email, { after }), '/reset-password').searchParams.get('token');

    const weak = await request(ctx.app).post('/api/auth/password-reset/confirm').send({ token, password: 'password123' });
    const personal = await request(ctx.app).post('/api/auth/password-reset/confirm').send({ token, password: user.email });
    const ok = await request(ctx.app).post('/api/auth/password-reset/confirm').send({ token, password: NEW_PASSWORD });

    expect(weak.status).toBe(400);
    expect(weak.body.error.fieldErrors.password[0]).toMatch(/common/);
    expect(personal.status).toBe(400);
    expect(personal.body.error.fieldErrors.password[0]).toMatch(/e-mail address/);
    expect(ok.status).toBe(200);
  });
});

describe('passwords longer than bcrypt reads', () => {
  it('two passwords that differ only after byte 72 no longer both work: more than 72 bytes is refused', async () => {
    const base = 'violet-harbour-7'.repeat(4) + 'grebe-mo'; // 72 bytes
    const signUp = await request(ctx.app).post('/api/auth/sign-up').send({ email: 'long@example.test', displayName: 'Long', password: base });
    expect(signUp.status).toBe(201);

    const longer = await request(ctx.app).post('/api/auth/sign-in').send({ email: 'long@example.test', password: `${base}X` });
    const tooLongSignUp = await request(ctx.app).post('/api/auth/sign-up').send({ email: 'longer@example.test', displayName: 'Longer', password: `${base}X` });

    expect(longer.status).toBe(401);
    expect(tooLongSignUp.status).toBe(400);
    expect(tooLongSignUp.body.error.fieldErrors.password[0]).toMatch(/at most 72 bytes/);
  });
});

describe('POST /api/auth/password (change)', () => {
  it('refuses the same password and a weak one, under the new-password field', async () => {
    const user = await signUpUser(ctx.app, 'Changer');

    const same = await request(ctx.app).post('/api/auth/password').set(bearer(user.token)).send({ currentPassword: user.password, newPassword: user.password });
    const weak = await request(ctx.app).post('/api/auth/password').set(bearer(user.token)).send({ currentPassword: user.password, newPassword: 'qwertyuiop' });

    expect(same.status).toBe(400);
    expect(same.body.error.fieldErrors.newPassword[0]).toMatch(/different/);
    expect(weak.status).toBe(400);
    expect(weak.body.error.fieldErrors.newPassword[0]).toMatch(/common|keyboard/i);
  });
});
