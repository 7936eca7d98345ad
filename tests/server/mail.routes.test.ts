import request from 'supertest';
import { UserModel } from '../../server/models';
import { retryDelayMs } from '../../server/mail/mail-sender';
import { renderMail, type MailData, type MailKind } from '../../server/mail/templates';
import { queueMail } from '../../server/services/mail.service';
import { bearer, signUpUser, useTestApp } from '../helpers/api';
import { waitForMail } from '../helpers/mail';

const ctx = useTestApp();

async function adminToken() {
  const admin = await signUpUser(ctx.app, 'Admin');
  await UserModel.update({ role: 'admin' }, { where: { id: admin.me.user.id } });
  return admin.token;
}

async function outboxRow(id: number) {
  const [rows] = await ctx.sequelize.query(`SELECT status, attempts, text_body, sent_at FROM mail_outbox WHERE id = ${id}`);
  return (rows as { status: string; attempts: number; text_body: string | null; sent_at: Date | null }[])[0];
}

describe('queueMail through the local fake SMTP server', () => {
  it('sends a queued mail after the transaction commits, in text and HTML, and drops the body once sent', async () => {
    const id = await ctx.sequelize.transaction(async () =>
      queueMail('password_reset', 'Cook@Example.test', { link: 'http://127.0.0.1:8080/reset-password?token=abc', expiresInMinutes: 60 }),
    );

    const mail = await waitForMail(ctx.sequelize, 'cook@example.test');
    expect(mail.subject).toBe('Choose a new Carbwright password');
    expect(mail.text).toContain('http://127.0.0.1:8080/reset-password?token=abc');
    expect(mail.html).toContain('href="http://127.0.0.1:8080/reset-password?token=abc"');
    for (let i = 0; i < 50 && (await outboxRow(id)).status !== 'sent'; i++) await new Promise((r) => setTimeout(r, 100));
    const row = await outboxRow(id);
    expect(row).toMatchObject({ status: 'sent', attempts: 1, text_body: null });
  });

  it('writes nothing when the transaction that queued the mail rolls back', async () => {
    await expect(
      ctx.sequelize.transaction(async () => {
        await queueMail('access_revoked', 'rolled-back@example.test', { profileName: 'Sam', revokedByName: 'Alex', role: 'carer' });
        throw new Error('the action failed');
      }),
    ).rejects.toThrow('the action failed');

    const [rows] = await ctx.sequelize.query("SELECT id FROM mail_outbox WHERE to_address = 'rolled-back@example.test'");
    expect(rows).toHaveLength(0);
  });
});

describe('GET /api/dev/mails (development page of captured mail)', () => {
  it('lists captured mail for one address, newest first', async () => {
    await queueMail('email_changed', 'dev-page@example.test', { oldEmail: 'dev-page@example.test', newEmail: 'new@example.test' });
    await waitForMail(ctx.sequelize, 'dev-page@example.test');

    const res = await request(ctx.app).get('/api/dev/mails').query({ to: 'dev-page@example.test' });

    expect(res.status).toBe(200);
    expect(res.body.mails).toHaveLength(1);
    expect(res.body.mails[0]).toMatchObject({ to: 'dev-page@example.test', subject: 'Your Carbwright e-mail address has changed' });
    expect(res.body.mails[0].text).toContain('new@example.test');
  });
});

