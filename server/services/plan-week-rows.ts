import { Op, QueryTypes } from 'sequelize';
import type { DayKindRatios, DoseSettings } from '../../shared/compute/dose';
import type { Nutrients } from '../../shared/compute/nutrients';
import type { PlanMealSource } from '../../shared/schemas/plan';
import type { CarbBasis, CarbUnit } from '../../shared/schemas/units';
import { remember } from '../lib/request-cache';
import { AppError } from '../errors';
import { DayKindDayModel, PlanMealModel, ProfileSettingsModel } from '../models';
import { toDoseSettings } from './dose-context.service';
import { timesOfDayJson } from './day-kinds.service';
import { loadRecipeRows } from './plan-recipes';

export type WeekKind = DayKindRatios & { isDefault: boolean; longActingUnits: number | null };

/** What the week needs of the profile, whatever the week: units, time zone, dose settings, plan settings, kinds of day. */
export type WeekContext = {
  timeZone: string;
  carbBasis: CarbBasis;
  carbUnit: CarbUnit;
  weekStart: number;
  pattern: { weekday: number; dayKindId: number }[];
  mealNames: Record<string, string>;
  kinds: WeekKind[];
  settings: DoseSettings | null;
};

/** One planned meal with what it holds joined in: its portion and batch, its food, the log entry that fulfils it. */
export type WeekMealRow = {
  id: number;
  date: string;
  minute: number;
  mealNameId: number | null;
  source: PlanMealSource;
  portionId: number | null;
  plannedCookId: number | null;
  recipeId: number | null;
  foodId: number | null;
  grams: number | null;
  portions: number | null;
  carbGrams: number | null;
  thawOn: string | null;
  note: string | null;
  portionCode: string | null;
  portionCarbAvailable: number | null;
  portionCarbTotal: number | null;
  batchId: number | null;
  batchTitle: string | null;
  storage: 'fridge' | 'freezer' | null;
  useBy: string | null;
  region: 'uk' | 'us' | null;
  totals: Nutrients | null;
  incomplete: string[] | null;
  /** The batch's ingredient names (for the rice rule) and how many of its portions are not eaten yet. */
  batchLines: { foodName: string; omitted: boolean }[] | null;
  batchAvailable: number | null;
  food: (Pick<Nutrients, 'carbAvailable' | 'carbTotal' | 'fibre'> & { name: string }) | null;
  entryId: number | null;
  entryAt: Date | null;
  entryCarbAvailable: number | null;
  entryCarbTotal: number | null;
};

export type WeekCookRow = { id: number; recipeId: number; cookOn: string | null; portions: number; batchId: number | null };

/** The profile's week context in one statement (plus the dose settings beside it), read once per request. */
export function loadWeekContext(profileId: number): Promise<WeekContext> {
  return remember(`plan-week-context:${profileId}`, async () => {
    const [[row], settings] = await Promise.all([
      PlanMealModel.sequelize!.query<Omit<WeekContext, 'settings'>>(
        `SELECT p.time_zone AS "timeZone", p.carb_basis AS "carbBasis", p.carb_unit AS "carbUnit",
           COALESCE((SELECT s.week_start FROM plan_settings s WHERE s.profile_id = p.id), 1) AS "weekStart",
           COALESCE((SELECT json_agg(json_build_object('weekday', w.weekday, 'dayKindId', w.day_kind_id)) FROM plan_weekdays w WHERE w.profile_id = p.id), '[]') AS pattern,
           COALESCE((SELECT json_object_agg(n.id, n.name) FROM plan_meal_names n WHERE n.profile_id = p.id), '{}') AS "mealNames",
           COALESCE((SELECT json_agg(json_build_object('id', k.id, 'name', k.name, 'isDefault', k.is_default, 'longActingUnits', k.long_acting_units,
               'timesOfDay', ${timesOfDayJson('k')}) ORDER BY k.id)
             FROM day_kinds k WHERE k.profile_id = p.id), '[]') AS kinds
         FROM profiles p WHERE p.id = :profileId`,
        { replacements: { profileId }, type: QueryTypes.SELECT },
      ),
      ProfileSettingsModel.findByPk(profileId, { raw: true }),
    ]);
    if (!row) throw AppError.notFound('profile');
    return { ...row, settings: settings && toDoseSettings(settings) };
  });
}

