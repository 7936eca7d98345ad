import { z } from 'zod';
import type { Nutrients } from '../compute/nutrients';

/** Where a food's values come from: an open table, or a package label typed in by a member. */
export const foodSourceSchema = z.enum(['ifct2017', 'usda_sr28', 'usda_fdc', 'pack']);
export type FoodSource = z.infer<typeof foodSourceSchema>;

const nutrientValue = z.number().nullable();

/** Per 100 g edible portion; keys are exactly the shared `Nutrients` keys (null = not known). */
export const nutrientsSchema = z.object({
  energyKcal: nutrientValue,
  energyKj: nutrientValue,
  carbAvailable: nutrientValue,
  carbTotal: nutrientValue,
  fibre: nutrientValue,
  sugars: nutrientValue,
  protein: nutrientValue,
  fat: nutrientValue,
  water: nutrientValue,
}) satisfies z.ZodType<Nutrients>;

export const foodMeasureSchema = z.object({ label: z.string(), grams: z.number() });
export type FoodMeasure = z.infer<typeof foodMeasureSchema>;

/** A food as the API returns it. `derived` lists the nutrient keys computed here rather than published. */
export const foodSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  source: foodSourceSchema,
  sourceCode: z.string(),
  group: z.string().nullable(),
  altNames: z.array(z.string()),
  per100g: nutrientsSchema,
  carbMeasured: z.enum(['available', 'total']).nullable(),
  carbNote: z.string().nullable(),
  derived: z.array(z.string()),
  attribution: z.string(),
  licence: z.string(),
  ownerUserId: z.number().int().nullable(),
  sharedProfileId: z.number().int().nullable(),
  labelConvention: z.enum(['eu', 'us']).nullable(),
  hasPhoto: z.boolean(),
  scientificName: z.string().nullable(),
  ndbNumber: z.string().nullable(),
  brand: z.string().nullable(),
  /** A manufacturer's product in an open table (USDA SR28 ManufacName or brand words in the name). */
  branded: z.boolean(),
  /**
   * Carbohydrate is known but fibre was not measured, so available carbohydrate is unknown; in the available basis
   * the total is shown with that note (shared/compute carbToShow).
   */
  fibreNotMeasured: z.boolean(),
  /** IFCT 2017 only: measured available carbohydrate (starch + free sugars), shown beside the counted value. */
  carbStarchSugars: z.number().nullable(),
  measures: z.array(foodMeasureSchema),
});
export type Food = z.infer<typeof foodSchema>;

/** One search hit: the same shape without measures (the detail call has them). */
export const foodSearchPageSchema = z.object({
  items: z.array(foodSchema.omit({ measures: true })),
  nextCursor: z.string().nullable(),
});
export type FoodSearchPage = z.infer<typeof foodSearchPageSchema>;
export type FoodSummary = FoodSearchPage['items'][number];

/** GET /api/foods query. The cursor is opaque (an offset into the ranked list). */
export const foodSearchQuerySchema = z.object({
  q: z.string().trim().max(100, 'Search at most 100 characters.').default(''),
  source: foodSourceSchema.optional(),
  group: z.string().trim().max(100).optional(),
  /** The profile whose preferred table ranks first (default: the user's own profile). */
  profileId: z.coerce.number().int().positive().optional(),
  limit: z.coerce.number().int().min(1, 'At least 1.').max(50, 'At most 50.').default(20),
  cursor: z
    .string()
    .regex(/^\d{1,7}$/, 'Not a valid cursor.')
    .optional(),
});
export type FoodSearchQuery = z.infer<typeof foodSearchQuerySchema>;

const MAX_GRAMS = 'Cannot be more than 100 g per 100 g.';
const grams = (label: string) =>
  z
    .number({ error: `${label} must be a number.` })
    .min(0, `${label} cannot be negative.`)
    .max(1000, `${label} is too large.`);
const optionalGrams = (label: string) => grams(label).nullable();