describe('GET /api/admin/mail', () => {
  it('shows the outbox to an admin, never the bodies, and is refused to a member', async () => {
    await queueMail('access_revoked', 'outbox@example.test', { profileName: 'Sam', revokedByName: 'Alex', role: 'clinician' });
    const member = await signUpUser(ctx.app, 'Member');

    const denied = await request(ctx.app).get('/api/admin/mail').set(bearer(member.token));
    const res = await request(ctx.app).get('/api/admin/mail').set(bearer(await adminToken()));

    expect(denied.status).toBe(403);
    expect(res.status).toBe(200);
    const mail = res.body.mails.find((m: { to: string }) => m.to === 'outbox@example.test');
    expect(mail).toMatchObject({ kind: 'access_revoked', subject: "Your access to Sam's profile has ended" });
    expect(JSON.stringify(res.body)).not.toContain('text');
  });

  it('filters by status, and `unsent` gives the pending and failed mails but not the sent ones', async () => {
    const token = await adminToken();
    const ids = {
      pending: await queueMail('access_revoked', 'pending@example.test', { profileName: 'Sam', revokedByName: 'Alex', role: 'carer' }),
      failed: await queueMail('access_revoked', 'failed@example.test', { profileName: 'Sam', revokedByName: 'Alex', role: 'carer' }),
      sent: await queueMail('access_revoked', 'sent@example.test', { profileName: 'Sam', revokedByName: 'Alex', role: 'carer' }),
    };
    // Once the sender has sent all three, two are set back by hand (the sender leaves them alone): one waits a day, one gave up.
    for (let i = 0; i < 50 && (await Promise.all(Object.values(ids).map(outboxRow))).some((r) => r.status !== 'sent'); i++) await new Promise((r) => setTimeout(r, 100));
    await ctx.sequelize.query(`UPDATE mail_outbox SET status = 'pending', next_attempt_at = now() + interval '1 day' WHERE id = ${ids.pending}`);
    await ctx.sequelize.query(`UPDATE mail_outbox SET status = 'failed', attempts = 8, last_error = 'connection refused', text_body = 'kept' WHERE id = ${ids.failed}`);
    const ours = (res: request.Response) => res.body.mails.map((m: { id: number }) => m.id).filter((id: number) => Object.values(ids).includes(id));

    const unsent = await request(ctx.app).get('/api/admin/mail').query({ status: 'unsent' }).set(bearer(token));
    const failed = await request(ctx.app).get('/api/admin/mail').query({ status: 'failed' }).set(bearer(token));
    const bad = await request(ctx.app).get('/api/admin/mail').query({ status: 'lost' }).set(bearer(token));

    expect(ours(unsent)).toEqual([ids.failed, ids.pending]);
    expect(ours(failed)).toEqual([ids.failed]);
    expect(failed.body.mails[0]).toMatchObject({ lastError: 'connection refused', attempts: 8, canResend: true });
    expect(bad.status).toBe(400);
  });
});

const LINK = 'https://carbwright.example/path?token=t0k3n';
const cases: { [K in MailKind]: { kind: K; data: MailData[K]; mentions: string[] } }[MailKind][] = [
  { kind: 'invitation', data: { inviterName: 'Alex', profileName: 'Sam', role: 'carer', link: LINK, expiresAt: new Date('2026-12-09T10:00:00Z') }, mentions: ['Alex', 'Sam', 'carer', LINK, '2026-12-09 10:00 UTC'] },
  { kind: 'share_offer', data: { senderName: 'Alex', recipeName: 'Overnight oats', link: LINK, hasAccount: false }, mentions: ['Alex', 'Overnight oats', 'Create one', LINK] },
  { kind: 'password_reset', data: { link: LINK, expiresInMinutes: 60 }, mentions: [LINK, '60 minutes', 'ignore'] },
  { kind: 'access_revoked', data: { profileName: 'Sam', revokedByName: 'Alex', role: 'clinician' }, mentions: ['Sam', 'Alex', 'clinician'] },
  { kind: 'email_changed', data: { oldEmail: 'old@example.test', newEmail: 'new@example.test' }, mentions: ['old@example.test', 'new@example.test', 'lock the account'] },
  { kind: 'email_change_taken', data: { newEmail: 'new@example.test' }, mentions: ['new@example.test', 'already uses this address', 'nothing has changed'] },
  { kind: 'email_change_confirm', data: { newEmail: 'new@example.test', link: LINK, expiresInMinutes: 60 }, mentions: ['new@example.test', LINK, '60 minutes'] },
];

describe('renderMail', () => {
  it.each(cases)('$kind says who, what and the link in both the text and the HTML', ({ kind, data, mentions }) => {
    const mail = renderMail(kind, data as never);

    for (const word of mentions) {
      expect(mail.text).toContain(word);
      expect(mail.html).toContain(word.replace(/&/g, '&amp;'));
    }
    expect(mail.subject.length).toBeGreaterThan(10);
  });

  it('escapes names in the HTML', () => {
    const mail = renderMail('access_revoked', { profileName: '<script>x</script>', revokedByName: 'A & B', role: 'carer' });

    expect(mail.html).not.toContain('<script>');
    expect(mail.html).toContain('&lt;script&gt;');
    expect(mail.html).toContain('A &amp; B');
  });
});

describe('retryDelayMs (exponential backoff)', () => {
  it.each([
    // base 30 s doubling per failed attempt, capped at six hours (common practice for retry queues)
    { failed: 1, ms: 30_000 },
    { failed: 2, ms: 60_000 },
    { failed: 5, ms: 480_000 },
    { failed: 20, ms: 6 * 3600_000 },
  ])('after $failed failed attempts waits $ms ms', ({ failed, ms }) => {
    expect(retryDelayMs(30, failed)).toBe(ms);
  });
});
