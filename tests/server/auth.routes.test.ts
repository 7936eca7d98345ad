import jwt from 'jsonwebtoken';
import request from 'supertest';
import { ProfileAccessModel, ProfileModel, UserModel } from '../../server/models';
import { bearer, signUpUser, useTestApp } from '../helpers/api';

const ctx = useTestApp();

describe('POST /api/auth/sign-up', () => {
  it('creates a member with a normalised email, a hashed password and their own profile', async () => {
    const res = await request(ctx.app)
      .post('/api/auth/sign-up')
      .send({ email: '  Ada.Cook@Example.TEST ', displayName: 'Ada', password: 'a long enough secret' });

    expect(res.status).toBe(201);
    expect(res.body.me.user).toMatchObject({ email: 'ada.cook@example.test', displayName: 'Ada', role: 'member' });
    expect(res.body.me.profiles).toEqual([expect.objectContaining({ displayName: 'Ada', access: 'owner' })]);
    const user = await UserModel.findOne({ where: { email: 'ada.cook@example.test' } });
    expect(user!.passwordHash).toMatch(/^\$2[aby]\$/);
    expect(user!.passwordHash).not.toContain('a long enough secret');
    const profile = await ProfileModel.findOne({ where: { ownerUserId: user!.id } });
    const access = await ProfileAccessModel.findOne({ where: { profileId: profile!.id, userId: user!.id } });
    expect(access!.role).toBe('owner');
  });

  it('returns 409 with a field error when the email is already taken, in any letter case', async () => {
    await request(ctx.app).post('/api/auth/sign-up').send({ email: 'dup@example.test', displayName: 'One', password: 'first password!' });

    const res = await request(ctx.app)
      .post('/api/auth/sign-up')
      .send({ email: 'DUP@example.test', displayName: 'Two', password: 'second password!' });

    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('conflict');
    expect(res.body.error.fieldErrors.email).toBeDefined();
    expect(await UserModel.count({ where: { email: 'dup@example.test' } })).toBe(1);
  });

  it('returns 400 with field detail for a password under 10 characters and saves nothing', async () => {
    const before = await UserModel.count();

    const res = await request(ctx.app)
      .post('/api/auth/sign-up')
      .send({ email: 'weak@example.test', displayName: 'Weak', password: 'nine char' });

    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'validation_failed', fieldErrors: { password: [expect.stringMatching(/10 characters/)] } });
    expect(await UserModel.count()).toBe(before);
  });

  it('returns 400 for a malformed email and a missing name together', async () => {
    const res = await request(ctx.app).post('/api/auth/sign-up').send({ email: 'not-an-email', password: 'long enough pw' });

    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors).sort()).toEqual(['displayName', 'email']);
  });

  it('returns 400 for a body that is not JSON', async () => {
    const res = await request(ctx.app).post('/api/auth/sign-up').set('Content-Type', 'application/json').send('{"email":');

    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
  });
});

describe('POST /api/auth/sign-in', () => {
  it('returns a token for the right password', async () => {
    const user = await signUpUser(ctx.app, 'Signer');

    const res = await request(ctx.app).post('/api/auth/sign-in').send({ email: user.email.toUpperCase(), password: user.password });

    expect(res.status).toBe(200);
    expect(res.body.token).toEqual(expect.any(String));
    expect(res.body.me.user.email).toBe(user.email);
  });

  it('gives the same 401 for a wrong password and for an unknown email', async () => {
    const user = await signUpUser(ctx.app, 'Private');

    const wrong = await request(ctx.app).post('/api/auth/sign-in').send({ email: user.email, password: 'not the password' });
    const unknown = await request(ctx.app).post('/api/auth/sign-in').send({ email: 'nobody@example.test', password: 'not the password' });

    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(unknown.body).toEqual(wrong.body);
  });
});

