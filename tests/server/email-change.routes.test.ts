import request from 'supertest';
import { AccountTokenModel, UserModel } from '../../server/models';
import { hashToken } from '../../server/services/account-tokens.service';
import { bearer, signUpUser, useTestApp } from '../helpers/api';
import { lastCapturedId, linkIn, waitForMail } from '../helpers/mail';

// Two confirmation mails an hour per address, so the throttle test reaches the limit quickly.
const ctx = useTestApp({ MAIL_RATE_LIMIT: '2' });

let seq = 0;
const freshAddress = (name: string) => `${name}${++seq}-${process.pid}@example.test`;

async function askToChange(token: string, body: { newEmail: string; currentPassword: string }) {
  const after = await lastCapturedId(ctx.sequelize);
  const res = await request(ctx.app).post('/api/auth/email').set(bearer(token)).send(body);
  return { res, after };
}

async function confirmToken(user: { token: string; password: string }, newEmail: string) {
  const { res, after } = await askToChange(user.token, { newEmail, currentPassword: user.password });
  expect(res.status).toBe(202);
  const mail = await waitForMail(ctx.sequelize, newEmail, { after, subject: 'Confirm your new' });
  return linkIn(mail, '/confirm-email').searchParams.get('token')!;
}

const outboxCount = async (to: string) => {
  const [rows] = await ctx.sequelize.query('SELECT count(*)::int AS n FROM mail_outbox WHERE to_address = :to', { replacements: { to } });
  return (rows as { n: number }[])[0].n;
};

const signIn = (email: string, password: string) => request(ctx.app).post('/api/auth/sign-in').send({ email, password });

describe('POST /api/auth/email', () => {
  it('mails a single-use link to the new address, stores only its hash, and changes nothing yet', async () => {
    const user = await signUpUser(ctx.app, 'Mover');
    const newEmail = freshAddress('moved');

    const token = await confirmToken(user, newEmail);

    const rows = await AccountTokenModel.findAll({ where: { userId: user.me.user.id, purpose: 'email_change' } });
    expect(rows).toHaveLength(1);
    expect(rows[0].tokenHash).toBe(hashToken(token));
    expect(rows[0].newEmail).toBe(newEmail);
    // one hour, as for a password reset link
    expect(rows[0].expiresAt.getTime() - rows[0].createdAt.getTime()).toBeLessThanOrEqual(60 * 60_000 + 1000);
    expect(rows[0].expiresAt.getTime() - rows[0].createdAt.getTime()).toBeGreaterThan(59 * 60_000);
    expect((await UserModel.findByPk(user.me.user.id))!.email).toBe(user.email);
    expect((await signIn(user.email, user.password)).status).toBe(200);
  });

  it('refuses a wrong current password under its field and sends nothing', async () => {
    const user = await signUpUser(ctx.app, 'Guesser');
    const newEmail = freshAddress('guessed');

    const { res } = await askToChange(user.token, { newEmail, currentPassword: 'not the password at all' });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.currentPassword).toEqual(['That is not your current password.']);
    expect(await outboxCount(newEmail)).toBe(0);
  });

  it('validates the new address with the shared e-mail field and refuses the current one', async () => {
    const user = await signUpUser(ctx.app, 'Typo');

    const bad = await askToChange(user.token, { newEmail: 'not-an-address', currentPassword: user.password });
    const same = await askToChange(user.token, { newEmail: user.email.toUpperCase(), currentPassword: user.password });

    expect(bad.res.status).toBe(400);
    expect(bad.res.body.error.fieldErrors.newEmail).toEqual(['Enter a valid email address.']);
    expect(same.res.status).toBe(400);
    expect(same.res.body.error.fieldErrors.newEmail).toEqual(['That is already your address.']);
  });

  it('answers the same for an address another account uses, and tells that address instead of sending a link', async () => {
    const user = await signUpUser(ctx.app, 'Prober');
    const other = await signUpUser(ctx.app, 'Holder');
    const free = freshAddress('free');

    const taken = await askToChange(user.token, { newEmail: other.email, currentPassword: user.password });
    const open = await askToChange(user.token, { newEmail: free, currentPassword: user.password });

    expect(taken.res.status).toBe(202);
    expect(open.res.status).toBe(202);
    expect(taken.res.body.message.replace(other.email, 'X')).toBe(open.res.body.message.replace(free, 'X'));
    const notice = await waitForMail(ctx.sequelize, other.email, { after: taken.after });
    expect(notice.subject).toBe('Someone asked to use this address on Carbwright');
    expect(notice.text).not.toMatch(/confirm-email/);
    expect(await AccountTokenModel.count({ where: { userId: user.me.user.id, newEmail: other.email } })).toBe(0);
  });

  it('stops mailing one address past MAIL_RATE_LIMIT an hour, with the same answer', async () => {
    const user = await signUpUser(ctx.app, 'Repeater');
    const newEmail = freshAddress('flooded');

    const answers = [];
    for (let i = 0; i < 3; i += 1) answers.push((await askToChange(user.token, { newEmail, currentPassword: user.password })).res);

    expect(answers.map((r) => r.status)).toEqual([202, 202, 202]);
    expect(answers[2].body).toEqual(answers[0].body);
    expect(await outboxCount(newEmail)).toBe(2);
  });

  it('needs a session', async () => {
    const res = await request(ctx.app).post('/api/auth/email').send({ newEmail: freshAddress('anon'), currentPassword: 'whatever it is' });

    expect(res.status).toBe(401);
  });
});

