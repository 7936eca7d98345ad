import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

/** A message as the fake SMTP server received and parsed it. */
export type ReceivedMail = { from: string; to: string[]; subject: string; text: string | null; html: string | null };

export type FakeSmtp = { port: number; close: () => Promise<void> };

/**
 * A local SMTP server on loopback that accepts every message without TLS or authentication and hands each one,
 * parsed, to `onMessage`. Used instead of a real mail server when SMTP_HOST is not set (npm start, npm test).
 */
export async function startFakeSmtp(options: { port?: number; onMessage: (mail: ReceivedMail) => Promise<void> | void }): Promise<FakeSmtp> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    banner: 'Carbwright local fake SMTP (captures mail, delivers nothing)',
    size: 1024 * 1024,
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          await options.onMessage({
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? '',
            text: parsed.text ?? null,
            html: typeof parsed.html === 'string' ? parsed.html : null,
          });
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.server.once('error', reject);
    server.listen(options.port ?? 0, '127.0.0.1', () => resolve());
  });
  // Never the reason a process stays alive (tests close their apps; npm start exits on a signal).
  server.server.unref();
  const port = (server.server.address() as AddressInfo).port;
  return { port, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}
