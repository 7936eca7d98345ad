import http from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { useTestApp } from '../helpers/api';

// Per address: 25 attempts per window; per account: the default 10 failed sign-ins per window.
const ctx = useTestApp({ AUTH_RATE_LIMIT: '25', MAIL_RATE_LIMIT: '2' });

/** POSTs JSON to the app from a given loopback source address (Linux routes all of 127.0.0.0/8 to loopback). */
function postFrom(server: http.Server, localAddress: string, path: string, body: object): Promise<number> {
  const { port } = server.address() as AddressInfo;
  const data = JSON.stringify(body);
  return new Promise((resolve, reject) => {
    const req = http.request({ host: '127.0.0.1', port, path, method: 'POST', localAddress, headers: { 'content-type': 'application/json', 'content-length': Buffer.byteLength(data) } }, (res) => {
      res.resume();
      res.on('end', () => resolve(res.statusCode!));
    });
    req.on('error', reject);
    req.end(data);
  });
}

describe('sign-in throttles, kept in PostgreSQL', () => {
  it('answers 429 once one address has used up its attempts', async () => {
    const attempt = () => request(ctx.app).post('/api/auth/sign-in').send({ email: `x${Math.random()}@example.test`, password: 'whatever it is' });

    const statuses = [];
    for (let i = 0; i < 26; i++) statuses.push((await attempt()).status);

    expect(statuses.slice(0, 25).every((s) => s === 401)).toBe(true);
    const last = await attempt();
    expect(last.status).toBe(429);
    expect(last.body.error.code).toBe('rate_limited');
    expect(Number(last.headers['retry-after'])).toBeGreaterThan(0);
    const [rows] = await ctx.sequelize.query("SELECT key FROM rate_limits WHERE key LIKE 'auth-ip:%'");
    expect(rows.length).toBeGreaterThan(0);
  });

  it('stops 60 guesses at one account from 3 addresses after 10 failures, even the right password, without touching other accounts', async () => {
    const server = ctx.app.listen(0, '127.0.0.1');
    await new Promise((resolve) => server.once('listening', resolve));
    try {
      const email = 'target@example.test';
      const password = 'orchard lantern tangerine';
      expect(await postFrom(server, '127.0.0.9', '/api/auth/sign-up', { email, displayName: 'Target', password })).toBe(201);
      const addresses = ['127.0.0.2', '127.0.0.3', '127.0.0.4'];

      const statuses: number[] = [];
      for (let i = 0; i < 60; i++) statuses.push(await postFrom(server, addresses[i % 3], '/api/auth/sign-in', { email, password: `guess number ${i} here` }));

      expect(statuses.filter((s) => s === 401)).toHaveLength(10);
      expect(statuses.slice(10).every((s) => s === 429)).toBe(true);
      expect(await postFrom(server, '127.0.0.5', '/api/auth/sign-in', { email, password })).toBe(429);
      expect(await postFrom(server, '127.0.0.5', '/api/auth/sign-in', { email: 'someone-else@example.test', password })).toBe(401);
    } finally {
      await new Promise((resolve) => server.close(resolve));
    }
  });

  it('sends at most MAIL_RATE_LIMIT reset mails an hour to one address, with the same answer', async () => {
    const server = ctx.app.listen(0, '127.0.0.1');
    await new Promise((resolve) => server.once('listening', resolve));
    try {
      const email = 'mailbomb@example.test';
      await postFrom(server, '127.0.0.6', '/api/auth/sign-up', { email, displayName: 'Target', password: 'orchard lantern tangerine' });

      const answers = [];
      for (let i = 0; i < 4; i++) answers.push(await postFrom(server, `127.0.0.${10 + i}`, '/api/auth/password-reset', { email }));

      expect(answers).toEqual([202, 202, 202, 202]);
      const [rows] = await ctx.sequelize.query('SELECT id FROM mail_outbox WHERE to_address = :email', { replacements: { email } });
      expect(rows).toHaveLength(2);
    } finally {
      await new Promise((resolve) => server.close(resolve));
    }
  });
});
