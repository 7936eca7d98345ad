import { z } from 'zod';
import { calendarDate } from './fields';
import { profileItemParamSchema } from './common';
import { netGrams, splitExceedsBatch } from '../compute/batch';
import type { Nutrients } from '../compute/nutrients';
import type { CarbBasis, CarbUnit } from './units';
import { carbAmountSchema, storageSchema, type Portion } from './portion';

export { storageSchema };

/** The heaviest reading we accept from a kitchen scale (g). */
export const MAX_SCALE_GRAMS = 50_000;

export const foodSafetyRegionSchema = z.enum(['uk', 'us']);

/** A calendar date, YYYY-MM-DD. */
export const isoDateSchema = calendarDate('Use a date like 2026-03-10.');

const grams = (what: string) =>
  z
    .number({ error: `Enter ${what} in grams.` })
    .refine((g) => Number.isFinite(g), `Enter ${what} in grams.`)
    .refine((g) => g <= MAX_SCALE_GRAMS, `At most ${MAX_SCALE_GRAMS} g.`);

const optionalId = z.number().int().positive('Not a valid id.').nullish().transform((v) => v ?? null);

/** A scale reading of something in a container: gross on the scale, minus the container's empty weight. */
export const weighingSchema = z
  .object({
    containerId: optionalId,
    grossGrams: grams('the weight on the scale').refine((g) => g > 0, 'The weight on the scale must be more than 0 g.'),
    tareGrams: grams('the empty container').refine((g) => g >= 0, 'The empty weight cannot be negative.'),
  })
  .refine((w) => !(w.tareGrams >= w.grossGrams), {
    message: 'The empty container must weigh less than the full one.',
    path: ['tareGrams'],
  });
export type WeighingInput = z.input<typeof weighingSchema>;

/** One line of the weighing checklist: the food used (maybe swapped), planned and actual grams, or left out. */
export const batchIngredientInputSchema = z
  .object({
    foodId: z.number({ error: 'Pick a food.' }).int('Pick a food.').positive('Pick a food.'),
    plannedGrams: grams('the planned amount').refine((g) => g >= 0, 'The planned amount cannot be negative.'),
    actualGrams: grams('what the scale read').nullish().transform((v) => v ?? null),
    omitted: z.boolean().default(false),
    swappedFromFoodId: optionalId,
  })
  .superRefine((line, ctx) => {
    if (line.omitted) return;
    if (line.actualGrams == null) ctx.addIssue({ code: 'custom', path: ['actualGrams'], message: 'Enter what the scale read, or leave the ingredient out.' });
    else if (!(line.actualGrams > 0)) ctx.addIssue({ code: 'custom', path: ['actualGrams'], message: 'The weighed amount must be more than 0 g.' });
  });
export type BatchIngredientInput = z.input<typeof batchIngredientInputSchema>;

export const splitInputSchema = z.discriminatedUnion('mode', [
  z.object({
    mode: z.literal('equal'),
    count: z.number({ error: 'Enter how many portions.' }).int('Portions must be a whole number.').min(1, 'At least 1 portion.').max(100, 'At most 100 portions.'),
  }),
  z.object({
    mode: z.literal('weighed'),
    portions: z.array(weighingSchema).min(1, 'Weigh at least one portion.').max(100, 'At most 100 portions.'),
  }),
]);
export type SplitInput = z.input<typeof splitInputSchema>;

/** Net grams of a weighing, or null when it is not a valid reading (its own field errors say why). */
function netOrNull(w: { grossGrams: number; tareGrams: number }): number | null {
  try {
    return netGrams(w.grossGrams, w.tareGrams);
  } catch {
    return null;
  }
}

