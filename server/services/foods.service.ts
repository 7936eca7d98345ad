import { literal, Op } from 'sequelize';
import type { Transaction, WhereOptions } from 'sequelize';
import type { Food, FoodSummary } from '../../shared/schemas/food';
import { carbToShow } from '../../shared/compute/nutrients';
import { AppError } from '../errors';
import { FoodModel } from '../models';

/** Maps a food row to the API shape, without measures. */
export function toFoodSummary(f: FoodModel): FoodSummary {
  return {
    id: f.id,
    name: f.name,
    source: f.source,
    sourceCode: f.sourceCode,
    group: f.foodGroup,
    altNames: f.altNames ?? [],
    per100g: {
      energyKcal: f.energyKcal,
      energyKj: f.energyKj,
      carbAvailable: f.carbAvailable,
      carbTotal: f.carbTotal,
      fibre: f.fibre,
      sugars: f.sugars,
      protein: f.protein,
      fat: f.fat,
      water: f.water,
    },
    carbMeasured: f.carbMeasured,
    carbNote: f.carbNote ?? null,
    derived: f.derived ?? [],
    attribution: f.attribution,
    licence: f.licence,
    ownerUserId: f.ownerUserId ?? null,
    sharedProfileId: f.sharedProfileId ?? null,
    labelConvention: f.labelConvention ?? null,
    hasPhoto: Boolean(f.photoPath),
    scientificName: f.extra?.scientificName ?? null,
    ndbNumber: f.extra?.ndbNumber ?? null,
    brand: f.extra?.brand ?? null,
    branded: Boolean(f.extra?.branded),
    fibreNotMeasured: carbToShow(f, 'available').fibreNotMeasured,
    carbStarchSugars: f.extra?.carbStarchSugars ?? null,
  };
}

/** Maps a food model with its measures loaded to the API shape. */
export function toFood(f: FoodModel): Food {
  const measures = [...(f.measures ?? [])].sort((a, b) => a.seq - b.seq).map((m) => ({ label: m.label, grams: m.grams }));
  return { ...toFoodSummary(f), measures };
}

// Measures as one JSON array per food, in their order, so foods and measures come back in one plain query.
const MEASURES_JSON = `COALESCE((SELECT json_agg(json_build_object('label', m.label, 'grams', m.grams) ORDER BY m.seq, m.id)
  FROM food_measures m WHERE m.food_id = "FoodModel"."id"), '[]'::json)`;

/**
 * Foods by id as plain objects (no model instances: the recipe shelf reads hundreds), with their measures unless
 * `measures: false`; `userId` applies the visibility rule. Ids that are absent (or not visible) are left out.
 * `inRecipe` reads every food a recipe's lines name instead of the ids (so they load beside the lines, not after).
 */
export async function loadFoods(
  ids: number[],
  opts: { userId?: number; measures?: boolean; transaction?: Transaction; inRecipe?: number } = {},
): Promise<Map<number, Food>> {
  const unique = [...new Set(ids)].filter((id) => Number.isInteger(id) && id > 0);
  if (!unique.length && opts.inRecipe === undefined) return new Map();
  const byId: WhereOptions<FoodModel> =
    opts.inRecipe === undefined
      ? { id: { [Op.in]: unique } }
      : { id: { [Op.in]: literal(`(SELECT food_id FROM recipe_ingredients WHERE recipe_id = ${Math.trunc(Number(opts.inRecipe))})`) } };
  const where: WhereOptions<FoodModel> = opts.userId === undefined ? byId : { [Op.and]: [byId, visibleWhere(opts.userId)] };
  const rows = (await FoodModel.findAll({
    where,
    attributes: opts.measures === false ? undefined : { include: [[literal(MEASURES_JSON), 'measuresJson']] },
    raw: true,
    transaction: opts.transaction,
  })) as unknown as (FoodModel & { measuresJson?: Food['measures'] })[];
  return new Map(rows.map((r) => [r.id, { ...toFoodSummary(r), measures: r.measuresJson ?? [] }]));
}

/**
 * The one visibility rule for foods: every table food; a pack food to the person who typed it and to the care team
 * (owner and carers; not clinicians) of the profile it is shared with. `userId` must be a bound parameter or an integer.
 */
export function visibleFoodSql(alias: string, userId: string): string {
  return `(${alias}.owner_user_id IS NULL OR ${alias}.owner_user_id = ${userId}
    OR ${alias}.shared_profile_id IN (SELECT pa.profile_id FROM profile_access pa WHERE pa.user_id = ${userId} AND pa.role IN ('owner', 'carer')))`;
}

/** The visibility rule as a Sequelize condition on FoodModel. */
function visibleWhere(userId: number): WhereOptions<FoodModel> {
  return literal(visibleFoodSql('"FoodModel"', String(Math.trunc(Number(userId)))));
}

/**
 * Foods a user may use in a recipe, keyed by id: every table food, and pack foods they own or that are
 * shared with a profile they have access to. Ids the user may not use (or that do not exist) are absent.
 */
export async function getUsableFoods(ids: number[], userId: number): Promise<Map<number, Food>> {
  return loadFoods(ids, { userId });
}

/** One food with its measures, or 404 when it does not exist or the user may not see it. */
export async function getFood(id: number, userId: number): Promise<Food> {
  const food = (await getUsableFoods([id], userId)).get(id);
  if (!food) throw AppError.notFound('food');
  return food;
}

/** The stored photo path of a pack food the user may see, or 404. */
export async function getFoodPhotoPath(id: number, userId: number): Promise<string> {
  const row = await FoodModel.findOne({ where: { [Op.and]: [{ id }, visibleWhere(userId)] }, attributes: ['photoPath'] });
  if (!row?.photoPath) throw AppError.notFound('photo');
  return row.photoPath;
}

