import { randomUUID } from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';
import { ForeignKeyConstraintError } from 'sequelize';
import type { Food } from '../../shared/schemas/food';
import type { CreateLabelFoodValues } from '../../shared/schemas/food';
import { emptyNutrients } from '../../shared/compute/nutrients';
import { AppError } from '../errors';
import { completeEnergy, deriveCarbs, roundTo } from '../importers/food-rows';
import { readImageHeader, type ImageKind } from '../lib/photo-worker';
import { FoodModel, ProfileAccessModel } from '../models';
import { getFood } from './foods.service';

export const LABEL_ATTRIBUTION = 'Typed from a package label by a Carbwright member; not checked by anyone else.';
export const LABEL_LICENCE = 'Private to the member who added it, and to the care team of a profile it is shared with.';

const PHOTO_TYPES: Record<string, string> = { 'image/jpeg': 'jpg', 'image/png': 'png', 'image/webp': 'webp' };
const IMAGE_EXTENSIONS: Record<ImageKind, string> = { jpeg: 'jpg', png: 'png', webp: 'webp' };
export const LABEL_PHOTO_MAX_BYTES = 8 * 1024 * 1024;

export type LabelPhoto = { buffer: Buffer; mimetype: string };

/**
 * Per-100 g nutrients from a label as printed. Per serving → per 100 g multiplies by 100 / serving grams.
 * EU/UK labels print available carbohydrate (fibre separate, Reg. (EU) 1169/2011 Annex I); US labels print total
 * carbohydrate with fibre included (21 CFR 101.9(c)(6)). The other basis is derived where fibre is printed.
 */
export function labelNutrients(v: CreateLabelFoodValues) {
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

/** Adds a food from a package label, private to the user (or shared with a profile's care team); stores the photo as uploaded. */
export async function createLabelFood(userId: number, input: CreateLabelFoodValues, uploadsDir: string, photo?: LabelPhoto): Promise<Food> {
  if (input.sharedProfileId != null) {
    const access = await ProfileAccessModel.findOne({ where: { userId, profileId: input.sharedProfileId } });
    if (!access || access.role === 'clinician') {
      throw AppError.validation({ sharedProfileId: ['You can only share with a profile you own or care for.'] });
    }
  }
  let photoPath: string | null = null;
  if (photo) {
    // The declared type is the browser's guess from the file name: the bytes decide what is stored and served.
    const header = readImageHeader(photo.buffer);
    const ext = PHOTO_TYPES[photo.mimetype] && header ? IMAGE_EXTENSIONS[header.kind] : undefined;
    if (!ext) throw AppError.validation({ photo: ['The photo must be a JPEG, PNG or WebP image.'] });
    photoPath = path.join('label-photos', `${randomUUID()}.${ext}`);
    await fs.mkdir(path.join(uploadsDir, 'label-photos'), { recursive: true });
    await fs.writeFile(path.join(uploadsDir, photoPath), photo.buffer);
  }
  const { nutrients, derived, carbMeasured } = labelNutrients(input);
  const servingNote = input.basis === 'perServing' ? ` per ${input.servingGrams} g serving, converted to per 100 g` : ' per 100 g';
  try {
    const food = await FoodModel.create({
      source: 'label',
      sourceCode: randomUUID(),
      name: input.brand ? `${input.name} (${input.brand})` : input.name,
      foodGroup: null,
      altNames: input.brand ? [input.brand] : [],
      ...nutrients,
      carbMeasured,
      carbNote:
        input.convention === 'eu'
          ? `EU/UK label: carbohydrate printed${servingNote} is available carbohydrate (fibre not included).`
          : `US label: total carbohydrate printed${servingNote} includes fibre; available = total − fibre.`,
      derived,
      attribution: LABEL_ATTRIBUTION,
      licence: LABEL_LICENCE,
      ownerUserId: userId,
      sharedProfileId: input.sharedProfileId,
      labelConvention: input.convention,
      photoPath,
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
    });
    return getFood(food.id, userId);
  } catch (err) {
    if (photoPath) await fs.rm(path.join(uploadsDir, photoPath), { force: true });
    throw err;
  }
}

/** Deletes a label food the user owns (404 otherwise) with its photo; 409 while a recipe still uses it. */
export async function deleteLabelFood(id: number, userId: number, uploadsDir: string): Promise<void> {
  const food = await FoodModel.findOne({ where: { id, source: 'label', ownerUserId: userId } });
  if (!food) throw AppError.notFound('food');
  try {
    await food.destroy();
  } catch (err) {
    if (err instanceof ForeignKeyConstraintError) throw AppError.conflict('This food is used in a recipe; remove it there first.');
    throw err;
  }
  if (food.photoPath) await fs.rm(path.join(uploadsDir, food.photoPath), { force: true });
}
