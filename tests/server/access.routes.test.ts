import request from 'supertest';
import { InvitationModel, ProfileAccessModel, ProfileModel } from '../../server/models';
import { bearer, signUpUser, useTestApp } from '../helpers/api';
import { lastCapturedId, linkIn, waitForMail } from '../helpers/mail';

const ctx = useTestApp();
const api = () => request(ctx.app);

/** Invites `email` to the profile and returns the token from the captured mail's link. */
async function inviteAndReadLink(ownerToken: string, profileId: number, email: string, role = 'carer', permissions: string[] = []) {
  const after = await lastCapturedId(ctx.sequelize);
  const res = await api().post(`/api/profiles/${profileId}/invitations`).set(bearer(ownerToken)).send({ email, role, permissions });
  expect(res.status).toBe(201);
  const mail = await waitForMail(ctx.sequelize, email, { after });
  return linkIn(mail, '/invitation').searchParams.get('token')!;
}

describe('invitations', () => {
  it('invite → mail → accept with the invited address → access works → revoke → 404 on the next request with the same token', async () => {
    const owner = await signUpUser(ctx.app, 'Owner');
    const carer = await signUpUser(ctx.app, 'Carer');
    const profileId = owner.me.profiles[0].id;

    const token = await inviteAndReadLink(owner.token, profileId, carer.email);
    const stored = await InvitationModel.findOne({ where: { profileId } });
    const before = await api().get(`/api/profiles/${profileId}/containers`).set(bearer(carer.token));
    const preview = await api().get(`/api/invitations/${token}`);
    const accepted = await api().post('/api/invitations/accept').set(bearer(carer.token)).send({ token });
    const during = await api().get(`/api/profiles/${profileId}/containers`).set(bearer(carer.token));
    const again = await api().post('/api/invitations/accept').set(bearer(carer.token)).send({ token });
    const list = await api().get(`/api/profiles/${profileId}/access`).set(bearer(owner.token));
    const after = await lastCapturedId(ctx.sequelize);
    const revoked = await api().delete(`/api/profiles/${profileId}/access/${carer.me.user.id}`).set(bearer(owner.token));
    const next = await api().get(`/api/profiles/${profileId}/containers`).set(bearer(carer.token));
    const me = await api().get('/api/me').set(bearer(carer.token));
    const revokedMail = await waitForMail(ctx.sequelize, carer.email, { after });
    const audit = await api().get(`/api/profiles/${profileId}/audit`).set(bearer(owner.token));

    expect(stored!.tokenHash).not.toContain(token);
    expect(stored!.tokenHash).toHaveLength(64);
    expect(before.status).toBe(404);
    expect(preview.body).toMatchObject({ profileName: 'Owner', inviterName: 'Owner', role: 'carer', status: 'open', email: carer.email });
    expect(accepted.status).toBe(200);
    expect(accepted.body.me.profiles.map((p: { id: number; access: string }) => [p.id, p.access])).toContainEqual([profileId, 'carer']);
    expect(during.status).toBe(200);
    expect(again.status).toBe(409);
    expect(list.body.people.map((p: { role: string; permissions: string[] }) => [p.role, p.permissions])).toEqual([['owner', []], ['carer', []]]);
    expect(list.body.invitations).toEqual([]);
    expect(revoked.status).toBe(204);
    expect(next.status).toBe(404);
    expect(me.status).toBe(200);
    expect(me.body.profiles.map((p: { id: number }) => p.id)).not.toContain(profileId);
    expect(revokedMail.text).toContain('Owner');
    expect(audit.body.entries.map((e: { kind: string }) => e.kind)).toEqual(['revoked', 'granted', 'invited']);
  });

  it('refuses another account, an expired link and a withdrawn one; only the owner may invite', async () => {
    const owner = await signUpUser(ctx.app, 'Owner');
    const invited = await signUpUser(ctx.app, 'Invited');
    const other = await signUpUser(ctx.app, 'Other');
    const profileId = owner.me.profiles[0].id;
    const token = await inviteAndReadLink(owner.token, profileId, invited.email, 'clinician', ['ratios']);

    const wrongAccount = await api().post('/api/invitations/accept').set(bearer(other.token)).send({ token });
    await InvitationModel.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { profileId } });
    const expired = await api().post('/api/invitations/accept').set(bearer(invited.token)).send({ token });
    const preview = await api().get(`/api/invitations/${token}`);
    const token2 = await inviteAndReadLink(owner.token, profileId, invited.email, 'clinician');
    const open = await api().get(`/api/profiles/${profileId}/access`).set(bearer(owner.token));
    const cancelled = await api().delete(`/api/profiles/${profileId}/invitations/${open.body.invitations[0].id}`).set(bearer(owner.token));
    const withdrawn = await api().post('/api/invitations/accept').set(bearer(invited.token)).send({ token: token2 });
    const strangerInvites = await api().post(`/api/profiles/${profileId}/invitations`).set(bearer(other.token)).send({ email: 'x@example.test', role: 'carer', permissions: [] });
    const badPermission = await api().post(`/api/profiles/${profileId}/invitations`).set(bearer(owner.token)).send({ email: 'x@example.test', role: 'carer', permissions: ['ratios'] });
    const ownerOfOwnProfile = await api().post(`/api/profiles/${profileId}/invitations`).set(bearer(owner.token)).send({ email: 'x@example.test', role: 'owner', permissions: [] });

    expect(wrongAccount.status).toBe(403);
    expect(expired.status).toBe(409);
    expect(preview.body.status).toBe('expired');
    expect(cancelled.status).toBe(204);
    expect(withdrawn.status).toBe(404);
    expect(strangerInvites.status).toBe(404);
    expect(badPermission.status).toBe(400);
    expect(badPermission.body.error.fieldErrors.permissions).toBeDefined();
    expect(ownerOfOwnProfile.status).toBe(400);
    expect(await ProfileAccessModel.count({ where: { profileId } })).toBe(1);
  });
});

