import { randomInt } from 'node:crypto';
import { literal, Op, QueryTypes, UniqueConstraintError } from 'sequelize';
import { carbUnderstated, computeBatch, gramsLeftToSplit, netGrams, splitBatch, weighingDifference, yieldFactor } from '../../shared/compute/batch';
import { carbInBasis, type Nutrients } from '../../shared/compute/nutrients';
import { generatePortionCode } from '../../shared/compute/portion-code';
import { batchContainsRice, defaultUseBy } from '../../shared/compute/use-by';
import type { BatchDetail, BatchIngredient, BatchSummary, CreateBatchParsed, UpdateBatchInput } from '../../shared/schemas/batch';
import type { Food } from '../../shared/schemas/food';
import type { PortionStatus } from '../../shared/schemas/portion';
import type { CarbBasis, CarbUnit } from '../../shared/schemas/units';
import { AppError, type FieldErrors } from '../errors';
import { currentTransaction } from '../lib/transaction-context';
import { together } from '../lib/together';
import { BatchIngredientModel, BatchModel, FoodModel, PortionModel, RecipeIngredientModel, UserModel } from '../models';
import { loadFoods, toFood } from './foods.service';
import { fillPlannedCook } from './plan.service';
import { carbOf, toPortion } from './portions.service';
import { profileUnits } from './profiles.service';
import { findViewableRecipeRow } from './recipes.service';

type Units = { basis: CarbBasis; unit: CarbUnit };

const noContainer = { containerId: null, containerName: null, grossGrams: null, tareGrams: null };

/** The carbohydrate basis and unit of a profile (404 when it does not exist). */
async function unitsOf(profileId: number): Promise<Units> {
  const p = await profileUnits(profileId);
  return { basis: p.carbBasis, unit: p.carbUnit };
}

/** `count` distinct new portion codes, not yet checked against the table. */
function newCodes(count: number): string[] {
  const codes = new Set<string>();
  while (codes.size < count) codes.add(generatePortionCode(randomInt));
  return [...codes];
}

/** New portion codes that are not in use yet (checked against the table; the unique index is the last word). */
async function freshCodes(count: number): Promise<string[]> {
  const sequelize = PortionModel.sequelize!;
  const codes = new Set<string>();
  while (codes.size < count) {
    const wanted = newCodes(count - codes.size).filter((code) => !codes.has(code));
    const taken = await sequelize.query<{ code: string }>('SELECT code FROM portions WHERE code IN (:wanted)', { replacements: { wanted }, type: QueryTypes.SELECT });
    const takenSet = new Set(taken.map((p) => p.code));
    for (const code of wanted) if (!takenSet.has(code)) codes.add(code);
  }
  return [...codes];
}

/** How many times a save outside a transaction draws new codes after the unique index refused one (with 80,000 of 148 million codes in use, about 1 eight-portion save in 230). */
const CODE_ATTEMPTS = 5;

const codeTaken = (err: unknown) => err instanceof UniqueConstraintError && Object.keys(err.fields ?? {}).includes('code');

function batchNumbers(batch: BatchModel, units: Units) {
  const understated = carbUnderstated(batch.totals, batch.incomplete, units.basis);
  const carbTotal = understated ? null : carbInBasis(batch.totals, units.basis);
  const carbPer100g = understated ? null : carbInBasis(batch.per100g, units.basis);
  return { carbTotal: carbOf(carbTotal, units.unit), carbPer100g: carbOf(carbPer100g, units.unit) };
}

function toSummary(batch: BatchModel, portions: PortionModel[], units: Units): BatchSummary {
  const counts = { available: 0, eaten: 0, discarded: 0 };
  for (const p of portions) counts[p.status as PortionStatus] += 1;
  return {
    id: batch.id,
    profileId: batch.profileId,
    recipeId: batch.recipeId,
    recipeTitle: batch.recipeTitle,
    cookedOn: batch.cookedOn,
    storage: batch.storage,
    useBy: batch.useBy,
    useBySource: batch.useBySource,
    cookedGrams: batch.cookedGrams,
    basis: units.basis,
    unit: units.unit,
    carbPer100g: batchNumbers(batch, units).carbPer100g,
    counts,
    portions: portions.map((p) => toPortion(p, units, carbUnderstated(batch.totals, batch.incomplete, units.basis))),
  };
}

