import type { Request } from 'express';
import { idParamSchema } from '../../shared/schemas/common';
import { capturedMailListSchema, capturedMailQuerySchema, outboxListSchema, outboxMailSchema, outboxQuerySchema } from '../../shared/schemas/mail';
import { usesFakeSmtp } from '../config';
import { AppError } from '../errors';
import { listCapturedMails, listOutbox, resendMail } from '../services/mail.service';
import { access, defineRoute, type AnyRoute } from './registry';

const LOOPBACK = new Set(['127.0.0.1', '::1', '::ffff:127.0.0.1']);
const fromLoopback = (req: Request) => LOOPBACK.has(req.socket.remoteAddress ?? '');

/** The admin's view of the mail outbox, and the development page of captured mail. */
export function mailRoutes(): AnyRoute[] {
  return [
    defineRoute({
      method: 'get', path: '/admin/mail', access: access.role('admin'), query: outboxQuerySchema, response: outboxListSchema,
      summary: 'The mail outbox, newest first (admin): pending, sent and failed mails with attempts and the last error; `status` filters (`unsent` = pending or failed).',
      handler: async ({ query }, _req, res) => res.json({ mails: await listOutbox(query.status) }),
    }),
    defineRoute({
      method: 'post', path: '/admin/mail/:id/resend', access: access.role('admin'), params: idParamSchema, response: outboxMailSchema,
      summary: 'Queue a failed mail again with a fresh count of attempts (admin). 409 unless it failed.',
      handler: async ({ params }, _req, res) => res.json(await resendMail(params.id)),
    }),
    defineRoute({
      method: 'get', path: '/dev/mails', access: access.public, query: capturedMailQuerySchema, response: capturedMailListSchema,
      enabled: (config) => usesFakeSmtp(config) && config.NODE_ENV !== 'production',
      summary: 'Development only, from this machine only: what the local fake SMTP server captured (absent when SMTP_HOST is set).',
      handler: async ({ query }, req, res) => {
        if (!fromLoopback(req)) throw AppError.notFound();
        res.json({ mails: await listCapturedMails(query.to) });
      },
    }),
  ];
}
