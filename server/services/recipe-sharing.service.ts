import { UniqueConstraintError } from 'sequelize';
import type { RecipeDetail, RecipeShare } from '../../shared/schemas/recipe';
import { AppError } from '../errors';
import type { FileStorage } from '../lib/storage';
import { RecipeIngredientModel, RecipeModel, RecipeShareModel, UserModel } from '../models';
import { copyPhotoFiles } from './photos.service';
import { findOwnedRecipe, findViewableRecipe, getRecipeForUser } from './recipes.service';

async function sharesOf(recipeId: number): Promise<RecipeShare[]> {
  const rows = await RecipeShareModel.findAll({ where: { recipeId }, include: [{ model: UserModel, as: 'user' }], order: [['createdAt', 'ASC']] });
  return rows.map((s) => ({ userId: s.userId, displayName: s.user!.displayName, email: s.user!.email, sharedAt: s.createdAt.toISOString() }));
}

/** Who the owner has shared the recipe with. */
export async function listShares(recipeId: number, userId: number): Promise<RecipeShare[]> {
  await findOwnedRecipe(recipeId, userId);
  return sharesOf(recipeId);
}

/**
 * Shares a recipe the user owns with the account that has this email (view and copy). We say plainly when
 * no account uses the email: the owner needs to know the share did not happen. A private recipe becomes
 * "shared"; sharing twice with the same person is harmless.
 */
export async function shareRecipe(recipeId: number, ownerId: number, email: string): Promise<RecipeShare[]> {
  await RecipeModel.sequelize!.transaction(async (transaction) => {
    const recipe = await findOwnedRecipe(recipeId, ownerId, transaction);
    const person = await UserModel.findOne({ where: { email }, transaction });
    if (!person) throw AppError.validation({ email: ['No Carbwright account uses that email. Ask them to sign up first.'] });
    if (person.id === ownerId) throw AppError.validation({ email: ['That is your own account.'] });
    try {
      await RecipeShareModel.findOrCreate({
        where: { recipeId, userId: person.id },
        defaults: { recipeId, userId: person.id, sharedByUserId: ownerId },
        transaction,
      });
    } catch (err) {
      if (!(err instanceof UniqueConstraintError)) throw err;
    }
    if (recipe.visibility === 'private') await recipe.update({ visibility: 'shared' }, { transaction });
  });
  return sharesOf(recipeId);
}

/** Withdraws one person's access to a recipe the user owns; copies they already made stay theirs. */
export async function revokeShare(recipeId: number, ownerId: number, personId: number): Promise<void> {
  await findOwnedRecipe(recipeId, ownerId);
  const removed = await RecipeShareModel.destroy({ where: { recipeId, userId: personId } });
  if (!removed) throw AppError.notFound('share');
}

/**
 * Copies a recipe the user may see into their own library as an independent, private recipe that remembers
 * where it came from (the owner's "duplicate" is the same operation). Photo files are copied too.
 */
export async function copyRecipe(recipeId: number, userId: number, storage: FileStorage): Promise<RecipeDetail> {
  const source = await findViewableRecipe(recipeId, userId);
  const photo = await copyPhotoFiles(source, storage);
  return RecipeModel.sequelize!.transaction(async (transaction) => {
    const lines = await RecipeIngredientModel.findAll({ where: { recipeId }, order: [['position', 'ASC']], transaction });
    const copy = await RecipeModel.create(
      {
        ownerUserId: userId,
        title: source.ownerUserId === userId ? `${source.title} (copy)`.slice(0, 120) : source.title,
        description: source.description,
        methodSteps: source.methodSteps,
        tags: source.tags,
        defaultPortions: source.defaultPortions,
        visibility: 'private',
        copiedFromRecipeId: source.id,
        ...photo,
      },
      { transaction },
    );
    await RecipeIngredientModel.bulkCreate(
      lines.map((l) => ({ recipeId: copy.id, position: l.position, foodId: l.foodId, grams: l.grams, measureLabel: l.measureLabel, note: l.note })),
      { transaction },
    );
    return getRecipeForUser(copy.id, userId, {}, transaction);
  });
}
