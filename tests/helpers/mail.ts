import { QueryTypes, type Sequelize } from 'sequelize';

type Row = { id: number; mail_to: string; subject: string; text_body: string | null; html_body: string | null };

export type Captured = { to: string; subject: string; text: string; html: string | null };

/**
 * Waits until the local fake SMTP server has captured a mail to `to` (optionally whose subject contains
 * `subject`) and returns the newest; fails after `timeoutMs`. Reads the captured_mails table of the app's database.
 */
export async function waitForMail(sequelize: Sequelize, to: string, options: { subject?: string; timeoutMs?: number; after?: number } = {}): Promise<Captured & { id: number }> {
  const deadline = Date.now() + (options.timeoutMs ?? 10_000);
  for (;;) {
    const rows = await sequelize.query<Row>('SELECT id, mail_to, subject, text_body, html_body FROM captured_mails WHERE id > :after ORDER BY id DESC', {
      replacements: { after: options.after ?? 0 },
      type: QueryTypes.SELECT,
    });
    const hit = rows.find((r) => r.mail_to.split(', ').includes(to.toLowerCase()) && (!options.subject || r.subject.includes(options.subject)));
    if (hit) return { id: hit.id, to: hit.mail_to, subject: hit.subject, text: hit.text_body ?? '', html: hit.html_body };
    if (Date.now() > deadline) throw new Error(`no mail to ${to}${options.subject ? ` about "${options.subject}"` : ''} within the time allowed`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** The id of the newest captured mail (0 when none), to wait only for mail that arrives after it. */
export async function lastCapturedId(sequelize: Sequelize): Promise<number> {
  const [row] = await sequelize.query<{ max: number | null }>('SELECT max(id) AS max FROM captured_mails', { type: QueryTypes.SELECT });
  return row?.max ?? 0;
}

/** The first link in a mail's plain text that goes to `path` (e.g. '/reset-password'). */
export function linkIn(mail: Captured, path: string): URL {
  const found = mail.text.match(/https?:\/\/\S+/g)?.map((u) => new URL(u)).find((u) => u.pathname === path);
  if (!found) throw new Error(`no link to ${path} in the mail "${mail.subject}"`);
  return found;
}