/**
 * Everything dated from `from` to `to` (a window around the week, read before the week start is known), in four
 * statements sent together: the dates set to a kind of day, the planned meals joined with what they hold, the planned
 * cooks (dated in the window, with no date, or used by its meals), and the recipes of those meals and cooks.
 */
export async function loadWeekRows(profileId: number, from: string, to: string) {
  const sequelize = PlanMealModel.sequelize!;
  const replacements = { profileId, from, to };
  const cookWhere = `c.profile_id = :profileId AND (c.cook_on BETWEEN :from AND :to OR c.cook_on IS NULL
    OR c.id IN (SELECT m.planned_cook_id FROM plan_meals m WHERE m.profile_id = :profileId AND m.date BETWEEN :from AND :to))`;
  const [setDays, meals, cooks, recipes] = await Promise.all([
    DayKindDayModel.findAll({ where: { profileId, date: { [Op.between]: [from, to] } }, attributes: ['date', 'dayKindId'], raw: true }),
    sequelize.query<WeekMealRow>(
      `SELECT m.id, m.date, m.minute, m.meal_name_id AS "mealNameId", m.source, m.portion_id AS "portionId", m.planned_cook_id AS "plannedCookId",
         m.recipe_id AS "recipeId", m.food_id AS "foodId", m.grams, m.portions, m.carb_grams AS "carbGrams", m.thaw_on AS "thawOn", m.note,
         p.code AS "portionCode", p.carb_available AS "portionCarbAvailable", p.carb_total AS "portionCarbTotal",
         b.id AS "batchId", b.recipe_title AS "batchTitle", b.storage, b.use_by AS "useBy", b.food_safety_region AS region, b.totals, b.incomplete,
         CASE WHEN b.id IS NULL THEN NULL ELSE COALESCE((SELECT json_agg(json_build_object('foodName', bi.food_name, 'omitted', bi.omitted))
           FROM batch_ingredients bi WHERE bi.batch_id = b.id), '[]') END AS "batchLines",
         CASE WHEN b.id IS NULL THEN NULL ELSE (SELECT count(*)::int FROM portions a WHERE a.batch_id = b.id AND a.status = 'available') END AS "batchAvailable",
         CASE WHEN f.id IS NULL THEN NULL ELSE json_build_object('name', f.name, 'carbAvailable', f.carb_available, 'carbTotal', f.carb_total, 'fibre', f.fibre) END AS food,
         e.id AS "entryId", e.occurred_at AS "entryAt", e.carb_available_g AS "entryCarbAvailable", e.carb_total_g AS "entryCarbTotal"
       FROM plan_meals m
       LEFT JOIN portions p ON p.id = m.portion_id
       LEFT JOIN batches b ON b.id = p.batch_id
       LEFT JOIN foods f ON f.id = m.food_id
       LEFT JOIN LATERAL (SELECT l.id, l.occurred_at, l.carb_available_g, l.carb_total_g FROM log_entries l
         WHERE l.plan_meal_id = m.id AND l.deleted_at IS NULL ORDER BY l.occurred_at DESC LIMIT 1) e ON true
       WHERE m.profile_id = :profileId AND m.date BETWEEN :from AND :to
       ORDER BY m.date, m.minute, m.id`,
      { replacements, type: QueryTypes.SELECT },
    ),
    sequelize.query<WeekCookRow>(
      `SELECT c.id, c.recipe_id AS "recipeId", c.cook_on AS "cookOn", c.portions, c.batch_id AS "batchId" FROM planned_cooks c
       WHERE ${cookWhere} ORDER BY c.cook_on, c.id`,
      { replacements, type: QueryTypes.SELECT },
    ),
    loadRecipeRows(
      `r.id IN (SELECT m.recipe_id FROM plan_meals m WHERE m.profile_id = :profileId AND m.date BETWEEN :from AND :to AND m.recipe_id IS NOT NULL
         UNION SELECT c.recipe_id FROM planned_cooks c WHERE ${cookWhere})`,
      replacements,
    ),
  ]);
  return { setDays: setDays as { date: string; dayKindId: number }[], meals, cooks, recipes };
}
