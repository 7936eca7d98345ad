import request from 'supertest';
import { signUpUser, useTestApp } from '../helpers/api';

const ctx = useTestApp();

function cookiesOf(res: request.Response): string[] {
  return ([] as string[]).concat(res.headers['set-cookie'] ?? []);
}

async function signedInAgent() {
  const user = await signUpUser(ctx.app, 'Cookie');
  const agent = request.agent(ctx.app);
  const res = await agent.post('/api/auth/sign-in').send({ email: user.email, password: user.password });
  const csrf = /cw_csrf=([^;]+)/.exec(cookiesOf(res).join('\n'))![1];
  return { agent, res, csrf, user };
}

describe('the web session in a cookie', () => {
  it('sets an HttpOnly, SameSite=Strict session cookie for /api and a readable CSRF cookie (no Secure on loopback)', async () => {
    const { res } = await signedInAgent();
    const [session, csrf] = ['cw_session', 'cw_csrf'].map((n) => cookiesOf(res).find((c) => c.startsWith(`${n}=`))!);

    expect(session).toMatch(/; Path=\/api/);
    expect(session).toMatch(/; HttpOnly/);
    expect(session).toMatch(/; SameSite=Strict/);
    expect(session).not.toMatch(/; Secure/);
    expect(csrf).not.toMatch(/HttpOnly/);
    expect(csrf).toMatch(/; SameSite=Strict/);
  });

  it('marks the cookies Secure when the app is reached by a name other than loopback', async () => {
    const user = await signUpUser(ctx.app, 'Remote');
    const res = await request(ctx.app).post('/api/auth/sign-in').set('Host', 'carbwright.example').send({ email: user.email, password: user.password });

    expect(cookiesOf(res).every((c) => /; Secure/.test(c))).toBe(true);
  });

  it('reads with the cookie alone, but changes only with the CSRF header that matches the session', async () => {
    const { agent, csrf } = await signedInAgent();

    expect((await agent.get('/api/me')).status).toBe(200);
    const without = await agent.post('/api/auth/password').send({ currentPassword: 'x', newPassword: 'orchard lantern tangerine' });
    const wrong = await agent.post('/api/auth/password').set('X-CSRF-Token', 'not-the-token').send({ currentPassword: 'x', newPassword: 'orchard lantern tangerine' });
    const right = await agent.post('/api/auth/password').set('X-CSRF-Token', csrf).send({ currentPassword: 'x', newPassword: 'orchard lantern tangerine' });

    expect(without.status).toBe(403);
    expect(wrong.status).toBe(403);
    // past the CSRF check: the current password is wrong, so a field error
    expect(right.status).toBe(400);
    expect(right.body.error.fieldErrors.currentPassword).toBeDefined();
  });

  it('signing out clears the cookies and revokes the session', async () => {
    const { agent, csrf, res } = await signedInAgent();
    const token = res.body.token as string;

    const out = await agent.post('/api/auth/sign-out').set('X-CSRF-Token', csrf);

    expect(out.status).toBe(204);
    expect(cookiesOf(out).some((c) => /^cw_session=;/.test(c))).toBe(true);
    expect((await request(ctx.app).get('/api/me').set('Cookie', `cw_session=${token}`)).status).toBe(401);
  });

  it('still takes a bearer token without a CSRF header (API clients)', async () => {
    const user = await signUpUser(ctx.app, 'Bearer');

    const res = await request(ctx.app).post('/api/auth/sign-out').set('Authorization', `Bearer ${user.token}`);

    expect(res.status).toBe(204);
  });
});

describe('content security policy', () => {
  it("allows scripts only from the app's own origin (no 'unsafe-inline')", async () => {
    const res = await request(ctx.app).get('/api/health');
    const scriptSrc = /script-src ([^;]+)/.exec(res.headers['content-security-policy'])![1];

    expect(scriptSrc.trim()).toBe("'self'");
  });
});
