import { z } from 'zod';

/** A positive integer id taken from a URL segment. */
export const idParamSchema = z.object({ id: z.coerce.number().int().positive('Not a valid id.') });
export type IdParam = z.infer<typeof idParamSchema>;
