import express from 'express';
import request from 'supertest';
import { errorHandler } from '../../server/middleware/error-handler';
import { requireAuth, requireProfileAccess } from '../../server/middleware/auth';
import { ProfileAccessModel } from '../../server/models';
import { bearer, signUpUser, useTestApp } from '../helpers/api';

let probe: express.Express;
const ctx = useTestApp();
beforeAll(async () => {
  probe = express();
  probe.get('/p/:profileId', requireAuth(ctx.config), requireProfileAccess('profile.read'), (req, res) => {
    res.json({ role: req.profileAccess!.role });
  });
  probe.get('/p/:profileId/owner-only', requireAuth(ctx.config), requireProfileAccess('access.manage'), (_req, res) => {
    res.json({ ok: true });
  });
  probe.use(errorHandler);
});

describe('requireProfileAccess', () => {
  it('lets the owner, a carer and a clinician in, each with their own role, and hides the profile from a stranger', async () => {
    const owner = await signUpUser(ctx.app, 'Owner');
    const carer = await signUpUser(ctx.app, 'Carer');
    const clinician = await signUpUser(ctx.app, 'Clinician');
    const stranger = await signUpUser(ctx.app, 'Stranger');
    const profileId = owner.me.profiles[0].id;
    await ProfileAccessModel.create({ profileId, userId: carer.me.user.id, role: 'carer', grantedByUserId: owner.me.user.id });
    await ProfileAccessModel.create({ profileId, userId: clinician.me.user.id, role: 'clinician', grantedByUserId: owner.me.user.id });

    const roles = [];
    for (const who of [owner, carer, clinician]) roles.push((await request(probe).get(`/p/${profileId}`).set(bearer(who.token))).body.role);
    const strangerRes = await request(probe).get(`/p/${profileId}`).set(bearer(stranger.token));
    const carerOwnerOnly = await request(probe).get(`/p/${profileId}/owner-only`).set(bearer(carer.token));
    const anonymous = await request(probe).get(`/p/${profileId}`);

    expect(roles).toEqual(['owner', 'carer', 'clinician']);
    expect(strangerRes.status).toBe(404);
    expect(carerOwnerOnly.status).toBe(403);
    expect(anonymous.status).toBe(401);
  });

  it('answers 400 for an id that is not a number', async () => {
    const someone = await signUpUser(ctx.app, 'Someone');

    const res = await request(probe).get('/p/abc').set(bearer(someone.token));

    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.profileId).toBeDefined();
  });
});
