import nodemailer, { type Transporter } from 'nodemailer';
import { Op, QueryTypes, type Sequelize } from 'sequelize';
import { usesFakeSmtp, type Config } from '../config';
import { logger } from '../logger';
import { CapturedMailModel, MailOutboxModel } from '../models';
import { startFakeSmtp, type FakeSmtp } from './fake-smtp';

const senders = new Set<MailSender>();
const BATCH = 10;
const CLAIM_SECONDS = 120;
const MAX_DELAY_MS = 6 * 3600 * 1000;

/** Wakes every mail sender of this process (after a transaction that queued mail commits). */
export function kickMailSenders(): void {
  for (const sender of senders) sender.kick();
}

/** Delay before attempt n+1 after n failed attempts: base × 2^(n−1), at most six hours. */
export function retryDelayMs(baseSeconds: number, failedAttempts: number): number {
  return Math.min(baseSeconds * 1000 * 2 ** Math.max(0, failedAttempts - 1), MAX_DELAY_MS);
}

/**
 * Sends the outbox: claims due rows (several processes may run one each; `FOR UPDATE SKIP LOCKED` plus a short
 * claim keeps a row with one of them), sends each over SMTP, and on failure schedules a retry with exponential
 * backoff until MAIL_MAX_ATTEMPTS, then marks it failed for the admin. Runs when kicked, when a retry falls due,
 * and every MAIL_POLL_SECONDS for rows other processes queued. Every query names `transaction: null`, as this
 * work is often started from a transaction's after-commit hook.
 */
export class MailSender {
  private transport?: Promise<Transporter>;
  private fake?: FakeSmtp;
  private running?: Promise<void>;
  private again = false;
  private stopped = false;
  private poll?: NodeJS.Timeout;
  private retry?: NodeJS.Timeout;

  constructor(
    private readonly config: Config,
    private readonly sequelize: Sequelize,
  ) {}

  /** Starts the loop (and the local fake SMTP server when no SMTP host is configured). */
  start(): void {
    senders.add(this);
    this.transport = this.openTransport();
    this.transport.catch((err: Error) => logger.error({ err }, 'mail: could not start the transport'));
    this.poll = setInterval(() => this.kick(), this.config.MAIL_POLL_SECONDS * 1000).unref();
    this.kick();
  }

  /** The fake SMTP server's port, once it listens (undefined with a real SMTP host). */
  async fakePort(): Promise<number | undefined> {
    await this.transport;
    return this.fake?.port;
  }

  /** Sends what is due now; a kick during a run makes the run go round once more. */
  kick(): void {
    if (this.stopped) return;
    if (this.running) {
      this.again = true;
      return;
    }
    this.running = this.drain()
      .catch((err: Error) => logger.error({ err }, 'mail: sender run failed'))
      .finally(() => {
        this.running = undefined;
      });
  }

  /** Stops the loop, waits for a run in progress, closes the transport and the fake server. */
  async stop(): Promise<void> {
    this.stopped = true;
    senders.delete(this);
    clearInterval(this.poll);
    clearTimeout(this.retry);
    await this.running;
    const transport = await this.transport?.catch(() => undefined);
    transport?.close();
    await this.fake?.close();
  }

  private async openTransport(): Promise<Transporter> {
    const timeouts = { connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 30_000 };
    if (!usesFakeSmtp(this.config)) {
      const { SMTP_HOST: host, SMTP_PORT: port, SMTP_USER: user, SMTP_PASSWORD: pass } = this.config;
      return nodemailer.createTransport({ host, port, secure: this.config.SMTP_SECURE === '1', auth: user ? { user, pass } : undefined, ...timeouts });
    }
    this.fake = await startFakeSmtp({
      port: this.config.FAKE_SMTP_PORT,
      onMessage: async (mail) => {
        await CapturedMailModel.create(
          { mailFrom: mail.from, mailTo: mail.to.join(', '), subject: mail.subject.slice(0, 200), textBody: mail.text, htmlBody: mail.html },
          { transaction: null },
        );
      },
    });
    logger.info({ port: this.fake.port }, 'mail: no SMTP_HOST, so mail goes to the local fake SMTP server (read it at /api/dev/mails)');
    return nodemailer.createTransport({ host: '127.0.0.1', port: this.fake.port, secure: false, ignoreTLS: true, ...timeouts });
  }

  private async drain(): Promise<void> {
    const transport = await this.transport!;
    do {
      this.again = false;
      while (!this.stopped && (await this.sendBatch(transport)) > 0);
    } while (this.again && !this.stopped);
    if (!this.stopped) await this.scheduleRetry();
  }

  private async sendBatch(transport: Transporter): Promise<number> {
    const claimed = await this.sequelize.query<{ id: number }>(
      `UPDATE mail_outbox SET locked_until = now() + make_interval(secs => :claim)
        WHERE id IN (SELECT id FROM mail_outbox
                      WHERE status = 'pending' AND next_attempt_at <= now() AND (locked_until IS NULL OR locked_until < now())
                      ORDER BY id LIMIT :batch FOR UPDATE SKIP LOCKED)
        RETURNING id`,
      { replacements: { claim: CLAIM_SECONDS, batch: BATCH }, type: QueryTypes.SELECT, transaction: null },
    );
    if (!claimed.length) return 0;
    const rows = await MailOutboxModel.findAll({ where: { id: claimed.map((c) => c.id) }, order: [['id', 'ASC']], transaction: null });
    for (const row of rows) await this.sendOne(transport, row);
    return rows.length;
  }

  private async sendOne(transport: Transporter, row: MailOutboxModel): Promise<void> {
    const attempts = row.attempts + 1;
    try {
      await transport.sendMail({ from: this.config.MAIL_FROM, to: row.toAddress, subject: row.subject, text: row.textBody ?? '', html: row.htmlBody ?? undefined });
      // The bodies carry single-use links: once delivered they are not kept.
      await row.update({ status: 'sent', attempts, sentAt: new Date(), lockedUntil: null, lastError: null, textBody: null, htmlBody: null }, { transaction: null });
    } catch (err) {
      const message = (err as Error).message?.slice(0, 500) || 'unknown error';
      const failed = attempts >= this.config.MAIL_MAX_ATTEMPTS;
      const nextAttemptAt = new Date(Date.now() + retryDelayMs(this.config.MAIL_RETRY_BASE_SECONDS, attempts));
      await row.update({ status: failed ? 'failed' : 'pending', attempts, lastError: message, lockedUntil: null, nextAttemptAt }, { transaction: null });
      const log = { mailId: row.id, kind: row.kind, attempts, error: message };
      if (failed) logger.error(log, 'mail: gave up sending (the admin can resend it from the outbox)');
      else logger.warn({ ...log, retryAt: nextAttemptAt.toISOString() }, 'mail: sending failed, will retry');
    }
  }

  private async scheduleRetry(): Promise<void> {
    clearTimeout(this.retry);
    const next = await MailOutboxModel.min<Date, MailOutboxModel>('nextAttemptAt', { where: { status: 'pending', nextAttemptAt: { [Op.gt]: new Date() } }, transaction: null });
    if (!next) return;
    this.retry = setTimeout(() => this.kick(), Math.max(0, new Date(next).getTime() - Date.now()) + 5).unref();
  }
}
