import { toLocalTime } from '../../shared/compute/local-time';
import { Op, QueryTypes } from 'sequelize';
import { carbUnderstated } from '../../shared/compute/batch';
import type { DayKindRatios } from '../../shared/compute/dose';
import {
  addDaysIso, dayKindFor, dayTotals, isoWeekday, mealCarbGrams, nextPlannedMeal, plannedMealDose, planWarnings, portionsUse, weekDates, weekTotals,
  type Holder, type MealAmount, type WarnMeal,
} from '../../shared/compute/plan';
import { batchContainsRice } from '../../shared/compute/use-by';
import { formatPortionCode } from '../../shared/compute/portion-code';
import { minutesToTime } from '../../shared/schemas/profile-settings';
import type { NextPlanMeal, PlanDay, PlanMealView, PlanWeek, PlannedCookView } from '../../shared/schemas/plan';
import { BatchIngredientModel, BatchModel, DayKindDayModel, DayKindModel, LogEntryModel, PlanMealModel, PlanMealNameModel, PlannedCookModel, PortionModel } from '../models';
import { withTimesOfDay } from './day-kinds.service';
import { loadDoseContext } from './dose-context.service';
import { getPlanSettings } from './plan-settings.service';
import { loadFoodRows, foodCarbPer100g, loadRecipeCarbs } from './plan-recipes';
import { carbOf } from './portions.service';

const fmt = (n: number) => String(Math.round(n * 10) / 10);