/**
 * A food typed from a package label. Values are as printed, per 100 g or per serving (then `servingGrams`).
 * `convention` says what the printed carbohydrate means: 'eu' = available (fibre not included),
 * 'us' = total carbohydrate (fibre included).
 */
export const createPackFoodInputSchema = z
  .object({
    name: z.string().trim().min(1, 'Give the food a name.').max(200, 'At most 200 characters.'),
    brand: z.string().trim().max(100, 'At most 100 characters.').nullable().default(null),
    basis: z.enum(['per100g', 'perServing']),
    servingGrams: z
      .number({ error: 'Serving size must be a number.' })
      .gt(0, 'Serving size must be more than 0 g.')
      .max(5000, 'Serving size is too large.')
      .nullable()
      .default(null),
    convention: z.enum(['eu', 'us']),
    carbohydrate: grams('Carbohydrate'),
    fibre: optionalGrams('Fibre').default(null),
    sugars: optionalGrams('Sugars').default(null),
    protein: optionalGrams('Protein').default(null),
    fat: optionalGrams('Fat').default(null),
    energyKcal: z.number({ error: 'Energy must be a number.' }).min(0, 'Energy cannot be negative.').max(10000).nullable().default(null),
    sharedProfileId: z.number().int().positive().nullable().default(null),
  })
  .superRefine((v, ctx) => {
    if (v.basis === 'perServing' && v.servingGrams == null) {
      ctx.addIssue({ code: 'custom', path: ['servingGrams'], message: 'Give the serving size in grams.' });
    }
    const factor = v.basis === 'perServing' && v.servingGrams ? 100 / v.servingGrams : 1;
    const macros = v.carbohydrate + (v.convention === 'eu' ? (v.fibre ?? 0) : 0) + (v.protein ?? 0) + (v.fat ?? 0);
    if (macros * factor > 100.5) {
      ctx.addIssue({ code: 'custom', path: ['carbohydrate'], message: `Carbohydrate, fibre, protein and fat add up to more than 100 g per 100 g. ${MAX_GRAMS}` });
    }
    if (v.fibre != null && v.convention === 'us' && v.fibre > v.carbohydrate) {
      ctx.addIssue({ code: 'custom', path: ['fibre'], message: 'On a US label fibre is part of total carbohydrate, so it cannot be larger.' });
    }
    if (v.sugars != null && v.convention === 'eu' && v.sugars > v.carbohydrate + 0.5) {
      ctx.addIssue({ code: 'custom', path: ['sugars'], message: 'Sugars are part of carbohydrate, so they cannot be larger.' });
    }
  });
export type CreatePackFoodInput = z.input<typeof createPackFoodInputSchema>;
export type CreatePackFoodValues = z.output<typeof createPackFoodInputSchema>;

/** Human names of the sources, for screens. */
export const FOOD_SOURCE_LABELS: Record<FoodSource, string> = {
  ifct2017: 'Indian Food Composition Tables 2017',
  usda_sr28: 'USDA SR28',
  usda_fdc: 'USDA FoodData Central',
  pack: 'Package label',
};

/** A dataset import as the admin screen sees it. */
export const datasetImportSchema = z.object({
  id: z.number().int(),
  dataset: z.enum(['ifct2017', 'usda_sr28', 'usda_fdc']),
  version: z.string(),
  status: z.enum(['running', 'succeeded', 'failed']),
  stage: z.string().nullable(),
  rowsRead: z.number(),
  rowsInserted: z.number(),
  rowsUpdated: z.number(),
  rowsUnchanged: z.number(),
  rowsSkipped: z.number(),
  report: z.record(z.string(), z.unknown()),
  error: z.string().nullable(),
  durationMs: z.number().nullable(),
  createdAt: z.string(),
  finishedAt: z.string().nullable(),
});
export type DatasetImport = z.infer<typeof datasetImportSchema>;
