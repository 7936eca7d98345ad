import { z } from 'zod';
import { decimalField, wholeNumberText } from './fields';
import { idParamSchema, positiveIdSchema } from './common';
import type { RecipeNutrition } from '../compute/recipe';
import type { Food } from './food';
import { carbBasisSchema, carbUnitSchema } from './units';

/** private = only the owner; shared = the owner and the people it is shared with; public = every signed-in person. */
export const recipeVisibilitySchema = z.enum(['private', 'shared', 'public']);
export type RecipeVisibility = z.infer<typeof recipeVisibilitySchema>;

/** The most grams one ingredient line may hold (a 20 kg catering pot is already generous). */
export const MAX_INGREDIENT_GRAMS = 20_000;

const optionalText = (max: number, label: string) =>
  z
    .string()
    .trim()
    .max(max, `${label} can be at most ${max} characters.`)
    .nullish()
    .transform((v) => (v ? v : null));

/** One ingredient as the editor sends it: a food id, raw grams, an optional household measure and note. */
export const recipeIngredientInputSchema = z.object({
  foodId: z.number({ error: 'Pick a food.' }).int('Pick a food.').positive('Pick a food.'),
  grams: z
    .number({ error: 'Enter the grams.' })
    .refine((g) => Number.isFinite(g), 'Enter the grams.')
    .refine((g) => g > 0, 'Grams must be more than 0.')
    .refine((g) => g <= MAX_INGREDIENT_GRAMS, `At most ${MAX_INGREDIENT_GRAMS} g per ingredient.`),
  measureLabel: optionalText(60, 'The household measure'),
  note: optionalText(200, 'The note'),
});
export type RecipeIngredientInput = z.input<typeof recipeIngredientInputSchema>;

/** Create and full update of a recipe (PUT replaces everything, ingredients in the order given). */
export const recipeInputSchema = z.object({
  title: z.string({ error: 'Give the recipe a title.' }).trim().min(1, 'Give the recipe a title.').max(120, 'At most 120 characters.'),
  description: z.string().trim().max(2000, 'At most 2000 characters.').default(''),
  methodSteps: z.array(z.string().trim().min(1, 'A step cannot be empty.').max(1000, 'At most 1000 characters.')).max(40, 'At most 40 steps.').default([]),
  tags: z
    .array(z.string().trim().toLowerCase().min(1, 'A tag cannot be empty.').max(30, 'At most 30 characters.'))
    .max(12, 'At most 12 tags.')
    .default([])
    .transform((tags) => [...new Set(tags)]),
  defaultPortions: z
    .number({ error: 'Enter the number of portions.' })
    .int('Portions must be a whole number.')
    .min(1, 'At least 1 portion.')
    .max(100, 'At most 100 portions.'),
  visibility: recipeVisibilitySchema.default('private'),
  ingredients: z.array(recipeIngredientInputSchema).min(1, 'Add at least one ingredient.').max(60, 'At most 60 ingredients.'),
});
export type RecipeInput = z.input<typeof recipeInputSchema>;
export type RecipeInputParsed = z.output<typeof recipeInputSchema>;

const positiveIntQuery = (label: string, max = Number.MAX_SAFE_INTEGER, maxMessage?: string) =>
  wholeNumberText(`${label} must be a whole number.`).pipe(z.number().positive(`${label} must be more than 0.`).max(max, maxMessage));

/** Which profile's carbohydrate basis and unit to answer in (default: the signed-in person's own). */
export const recipeViewQuerySchema = z
  .object({
    profileId: positiveIntQuery('profileId').optional(),
    factor: decimalField('The scale factor must be a number.').pipe(z.number().positive('The scale factor must be more than 0.').max(50, 'At most × 50.')).optional(),
    portions: positiveIntQuery('portions', 500, 'At most 500 portions.').optional(),
  })
  .refine((q) => q.factor === undefined || q.portions === undefined, { message: 'Scale by a factor or to a number of portions, not both.', path: ['factor'] });
export type RecipeViewQuery = z.infer<typeof recipeViewQuerySchema>;

export const recipeScopeSchema = z.enum(['mine', 'shared', 'public']);
export type RecipeScope = z.infer<typeof recipeScopeSchema>;
export const recipeSortSchema = z.enum(['recent', 'title', 'carbPerPortion', 'cooked']);
export type RecipeSort = z.infer<typeof recipeSortSchema>;

/** GET /api/recipes: one shelf, an optional search over title, tag and ingredient name, a sort. */
export const recipeListQuerySchema = z.object({
  scope: recipeScopeSchema.default('mine'),
  q: z.string().trim().max(100, 'Search at most 100 characters.').default(''),
  sort: recipeSortSchema.default('recent'),
  profileId: positiveIntQuery('profileId').optional(),
});
export type RecipeListQuery = z.infer<typeof recipeListQuerySchema>;

/** POST /api/recipes/:id/shares */
export const shareRecipeInputSchema = z.object({
  email: z.string({ error: 'Enter an email address.' }).trim().toLowerCase().pipe(z.email('Enter a valid email address.')),
});
export type ShareRecipeInput = z.input<typeof shareRecipeInputSchema>;

export const recipeShareParamsSchema = idParamSchema.extend({ userId: positiveIdSchema });

export type RecipePerson = { id: number; displayName: string };
export type RecipePhoto = { largeUrl: string; thumbUrl: string };
export type RecipeShare = { userId: number; displayName: string; email: string; sharedAt: string };
/** An offer the owner made and nobody has answered yet. */
export type RecipeOfferSent = { id: number; email: string; offeredAt: string };
/** A recipe offered to the signed-in person: accept to put it on the shared shelf, or decline. */
export type RecipeOffer = { id: number; recipeId: number; recipeTitle: string; senderName: string; offeredAt: string };

/** A recipe on a library shelf, with its carbohydrate per portion in the requested basis (full precision). */
export type RecipeSummary = {
  id: number;
  title: string;
  description: string;
  tags: string[];
  defaultPortions: number;
  visibility: RecipeVisibility;
  owner: RecipePerson;
  isOwner: boolean;
  photo: RecipePhoto | null;
  ingredientNames: string[];
  carbPerPortionGrams: number | null;
  carbIncomplete: boolean;
  basis: z.infer<typeof carbBasisSchema>;
  unit: z.infer<typeof carbUnitSchema>;
  copiedFromRecipeId: number | null;
  lastCookedAt: string | null;
  updatedAt: string;
};

export type RecipeIngredient = {
  id: number;
  position: number;
  foodId: number;
  grams: number;
  measureLabel: string | null;
  note: string | null;
  food: Food;
};

/** A recipe page: everything in the summary plus ingredients, method and the server-computed breakdown. */
export type RecipeDetail = RecipeSummary & {
  methodSteps: string[];
  ingredients: RecipeIngredient[];
  nutrition: RecipeNutrition;
  /** The scale the nutrition and ingredient grams were computed at (1 = as saved). */
  scale: { factor: number; portions: number };
  /** Only for the owner: who the recipe is shared with. */
  sharedWith: RecipeShare[] | null;
  copiedFrom: { id: number; title: string } | null;
};
