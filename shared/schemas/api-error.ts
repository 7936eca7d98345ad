import { z } from 'zod';

/** Stable, snake_case error codes the client may branch on. */
export const apiErrorCodeSchema = z.enum([
  'validation_failed',
  'unauthorized',
  'forbidden',
  'not_found',
  'conflict',
  'payload_too_large',
  'storage_full',
  'unprocessable',
  'rate_limited',
  'busy',
  'unavailable',
  'internal',
]);
export type ApiErrorCode = z.infer<typeof apiErrorCodeSchema>;

/** The one error body every API error uses. */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fieldErrors: z.record(z.string(), z.array(z.string())).optional(),
  }),
});
export type ApiErrorBody = z.infer<typeof apiErrorSchema>;
