import { toLocalTime } from '../../shared/compute/local-time';
import { carbUnderstated } from '../../shared/compute/batch';
import { carbInBasis } from '../../shared/compute/nutrients';
import {
  addDaysIso, dayKindFor, dayTotals, isoWeekday, mealCarbGrams, nextPlannedMeal, plannedMealDose, planWarnings, portionsUse, weekDates, weekTotals,
  type Holder, type MealAmount, type WarnMeal,
} from '../../shared/compute/plan';
import { batchContainsRice } from '../../shared/compute/use-by';
import { formatPortionCode } from '../../shared/compute/portion-code';
import { minutesToTime } from '../../shared/schemas/profile-settings';
import type { NextPlanMeal, PlanDay, PlanMealView, PlanWeek, PlannedCookView } from '../../shared/schemas/plan';
import { recipeCarbs } from './plan-recipes';
import { loadWeekContext, loadWeekRows } from './plan-week-rows';
import { carbOf } from './portions.service';

const fmt = (n: number) => String(Math.round(n * 10) / 10);

/** The week holding `date` (default: today in the profile's time zone) with every number the plan shows. */
export async function getPlanWeek(profileId: number, date: string | undefined, nowMs: number): Promise<PlanWeek> {
  // The week lies within 7 days of `date`, and today in any time zone within a day of today in UTC: one window
  // around it lets the rows be read together with the context, before the week start and time zone are known.
  const around = date ?? new Date(nowMs).toISOString().slice(0, 10);
  const [context, rows] = await Promise.all([loadWeekContext(profileId), loadWeekRows(profileId, addDaysIso(around, -7), addDaysIso(around, 7))]);
  const { settings, carbBasis: basis, carbUnit: unit } = context;
  const today = toLocalTime(nowMs, context.timeZone).localDate;
  const dates = weekDates(date ?? today, context.weekStart);
  const [from, to] = [dates[0], dates[6]];
  const { setDays } = rows;
  const mealRows = rows.meals.filter((m) => m.date >= from && m.date <= to);
  const used = new Set(mealRows.map((m) => m.plannedCookId));
  const cooks = rows.cooks.filter((c) => c.cookOn == null || (c.cookOn >= from && c.cookOn <= to) || used.has(c.id));
  const recipes = recipeCarbs(rows.recipes, basis);

  const ratios = new Map(context.kinds.map((k) => [k.id, k]));
  const defaultId = context.kinds.find((k) => k.isDefault)?.id ?? null;
  const setForDate = new Map(setDays.map((d) => [d.date, d.dayKindId]));
  const pattern = new Map(context.pattern.map((p) => [p.weekday, p.dayKindId]));
  const cookById = new Map(cooks.map((c) => [c.id, c]));
  const batches = new Map(mealRows.filter((m) => m.batchId != null).map((m) => [m.batchId!, m]));

  const warnMeals: WarnMeal[] = [];
  const views: PlanMealView[] = mealRows.map((m) => {
    const batch = m.batchId != null ? m : undefined;
    const cook = m.plannedCookId ? cookById.get(m.plannedCookId) : undefined;
    const recipe = recipes.get(m.recipeId ?? cook?.recipeId ?? 0);
    const food = m.food;
    let amount: MealAmount;
    let title: string;
    let detail: string;
    if (batch) {
      const understated = carbUnderstated(batch.totals!, batch.incomplete ?? [], basis);
      amount = { kind: 'portion', carbGrams: understated ? null : basis === 'available' ? batch.portionCarbAvailable : batch.portionCarbTotal };
      title = batch.batchTitle!;
      detail = `portion ${formatPortionCode(batch.portionCode!)}${batch.storage === 'freezer' ? ' (freezer)' : ''}`;
    } else if (cook) {
      amount = { kind: 'portions', carbPerPortion: recipe?.carbPerPortion ?? null, portions: 1 };
      title = recipe?.title ?? 'Planned cook';
      detail = cook.cookOn ? `from the cook on ${cook.cookOn}` : 'from a planned cook with no date yet';
    } else if (m.source === 'recipe') {
      amount = m.portions != null ? { kind: 'portions', carbPerPortion: recipe?.carbPerPortion ?? null, portions: m.portions } : { kind: 'grams', carbPer100g: recipe?.carbPer100g ?? null, grams: m.grams ?? 0 };
      title = recipe?.title ?? 'Recipe';
      detail = m.portions != null ? `${fmt(m.portions)} ${m.portions === 1 ? 'portion' : 'portions'}` : `${fmt(m.grams ?? 0)} g`;
    } else if (m.source === 'food') {
      amount = { kind: 'grams', carbPer100g: food ? carbInBasis(food, basis) : null, grams: m.grams ?? 0 };
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
        const mealName = (m.mealNameId && context.mealNames[m.mealNameId]) || 'Meal';
    warnMeals.push({
      id: m.id,
      date: m.date,
      title: `${mealName} (${title})`,
      logged: m.entryId != null,
      doseStatus: dose.status,
      thawOn: m.thawOn,
      portion: batch ? { id: m.portionId!, batchId: m.batchId!, keeping: { kind: 'batch', storage: batch.storage!, useBy: batch.useBy!, region: batch.region!, containsRice: batchContainsRice(batch.batchLines ?? []) } } : null,
      plannedCook: cook && !batch ? { id: cook.id, cookOn: cook.cookOn } : null,
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
      portionCode: m.portionCode,
      batchId: m.batchId,
      plannedCookId: m.plannedCookId,
      recipeId: m.recipeId ?? cook?.recipeId ?? null,
      foodId: m.foodId,
      grams: m.grams,
      portions: m.portions,
      thawOn: m.thawOn,
      carb: carbOf(carbGrams, unit),
      plannedCarb: cook && batch ? carbOf(recipe?.carbPerPortion ?? null, unit) : null,
      dose,
      logged: m.entryId != null ? { entryId: m.entryId, occurredAt: new Date(m.entryAt!).toISOString(), carbGrams: basis === 'available' ? m.entryCarbAvailable : m.entryCarbTotal } : null,
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

  const holders: Holder[] = [
    ...[...batches.values()].map((b) => ({ batchId: b.batchId!, plannedCookId: null, title: b.batchTitle!, holds: b.batchAvailable ?? 0 })),
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
    timeZone: context.timeZone,
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

