import { z } from 'zod';

export const mailStatusSchema = z.enum(['pending', 'sent', 'failed']);

/** One row of the mail outbox as the admin sees it (bodies are never shown: they carry single-use links). */
export const outboxMailSchema = z.object({
  id: z.number().int(),
  kind: z.string(),
  to: z.string(),
  subject: z.string(),
  status: mailStatusSchema,
  attempts: z.number().int(),
  lastError: z.string().nullable(),
  nextAttemptAt: z.string().nullable(),
  sentAt: z.string().nullable(),
  createdAt: z.string(),
  /** Failed and its body still kept. */
  canResend: z.boolean(),
});
export type OutboxMail = z.infer<typeof outboxMailSchema>;

export const outboxListSchema = z.object({ mails: z.array(outboxMailSchema) });
/** `unsent` = pending or failed: what still needs the admin's eye. */
export const outboxFilterSchema = z.enum([...mailStatusSchema.options, 'unsent']);
export type OutboxFilter = z.infer<typeof outboxFilterSchema>;
export const outboxQuerySchema = z.object({ status: outboxFilterSchema.optional() });

/** A message the local fake SMTP server captured (development only). */
export const capturedMailSchema = z.object({
  id: z.number().int(),
  from: z.string(),
  to: z.string(),
  subject: z.string(),
  text: z.string().nullable(),
  html: z.string().nullable(),
  receivedAt: z.string(),
});
export type CapturedMail = z.infer<typeof capturedMailSchema>;

export const capturedMailListSchema = z.object({ mails: z.array(capturedMailSchema) });
export const capturedMailQuerySchema = z.object({ to: z.string().max(254).optional() });
