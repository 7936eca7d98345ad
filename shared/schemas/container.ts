import { z } from 'zod';
import { decimalField } from './fields';

/** A pot weighs a whole cooked batch; a container holds one portion. */
export const containerKindSchema = z.enum(['pot', 'container']);
export type ContainerKind = z.infer<typeof containerKindSchema>;

/** A saved pot or container with its empty weight (tare), kept on a profile so the whole household uses it. */
export const containerSchema = z.object({
  id: z.number().int(),
  profileId: z.number().int(),
  name: z.string(),
  kind: containerKindSchema,
  tareGrams: z.number(),
  createdAt: z.string(),
});
export type Container = z.infer<typeof containerSchema>;

const containerFields = {
  name: z.string().trim().min(1, 'Give it a name, e.g. "Big blue pot".').max(80, 'Use at most 80 characters.'),
  kind: containerKindSchema,
  tareGrams: decimalField('Enter the empty weight in grams.')
    .pipe(z.number().min(0, 'The empty weight cannot be negative.').max(20_000, 'That is heavier than any kitchen scale reads (20 kg).')),
};

export const createContainerInputSchema = z.object({ ...containerFields, kind: containerKindSchema.default('container') });
export type CreateContainerInput = z.input<typeof createContainerInputSchema>;

/** Only the fields sent change (no defaults here: a rename must not turn a pot into a container). */
export const updateContainerInputSchema = z.object(containerFields).partial();
export type UpdateContainerInput = z.input<typeof updateContainerInputSchema>;