function toIngredient(line: BatchIngredientModel, units: Units): BatchIngredient {
  const used = !line.omitted && line.actualGrams != null;
  const carb = used ? carbInBasis(line.per100g, units.basis) : null;
  return {
    position: line.position,
    foodId: line.foodId,
    foodName: line.foodName,
    foodSource: line.foodSource,
    per100g: line.per100g,
    plannedGrams: line.plannedGrams,
    actualGrams: line.actualGrams,
    differenceGrams: line.actualGrams == null ? null : weighingDifference(line.plannedGrams, line.actualGrams),
    omitted: line.omitted,
    swappedFrom: line.swappedFromName ? { foodId: line.swappedFromFoodId, foodName: line.swappedFromName } : null,
    carb: used ? carbOf(carb == null ? null : (carb * line.actualGrams!) / 100, units.unit) : carbOf(0, units.unit),
  };
}

/** A batch page for anyone with access to its profile (the route checks access), or 404. */
export async function getBatch(profileId: number, id: number): Promise<BatchDetail> {
  // Four plain reads at once instead of one join of ingredients × portions hydrated into models.
  const [batch, ingredients, portions, units] = await Promise.all([
    BatchModel.findOne({ where: { id, profileId }, include: [{ model: UserModel, as: 'cookedBy', attributes: ['id', 'displayName'] }], raw: true, nest: true }),
    BatchIngredientModel.findAll({ where: { batchId: id }, order: [['position', 'ASC']], raw: true }),
    PortionModel.findAll({ where: { batchId: id, profileId }, order: [['position', 'ASC']], raw: true }),
    unitsOf(profileId),
  ]);
  if (!batch) throw AppError.notFound('batch');
  return toDetail(batch, ingredients, portions, units);
}

/** A batch row (with `cookedBy` as id and name), its lines and its portions, in position order, as the batch page answers them. */
function toDetail(batch: BatchModel, ingredients: BatchIngredientModel[], portions: PortionModel[], units: Units): BatchDetail {
  return {
    ...toSummary(batch, portions, units),
    scaleFactor: batch.scaleFactor,
    useByNote: batch.useByNote,
    cookedBy: batch.cookedBy?.id ? { id: batch.cookedBy.id, displayName: batch.cookedBy.displayName } : null,
    rawGrams: batch.rawGrams,
    cookedGrossGrams: batch.cookedGrossGrams,
    potTareGrams: batch.potTareGrams,
    potName: batch.potName,
    yieldFactor: yieldFactor(batch.cookedGrams, batch.rawGrams),
    splitMode: batch.splitMode,
    gramsLeft: gramsLeftToSplit(batch.cookedGrams, portions.map((p) => p.netGrams)),
    carbTotal: batchNumbers(batch, units).carbTotal,
    totals: batch.totals,
    per100g: batch.per100g,
    incomplete: batch.incomplete,
    ingredients: ingredients.map((l) => toIngredient(l, units)),
    note: batch.note,
    createdAt: batch.createdAt.toISOString(),
  };
}

/** The most batches the "all" inventory returns (newest first). */
export const INVENTORY_LIMIT = 100;

/**
 * The inventory: a profile's batches, newest cook first, each with all its portions; `available` keeps only
 * batches with portions left. Two plain queries (no joins to hydrate), since this is the kitchen's busiest page.
 */
export async function listBatches(profileId: number, include: 'available' | 'all'): Promise<BatchSummary[]> {
  const units = await unitsOf(profileId);
  const where =
    include === 'available'
      ? { profileId, id: { [Op.in]: literal(`(SELECT DISTINCT batch_id FROM portions WHERE profile_id = ${Number(profileId)} AND status = 'available')`) } }
      : { profileId };
  const batches = await BatchModel.findAll({ where, order: [['cookedOn', 'DESC'], ['id', 'DESC']], limit: INVENTORY_LIMIT, raw: true });
  if (!batches.length) return [];
  const portions = await PortionModel.findAll({
    where: { batchId: { [Op.in]: batches.map((b) => b.id) } },
    order: [['batchId', 'ASC'], ['position', 'ASC']],
    raw: true,
  });
  const byBatch = new Map<number, PortionModel[]>();
  for (const p of portions) {
    const list = byBatch.get(p.batchId);
    if (list) list.push(p);
    else byBatch.set(p.batchId, [p]);
  }
  return batches.map((b) => toSummary(b, byBatch.get(b.id) ?? [], units));
}

type Snapshot = { foodId: number; name: string; source: string; per100g: Nutrients };

/**
 * Loads every food the batch names (used and swapped-from): foods the cook may use, and the recipe's own foods
 * (seeing a recipe lets you see, and so cook, its foods, as the recipe page does). Unknown ids → 400 per line.
 */
