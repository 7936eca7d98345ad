import { Op } from 'sequelize';
import { carbInBasis } from '../../shared/compute/nutrients';
import { computeRecipe } from '../../shared/compute/recipe';
import type { CarbBasis } from '../../shared/schemas/units';
import { FoodModel, RecipeIngredientModel, RecipeModel } from '../models';
import { toFoodSummary } from './foods.service';

export type RecipeCarbs = {
  id: number;
  title: string;
  defaultPortions: number;
  /** Carbohydrate per portion and per 100 g of the raw mixture, in the basis (null = unknown). */
  carbPerPortion: number | null;
  carbPer100g: number | null;
  lines: { foodId: number; grams: number }[];
};

/** Recipes with their carbohydrate per portion and per 100 g (the recipe's own weights), in the profile's basis. */
export async function loadRecipeCarbs(ids: number[], basis: CarbBasis): Promise<Map<number, RecipeCarbs>> {
  const unique = [...new Set(ids)];
  if (!unique.length) return new Map();
  const [recipes, lines] = await Promise.all([
    RecipeModel.findAll({ where: { id: { [Op.in]: unique } } }),
    RecipeIngredientModel.findAll({ where: { recipeId: { [Op.in]: unique } }, order: [['recipeId', 'ASC'], ['position', 'ASC']] }),
  ]);
  const foods = await loadFoodRows(lines.map((l) => l.foodId));
  return new Map(
    recipes.map((r) => {
      const own = lines.filter((l) => l.recipeId === r.id && foods.has(l.foodId));
      const n = own.length ? computeRecipe(own.map((l) => ({ grams: l.grams, per100g: toFoodSummary(foods.get(l.foodId)!).per100g })), { portions: r.defaultPortions, basis }) : null;
      return [
        r.id,
        {
          id: r.id,
          title: r.title,
          defaultPortions: r.defaultPortions,
          carbPerPortion: n ? (n.carbIncomplete ? null : n.carbPerPortion.grams) : null,
          carbPer100g: n ? (n.carbIncomplete ? null : n.carbPer100gRaw.grams) : null,
          lines: own.map((l) => ({ foodId: l.foodId, grams: l.grams })),
        },
      ];
    }),
  );
}

/** Food rows by id. */
export async function loadFoodRows(ids: number[]): Promise<Map<number, FoodModel>> {
  const unique = [...new Set(ids)];
  if (!unique.length) return new Map();
  const rows = await FoodModel.findAll({ where: { id: { [Op.in]: unique } } });
  return new Map(rows.map((f) => [f.id, f]));
}


/** A food's carbohydrate per 100 g in the basis (null = unknown). */
export function foodCarbPer100g(f: FoodModel, basis: CarbBasis): number | null {
  return carbInBasis(f, basis);
}
