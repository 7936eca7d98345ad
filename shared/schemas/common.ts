import { z } from 'zod';
import { wholeNumberText } from './fields';

/** A positive integer id taken from a URL segment (digits only) or JSON. */
export const positiveIdSchema = wholeNumberText('Not a valid id.').pipe(z.number().positive('Not a valid id.'));

/** `/…/:id` */
export const idParamSchema = z.object({ id: positiveIdSchema });
export type IdParam = z.infer<typeof idParamSchema>;

/** `/profiles/:profileId/…` — the one profile param every profile route uses. */
export const profileIdParamSchema = z.object({ profileId: positiveIdSchema });
export type ProfileIdParam = z.infer<typeof profileIdParamSchema>;

/** `/profiles/:profileId/<things>/:id` */
export const profileItemParamSchema = profileIdParamSchema.extend({ id: positiveIdSchema });
export type ProfileItemParam = z.infer<typeof profileItemParamSchema>;