describe('permissions', () => {
  it('a carer edits settings and day kinds only with the settings permission; a clinician edits day kinds only with ratios', async () => {
    const owner = await signUpUser(ctx.app, 'Owner');
    const carer = await signUpUser(ctx.app, 'Carer');
    const clinician = await signUpUser(ctx.app, 'Clinician');
    const profileId = owner.me.profiles[0].id;
    for (const [who, role] of [[carer, 'carer'], [clinician, 'clinician']] as const) {
      const token = await inviteAndReadLink(owner.token, profileId, who.email, role);
      await api().post('/api/invitations/accept').set(bearer(who.token)).send({ token });
    }
    const put = (who: { token: string }) => api().put(`/api/profiles/${profileId}/days/2026-03-02`).set(bearer(who.token)).send({ dayKindId: null });
    const settingsPut = (who: { token: string }) => api().put(`/api/profiles/${profileId}/settings`).set(bearer(who.token)).send({});

    const carerBefore = [(await put(carer)).status, (await settingsPut(carer)).status];
    const clinicianBefore = (await put(clinician)).status;
    await api().patch(`/api/profiles/${profileId}/access/${carer.me.user.id}`).set(bearer(owner.token)).send({ permissions: ['settings'] });
    await api().patch(`/api/profiles/${profileId}/access/${clinician.me.user.id}`).set(bearer(owner.token)).send({ permissions: ['ratios'] });
    const carerAfter = [(await put(carer)).status, (await settingsPut(carer)).status];
    const clinicianAfter = [(await put(clinician)).status, (await settingsPut(clinician)).status];
    const wrong = await api().patch(`/api/profiles/${profileId}/access/${clinician.me.user.id}`).set(bearer(owner.token)).send({ permissions: ['settings'] });

    expect(carerBefore).toEqual([403, 403]);
    expect(clinicianBefore).toBe(403);
    // With the permission the access check passes; the empty settings body then fails validation (400), not access.
    expect(carerAfter).toEqual([200, 400]);
    expect(clinicianAfter).toEqual([200, 403]);
    expect(wrong.status).toBe(400);
  });
});

