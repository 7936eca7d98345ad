import { stringify } from 'csv-stringify/sync';
import { Op } from 'sequelize';
import { shoppingLines } from '../../shared/compute/plan-shopping';
import { weekDates } from '../../shared/compute/plan';
import type { ShoppingList, ShoppingTickInput } from '../../shared/schemas/plan';
import { FoodMeasureModel, PlannedCookModel, ShoppingTickModel } from '../models';
import { getPlanSettings } from './plan-settings.service';
import { loadFoodRows, loadRecipeCarbs } from './plan-recipes';
import { loadProfile } from './profiles.service';

/**
 * The shopping list of the week holding `date`: grams per food summed over the week's planned cooks not yet cooked
 * (each recipe scaled to its planned portions), grouped by food group, with a household measure where one is known,
 * and the ticks kept for that week.
 */
export async function getShoppingList(profileId: number, date: string): Promise<ShoppingList> {
  const profile = await loadProfile(profileId);
  const plan = await getPlanSettings(profileId);
  const dates = weekDates(date, plan.weekStart);
  const cooks = await PlannedCookModel.findAll({ where: { profileId, batchId: null, cookOn: { [Op.between]: [dates[0], dates[6]] } }, order: [['cookOn', 'ASC'], ['id', 'ASC']] });
  const recipes = await loadRecipeCarbs(cooks.map((c) => c.recipeId), profile.carbBasis);
  const uses = cooks.flatMap((c) => {
    const r = recipes.get(c.recipeId);
    return r ? r.lines.map((l) => ({ foodId: l.foodId, grams: (l.grams * c.portions) / r.defaultPortions, recipe: r.title })) : [];
  });
  const foodIds = [...new Set(uses.map((u) => u.foodId))];
  const [foods, measures, ticks] = await Promise.all([
    loadFoodRows(foodIds),
    foodIds.length ? FoodMeasureModel.findAll({ where: { foodId: { [Op.in]: foodIds } }, order: [['seq', 'ASC']] }) : [],
    ShoppingTickModel.findAll({ where: { profileId, weekStart: dates[0] } }),
  ]);
  const lines = shoppingLines(
    uses,
    new Map([...foods].map(([id, f]) => [id, { name: f.name, group: f.foodGroup }])),
    measures.map((m) => ({ foodId: m.foodId, label: m.label, grams: m.grams })),
    new Set(ticks.map((t) => t.foodId)),
  );
  return {
    weekStart: dates[0],
    groups: lines,
    cooks: cooks.map((c) => ({ id: c.id, recipeTitle: recipes.get(c.recipeId)?.title ?? 'Recipe', cookOn: c.cookOn, portions: c.portions })),
  };
}

/** Ticks a food off the week's list, or back on. */
export async function setShoppingTick(profileId: number, userId: number, input: ShoppingTickInput): Promise<{ ticked: boolean }> {
  const where = { profileId, weekStart: input.weekStart, foodId: input.foodId };
  if (!input.ticked) await ShoppingTickModel.destroy({ where });
  else await ShoppingTickModel.findOrCreate({ where, defaults: { ...where, tickedByUserId: userId } });
  return { ticked: input.ticked };
}

/** The list as CSV (one row per food: group, food, grams, household measure, recipes, ticked). */
export function shoppingListCsv(list: ShoppingList): string {
  const rows = list.groups.flatMap((g) =>
    g.lines.map((l) => [g.group, l.foodName, Math.round(l.grams), l.measure ? `about ${l.measure.count} × ${l.measure.label}` : '', l.recipes.join('; '), l.ticked ? 'yes' : 'no']),
  );
  return stringify([['group', 'food', 'grams', 'household measure', 'recipes', 'ticked'], ...rows]);
}
