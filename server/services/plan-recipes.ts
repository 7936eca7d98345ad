import { Op, QueryTypes } from 'sequelize';
import { NUTRIENT_KEYS, type Nutrients } from '../../shared/compute/nutrients';
import { computeRecipe } from '../../shared/compute/recipe';
import type { CarbBasis } from '../../shared/schemas/units';
import { FoodModel, RecipeModel } from '../models';

export type RecipeCarbs = {
  id: number;
  title: string;
  defaultPortions: number;
  /** Carbohydrate per portion and per 100 g of the raw mixture, in the basis (null = unknown). */
  carbPerPortion: number | null;
  carbPer100g: number | null;
  lines: { foodId: number; grams: number }[];
};

// Each nutrient column as `"key", column` for json_build_object: the food table names its columns after the keys.
const NUTRIENTS_JSON = NUTRIENT_KEYS.map((k) => `'${k}', f.${k.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`)}`).join(', ');

export type RecipeRow = { id: number; title: string; defaultPortions: number; lines: { foodId: number; grams: number; per100g: Nutrients }[] };

/** Recipes chosen by `where` (SQL on `r`, the recipes table) with their lines and each line's food per 100 g, in one statement. */
export function loadRecipeRows(where: string, replacements: Record<string, unknown>): Promise<RecipeRow[]> {
  return RecipeModel.sequelize!.query<RecipeRow>(
    `SELECT r.id, r.title, r.default_portions AS "defaultPortions",
       COALESCE((SELECT json_agg(json_build_object('foodId', ri.food_id, 'grams', ri.grams, 'per100g', json_build_object(${NUTRIENTS_JSON})) ORDER BY ri.position)
                 FROM recipe_ingredients ri JOIN foods f ON f.id = ri.food_id WHERE ri.recipe_id = r.id), '[]') AS lines
     FROM recipes r WHERE ${where}`,
    { replacements, type: QueryTypes.SELECT },
  );
}

/** Recipe rows with their carbohydrate per portion and per 100 g (the recipe's own weights) in the profile's basis. */
export function recipeCarbs(rows: RecipeRow[], basis: CarbBasis): Map<number, RecipeCarbs> {
  return new Map(
    rows.map((r) => {
      const n = r.lines.length ? computeRecipe(r.lines, { portions: r.defaultPortions, basis }) : null;
      return [
        r.id,
        {
          id: r.id,
          title: r.title,
          defaultPortions: r.defaultPortions,
          carbPerPortion: n ? (n.carbIncomplete ? null : n.carbPerPortion.grams) : null,
          carbPer100g: n ? (n.carbIncomplete ? null : n.carbPer100gRaw.grams) : null,
          lines: r.lines.map((l) => ({ foodId: l.foodId, grams: l.grams })),
        },
      ];
    }),
  );
}

/** Recipes by id with their carbohydrate per portion and per 100 g (the recipe's own weights), in the profile's basis. */
export async function loadRecipeCarbs(ids: number[], basis: CarbBasis): Promise<Map<number, RecipeCarbs>> {
  const unique = [...new Set(ids)];
  if (!unique.length) return new Map();
  return recipeCarbs(await loadRecipeRows('r.id IN (:ids)', { ids: unique }), basis);
}

/** Food rows by id. */
export async function loadFoodRows(ids: number[]): Promise<Map<number, FoodModel>> {
  const unique = [...new Set(ids)];
  if (!unique.length) return new Map();
  const rows = await FoodModel.findAll({ where: { id: { [Op.in]: unique } } });
  return new Map(rows.map((f) => [f.id, f]));
}