async function snapshotFoods(input: CreateBatchParsed, foods: Map<number, Food>, recipeId: number): Promise<Map<number, Snapshot>> {
  const missing = foodIdsOf(input).filter((id) => !foods.has(id));
  if (missing.length) {
    const inRecipe = await RecipeIngredientModel.findAll({ where: { recipeId, foodId: { [Op.in]: missing } }, attributes: ['foodId'] });
    const rows = inRecipe.length ? await FoodModel.findAll({ where: { id: { [Op.in]: inRecipe.map((l) => l.foodId) } } }) : [];
    for (const row of rows) foods.set(row.id, toFood(row));
  }
  const fieldErrors: FieldErrors = {};
  input.ingredients.forEach((l, i) => {
    if (!foods.has(l.foodId)) fieldErrors[`ingredients.${i}.foodId`] = ['That food was not found.'];
    if (l.swappedFromFoodId && !foods.has(l.swappedFromFoodId)) fieldErrors[`ingredients.${i}.swappedFromFoodId`] = ['That food was not found.'];
  });
  if (Object.keys(fieldErrors).length) throw AppError.validation(fieldErrors);
  const out = new Map<number, Snapshot>();
  for (const [id, f] of foods) out.set(id, { foodId: id, name: f.name, source: f.source, per100g: f.per100g });
  return out;
}

const foodIdsOf = (input: CreateBatchParsed) => input.ingredients.flatMap((l) => [l.foodId, ...(l.swappedFromFoodId ? [l.swappedFromFoodId] : [])]);

type Container = { id: number; name: string };

/** The containers the cook weighed with (the pot and each weighed portion's), each on this profile or a 400 naming its field. */
async function containersOf(profileId: number, input: CreateBatchParsed): Promise<{ pot: Container | null; portions: (Container | null)[] }> {
  const wanted: [string, number | null | undefined][] = [
    ['cookedWeight.containerId', input.cookedWeight.containerId],
    ...(input.split.mode === 'weighed' ? input.split.portions.map((w, i): [string, number | null | undefined] => [`split.portions.${i}.containerId`, w.containerId]) : []),
  ];
  const ids = [...new Set(wanted.map(([, id]) => id).filter((id): id is number => Boolean(id)))];
  const rows = ids.length
    ? await BatchModel.sequelize!.query<Container>('SELECT id, name FROM containers WHERE profile_id = :profileId AND id IN (:ids)', { replacements: { profileId, ids }, type: QueryTypes.SELECT })
    : [];
  const byId = new Map(rows.map((r) => [r.id, r]));
  const found = wanted.map(([field, id]) => {
    if (!id) return null;
    const row = byId.get(id);
    if (!row) throw AppError.validation({ [field]: ['That container is not saved on this profile.'] });
    return row;
  });
  return { pot: found[0], portions: found.slice(1) };
}

// The saved batch, its lines and its portions in one statement, answered as the batch page reads them (plain rows).
const BATCH_COLUMNS = `id, profile_id AS "profileId", recipe_id AS "recipeId", recipe_title AS "recipeTitle", scale_factor AS "scaleFactor",
  cooked_by_user_id AS "cookedByUserId", cooked_on AS "cookedOn", storage, use_by AS "useBy", use_by_source AS "useBySource",
  food_safety_region AS "foodSafetyRegion", use_by_note AS "useByNote", raw_grams AS "rawGrams", cooked_gross_grams AS "cookedGrossGrams",
  pot_tare_grams AS "potTareGrams", pot_container_id AS "potContainerId", pot_name AS "potName", cooked_grams AS "cookedGrams",
  split_mode AS "splitMode", totals, per100g, incomplete, note, created_at AS "createdAt", updated_at AS "updatedAt"`;
