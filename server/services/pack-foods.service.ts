import { randomUUID } from 'node:crypto';
import { ForeignKeyConstraintError } from 'sequelize';
import type { Food } from '../../shared/schemas/food';
import type { CreatePackFoodValues } from '../../shared/schemas/food';
import { emptyNutrients } from '../../shared/compute/nutrients';
import { AppError } from '../errors';
import { completeEnergy, deriveCarbs, roundTo } from '../importers/food-rows';
import { isReasonableSize, readImageHeader, type PhotoProcessor } from '../lib/photo-worker';
import { newStorageKey, type FileStorage } from '../lib/storage';
import { logger } from '../logger';
import { FoodModel, ProfileAccessModel, RecipeIngredientModel, RecipeModel } from '../models';
import { getFood } from './foods.service';

export const PACK_FOOD_ATTRIBUTION = 'Typed from a package label by a Carbwright member; not checked by anyone else.';
export const PACK_FOOD_LICENCE = 'Private to the member who added it, and to the care team of a profile it is shared with.';

export const PACK_PHOTO_MAX_BYTES = 8 * 1024 * 1024;

/** An uploaded label photo with the one storage and photo processor of the app. */
export type PackPhoto = { buffer: Buffer; storage: FileStorage; photos: PhotoProcessor };

/**
 * Checks a label photo by its bytes (JPEG, PNG or WebP, whatever its name or declared type), re-encodes it off the
 * request thread like recipe photos (so EXIF and location data are gone) and stores the large variant; returns its key.
 */
async function storePackPhoto(photo: PackPhoto): Promise<string> {
  const header = readImageHeader(photo.buffer);
  if (!header) throw AppError.validation({ photo: ['The photo must be a JPEG, PNG or WebP image.'] });
  if (!isReasonableSize(header)) {
    throw AppError.validation({ photo: [`That image is ${header.width} × ${header.height} pixels, too large to open. Please send a smaller photo.`] });
  }
  let processed;
  try {
    processed = await photo.photos.process(photo.buffer);
  } catch (err) {
    logger.info({ err: (err as Error).message }, 'label photo could not be decoded');
    throw AppError.validation({ photo: ['That image could not be read. It may be damaged or cut short.'] });
  }
  const key = newStorageKey('label-photos', 'jpg');
  await photo.storage.put(key, processed.large.data);
  return key;
}

/**
 * Per-100 g nutrients from a label as printed. Per serving → per 100 g multiplies by 100 / serving grams.
 * EU/UK labels print available carbohydrate (fibre separate, Reg. (EU) 1169/2011 Annex I); US labels print total
 * carbohydrate with fibre included (21 CFR 101.9(c)(6)). The other basis is derived where fibre is printed.
 */
export function packFoodNutrients(v: CreatePackFoodValues) {
  const factor = v.basis === 'perServing' ? 100 / v.servingGrams! : 1;
  const scale = (x: number | null) => (x == null ? null : roundTo(x * factor, 6));
  const n = emptyNutrients();
  n.fibre = scale(v.fibre);
  n.sugars = scale(v.sugars);
  n.protein = scale(v.protein);
  n.fat = scale(v.fat);
  n.energyKcal = scale(v.energyKcal);
  const measured = v.convention === 'eu' ? 'available' : 'total';
  if (measured === 'available') n.carbAvailable = scale(v.carbohydrate);
  else n.carbTotal = scale(v.carbohydrate);
  const { nutrients, derived } = deriveCarbs(n, measured);
  completeEnergy(nutrients, derived);
  return { nutrients, derived, carbMeasured: measured as 'available' | 'total' };
}

async function checkShare(userId: number, sharedProfileId: number | null): Promise<void> {
  if (sharedProfileId == null) return;
  const access = await ProfileAccessModel.findOne({ where: { userId, profileId: sharedProfileId } });
  if (!access || access.role === 'clinician') {
    throw AppError.validation({ sharedProfileId: ['You can only share with a profile you own or care for.'] });
  }
}

