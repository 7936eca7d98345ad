import { Op } from 'sequelize';
import type { CapturedMail, OutboxFilter, OutboxMail } from '../../shared/schemas/mail';
import { publicUrl, type Config } from '../config';
import { AppError } from '../errors';
import { currentTransaction } from '../lib/transaction-context';
import { kickMailSenders } from '../mail/mail-sender';
import { renderMail, type MailData, type MailKind } from '../mail/templates';
import { CapturedMailModel, MailOutboxModel } from '../models';

let baseUrl = 'http://127.0.0.1:8080';

/** Sets the address links in e-mails point at (PUBLIC_URL, else HOST:PORT); called once by createApp. */
export function configureMail(config: Config): void {
  baseUrl = publicUrl(config);
}

/** An absolute link into the web app for an e-mail, e.g. `mailLink('/reset-password', { token })`. */
export function mailLink(path: string, query: Record<string, string> = {}): string {
  const url = new URL(path, `${baseUrl}/`);
  for (const [k, v] of Object.entries(query)) url.searchParams.set(k, v);
  return url.toString();
}

/**
 * Queues one e-mail: renders the template and writes an outbox row. Inside a transaction the row joins it (so the
 * mail exists exactly when the action does) and the sender is woken after commit; outside one it is woken now.
 * Returns the outbox id.
 */
export async function queueMail<K extends MailKind>(kind: K, to: string, data: MailData[K]): Promise<number> {
  const { subject, text, html } = renderMail(kind, data);
  const row = await MailOutboxModel.create({ kind, toAddress: to.trim().toLowerCase(), subject: subject.slice(0, 200), textBody: text, htmlBody: html, nextAttemptAt: new Date() });
  const transaction = currentTransaction();
  if (transaction) transaction.afterCommit(() => kickMailSenders());
  else kickMailSenders();
  return row.id;
}

function toOutboxMail(row: MailOutboxModel): OutboxMail {
  return {
    id: row.id,
    kind: row.kind,
    to: row.toAddress,
    subject: row.subject,
    status: row.status,
    attempts: row.attempts,
    lastError: row.lastError,
    nextAttemptAt: row.status === 'pending' ? row.nextAttemptAt.toISOString() : null,
    sentAt: row.sentAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
    canResend: row.status === 'failed' && row.textBody !== null,
  };
}

/** The outbox for the admin, newest first: every mail, those of one status, or the unsent ones (pending or failed). */
export async function listOutbox(status?: OutboxFilter): Promise<OutboxMail[]> {
  const where = status === 'unsent' ? { status: ['pending', 'failed'] as OutboxMail['status'][] } : status ? { status } : {};
  const rows = await MailOutboxModel.findAll({ where, order: [['id', 'DESC']], limit: 200 });
  return rows.map(toOutboxMail);
}

/** Puts a failed mail back in the queue with a fresh count of attempts (admin). */
export async function resendMail(id: number): Promise<OutboxMail> {
  const row = await MailOutboxModel.findByPk(id);
  if (!row) throw AppError.notFound('mail');
  if (row.status !== 'failed' || row.textBody === null) throw AppError.conflict('Only a failed mail can be sent again.');
  await row.update({ status: 'pending', attempts: 0, nextAttemptAt: new Date(), lockedUntil: null });
  kickMailSenders();
  return toOutboxMail(row);
}

/** What the local fake SMTP server captured, newest first (development only), optionally for one address. */
export async function listCapturedMails(to?: string): Promise<CapturedMail[]> {
  const rows = await CapturedMailModel.findAll({
    where: to ? { mailTo: { [Op.iLike]: `%${to.replace(/[%_\\]/g, '\\$&')}%` } } : {},
    order: [['id', 'DESC']],
    limit: 100,
  });
  return rows.map((r) => ({ id: r.id, from: r.mailFrom, to: r.mailTo, subject: r.subject, text: r.textBody, html: r.htmlBody, receivedAt: r.createdAt.toISOString() }));
}
