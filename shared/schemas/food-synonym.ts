import { z } from 'zod';

/** Where an equivalence of food names comes from. */
export const synonymOriginSchema = z.enum(['dictionary', 'table', 'common usage']);
export type SynonymOrigin = z.infer<typeof synonymOriginSchema>;

const phrase = (label: string) =>
  z
    .string()
    .trim()
    .min(1, `Enter the ${label}.`)
    .max(60, 'Use at most 60 characters.')
    .refine((s) => /[\p{L}\p{N}]/u.test(s), 'Use letters or digits.');

/** A new pair of names search treats as the same food (both directions), with its source. */
export const createFoodSynonymInputSchema = z
  .object({
    term: phrase('name people type'),
    equivalent: phrase('name the food tables use'),
    origin: synonymOriginSchema,
    reference: z.string().trim().min(1, 'Say where this comes from (dictionary, table or usage).').max(200, 'Use at most 200 characters.'),
  })
  .refine((v) => v.term.toLowerCase() !== v.equivalent.toLowerCase(), { path: ['equivalent'], message: 'Give a different name.' });
export type CreateFoodSynonymInput = z.infer<typeof createFoodSynonymInputSchema>;

export const foodSynonymSchema = z.object({
  id: z.number().int(),
  term: z.string(),
  equivalent: z.string(),
  origin: synonymOriginSchema,
  reference: z.string(),
  createdAt: z.string(),
});
export type FoodSynonym = z.infer<typeof foodSynonymSchema>;
