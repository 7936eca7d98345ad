import type { Nutrients } from '../../shared/compute/nutrients';
import type { FoodMeasure } from '../../shared/schemas/food';
import { recipeInputSchema, type RecipeDetail, type RecipeInput, type RecipeVisibility } from '../../shared/schemas/recipe';
import { requestFormSchema } from '../ui/request-form-schema';

/** One ingredient line as typed; the food's name, values and measures ride along for the screen. */
export type IngredientRow = { foodId: number; foodName: string; per100g: Nutrients; measures: FoodMeasure[]; grams: string; measureLabel: string; note: string };

/** The recipe editor's values: text as typed (tags comma-separated, one method step per line). */
export type RecipeFormValues = {
  title: string;
  description: string;
  portions: string;
  tags: string;
  steps: string;
  visibility: RecipeVisibility;
  ingredients: IngredientRow[];
};

/** A typed number ("12,5" reads as 12.5); empty is NaN, which the shared schema names. */
export const typedNumber = (s: string) => (s.trim() === '' ? Number.NaN : Number(s.trim().replace(',', '.')));

/** The editor's starting values: empty, or the saved recipe. */
export function recipeFormValues(recipe?: RecipeDetail): RecipeFormValues {
  if (!recipe) return { title: '', description: '', portions: '4', tags: '', steps: '', visibility: 'private', ingredients: [] };
  return {
    title: recipe.title,
    description: recipe.description,
    portions: String(recipe.defaultPortions),
    tags: recipe.tags.join(', '),
    steps: recipe.methodSteps.join('\n'),
    visibility: recipe.visibility,
    ingredients: recipe.ingredients.map((i) => ({
      foodId: i.food.id,
      foodName: i.food.name,
      per100g: i.food.per100g,
      measures: i.food.measures ?? [],
      grams: String(i.grams),
      measureLabel: i.measureLabel ?? '',
      note: i.note ?? '',
    })),
  };
}

/** The request body from the typed values. */
export function toRecipeRequest(v: RecipeFormValues): RecipeInput {
  return {
    title: v.title,
    description: v.description,
    defaultPortions: typedNumber(v.portions),
    tags: v.tags.split(',').map((t) => t.trim()).filter(Boolean),
    methodSteps: v.steps.split('\n').map((s) => s.trim()).filter(Boolean),
    visibility: v.visibility,
    ingredients: v.ingredients.map((l) => ({ foodId: l.foodId, grams: typedNumber(l.grams), measureLabel: l.measureLabel || null, note: l.note || null })),
  };
}

/** Where an error on a request path ("defaultPortions", "methodSteps.2", "ingredients.1.grams") lands in the form. */
export function recipeFieldOf(path: string): string | undefined {
  if (path === 'defaultPortions') return 'portions';
  if (path.startsWith('methodSteps')) return 'steps';
  if (path.startsWith('tags')) return 'tags';
  if (/^ingredients\.\d+\.(foodId|grams|measureLabel|note)$/.test(path)) return path;
  if (path.startsWith('ingredients')) return 'ingredients';
  return ['title', 'description', 'visibility'].includes(path) ? path : undefined;
}

/** The editor's schema for zodResolver: the shared recipe input schema on the built request. */
export const recipeFormSchema = requestFormSchema(recipeInputSchema, (v: RecipeFormValues) => ({ request: toRecipeRequest(v), fieldOf: recipeFieldOf }));