const INSERT_BATCH = `WITH b AS (
  INSERT INTO batches (profile_id, recipe_id, recipe_title, scale_factor, cooked_by_user_id, cooked_on, storage, use_by, use_by_source,
    food_safety_region, use_by_note, raw_grams, cooked_gross_grams, pot_tare_grams, pot_container_id, pot_name, cooked_grams, split_mode,
    totals, per100g, incomplete, note, created_at, updated_at)
  VALUES (:profileId, :recipeId, :recipeTitle, :scaleFactor, :cookedByUserId, :cookedOn, :storage, :useBy, :useBySource,
    :foodSafetyRegion, :useByNote, :rawGrams, :cookedGrossGrams, :potTareGrams, :potContainerId, :potName, :cookedGrams, :splitMode,
    :totals, :per100g, ARRAY(SELECT jsonb_array_elements_text(CAST(:incomplete AS jsonb))), :note, :now, :now)
  RETURNING ${BATCH_COLUMNS}
), i AS (
  INSERT INTO batch_ingredients (batch_id, position, food_id, food_name, food_source, per100g, planned_grams, actual_grams, omitted, swapped_from_food_id, swapped_from_name)
  SELECT b.id, x.position::int, x.food_id::int, x.food_name::text, x.food_source::text, x.per100g::jsonb, x.planned_grams::float8,
      x.actual_grams::float8, x.omitted::boolean, x.swapped_from_food_id::int, x.swapped_from_name::text
    FROM b, (VALUES :ingredients) AS x(position, food_id, food_name, food_source, per100g, planned_grams, actual_grams, omitted, swapped_from_food_id, swapped_from_name)
  RETURNING id, batch_id AS "batchId", position, food_id AS "foodId", food_name AS "foodName", food_source AS "foodSource", per100g,
    planned_grams AS "plannedGrams", actual_grams AS "actualGrams", omitted, swapped_from_food_id AS "swappedFromFoodId", swapped_from_name AS "swappedFromName"
), p AS (
  INSERT INTO portions (batch_id, profile_id, code, position, container_id, container_name, gross_grams, tare_grams, net_grams, carb_available, carb_total, created_at, updated_at)
  SELECT b.id, b."profileId", x.code::text, x.position::int, x.container_id::int, x.container_name::text, x.gross_grams::float8, x.tare_grams::float8,
      x.net_grams::float8, x.carb_available::float8, x.carb_total::float8, CAST(:now AS timestamptz), CAST(:now AS timestamptz)
    FROM b, (VALUES :portions) AS x(code, position, container_id, container_name, gross_grams, tare_grams, net_grams, carb_available, carb_total)
  RETURNING id, batch_id AS "batchId", profile_id AS "profileId", code, position, container_id AS "containerId", container_name AS "containerName",
    gross_grams AS "grossGrams", tare_grams AS "tareGrams", net_grams AS "netGrams", carb_available AS "carbAvailable", carb_total AS "carbTotal",
    status, status_changed_at AS "statusChangedAt", status_changed_by_user_id AS "statusChangedByUserId"
)
SELECT b.*, u.display_name AS "cookedByName",
  (SELECT json_agg(i ORDER BY i.position) FROM i) AS "ingredientRows",
  (SELECT json_agg(p ORDER BY p.position) FROM p) AS "portionRows"
FROM b LEFT JOIN users u ON u.id = b."cookedByUserId"`;

type SavedRow = BatchModel & { cookedByName: string | null; ingredientRows: BatchIngredientModel[]; portionRows: PortionModel[] };

/**
 * Saves a whole cook at once: the weighed lines as a snapshot, the cooked weight, the batch arithmetic, the use-by
 * date (default from the food-safety rule unless given) and the portions with codes. The batch, its lines and its
 * portions are one INSERT statement (all or nothing), answered from what it returns; filling a planned cook joins
 * it in one transaction. Everything it checks is read before, together.
 */
