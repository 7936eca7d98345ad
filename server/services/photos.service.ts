import crypto from 'node:crypto';
import type { RecipePhoto } from '../../shared/schemas/recipe';
import { AppError } from '../errors';
import { DecodeTimeoutError, isCutShort, isReasonableSize, MAX_PIXELS, MAX_SIDE, readImageHeader, type PhotoProcessor, type ProcessedPhoto } from '../lib/photo-worker';
import { newStorageKey, type FileStorage } from '../lib/storage';
import { logger } from '../logger';
import { RecipeModel } from '../models';
import { findOwnedRecipe } from './recipes.service';

/** Signed photo links stay valid for one to two hours, and are stable within each hour so browsers can cache them. */
const LINK_HOURS = 1;
let signingKey: Buffer = crypto.randomBytes(32);

/** Sets the key photo links are signed with (derived from the server secret, so every server copy agrees). */
export function configurePhotoSigning(secret: string): void {
  signingKey = crypto.createHmac('sha256', secret).update('carbwright photo links').digest();
}

function signature(key: string, expires: number): string {
  return crypto.createHmac('sha256', signingKey).update(`${key}\n${expires}`).digest('base64url');
}

/** A short-lived link to a stored photo: /api/photos/<key>?exp=<unix s>&sig=<hmac>. */
export function signedPhotoUrl(key: string, nowMs = Date.now()): string {
  const hour = 3600;
  const expires = (Math.floor(nowMs / 1000 / hour) + 1 + LINK_HOURS) * hour;
  return `/api/photos/${key}?exp=${expires}&sig=${signature(key, expires)}`;
}

/** True when the link's signature matches and it has not expired. */
export function verifyPhotoLink(key: string, exp: number, sig: string, nowMs = Date.now()): boolean {
  if (!Number.isInteger(exp) || exp * 1000 < nowMs) return false;
  const expected = Buffer.from(signature(key, exp));
  const given = Buffer.from(sig);
  return expected.length === given.length && crypto.timingSafeEqual(expected, given);
}

/** Signed links for a recipe's photo, or null when it has none. Only call for people who may see the recipe. */
export function photoUrls(recipe: Pick<RecipeModel, 'photoLargeKey' | 'photoThumbKey'>, nowMs = Date.now()): RecipePhoto | null {
  if (!recipe.photoLargeKey || !recipe.photoThumbKey) return null;
  return { largeUrl: signedPhotoUrl(recipe.photoLargeKey, nowMs), thumbUrl: signedPhotoUrl(recipe.photoThumbKey, nowMs) };
}

async function removeQuietly(storage: FileStorage, keys: (string | null)[]) {
  for (const key of keys) {
    if (!key) continue;
    try {
      await storage.remove(key);
    } catch (err) {
      logger.warn({ err, key }, 'could not remove a stored photo');
    }
  }
}

/**
 * Checks an uploaded photo by its bytes (JPEG, PNG or WebP, whatever its name or declared type), refuses absurd
 * pixel sizes and data shorter than its header promises before decoding, then decodes and re-encodes it off the
 * request thread within the decode time limit. Problems are 400s on `field`.
 */
export async function decodeUploadedPhoto(file: Buffer, processor: PhotoProcessor, field = 'photo'): Promise<ProcessedPhoto> {
  const refuse = (message: string) => AppError.validation({ [field]: [message] });
  const header = readImageHeader(file);
  if (!header) throw refuse('That file is not a JPEG, PNG or WebP image.');
  if (!isReasonableSize(header)) {
    throw refuse(
      `That image is ${header.width} × ${header.height} pixels, too large to open (the most is ${MAX_PIXELS / 1_000_000} megapixels and ` +
        `${MAX_SIDE.toLocaleString('en')} pixels a side). Please send a smaller photo.`,
    );
  }
  if (isCutShort(file, header)) throw refuse('That image is cut short: the file holds less than its size promises. Please send it again.');
  try {
    return await processor.process(file);
  } catch (err) {
    logger.info({ err: (err as Error).message }, 'photo could not be decoded');
    if (err instanceof DecodeTimeoutError) throw refuse('That image took too long to open. Please send a smaller or simpler photo.');
    throw refuse('That image could not be read. It may be damaged or cut short.');
  }
}