describe('POST /api/auth/email/confirm', () => {
  it('moves the account to the new address, tells the old one, ends other sessions and refuses the link again', async () => {
    const user = await signUpUser(ctx.app, 'Confirmer');
    const newEmail = freshAddress('confirmed');
    const token = await confirmToken(user, newEmail);
    const after = await lastCapturedId(ctx.sequelize);

    const res = await request(ctx.app).post('/api/auth/email/confirm').set(bearer(user.token)).send({ token });

    expect(res.status).toBe(200);
    expect(res.body.me.user.email).toBe(newEmail);
    expect((await request(ctx.app).get('/api/me').set(bearer(res.body.token))).status).toBe(200);
    expect((await request(ctx.app).get('/api/me').set(bearer(user.token))).status).toBe(401);
    expect((await signIn(newEmail, user.password)).status).toBe(200);
    expect((await signIn(user.email, user.password)).status).toBe(401);
    const told = await waitForMail(ctx.sequelize, user.email, { after });
    expect(told.subject).toBe('Your Carbwright e-mail address has changed');
    expect(told.text).toContain(newEmail);

    const again = await request(ctx.app).post('/api/auth/email/confirm').set(bearer(res.body.token)).send({ token });
    expect(again.status).toBe(400);
    expect(again.body.error.fieldErrors.token[0]).toMatch(/expired or has already been used/);
  });

  it('refuses an expired link and keeps the old address', async () => {
    const user = await signUpUser(ctx.app, 'Slow');
    const newEmail = freshAddress('slow');
    const token = await confirmToken(user, newEmail);
    await AccountTokenModel.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { tokenHash: hashToken(token) } });

    const res = await request(ctx.app).post('/api/auth/email/confirm').set(bearer(user.token)).send({ token });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.token[0]).toMatch(/expired or has already been used/);
    expect((await signIn(user.email, user.password)).status).toBe(200);
    expect((await signIn(newEmail, user.password)).status).toBe(401);
  });

  it('refuses the link from another account and leaves it usable by its own', async () => {
    const user = await signUpUser(ctx.app, 'Owner');
    const stranger = await signUpUser(ctx.app, 'Stranger');
    const newEmail = freshAddress('owned');
    const token = await confirmToken(user, newEmail);

    const wrong = await request(ctx.app).post('/api/auth/email/confirm').set(bearer(stranger.token)).send({ token });
    const right = await request(ctx.app).post('/api/auth/email/confirm').set(bearer(user.token)).send({ token });

    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fieldErrors.token[0]).toMatch(/another account/);
    expect((await UserModel.findByPk(stranger.me.user.id))!.email).toBe(stranger.email);
    expect(right.status).toBe(200);
    expect(right.body.me.user.email).toBe(newEmail);
  });

  it('answers 409 when another account took the address between the request and the confirmation', async () => {
    const user = await signUpUser(ctx.app, 'Late');
    const newEmail = freshAddress('raced');
    const token = await confirmToken(user, newEmail);
    await request(ctx.app).post('/api/auth/sign-up').send({ email: newEmail, displayName: 'Quick', password: 'a quick orchard lantern' }).expect(201);

    const res = await request(ctx.app).post('/api/auth/email/confirm').set(bearer(user.token)).send({ token });

    expect(res.status).toBe(409);
    expect((await UserModel.findByPk(user.me.user.id))!.email).toBe(user.email);
  });
});