export async function createBatch(profileId: number, userId: number, input: CreateBatchParsed): Promise<BatchDetail> {
  const portionCount = input.split.mode === 'equal' ? input.split.count : input.split.portions.length;
  // Inside a transaction a refused statement would abort it, so codes are checked first; outside one, the statement
  // is all or nothing and is simply tried again with new codes if the unique index refuses one.
  const inTransaction = Boolean(currentTransaction() || input.plannedCookId);
  const [recipe, usable, checkedCodes, units] = await together(currentTransaction(), [
    () => findViewableRecipeRow(input.recipeId, userId),
    () => loadFoods(foodIdsOf(input), { userId, measures: false }),
    () => (inTransaction ? freshCodes(portionCount) : Promise.resolve(null)),
    () => unitsOf(profileId),
  ] as const);
  if (!recipe) throw AppError.validation({ recipeId: ['That recipe was not found.'] });
  const foods = await snapshotFoods(input, usable, recipe.id);
  const cookedGrams = netGrams(input.cookedWeight.grossGrams, input.cookedWeight.tareGrams);
  const lines = input.ingredients.map((l) => ({ per100g: foods.get(l.foodId)!.per100g, actualGrams: l.actualGrams ?? 0, omitted: l.omitted }));
  const batch = computeBatch(lines, cookedGrams, 'available');
  const shares = splitBatch(batch, input.split);
  const containsRice = batchContainsRice(input.ingredients.map((l) => ({ foodName: foods.get(l.foodId)!.name, omitted: l.omitted })));
  const rule = defaultUseBy(input.cookedOn, input.storage, input.region, containsRice);
  const containers = await containersOf(profileId, input);
  const split = input.split;
  const portions = (codes: string[]) => shares.map((share, i) => {
    const container = containers.portions[i] ?? null;
    const weighed = split.mode === 'weighed' ? split.portions[i] : null;
    const { containerName, grossGrams, tareGrams } = weighed ? { containerName: container?.name ?? null, grossGrams: weighed.grossGrams, tareGrams: weighed.tareGrams } : noContainer;
    return [codes[i], i + 1, container?.id ?? null, containerName, grossGrams, tareGrams, share.netGrams, share.carbAvailable, share.carbTotal];
  });
  const replacements = {
    profileId,
    recipeId: recipe.id,
    recipeTitle: recipe.title,
    scaleFactor: input.scaleFactor,
    cookedByUserId: userId,
    cookedOn: input.cookedOn,
    storage: input.storage,
    useBy: input.useBy ?? rule.useBy,
    useBySource: input.useBy && input.useBy !== rule.useBy ? 'Set by the cook' : rule.source,
    foodSafetyRegion: input.region,
    useByNote: rule.note,
    rawGrams: batch.rawGrams,
    cookedGrossGrams: input.cookedWeight.grossGrams,
    potTareGrams: input.cookedWeight.tareGrams,
    potContainerId: containers.pot?.id ?? null,
    potName: containers.pot?.name ?? null,
    cookedGrams,
    splitMode: input.split.mode,
    totals: JSON.stringify(batch.totals),
    per100g: JSON.stringify(batch.per100gCooked),
    incomplete: JSON.stringify(batch.incomplete),
    note: input.note,
    now: new Date(),
    ingredients: input.ingredients.map((l, i) => {
      const food = foods.get(l.foodId)!;
      const from = l.swappedFromFoodId ? foods.get(l.swappedFromFoodId)! : null;
      return [i + 1, food.foodId, food.name, food.source, JSON.stringify(food.per100g), l.plannedGrams, l.omitted ? null : l.actualGrams, l.omitted, from?.foodId ?? null, from?.name ?? null];
    }),
  };
  const sequelize = BatchModel.sequelize!;
  const save = async (): Promise<SavedRow> => {
    for (let attempt = 1; ; attempt += 1) {
      const codes = checkedCodes ?? newCodes(portionCount);
      try {
        const [row] = await sequelize.query<SavedRow>(INSERT_BATCH, { replacements: { ...replacements, portions: portions(codes) }, type: QueryTypes.SELECT });
        return row;
      } catch (err) {
        if (checkedCodes || attempt >= CODE_ATTEMPTS || !codeTaken(err)) throw err;
      }
    }
  };
  const row = input.plannedCookId
    ? await sequelize.transaction(async (transaction) => {
        const saved = await save();
        await fillPlannedCook(profileId, input.plannedCookId!, saved.id, transaction);
        return saved;
      })
    : await save();
  const { cookedByName, ingredientRows, portionRows, ...saved } = row;
  const detail = { ...saved, cookedBy: cookedByName == null ? null : { id: userId, displayName: cookedByName } } as BatchModel;
  return toDetail(detail, ingredientRows, portionRows, units);
}

/** Moves a batch between fridge and freezer or corrects its use-by date (default follows the new storage, rice rule included). */
export async function updateBatch(profileId: number, id: number, input: UpdateBatchInput): Promise<BatchDetail> {
  const batch = await BatchModel.findOne({ where: { id, profileId }, include: [{ model: BatchIngredientModel, as: 'ingredients' }] });
  if (!batch) throw AppError.notFound('batch');
  if (input.useBy && input.useBy < batch.cookedOn) {
    throw AppError.validation({ useBy: ['The use-by date cannot be before the cooking date.'] });
  }
  if (input.storage) batch.storage = input.storage;
  if (input.region) batch.foodSafetyRegion = input.region;
  if (input.useBy) {
    batch.useBy = input.useBy;
    batch.useBySource = 'Set by the cook';
  } else if (input.storage) {
    const containsRice = batchContainsRice(batch.ingredients ?? []);
    const rule = defaultUseBy(batch.cookedOn, batch.storage, batch.foodSafetyRegion, containsRice);
    Object.assign(batch, { useBy: rule.useBy, useBySource: rule.source, useByNote: rule.note });
  }
  await batch.save();
  return getBatch(profileId, id);
}