describe('GET /api/me', () => {
  it('answers with the user for a valid token', async () => {
    const user = await signUpUser(ctx.app, 'Me');

    const res = await request(ctx.app).get('/api/me').set(bearer(user.token));

    expect(res.status).toBe(200);
    expect(res.body.user.id).toBe(user.me.user.id);
  });

  it('returns 401 without a token', async () => {
    const res = await request(ctx.app).get('/api/me');

    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthorized');
  });

  it('returns 401 for an expired token', async () => {
    const user = await signUpUser(ctx.app, 'Expired');
    const expired = jwt.sign({ tv: 0, jti: 'x1', exp: Math.floor(Date.now() / 1000) - 60 }, ctx.config.jwtSecret, {
      subject: String(user.me.user.id),
    });

    const res = await request(ctx.app).get('/api/me').set(bearer(expired));

    expect(res.status).toBe(401);
    expect(res.body.error.message).toMatch(/expired/);
  });

  it('returns 401 for a tampered token', async () => {
    const user = await signUpUser(ctx.app, 'Tamper');
    const [head, , sig] = user.token.split('.');
    const forgedPayload = Buffer.from(JSON.stringify({ sub: '1', tv: 0, jti: 'x', exp: 9999999999 })).toString('base64url');

    const res = await request(ctx.app).get('/api/me').set(bearer(`${head}.${forgedPayload}.${sig}`));

    expect(res.status).toBe(401);
  });

  it('returns 401 for a token signed with another secret', async () => {
    const user = await signUpUser(ctx.app, 'Other');
    const foreign = jwt.sign({ tv: 0, jti: 'x2' }, 'another-secret-of-sufficient-length-000000', { subject: String(user.me.user.id) });

    const res = await request(ctx.app).get('/api/me').set(bearer(foreign));

    expect(res.status).toBe(401);
  });
});

describe('POST /api/auth/sign-out', () => {
  it('makes that token unusable while another session stays signed in', async () => {
    const user = await signUpUser(ctx.app, 'Leaver');
    const second = await request(ctx.app).post('/api/auth/sign-in').send({ email: user.email, password: user.password });

    const out = await request(ctx.app).post('/api/auth/sign-out').set(bearer(user.token));

    expect(out.status).toBe(204);
    expect((await request(ctx.app).get('/api/me').set(bearer(user.token))).status).toBe(401);
    expect((await request(ctx.app).get('/api/me').set(bearer(second.body.token))).status).toBe(200);
  });
});

describe('POST /api/auth/password', () => {
  it('changes the password and invalidates tokens issued before', async () => {
    const user = await signUpUser(ctx.app, 'Changer');

    const res = await request(ctx.app)
      .post('/api/auth/password')
      .set(bearer(user.token))
      .send({ currentPassword: user.password, newPassword: 'a brand new passphrase' });

    expect(res.status).toBe(200);
    expect((await request(ctx.app).get('/api/me').set(bearer(user.token))).status).toBe(401);
    expect((await request(ctx.app).get('/api/me').set(bearer(res.body.token))).status).toBe(200);
    const oldPw = await request(ctx.app).post('/api/auth/sign-in').send({ email: user.email, password: user.password });
    const newPw = await request(ctx.app).post('/api/auth/sign-in').send({ email: user.email, password: 'a brand new passphrase' });
    expect(oldPw.status).toBe(401);
    expect(newPw.status).toBe(200);
  });

  it('returns 400 on currentPassword when it is wrong, and keeps the old password', async () => {
    const user = await signUpUser(ctx.app, 'Wrong');

    const res = await request(ctx.app)
      .post('/api/auth/password')
      .set(bearer(user.token))
      .send({ currentPassword: 'not it at all', newPassword: 'a brand new passphrase' });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.currentPassword).toBeDefined();
    expect((await request(ctx.app).get('/api/me').set(bearer(user.token))).status).toBe(200);
  });
});

describe('role middleware', () => {
  it('returns 403 to a member on an admin route and 200 to an admin', async () => {
    const member = await signUpUser(ctx.app, 'Member');
    const admin = await signUpUser(ctx.app, 'Boss');
    await UserModel.update({ role: 'admin' }, { where: { id: admin.me.user.id } });

    const asMember = await request(ctx.app).get('/api/admin/users').set(bearer(member.token));
    const asAdmin = await request(ctx.app).get('/api/admin/users').set(bearer(admin.token));

    expect(asMember.status).toBe(403);
    expect(asMember.body.error.code).toBe('forbidden');
    expect(asAdmin.status).toBe(200);
    expect(asAdmin.body.users.map((u: { email: string }) => u.email)).toContain(member.email);
  });
});

describe('errors', () => {
  it('answers an unknown API path with the 404 error shape', async () => {
    const res = await request(ctx.app).get('/api/no-such-thing');

    expect(res.status).toBe(404);
    expect(res.body).toEqual({ error: { code: 'not_found', message: expect.any(String) } });
  });

  it('answers a body over 1 MB with 413', async () => {
    const res = await request(ctx.app)
      .post('/api/auth/sign-in')
      .send({ email: 'a@b.test', password: 'x'.repeat(1_100_000) });

    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
  });
});