/** The week holding `date` (default: today in the profile's time zone) with every number the plan shows. */
export async function getPlanWeek(profileId: number, date: string | undefined, nowMs: number): Promise<PlanWeek> {
  const { profile, settings } = await loadDoseContext(profileId);
  const plan = await getPlanSettings(profileId);
  const today = toLocalTime(nowMs, profile.timeZone).localDate;
  const dates = weekDates(date ?? today, plan.weekStart);
  const [from, to] = [dates[0], dates[6]];
  const basis = profile.carbBasis;
  const unit = profile.carbUnit;

  const [kinds, setDays, mealRows, names, cookRows] = await Promise.all([
    DayKindModel.findAll({ where: { profileId }, ...withTimesOfDay }),
    DayKindDayModel.findAll({ where: { profileId, date: { [Op.between]: [from, to] } } }),
    PlanMealModel.findAll({ where: { profileId, date: { [Op.between]: [from, to] } }, order: [['date', 'ASC'], ['minute', 'ASC'], ['id', 'ASC']] }),
    PlanMealNameModel.findAll({ where: { profileId } }),
    PlannedCookModel.findAll({ where: { profileId, [Op.or]: [{ cookOn: { [Op.between]: [from, to] } }, { cookOn: null }] }, order: [['cookOn', 'ASC'], ['id', 'ASC']] }),
  ]);
  const ratios = new Map<number, DayKindRatios & { longActingUnits: number | null }>(
    kinds.map((k) => [k.id, { id: k.id, name: k.name, longActingUnits: k.longActingUnits, timesOfDay: (k.timesOfDay ?? []).map((b) => ({ startMinute: b.startMinute, endMinute: b.endMinute, carbRatio: b.carbRatio, correctionFactorMmol: b.correctionFactorMmol })) }]),
  );
  const defaultId = kinds.find((k) => k.isDefault)?.id ?? null;
  const setForDate = new Map(setDays.map((d) => [d.date, d.dayKindId]));
  const pattern = new Map(plan.pattern.filter((p) => p.dayKindId != null).map((p) => [p.weekday, p.dayKindId!]));
  const nameById = new Map(names.map((n) => [n.id, n.name]));

  // Planned cooks the meals use but that are cooked (or planned) outside this week.
  const extraCookIds = mealRows.map((m) => m.plannedCookId).filter((id): id is number => id != null && !cookRows.some((c) => c.id === id));
  const cooks = extraCookIds.length ? [...cookRows, ...(await PlannedCookModel.findAll({ where: { profileId, id: { [Op.in]: extraCookIds } } }))] : cookRows;
  const cookById = new Map(cooks.map((c) => [c.id, c]));

  const portionIds = mealRows.map((m) => m.portionId).filter((id): id is number => id != null);
  const portions = portionIds.length ? await PortionModel.findAll({ where: { id: { [Op.in]: portionIds } }, include: [{ model: BatchModel, as: 'batch' }] }) : [];
  const portionById = new Map(portions.map((p) => [p.id, p]));
  const batchIds = [...new Set(portions.map((p) => p.batchId))];
  const [riceLines, available] = batchIds.length
    ? await Promise.all([
        BatchIngredientModel.findAll({ where: { batchId: { [Op.in]: batchIds } }, attributes: ['batchId', 'foodName', 'omitted'] }),
        PortionModel.sequelize!.query<{ batch_id: number; n: string }>(
          "SELECT batch_id, count(*) AS n FROM portions WHERE batch_id IN (:batchIds) AND status = 'available' GROUP BY batch_id",
          { replacements: { batchIds }, type: QueryTypes.SELECT },
        ),
      ])
    : [[], []];
  const recipes = await loadRecipeCarbs([...mealRows.map((m) => m.recipeId), ...cooks.map((c) => c.recipeId)].filter((id): id is number => id != null), basis);
  const foods = await loadFoodRows(mealRows.map((m) => m.foodId).filter((id): id is number => id != null));
  const logged = mealRows.length
    ? await LogEntryModel.findAll({ where: { planMealId: { [Op.in]: mealRows.map((m) => m.id) }, deletedAt: null }, order: [['occurredAt', 'ASC']] })
    : [];
  const loggedBy = new Map(logged.map((e) => [e.planMealId!, e]));

  const warnMeals: WarnMeal[] = [];
  const views: PlanMealView[] = mealRows.map((m) => {
    const portion = m.portionId ? portionById.get(m.portionId) : undefined;
    const batch = portion?.batch;
    const cook = m.plannedCookId ? cookById.get(m.plannedCookId) : undefined;
    const recipe = recipes.get(m.recipeId ?? cook?.recipeId ?? 0);
    const food = m.foodId ? foods.get(m.foodId) : undefined;
    let amount: MealAmount;
    let title: string;
    let detail: string;
    if (portion && batch) {
      const understated = carbUnderstated(batch.totals, batch.incomplete, basis);
      amount = { kind: 'portion', carbGrams: understated ? null : basis === 'available' ? portion.carbAvailable : portion.carbTotal };
      title = batch.recipeTitle;
      detail = `portion ${formatPortionCode(portion.code)}${batch.storage === 'freezer' ? ' (freezer)' : ''}`;
    } else if (cook) {
      amount = { kind: 'portions', carbPerPortion: recipe?.carbPerPortion ?? null, portions: 1 };
      title = recipe?.title ?? 'Planned cook';
      detail = cook.cookOn ? `from the cook on ${cook.cookOn}` : 'from a planned cook with no date yet';
    } else if (m.source === 'recipe') {
      amount = m.portions != null ? { kind: 'portions', carbPerPortion: recipe?.carbPerPortion ?? null, portions: m.portions } : { kind: 'grams', carbPer100g: recipe?.carbPer100g ?? null, grams: m.grams ?? 0 };
      title = recipe?.title ?? 'Recipe';
      detail = m.portions != null ? `${fmt(m.portions)} ${m.portions === 1 ? 'portion' : 'portions'}` : `${fmt(m.grams ?? 0)} g`;
    } else if (m.source === 'food') {
      amount = { kind: 'grams', carbPer100g: food ? foodCarbPer100g(food, basis) : null, grams: m.grams ?? 0 };
      title = food?.name ?? 'Food';
      detail = `${fmt(m.grams ?? 0)} g`;
    } else {
      amount = m.source === 'carb' ? { kind: 'plain', carbGrams: m.carbGrams ?? 0 } : { kind: 'portion', carbGrams: null };
      title = m.note ?? (m.source === 'carb' ? 'Carbohydrate' : 'Portion no longer kept');
      detail = m.source === 'carb' ? 'typed amount' : 'the portion was removed';
    }
    const carbGrams = mealCarbGrams(amount);
    const kind = dayKindFor(m.date, setForDate, pattern, defaultId);
    const dose = plannedMealDose(carbGrams, kind.dayKindId ? ratios.get(kind.dayKindId) ?? null : null, m.minute, settings);
    const entry = loggedBy.get(m.id);
    const mealName = (m.mealNameId && nameById.get(m.mealNameId)) || 'Meal';
    warnMeals.push({
      id: m.id,
      date: m.date,
      title: `${mealName} (${title})`,
      logged: !!entry,
      doseStatus: dose.status,
      thawOn: m.thawOn,
      portion: portion && batch ? { id: portion.id, batchId: batch.id, keeping: { kind: 'batch', storage: batch.storage, useBy: batch.useBy, region: batch.foodSafetyRegion, containsRice: batchContainsRice(riceLines.filter((l) => l.batchId === batch.id)) } } : null,
      plannedCook: cook && !portion ? { id: cook.id, cookOn: cook.cookOn } : null,
    });
    return {
      id: m.id,
      date: m.date,
      mealNameId: m.mealNameId,
      mealName,
      time: minutesToTime(m.minute),
      source: m.source,
      title,
      detail,
      portionId: m.portionId,
      portionCode: portion?.code ?? null,
      batchId: batch?.id ?? null,
      plannedCookId: m.plannedCookId,
      recipeId: m.recipeId ?? cook?.recipeId ?? null,
      foodId: m.foodId,
      grams: m.grams,
      portions: m.portions,
      thawOn: m.thawOn,
      carb: carbOf(carbGrams, unit),
      plannedCarb: cook && portion ? carbOf(recipe?.carbPerPortion ?? null, unit) : null,
      dose,
      logged: entry ? { entryId: entry.id, occurredAt: entry.occurredAt.toISOString(), carbGrams: basis === 'available' ? entry.carbAvailableG : entry.carbTotalG } : null,
    };
  });

  const days: PlanDay[] = dates.map((d) => {
    const kind = dayKindFor(d, setForDate, pattern, defaultId);
    const ratio = kind.dayKindId ? ratios.get(kind.dayKindId) : undefined;
    const meals = views.filter((v) => v.date === d);
    return {
      date: d,
      weekday: isoWeekday(d),
      dayKind: ratio && kind.from ? { id: ratio.id, name: ratio.name, from: kind.from } : null,
      meals,
      totals: dayTotals(meals.map((m) => ({ carbGrams: m.carb.grams, doseUnits: m.dose.status === 'ok' ? m.dose.units : null })), ratio?.longActingUnits ?? null),
    };
  });

  const availableBy = new Map(available.map((a) => [a.batch_id, Number(a.n)]));
  const holders: Holder[] = [
    ...batchIds.map((id) => ({ batchId: id, plannedCookId: null, title: portions.find((p) => p.batchId === id)!.batch!.recipeTitle, holds: availableBy.get(id) ?? 0 })),
    ...cooks.filter((c) => !c.batchId).map((c) => ({ batchId: null, plannedCookId: c.id, title: recipes.get(c.recipeId)?.title ?? 'Planned cook', holds: c.portions })),
  ];
  const use = portionsUse(holders, warnMeals);
  const cookViews: PlannedCookView[] = cooks.map((c) => ({
    id: c.id,
    recipeId: c.recipeId,
    recipeTitle: recipes.get(c.recipeId)?.title ?? 'Recipe',
    cookOn: c.cookOn,
    portions: c.portions,
    placed: mealRows.filter((m) => m.plannedCookId === c.id).length,
    batchId: c.batchId,
    carbPerPortion: carbOf(recipes.get(c.recipeId)?.carbPerPortion ?? null, unit),
  }));
  return {
    weekStart: from,
    today,
    timeZone: profile.timeZone,
    basis,
    unit,
    doseReady: settings != null,
    days,
    cooks: cookViews,
    use,
    totals: weekTotals(days.map((d) => d.totals)),
    warnings: planWarnings(warnMeals, holders, cookViews.filter((c) => !c.batchId).map((c) => ({ id: c.id, title: c.recipeTitle, cookOn: c.cookOn }))),
  };
}

/** The next planned meal not yet logged, from today on (this week and the next), for the logging flow to offer first. */
export async function getNextPlanMeal(profileId: number, nowMs: number): Promise<NextPlanMeal> {
  const week = await getPlanWeek(profileId, undefined, nowMs);
  const days = [...week.days];
  const later = await getPlanWeek(profileId, addDaysIso(days[6].date, 1), nowMs);
  days.push(...later.days);
  const meals = days.flatMap((d) => d.meals.map((m) => ({ ...m, minute: Number(m.time.slice(0, 2)) * 60 + Number(m.time.slice(3)), logged: m.logged != null, view: m })));
  const next = nextPlannedMeal(meals, week.today);
  return { meal: next?.view ?? null, dayKind: next ? days.find((d) => d.date === next.date)!.dayKind : null };
}

