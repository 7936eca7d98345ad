import request from 'supertest';
import { ProfileModel } from '../../server/models';
import { bearer, signUpMember, useTestApp } from '../helpers/api';
import { TEST_DOSE_SETTINGS } from '../helpers/dose-settings';

const ctx = useTestApp();

let n = 0;
const signUp = (extra: object) => {
  n += 1;
  return request(ctx.app).post('/api/auth/sign-up').send({ email: `zone${n}-${process.pid}@example.test`, displayName: 'Zone', password: 'correct horse battery', ...extra });
};

describe('profile time zone', () => {
  it('takes the browser zone at sign-up, UTC without one, and refuses a name that is not an IANA zone', async () => {
    const london = await signUp({ timeZone: 'Europe/London' });
    const none = await signUp({});
    const bad = await signUp({ timeZone: 'Mars/Olympus_Mons' });

    expect(london.status).toBe(201);
    expect(london.body.me.profiles[0].timeZone).toBe('Europe/London');
    expect((await ProfileModel.findByPk(london.body.me.profiles[0].id))!.timeZone).toBe('Europe/London');
    expect(none.body.me.profiles[0].timeZone).toBe('UTC');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fieldErrors).toHaveProperty('timeZone');
  });

  it('is changed in settings and kept when settings are saved without it', async () => {
    const m = await signUpMember(ctx.app, 'Mover');
    const put = (body: object) => request(ctx.app).put(`/api/profiles/${m.profileId}/settings`).set(bearer(m.token)).send(body);

    const changed = await put({ ...TEST_DOSE_SETTINGS, timeZone: 'Asia/Kolkata' });
    const kept = await put({ ...TEST_DOSE_SETTINGS });
    const bad = await put({ ...TEST_DOSE_SETTINGS, timeZone: 'Kolkata' });

    expect(changed.body.timeZone).toBe('Asia/Kolkata');
    expect(kept.body.timeZone).toBe('Asia/Kolkata');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fieldErrors).toHaveProperty('timeZone');
  });
});