/** POST /api/profiles/:profileId/batches — a whole cook, saved at once. */
export const createBatchInputSchema = z
  .object({
    recipeId: z.number({ error: 'Pick a recipe.' }).int().positive('Pick a recipe.'),
    scaleFactor: z.number().positive('The scale factor must be more than 0.').max(50, 'At most × 50.').default(1),
    cookedOn: isoDateSchema,
    storage: storageSchema,
    region: foodSafetyRegionSchema.default('uk'),
    useBy: isoDateSchema.nullish().transform((v) => v ?? null),
    ingredients: z.array(batchIngredientInputSchema).min(1, 'The batch needs at least one ingredient.').max(60, 'At most 60 ingredients.'),
    cookedWeight: weighingSchema,
    split: splitInputSchema,
    note: z.string().trim().max(500, 'At most 500 characters.').default(''),
    /** The week plan's planned cook this batch fulfils: its planned meals get these portions. */
    plannedCookId: optionalId,
  })
  .superRefine((input, ctx) => {
    if (input.ingredients.length && input.ingredients.every((l) => l.omitted)) {
      ctx.addIssue({ code: 'custom', path: ['ingredients'], message: 'Every ingredient is left out: there is nothing in the pot.' });
    }
    if (input.useBy && input.useBy < input.cookedOn) {
      ctx.addIssue({ code: 'custom', path: ['useBy'], message: 'The use-by date cannot be before the cooking date.' });
    }
    const cooked = netOrNull(input.cookedWeight);
    if (input.split.mode === 'weighed' && cooked != null) {
      const nets = input.split.portions.map((p) => netOrNull(p) ?? 0);
      const sum = nets.reduce((a, b) => a + b, 0);
      if (splitExceedsBatch(cooked, nets)) {
        ctx.addIssue({
          code: 'custom',
          path: ['split', 'portions'],
          message: `These portions hold ${Math.round(sum)} g, more than the ${Math.round(cooked)} g in the pot. Check the weights and tares.`,
        });
      }
    }
  });
export type CreateBatchInput = z.input<typeof createBatchInputSchema>;
export type CreateBatchParsed = z.output<typeof createBatchInputSchema>;

/** PATCH /api/profiles/:profileId/batches/:id — moving a batch to the freezer, or correcting its use-by date. */
export const updateBatchInputSchema = z
  .object({ storage: storageSchema.optional(), region: foodSafetyRegionSchema.optional(), useBy: isoDateSchema.nullish() })
  .refine((v) => v.storage !== undefined || v.useBy !== undefined, { message: 'Change the storage or the use-by date.', path: ['storage'] });
export type UpdateBatchInput = z.input<typeof updateBatchInputSchema>;

export const batchParamsSchema = profileItemParamSchema;

export const batchListQuerySchema = z.object({ include: z.enum(['available', 'all']).default('available') });

type CarbAmount = z.infer<typeof carbAmountSchema>;

/** A weighed line as the batch snapshot keeps it (independent of later recipe or food edits). */
export type BatchIngredient = {
  position: number;
  foodId: number | null;
  foodName: string;
  foodSource: string;
  per100g: Nutrients;
  plannedGrams: number;
  actualGrams: number | null;
  differenceGrams: number | null;
  omitted: boolean;
  swappedFrom: { foodId: number | null; foodName: string } | null;
  carb: CarbAmount;
};

/** A batch on the inventory shelf. */
export type BatchSummary = {
  id: number;
  profileId: number;
  recipeId: number | null;
  recipeTitle: string;
  cookedOn: string;
  storage: 'fridge' | 'freezer';
  useBy: string;
  useBySource: string;
  cookedGrams: number;
  basis: CarbBasis;
  unit: CarbUnit;
  carbPer100g: CarbAmount;
  counts: { available: number; eaten: number; discarded: number };
  portions: Portion[];
};

/** A batch page: the summary plus the weighing record and the batch arithmetic. */
export type BatchDetail = BatchSummary & {
  scaleFactor: number;
  useByNote: string;
  cookedBy: { id: number; displayName: string } | null;
  rawGrams: number;
  cookedGrossGrams: number;
  potTareGrams: number;
  potName: string | null;
  yieldFactor: number;
  splitMode: 'equal' | 'weighed';
  gramsLeft: number;
  carbTotal: CarbAmount;
  totals: Nutrients;
  per100g: Nutrients;
  incomplete: string[];
  ingredients: BatchIngredient[];
  note: string;
  createdAt: string;
};