/** The stored columns of a pack food from its label values (create and edit use the same rule). */
function packFoodColumns(input: CreatePackFoodValues) {
  const { nutrients, derived, carbMeasured } = packFoodNutrients(input);
  const servingNote = input.basis === 'perServing' ? ` per ${input.servingGrams} g serving, converted to per 100 g` : ' per 100 g';
  return {
    name: input.brand ? `${input.name} (${input.brand})` : input.name,
    altNames: input.brand ? [input.brand] : [],
    ...nutrients,
    carbMeasured,
    carbNote:
      input.convention === 'eu'
        ? `EU/UK label: carbohydrate printed${servingNote} is available carbohydrate (fibre not included).`
        : `US label: total carbohydrate printed${servingNote} includes fibre; available = total − fibre.`,
    derived,
    sharedProfileId: input.sharedProfileId,
    labelConvention: input.convention,
    extra: {
      ...(input.brand ? { brand: input.brand } : {}),
      printed: {
        basis: input.basis,
        servingGrams: input.servingGrams,
        carbohydrate: input.carbohydrate,
        fibre: input.fibre,
        sugars: input.sugars,
        protein: input.protein,
        fat: input.fat,
        energyKcal: input.energyKcal,
      },
    },
  };
}

/** Adds a food from a package label, private to the user (or shared with a profile's care team), with its re-encoded photo. */
export async function createPackFood(userId: number, input: CreatePackFoodValues, photo?: PackPhoto): Promise<Food> {
  await checkShare(userId, input.sharedProfileId);
  const photoPath = photo ? await storePackPhoto(photo) : null;
  try {
    const food = await FoodModel.create({
      source: 'pack',
      sourceCode: randomUUID(),
      foodGroup: null,
      ...packFoodColumns(input),
      attribution: PACK_FOOD_ATTRIBUTION,
      licence: PACK_FOOD_LICENCE,
      ownerUserId: userId,
      photoPath,
    });
    return getFood(food.id, userId);
  } catch (err) {
    if (photo && photoPath) await photo.storage.remove(photoPath);
    throw err;
  }
}

/**
 * Replaces the values of a pack food the user owns (404 otherwise). Recipes read food rows when they are shown, so they
 * count the new values from now on; batches keep the values they were cooked with (their ingredients are snapshots).
 */
export async function updatePackFood(id: number, userId: number, input: CreatePackFoodValues): Promise<Food> {
  const food = await FoodModel.findOne({ where: { id, source: 'pack', ownerUserId: userId } });
  if (!food) throw AppError.notFound('food');
  await checkShare(userId, input.sharedProfileId);
  await food.update(packFoodColumns(input));
  return getFood(food.id, userId);
}

/**
 * Deletes a pack food the user owns (404 otherwise) with its photo. Refused (409) while the user's own recipes use it,
 * naming them in the message and in `fieldErrors.recipes`; any other recipe still holding it also refuses (409).
 */
export async function deletePackFood(id: number, userId: number, storage: FileStorage): Promise<void> {
  const food = await FoodModel.findOne({ where: { id, source: 'pack', ownerUserId: userId } });
  if (!food) throw AppError.notFound('food');
  const own = await RecipeModel.findAll({
    where: { ownerUserId: userId },
    attributes: ['title'],
    include: [{ model: RecipeIngredientModel, as: 'ingredients', where: { foodId: id }, attributes: [], required: true }],
    order: [['title', 'ASC']],
  });
  if (own.length) {
    const titles = [...new Set(own.map((r) => r.title))];
    throw AppError.conflict(`This pack food is used in your recipes: ${titles.join(', ')}. Remove it there first.`, { recipes: titles });
  }
  try {
    await food.destroy();
  } catch (err) {
    if (err instanceof ForeignKeyConstraintError) throw AppError.conflict('This pack food is used in a recipe; remove it there first.');
    throw err;
  }
  if (food.photoPath) await storage.remove(food.photoPath).catch((err: unknown) => logger.warn({ err, key: food.photoPath }, 'could not remove a label photo'));
}
