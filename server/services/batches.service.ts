import { randomInt } from 'node:crypto';
import { literal, Op, type Transaction } from 'sequelize';
import { carbUnderstated, computeBatch, gramsLeftToSplit, netGrams, splitBatch, weighingDifference, yieldFactor, type SplitShare } from '../../shared/compute/batch';
import { carbInBasis, type Nutrients } from '../../shared/compute/nutrients';
import { generatePortionCode } from '../../shared/compute/portion-code';
import { batchContainsRice, defaultUseBy } from '../../shared/compute/use-by';
import type { BatchDetail, BatchIngredient, BatchSummary, CreateBatchParsed, UpdateBatchInput } from '../../shared/schemas/batch';
import type { PortionStatus } from '../../shared/schemas/portion';
import type { CarbBasis, CarbUnit } from '../../shared/schemas/units';
import { AppError, type FieldErrors } from '../errors';
import { BatchIngredientModel, BatchModel, FoodModel, PortionModel, RecipeIngredientModel, UserModel } from '../models';
import { findContainer } from './containers.service';
import { getUsableFoods, loadFoods, toFood } from './foods.service';
import { fillPlannedCook } from './plan.service';
import { carbOf, toPortion } from './portions.service';
import { profileUnits } from './profiles.service';
import { findViewableRecipe } from './recipes.service';

type Units = { basis: CarbBasis; unit: CarbUnit };

const noContainer = { containerId: null, containerName: null, grossGrams: null, tareGrams: null };

/** The carbohydrate basis and unit of a profile (404 when it does not exist). */
async function unitsOf(profileId: number): Promise<Units> {
  const p = await profileUnits(profileId);
  return { basis: p.carbBasis, unit: p.carbUnit };
}

/** New portion codes that are not in use yet (checked against the table; the unique index is the last word). */
async function freshCodes(count: number, transaction: Transaction): Promise<string[]> {
  const codes = new Set<string>();
  while (codes.size < count) {
    const wanted = Array.from({ length: count - codes.size }, () => generatePortionCode(randomInt));
    const taken = await PortionModel.findAll({ where: { code: { [Op.in]: wanted } }, attributes: ['code'], transaction });
    const takenSet = new Set(taken.map((p) => p.code));
    for (const code of wanted) if (!takenSet.has(code)) codes.add(code);
  }
  return [...codes];
}

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
async function snapshotFoods(input: CreateBatchParsed, userId: number, recipeId: number): Promise<Map<number, Snapshot>> {
  const ids = input.ingredients.flatMap((l) => [l.foodId, ...(l.swappedFromFoodId ? [l.swappedFromFoodId] : [])]);
  const foods = await loadFoods(ids, { userId, measures: false });
  const missing = ids.filter((id) => !foods.has(id));
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

/**
 * Saves a whole cook at once, in one transaction: the weighed lines as a snapshot, the cooked weight, the
 * batch arithmetic, the use-by date (default from the food-safety rule unless given) and the portions with codes.
 */
export async function createBatch(profileId: number, userId: number, input: CreateBatchParsed): Promise<BatchDetail> {
  const recipe = await findViewableRecipe(input.recipeId, userId).catch((err: unknown) => {
    if (err instanceof AppError && err.status === 404) throw AppError.validation({ recipeId: ['That recipe was not found.'] });
    throw err;
  });
  const foods = await snapshotFoods(input, userId, recipe.id);
  const cookedGrams = netGrams(input.cookedWeight.grossGrams, input.cookedWeight.tareGrams);
  const lines = input.ingredients.map((l) => ({ per100g: foods.get(l.foodId)!.per100g, actualGrams: l.actualGrams ?? 0, omitted: l.omitted }));
  const batch = computeBatch(lines, cookedGrams, 'available');
  const shares = splitBatch(batch, input.split);
  const containsRice = batchContainsRice(input.ingredients.map((l) => ({ foodName: foods.get(l.foodId)!.name, omitted: l.omitted })));
  const rule = defaultUseBy(input.cookedOn, input.storage, input.region, containsRice);
  const sequelize = BatchModel.sequelize!;

  // The answer is read inside the transaction: once committed, the save is answered from what is in hand.
  return sequelize.transaction(async (transaction) => {
    const pot = input.cookedWeight.containerId ? await findContainerOr400(profileId, input.cookedWeight.containerId, 'cookedWeight.containerId', transaction) : null;
    const row = await BatchModel.create(
      {
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
        potContainerId: pot?.id ?? null,
        potName: pot?.name ?? null,
        cookedGrams,
        splitMode: input.split.mode,
        totals: batch.totals,
        per100g: batch.per100gCooked,
        incomplete: batch.incomplete,
        note: input.note,
      },
      { transaction },
    );
    await BatchIngredientModel.bulkCreate(
      input.ingredients.map((l, i) => {
        const food = foods.get(l.foodId)!;
        const from = l.swappedFromFoodId ? foods.get(l.swappedFromFoodId)! : null;
        return {
          batchId: row.id,
          position: i + 1,
          foodId: food.foodId,
          foodName: food.name,
          foodSource: food.source,
          per100g: food.per100g,
          plannedGrams: l.plannedGrams,
          actualGrams: l.omitted ? null : l.actualGrams,
          omitted: l.omitted,
          swappedFromFoodId: from?.foodId ?? null,
          swappedFromName: from?.name ?? null,
        };
      }),
      { transaction },
    );
    const split = input.split;
    const portions =
      split.mode === 'equal'
        ? shares.map((share) => ({ ...noContainer, ...toPortionCarb(share) }))
        : await inSequence(
            split.portions.map((w, i) => async () => {
              const container = w.containerId ? await findContainerOr400(profileId, w.containerId, `split.portions.${i}.containerId`, transaction) : null;
              return {
                containerId: container?.id ?? null,
                containerName: container?.name ?? null,
                grossGrams: w.grossGrams,
                tareGrams: w.tareGrams,
                ...toPortionCarb(shares[i]),
              };
            }),
          );
    const codes = await freshCodes(portions.length, transaction);
    await PortionModel.bulkCreate(
      portions.map((p, i) => ({ ...p, batchId: row.id, profileId, code: codes[i], position: i + 1 })),
      { transaction },
    );
    if (input.plannedCookId) await fillPlannedCook(profileId, input.plannedCookId, row.id, transaction);
    return getBatch(profileId, row.id);
  });
}

async function findContainerOr400(profileId: number, id: number, field: string, transaction: Transaction) {
  return findContainer(profileId, id, transaction).catch(() => {
    throw AppError.validation({ [field]: ['That container is not saved on this profile.'] });
  });
}

/** The stored columns of one share of the split. */
function toPortionCarb(share: SplitShare) {
  return { netGrams: share.netGrams, carbAvailable: share.carbAvailable, carbTotal: share.carbTotal };
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

/** Runs async steps one after another (a transaction's connection runs one query at a time). */
async function inSequence<T>(steps: (() => Promise<T>)[]): Promise<T[]> {
  const out: T[] = [];
  for (const step of steps) out.push(await step());
  return out;
}
