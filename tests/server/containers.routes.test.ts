import request from 'supertest';
import { ContainerModel, ProfileAccessModel } from '../../server/models';
import { bearer, signUpMember, useTestApp } from '../helpers/api';

const ctx = useTestApp();

const member = (name = 'Cook') => signUpMember(ctx.app, name);

describe('/api/profiles/:profileId/containers', () => {
  it('saves a pot and a container with their tares and lists pots first', async () => {
    const cook = await member();
    const base = `/api/profiles/${cook.profileId}/containers`;

    const container = await request(ctx.app).post(base).set(bearer(cook.token)).send({ name: 'Jar 1', kind: 'container', tareGrams: 212 });
    const pot = await request(ctx.app).post(base).set(bearer(cook.token)).send({ name: 'Big pot', kind: 'pot', tareGrams: '1450.5' });
    const list = await request(ctx.app).get(base).set(bearer(cook.token));

    expect(container.status).toBe(201);
    expect(pot.status).toBe(201);
    expect(pot.body).toMatchObject({ name: 'Big pot', kind: 'pot', tareGrams: 1450.5, profileId: cook.profileId });
    expect(list.body.items.map((c: { name: string }) => c.name)).toEqual(['Big pot', 'Jar 1']);
  });

  it.each([
    { name: 'a negative tare', body: { name: 'Jar', tareGrams: -1 }, field: 'tareGrams' },
    { name: 'a tare that is not a number', body: { name: 'Jar', tareGrams: 'heavy' }, field: 'tareGrams' },
    { name: 'an empty name', body: { name: '  ', tareGrams: 200 }, field: 'name' },
    { name: 'an unknown kind', body: { name: 'Jar', kind: 'bucket', tareGrams: 200 }, field: 'kind' },
  ])('returns 400 on $field for $name and saves nothing', async ({ body, field }) => {
    const cook = await member();

    const res = await request(ctx.app).post(`/api/profiles/${cook.profileId}/containers`).set(bearer(cook.token)).send(body);

    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors)).toContain(field);
    expect(await ContainerModel.count({ where: { profileId: cook.profileId } })).toBe(0);
  });

  it('corrects a tare and deletes a container', async () => {
    const cook = await member();
    const base = `/api/profiles/${cook.profileId}/containers`;
    const container = await request(ctx.app).post(base).set(bearer(cook.token)).send({ name: 'Jar', tareGrams: 212 });

    const patched = await request(ctx.app).patch(`${base}/${container.body.id}`).set(bearer(cook.token)).send({ tareGrams: 214 });
    const deleted = await request(ctx.app).delete(`${base}/${container.body.id}`).set(bearer(cook.token));

    expect(patched.body.tareGrams).toBe(214);
    expect(deleted.status).toBe(204);
    expect(await ContainerModel.count({ where: { id: container.body.id } })).toBe(0);
  });

  it('hides containers from strangers, lets clinicians look but not change', async () => {
    const cook = await member();
    const stranger = await member('Stranger');
    const clinician = await member('Clinician');
    await ProfileAccessModel.create({ profileId: cook.profileId, userId: clinician.userId, role: 'clinician', grantedByUserId: cook.userId });
    const base = `/api/profiles/${cook.profileId}/containers`;
    const container = await request(ctx.app).post(base).set(bearer(cook.token)).send({ name: 'Jar', tareGrams: 212 });

    const strangerList = await request(ctx.app).get(base).set(bearer(stranger.token));
    const strangerEdit = await request(ctx.app).patch(`${base}/${container.body.id}`).set(bearer(stranger.token)).send({ tareGrams: 1 });
    const clinicianList = await request(ctx.app).get(base).set(bearer(clinician.token));
    const clinicianPost = await request(ctx.app).post(base).set(bearer(clinician.token)).send({ name: 'Jar', tareGrams: 5 });
    const viaOwnProfile = await request(ctx.app).delete(`/api/profiles/${stranger.profileId}/containers/${container.body.id}`).set(bearer(stranger.token));

    expect([strangerList.status, strangerEdit.status, clinicianList.status, clinicianPost.status, viaOwnProfile.status]).toEqual([404, 404, 200, 403, 404]);
    expect((await ContainerModel.findByPk(container.body.id))!.tareGrams).toBe(212);
  });
});

describe('PATCH /api/profiles/:profileId/containers/:id', () => {
  it('keeps a pot a pot when only its name is changed', async () => {
    const m = await member();
    const base = `/api/profiles/${m.profileId}/containers`;
    const pot = await request(ctx.app).post(base).set(bearer(m.token)).send({ name: 'Big pot', kind: 'pot', tareGrams: 1450 });

    const renamed = await request(ctx.app).patch(`${base}/${pot.body.id}`).set(bearer(m.token)).send({ name: 'Big blue pot' });
    const list = await request(ctx.app).get(base).set(bearer(m.token));

    expect(renamed.status).toBe(200);
    expect(renamed.body).toMatchObject({ name: 'Big blue pot', kind: 'pot', tareGrams: 1450 });
    expect(list.body.items).toEqual([expect.objectContaining({ id: pot.body.id, kind: 'pot' })]);
  });
});
