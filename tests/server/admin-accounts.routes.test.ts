import request from 'supertest';
import { UserModel } from '../../server/models';
import { bearer, signUpUser, useTestApp } from '../helpers/api';
import { lastCapturedId, linkIn, waitForMail } from '../helpers/mail';

const ctx = useTestApp();

async function admin() {
  const a = await signUpUser(ctx.app, 'Admin');
  await UserModel.update({ role: 'admin' }, { where: { id: a.me.user.id } });
  return a;
}

describe('the admin desk: accounts', () => {
  it('searches accounts by part of the e-mail address or name', async () => {
    const boss = await admin();
    const nurse = await signUpUser(ctx.app, 'Nurse Ada');
    await signUpUser(ctx.app, 'Cook');

    const res = await request(ctx.app).get('/api/admin/users').query({ q: 'ada' }).set(bearer(boss.token));

    expect(res.status).toBe(200);
    expect(res.body.users.map((u: { email: string }) => u.email)).toEqual([nurse.email]);
  });

  it('changes a role with the reason in the audit, and refuses members and the admin themself', async () => {
    const boss = await admin();
    const nurse = await signUpUser(ctx.app, 'Nurse');

    const byMember = await request(ctx.app).put(`/api/admin/users/${boss.me.user.id}/role`).set(bearer(nurse.token)).send({ role: 'member', reason: 'coup attempt' });
    const own = await request(ctx.app).put(`/api/admin/users/${boss.me.user.id}/role`).set(bearer(boss.token)).send({ role: 'member', reason: 'oops' });
    const res = await request(ctx.app).put(`/api/admin/users/${nurse.me.user.id}/role`).set(bearer(boss.token)).send({ role: 'clinician', reason: 'Diabetes nurse at the clinic' });

    expect(byMember.status).toBe(403);
    expect(own.status).toBe(409);
    expect(res.status).toBe(200);
    expect(res.body.role).toBe('clinician');
    expect((await UserModel.findByPk(nurse.me.user.id))!.role).toBe('clinician');
    const audit = await request(ctx.app).get('/api/admin/audit').set(bearer(boss.token));
    expect(audit.body.entries[0]).toMatchObject({
      action: 'role_changed', oldValue: 'member', newValue: 'clinician', reason: 'Diabetes nurse at the clinic',
      user: { email: nurse.email }, actor: { email: boss.email },
    });
  });

  it('disables an account with the reason: its session ends, it cannot sign in or get a reset mail; enabling restores sign-in', async () => {
    const boss = await admin();
    const cook = await signUpUser(ctx.app, 'Cook');

    const off = await request(ctx.app).post(`/api/admin/users/${cook.me.user.id}/disable`).set(bearer(boss.token)).send({ reason: 'Asked to close the account' });

    expect(off.status).toBe(200);
    expect(off.body).toMatchObject({ disabledReason: 'Asked to close the account' });
    expect((await request(ctx.app).get('/api/me').set(bearer(cook.token))).status).toBe(401);
    const signIn = await request(ctx.app).post('/api/auth/sign-in').send({ email: cook.email, password: cook.password });
    expect(signIn.status).toBe(403);
    expect(signIn.body.error.message).toMatch(/disabled/);
    const wrong = await request(ctx.app).post('/api/auth/sign-in').send({ email: cook.email, password: 'not the password at all' });
    expect(wrong.status).toBe(401);
    expect((await request(ctx.app).post('/api/auth/password-reset').send({ email: cook.email })).status).toBe(202);
    const [mails] = await ctx.sequelize.query('SELECT id FROM mail_outbox WHERE to_address = :to', { replacements: { to: cook.email } });
    expect(mails).toHaveLength(0);

    const on = await request(ctx.app).post(`/api/admin/users/${cook.me.user.id}/enable`).set(bearer(boss.token)).send({ reason: 'Changed their mind' });
    expect(on.body.disabledAt).toBeNull();
    expect((await request(ctx.app).post('/api/auth/sign-in').send({ email: cook.email, password: cook.password })).status).toBe(200);
    const audit = await request(ctx.app).get('/api/admin/audit').set(bearer(boss.token));
    expect(audit.body.entries.slice(0, 2).map((e: { action: string; reason: string }) => [e.action, e.reason])).toEqual([
      ['enabled', 'Changed their mind'],
      ['disabled', 'Asked to close the account'],
    ]);
  });

  it('asks for a reason', async () => {
    const boss = await admin();
    const cook = await signUpUser(ctx.app, 'Cook');

    const res = await request(ctx.app).post(`/api/admin/users/${cook.me.user.id}/disable`).set(bearer(boss.token)).send({ reason: '' });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.reason).toBeDefined();
  });

  it('joins the access to profiles into the audit: invited, granted on accepting, changed, revoked, newest first with role changes', async () => {
    const boss = await admin();
    const owner = await signUpUser(ctx.app, 'Owner');
    const carer = await signUpUser(ctx.app, 'Carer');
    const profileId = owner.me.profiles[0].id;
    const after = await lastCapturedId(ctx.sequelize);
    await request(ctx.app).post(`/api/profiles/${profileId}/invitations`).set(bearer(owner.token)).send({ email: carer.email, role: 'carer', permissions: [] });
    const token = linkIn(await waitForMail(ctx.sequelize, carer.email, { after }), '/invitation').searchParams.get('token')!;
    expect((await request(ctx.app).post('/api/invitations/accept').set(bearer(carer.token)).send({ token })).status).toBe(200);
    await request(ctx.app).patch(`/api/profiles/${profileId}/access/${carer.me.user.id}`).set(bearer(owner.token)).send({ permissions: ['settings'] });
    await request(ctx.app).delete(`/api/profiles/${profileId}/access/${carer.me.user.id}`).set(bearer(owner.token));
    await request(ctx.app).put(`/api/admin/users/${carer.me.user.id}/role`).set(bearer(boss.token)).send({ role: 'clinician', reason: 'Joined the clinic' });

    const res = await request(ctx.app).get('/api/admin/audit').set(bearer(boss.token));

    expect(res.status).toBe(200);
    expect(res.body.entries.slice(0, 5).map((e: { source: string; action: string }) => `${e.source} ${e.action}`)).toEqual([
      'account role_changed', 'access revoked', 'access changed', 'access granted', 'access invited',
    ]);
    expect(res.body.entries[2]).toMatchObject({
      profile: { id: profileId, displayName: owner.me.profiles[0].displayName },
      user: { id: carer.me.user.id, email: carer.email }, email: carer.email,
      actor: { email: owner.email }, role: 'carer', permissions: ['settings'],
    });
    expect(res.body.entries[4]).toMatchObject({ user: null, email: carer.email, actor: { email: owner.email }, permissions: [] });
    const times = res.body.entries.map((e: { createdAt: string }) => e.createdAt);
    expect(times).toEqual([...times].sort().reverse());
  });
});
