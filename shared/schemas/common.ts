import { z } from 'zod';

/** A positive integer id taken from a URL segment. */
export const positiveIdSchema = z.coerce.number().int().positive('Not a valid id.');

/** `/…/:id` */
export const idParamSchema = z.object({ id: positiveIdSchema });
export type IdParam = z.infer<typeof idParamSchema>;

/** `/profiles/:profileId/…` — the one profile param every profile route uses. */
export const profileIdParamSchema = z.object({ profileId: positiveIdSchema });
export type ProfileIdParam = z.infer<typeof profileIdParamSchema>;

/** `/profiles/:profileId/<things>/:id` */
export const profileItemParamSchema = profileIdParamSchema.extend({ id: positiveIdSchema });
export type ProfileItemParam = z.infer<typeof profileItemParamSchema>;
