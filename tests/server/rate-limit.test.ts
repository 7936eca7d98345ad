import request from 'supertest';
import { useTestApp } from '../helpers/api';

const ctx = useTestApp({ AUTH_RATE_LIMIT: '3' });

describe('sign-in rate limit', () => {
  it('answers 429 once the limit of attempts is used up', async () => {
    const attempt = () => request(ctx.app).post('/api/auth/sign-in').send({ email: 'x@example.test', password: 'whatever it is' });

    const statuses = [];
    for (let i = 0; i < 4; i++) statuses.push((await attempt()).status);

    expect(statuses).toEqual([401, 401, 401, 429]);
    const last = await attempt();
    expect(last.body.error.code).toBe('rate_limited');
  });
});
