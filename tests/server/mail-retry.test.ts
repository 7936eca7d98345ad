import net from 'node:net';
import request from 'supertest';
import { stopApp } from '../../server/app';
import { startFakeSmtp, type FakeSmtp, type ReceivedMail } from '../../server/mail/fake-smtp';
import { UserModel } from '../../server/models';
import { queueMail } from '../../server/services/mail.service';
import { bearer, signUpUser, startTestApp, type TestContext } from '../helpers/api';

/** A loopback port with nothing listening on it (yet). */
async function freePort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as net.AddressInfo;
  await new Promise((resolve) => server.close(resolve));
  return port;
}

async function until<T>(what: string, read: () => Promise<T>, ok: (v: T) => boolean, timeoutMs = 20_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await read();
    if (ok(value)) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}: ${JSON.stringify(value)}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

let ctx: TestContext;
let smtpPort: number;
let smtp: FakeSmtp | undefined;
const received: ReceivedMail[] = [];

beforeAll(async () => {
  smtpPort = await freePort();
  // A "real" SMTP host that is down: retries start at 0.1 s and double; six attempts (3.1 s) before giving up.
  ctx = await startTestApp({ SMTP_HOST: '127.0.0.1', SMTP_PORT: String(smtpPort), MAIL_RETRY_BASE_SECONDS: '0.1', MAIL_MAX_ATTEMPTS: '6' });
});
afterAll(async () => {
  await smtp?.close();
  await stopApp(ctx.app);
  await ctx.sequelize.close();
});

const outbox = async (to: string) => {
  const [rows] = await ctx.sequelize.query('SELECT id, status, attempts, last_error FROM mail_outbox WHERE to_address = :to', { replacements: { to } });
  return rows as { id: number; status: string; attempts: number; last_error: string | null }[];
};

describe('the outbox while the SMTP server is down', () => {
  it('has no development page of captured mail when an SMTP host is set', async () => {
    expect((await request(ctx.app).get('/api/dev/mails')).status).toBe(404);
  });

  it('gives up after MAIL_MAX_ATTEMPTS, shows the failure to the admin, and sends it again on resend once SMTP is back', async () => {
    const to = 'given-up@example.test';
    await queueMail('access_revoked', to, { profileName: 'Sam', revokedByName: 'Alex', role: 'carer' });
    const [failed] = await until('the mail to fail', () => outbox(to), (r) => r[0]?.status === 'failed');
    expect(failed.attempts).toBe(6);
    expect(failed.last_error).toMatch(/ECONNREFUSED|connect/i);

    const admin = await signUpUser(ctx.app, 'Admin');
    await UserModel.update({ role: 'admin' }, { where: { id: admin.me.user.id } });
    const list = await request(ctx.app).get('/api/admin/mail').query({ status: 'failed' }).set(bearer(admin.token));
    expect(list.body.mails).toEqual([expect.objectContaining({ id: failed.id, to, status: 'failed', attempts: 6, canResend: true })]);

    smtp = await startFakeSmtp({ port: smtpPort, onMessage: (m) => void received.push(m) });
    const resent = await request(ctx.app).post(`/api/admin/mail/${failed.id}/resend`).set(bearer(admin.token));

    expect(resent.status).toBe(200);
    await until('the resent mail', async () => received.filter((m) => m.to.includes(to)).length, (n) => n === 1);
    expect((await outbox(to))[0]).toMatchObject({ status: 'sent', attempts: 1 });
    const again = await request(ctx.app).post(`/api/admin/mail/${failed.id}/resend`).set(bearer(admin.token));
    expect(again.status).toBe(409);
    await smtp.close();
    smtp = undefined;
  });

  it('keeps the action that queued the mail and delivers the mail when SMTP comes back', async () => {
    const to = 'comes-back@example.test';
    await ctx.sequelize.transaction(async () => {
      await UserModel.create({ email: to, displayName: 'Saved anyway', passwordHash: 'x' });
      await queueMail('password_reset', to, { link: 'http://127.0.0.1/reset-password?token=t', expiresInMinutes: 60 });
    });
    await until('a failed attempt', () => outbox(to), (r) => r[0]?.attempts >= 1 && r[0].status === 'pending');
    expect(await UserModel.count({ where: { email: to } })).toBe(1);

    smtp = await startFakeSmtp({ port: smtpPort, onMessage: (m) => void received.push(m) });

    const mail = await until('the mail', async () => received.find((m) => m.to.includes(to)), (m) => m !== undefined);
    expect(mail!.subject).toBe('Choose a new Carbwright password');
    expect((await outbox(to))[0].status).toBe('sent');
  });
});