/** Stores each (key, bytes); if one fails, the ones already stored are removed again, and the error is rethrown. */
export async function putAll(storage: FileStorage, files: [string, Buffer][]): Promise<void> {
  const done: string[] = [];
  try {
    for (const [key, data] of files) {
      await storage.put(key, data);
      done.push(key);
    }
  } catch (err) {
    await removeQuietly(storage, done);
    throw err;
  }
}

/**
 * Checks an uploaded photo by its bytes (JPEG, PNG or WebP, whatever its name or declared type),
 * refuses absurd pixel sizes before decoding, decodes and re-encodes it off the request thread, stores a
 * large and a thumbnail variant under fresh unguessable keys and attaches them to the recipe (owner only).
 */
export async function setRecipePhoto(
  recipeId: number,
  userId: number,
  file: Buffer | undefined,
  deps: { storage: FileStorage; processor: PhotoProcessor },
): Promise<RecipePhoto> {
  // 404 unless the user may see the recipe (a share with someone else does not make it known), 403 for a viewer.
  const recipe = await findOwnedRecipe(recipeId, userId);
  if (!file?.length) throw AppError.validation({ photo: ['Choose a photo to upload.'] });
  const processed = await decodeUploadedPhoto(file, deps.processor);
  const largeKey = newStorageKey('recipes', 'jpg');
  const thumbKey = newStorageKey('recipes', 'jpg');
  await putAll(deps.storage, [[largeKey, processed.large.data], [thumbKey, processed.thumb.data]]);
  const old = [recipe.photoLargeKey, recipe.photoThumbKey];
  try {
    const [count] = await RecipeModel.update({ photoLargeKey: largeKey, photoThumbKey: thumbKey }, { where: { id: recipeId, ownerUserId: userId } });
    if (!count) throw AppError.notFound('recipe');
  } catch (err) {
    await removeQuietly(deps.storage, [largeKey, thumbKey]);
    throw err;
  }
  await removeQuietly(deps.storage, old);
  return photoUrls({ photoLargeKey: largeKey, photoThumbKey: thumbKey })!;
}

/** Removes a recipe's photo (owner only). */
export async function removeRecipePhoto(recipeId: number, userId: number, storage: FileStorage): Promise<void> {
  // 404 unless the user may see the recipe (a share with someone else does not make it known), 403 for a viewer.
  const recipe = await findOwnedRecipe(recipeId, userId);
  const old = [recipe.photoLargeKey, recipe.photoThumbKey];
  await recipe.update({ photoLargeKey: null, photoThumbKey: null });
  await removeQuietly(storage, old);
}

/** Stores fresh copies of a recipe's photo files for a copied recipe (so deleting one never breaks the other). */
export async function copyPhotoFiles(
  recipe: Pick<RecipeModel, 'photoLargeKey' | 'photoThumbKey'>,
  storage: FileStorage,
): Promise<{ photoLargeKey: string | null; photoThumbKey: string | null }> {
  if (!recipe.photoLargeKey || !recipe.photoThumbKey) return { photoLargeKey: null, photoThumbKey: null };
  const [large, thumb] = await Promise.all([storage.get(recipe.photoLargeKey), storage.get(recipe.photoThumbKey)]);
  if (!large || !thumb) return { photoLargeKey: null, photoThumbKey: null };
  const photoLargeKey = newStorageKey('recipes', 'jpg');
  const photoThumbKey = newStorageKey('recipes', 'jpg');
  await putAll(storage, [[photoLargeKey, large], [photoThumbKey, thumb]]);
  return { photoLargeKey, photoThumbKey };
}