describe('managed profile', () => {
  it('a carer keeps a child\'s profile, cooks in its kitchen, a clinician reads and cannot write, then hands it over to the child as owner', async () => {
    const parent = await signUpUser(ctx.app, 'Parent');
    const clinician = await signUpUser(ctx.app, 'Nurse');
    const created = await api().post('/api/profiles').set(bearer(parent.token)).send({ displayName: 'Sam' });
    const profileId = created.body.id as number;
    const container = await api().post(`/api/profiles/${profileId}/containers`).set(bearer(parent.token)).send({ name: 'Blue pot', tareGrams: 512 });
    const clinicianToken = await inviteAndReadLink(parent.token, profileId, clinician.email, 'clinician');
    await api().post('/api/invitations/accept').set(bearer(clinician.token)).send({ token: clinicianToken });
    const clinicianReads = await api().get(`/api/profiles/${profileId}/containers`).set(bearer(clinician.token));
    const clinicianWrites = await api().post(`/api/profiles/${profileId}/containers`).set(bearer(clinician.token)).send({ name: 'Red pot', tareGrams: 300 });

    const child = await signUpUser(ctx.app, 'Sam');
    const ownerToken = await inviteAndReadLink(parent.token, profileId, child.email, 'owner');
    const handed = await api().post('/api/invitations/accept').set(bearer(child.token)).send({ token: ownerToken });
    const childSees = await api().get(`/api/profiles/${profileId}/containers`).set(bearer(child.token));
    const people = await api().get(`/api/profiles/${profileId}/access`).set(bearer(child.token));
    const parentManages = await api().get(`/api/profiles/${profileId}/access`).set(bearer(parent.token));
    const parentCooks = await api().post(`/api/profiles/${profileId}/containers`).set(bearer(parent.token)).send({ name: 'Green pot', tareGrams: 200 });

    expect(created.status).toBe(201);
    expect(created.body.me.profiles.find((p: { id: number }) => p.id === profileId)).toMatchObject({ displayName: 'Sam', access: 'owner', managed: true });
    expect(container.status).toBe(201);
    expect(clinicianReads.body.items.map((c: { name: string }) => c.name)).toEqual(['Blue pot']);
    expect(clinicianWrites.status).toBe(403);
    expect(handed.status).toBe(200);
    expect(childSees.body.items.map((c: { name: string }) => c.name)).toEqual(['Blue pot']);
    expect(people.body.people.map((p: { displayName: string; role: string; permissions: string[] }) => [p.displayName, p.role, p.permissions])).toEqual([
      ['Sam', 'owner', []],
      ['Parent', 'carer', ['settings']],
      ['Nurse', 'clinician', []],
    ]);
    expect(parentManages.status).toBe(403);
    expect(parentCooks.status).toBe(201);
  });
});

describe('managed profile time zone', () => {
  it.each([
    // the parent signed up in London; a child's day starts where the family lives unless they say otherwise
    { name: 'takes the time zone given', body: { displayName: 'Ola', colour: 'moss', timeZone: 'Asia/Kolkata' }, timeZone: 'Asia/Kolkata', colour: 'moss' },
    // with no colour chosen: the parent's own profile wears the first (teal), so the next free one in PROFILE_COLOURS
    { name: 'otherwise the creator\'s own profile\'s', body: { displayName: 'Ola' }, timeZone: 'Europe/London', colour: 'plum' },
  ])('$name', async ({ body, timeZone, colour }) => {
    const parent = await signUpUser(ctx.app, 'Zoned');
    await ProfileModel.update({ timeZone: 'Europe/London' }, { where: { id: parent.me.profiles[0].id } });

    const created = await api().post('/api/profiles').set(bearer(parent.token)).send(body);

    expect(created.status).toBe(201);
    const summary = created.body.me.profiles.find((p: { id: number }) => p.id === created.body.id);
    expect(summary.timeZone).toBe(timeZone);
    expect(summary.colour).toBe(colour);
  });

  it('refuses a time zone that does not exist, under its field', async () => {
    const parent = await signUpUser(ctx.app, 'Unzoned');

    const res = await api().post('/api/profiles').set(bearer(parent.token)).send({ displayName: 'Ola', timeZone: 'Mars/Olympus' });

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.timeZone).toBeDefined();
  });
});

describe('tokens', () => {
  it('a token whose subject is not a user id gets 401, not 500', async () => {
    const jwt = await import('jsonwebtoken');
    const forged = jwt.default.sign({ tv: 0, jti: 'x' }, ctx.config.jwtSecret, { algorithm: 'HS256', subject: 'abc', expiresIn: 60 });

    const res = await api().get('/api/me').set(bearer(forged));

    expect(res.status).toBe(401);
  });
});
