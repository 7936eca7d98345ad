import { Op, QueryTypes, type Transaction } from 'sequelize';
import { addDaysIso } from '../../shared/compute/plan';
import { timeToMinutes } from '../../shared/schemas/profile-settings';
import type { PlanMealInput, PlannedCookInput } from '../../shared/schemas/plan';
import { AppError } from '../errors';
import { PlanMealModel, PlanMealNameModel, PlannedCookModel, PortionModel } from '../models';
import { getUsableFoods } from './foods.service';
import { findViewableRecipe } from './recipes.service';

/** Checks that everything a planned meal names is on this profile (or visible to the acting user) and returns its row values. */
async function mealValues(profileId: number, userId: number, input: PlanMealInput) {
  const name = await PlanMealNameModel.findOne({ where: { id: input.mealNameId, profileId } });
  if (!name) throw AppError.validation({ mealNameId: ['That meal is not on this profile.'] });
  const base = {
    profileId,
    date: input.date,
    mealNameId: name.id,
    minute: input.time ? timeToMinutes(input.time) : name.minute,
    source: input.source,
    portionId: null as number | null,
    plannedCookId: null as number | null,
    recipeId: null as number | null,
    foodId: null as number | null,
    grams: null as number | null,
    portions: null as number | null,
    carbGrams: null as number | null,
    thawOn: null as string | null,
    note: input.note ?? null,
  };
  switch (input.source) {
    case 'portion': {
      const portion = await PortionModel.findOne({ where: { id: input.portionId!, profileId } });
      if (!portion) throw AppError.validation({ portionId: ['That portion is not on this profile.'] });
      if (portion.status !== 'available') throw AppError.validation({ portionId: ['That portion has been eaten or thrown away.'] });
      return { ...base, portionId: portion.id, thawOn: input.thawOn };
    }
    case 'planned_cook': {
      const cook = await PlannedCookModel.findOne({ where: { id: input.plannedCookId!, profileId } });
      if (!cook) throw AppError.validation({ plannedCookId: ['That planned cook is not on this profile.'] });
      return { ...base, plannedCookId: cook.id };
    }
    case 'recipe': {
      const recipe = await findViewableRecipe(input.recipeId!, userId).catch(() => {
        throw AppError.validation({ recipeId: ['That recipe was not found.'] });
      });
      return { ...base, recipeId: recipe.id, ...(input.portions != null ? { portions: input.portions } : { grams: input.grams ?? null }) };
    }
    case 'food': {
      const foods = await getUsableFoods([input.foodId!], userId);
      if (!foods.has(input.foodId!)) throw AppError.validation({ foodId: ['That food was not found.'] });
      return { ...base, foodId: input.foodId!, grams: input.grams ?? null };
    }
    case 'carb':
      return { ...base, carbGrams: input.carbGrams ?? null };
  }
}

async function findMeal(profileId: number, id: number) {
  const row = await PlanMealModel.findOne({ where: { id, profileId } });
  if (!row) throw AppError.notFound('planned meal');
  return row;
}

/** The next available portions of a batch after `first` (by position) that no meal not yet logged holds. */
async function freePortionsAfter(profileId: number, first: number, count: number): Promise<number[]> {
  const portion = (await PortionModel.findByPk(first))!;
  const free = await PortionModel.sequelize!.query<{ id: number }>(
    `SELECT p.id FROM portions p WHERE p.batch_id = :batchId AND p.profile_id = :profileId AND p.status = 'available' AND p.position > :position
       AND NOT EXISTS (SELECT 1 FROM plan_meals m WHERE m.portion_id = p.id
                       AND NOT EXISTS (SELECT 1 FROM log_entries e WHERE e.plan_meal_id = m.id AND e.deleted_at IS NULL))
     ORDER BY p.position LIMIT :count`,
    { replacements: { batchId: portion.batchId, profileId, position: portion.position, count }, type: QueryTypes.SELECT },
  );
  return free.map((r) => r.id);
}

/**
 * Plans a meal on a date, or on `repeatDays` days in a row (a batch portion: the batch's next portions not planned
 * yet, 400 when it has too few); returns the new ids (the week answer carries their numbers).
 */
export async function createPlanMeal(profileId: number, userId: number, input: PlanMealInput): Promise<{ ids: number[] }> {
  const values = await mealValues(profileId, userId, input);
  const extra = input.repeatDays - 1;
  const more = values.portionId && extra > 0 ? await freePortionsAfter(profileId, values.portionId, extra) : [];
  if (values.portionId && more.length < extra) {
    throw AppError.validation({ repeatDays: [`The batch has only ${more.length + 1} portions after this one that are not planned yet.`] });
  }
  const rows = Array.from({ length: input.repeatDays }, (_, i) => ({ ...values, date: addDaysIso(input.date, i), portionId: i === 0 ? values.portionId : (more[i - 1] ?? null) }));
  const created = await PlanMealModel.bulkCreate(rows);
  return { ids: created.map((r) => r.id) };
}

/** Replaces a planned meal. */
export async function updatePlanMeal(profileId: number, id: number, userId: number, input: PlanMealInput): Promise<{ id: number }> {
  const row = await findMeal(profileId, id);
  await row.update(await mealValues(profileId, userId, input));
  return { id: row.id };
}

/** Takes a meal off the plan (a log entry that fulfilled it keeps its numbers and loses the link). */
export async function deletePlanMeal(profileId: number, id: number): Promise<void> {
  await (await findMeal(profileId, id)).destroy();
}

/** Plans a cook (a recipe, a date or none yet, portions); a recipe the acting user cannot see is a 400. */
export async function savePlannedCook(profileId: number, userId: number, input: PlannedCookInput, id?: number): Promise<{ id: number }> {
  await findViewableRecipe(input.recipeId, userId).catch(() => {
    throw AppError.validation({ recipeId: ['That recipe was not found.'] });
  });
  const values = { recipeId: input.recipeId, cookOn: input.cookOn, portions: input.portions };
  if (id == null) return { id: (await PlannedCookModel.create({ profileId, ...values })).id };
  const row = await PlannedCookModel.findOne({ where: { id, profileId } });
  if (!row) throw AppError.notFound('planned cook');
  await row.update(values);
  return { id: row.id };
}

/** Removes a planned cook and the meals planned from its portions. */
export async function deletePlannedCook(profileId: number, id: number): Promise<void> {
  const row = await PlannedCookModel.findOne({ where: { id, profileId } });
  if (!row) throw AppError.notFound('planned cook');
  await row.destroy();
}

/**
 * Links a cooked batch to the planned cook it fulfils, inside the batch's transaction: the meals planned from the
 * cook get the new portions in date order, so they show the weighed carbohydrate (beside the planned value).
 */
export async function fillPlannedCook(profileId: number, plannedCookId: number, batchId: number, transaction: Transaction): Promise<void> {
  const cook = await PlannedCookModel.findOne({ where: { id: plannedCookId, profileId, batchId: null }, transaction });
  if (!cook) throw AppError.validation({ plannedCookId: ['That planned cook is not on this profile or is already cooked.'] });
  await cook.update({ batchId }, { transaction });
  const portions = await PortionModel.findAll({ where: { batchId }, order: [['position', 'ASC']], transaction });
  const meals = await PlanMealModel.findAll({ where: { plannedCookId, portionId: { [Op.is]: null } }, order: [['date', 'ASC'], ['minute', 'ASC'], ['id', 'ASC']], transaction });
  for (const [i, meal] of meals.entries()) {
    if (!portions[i]) break;
    await meal.update({ portionId: portions[i].id }, { transaction });
  }
}
