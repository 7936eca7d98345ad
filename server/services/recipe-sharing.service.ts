import { randomUUID } from 'node:crypto';
import { Op } from 'sequelize';
import type { RecipeDetail, RecipeOffer, RecipeOfferSent, RecipeShare } from '../../shared/schemas/recipe';
import { AppError } from '../errors';
import { newStorageKey, type FileStorage } from '../lib/storage';
import { FoodMeasureModel, FoodModel, ProfileAccessModel, ProfileModel, RecipeIngredientModel, RecipeModel, RecipeShareModel, RecipeShareOfferModel, UserModel } from '../models';
import { mailLink, queueMail } from './mail.service';
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

/** At most this many share offers per sender per hour: sharing is not a way to probe which addresses have accounts. */
export const SHARE_OFFERS_PER_HOUR = 20;

async function assertUnderOfferLimit(senderId: number, adding: number, now: Date) {
  const recent = await RecipeShareOfferModel.count({ where: { senderUserId: senderId, createdAt: { [Op.gt]: new Date(now.getTime() - 3600_000) } } });
  if (recent + adding > SHARE_OFFERS_PER_HOUR) throw new AppError(429, 'rate_limited', 'You have offered many recipes in the last hour. Please wait a while and try again.');
}

/** One offer (inside the caller's transaction): recorded, and mailed unless an offer is open or they already have it. */
async function offerTo(recipe: RecipeModel, sender: UserModel, email: string, now: Date): Promise<void> {
  const person = await UserModel.findOne({ where: { email } });
  const pending = await RecipeShareOfferModel.findOne({ where: { recipeId: recipe.id, email, status: 'offered' } });
  const has = person ? await RecipeShareModel.count({ where: { recipeId: recipe.id, userId: person.id } }) : 0;
  await RecipeShareOfferModel.create({ recipeId: recipe.id, senderUserId: sender.id, email, status: pending || has ? 'accepted' : 'offered', respondedAt: pending || has ? now : null });
  if (recipe.visibility === 'private') await recipe.update({ visibility: 'shared' });
  if (pending || has) return;
  const link = person ? mailLink('/recipes', { offers: '1' }) : mailLink('/sign-up', { email });
  await queueMail('share_offer', email, { senderName: sender.displayName, recipeName: recipe.title, link, hasAccount: !!person });
}

/**
 * Offers a recipe the user owns to an e-mail address. The answer is the same whether or not an account uses it: a
 * known person gets a notice on their recipes screen (and a mail) to accept or decline; an unknown address gets a
 * mail asking them to join first, and the offer waits for them. Nothing reaches anyone's shelf until they accept.
 * Offering again while an offer is open, or to someone who already has it, sends nothing more. Rate-limited per sender.
 */
export async function offerRecipe(recipeId: number, senderId: number, email: string, now = new Date()): Promise<void> {
  await RecipeModel.sequelize!.transaction(async () => {
    const recipe = await findOwnedRecipe(recipeId, senderId);
    const sender = (await UserModel.findByPk(senderId))!;
    if (sender.email === email) throw AppError.validation({ email: ['That is your own account.'] });
    await assertUnderOfferLimit(senderId, 1, now);
    await offerTo(recipe, sender, email, now);
  });
}

/**
 * A clinician offers a recipe they own to the owner of every profile they hold as clinician, at once: one offer per
 * owner, with the same consent (they accept or decline) and the same per-sender hourly limit, counted for every
 * offer (all or none). Returns how many people were offered it.
 */
export async function offerRecipeToMyPeople(recipeId: number, senderId: number, now = new Date()): Promise<number> {
  return RecipeModel.sequelize!.transaction(async () => {
    const recipe = await findOwnedRecipe(recipeId, senderId);
    const sender = (await UserModel.findByPk(senderId))!;
    const grants = await ProfileAccessModel.findAll({
      where: { userId: senderId, role: 'clinician' },
      include: [{ model: ProfileModel, as: 'profile', required: true, include: [{ model: UserModel, as: 'owner', required: true }] }],
    });
    const owners = grants.map((g) => (g as ProfileAccessModel & { profile: ProfileModel & { owner: UserModel } }).profile.owner.email);
    const emails = [...new Set(owners)].filter((e) => e !== sender.email);
    if (!emails.length) throw AppError.unprocessable('You do not support anyone yet: this offers a recipe to the people whose profiles you hold as clinician.');
    await assertUnderOfferLimit(senderId, emails.length, now);
    for (const email of emails) await offerTo(recipe, sender, email, now);
    return emails.length;
  });
}

/** The open offers of the owner's recipe (by address, since the sender typed it). */
export async function listOffersOfRecipe(recipeId: number, ownerId: number): Promise<RecipeOfferSent[]> {
  await findOwnedRecipe(recipeId, ownerId);
  const rows = await RecipeShareOfferModel.findAll({ where: { recipeId, status: 'offered' }, order: [['createdAt', 'ASC']] });
  return rows.map((o) => ({ id: o.id, email: o.email, offeredAt: o.createdAt.toISOString() }));
}

/** Recipes offered to the signed-in person and not yet answered, newest first. */
export async function listOffersForMe(userId: number): Promise<RecipeOffer[]> {
  const me = await UserModel.findByPk(userId);
  if (!me) throw AppError.unauthorized();
  const rows = await RecipeShareOfferModel.findAll({
    where: { email: me.email, status: 'offered' },
    include: [{ model: RecipeModel, as: 'recipe', required: true, where: { visibility: { [Op.ne]: 'private' } } }, { model: UserModel, as: 'sender' }],
    order: [['createdAt', 'DESC']],
  });
  return rows.map((o) => ({ id: o.id, recipeId: o.recipeId, recipeTitle: o.recipe!.title, senderName: o.sender!.displayName, offeredAt: o.createdAt.toISOString() }));
}

/** Accepts (the recipe joins the "shared with me" shelf) or declines an offer made to the signed-in person's address. */
export async function answerOffer(offerId: number, userId: number, accept: boolean, now = new Date()): Promise<void> {
  await RecipeModel.sequelize!.transaction(async () => {
    const me = await UserModel.findByPk(userId);
    const offer = await RecipeShareOfferModel.findOne({ where: { id: offerId, email: me?.email ?? '', status: 'offered' }, lock: true });
    if (!offer) throw AppError.notFound('offer');
    await offer.update({ status: accept ? 'accepted' : 'declined', respondedAt: now });
    if (!accept) return;
    const recipe = await RecipeModel.findByPk(offer.recipeId);
    if (!recipe || recipe.visibility === 'private') throw AppError.notFound('recipe');
    await RecipeShareModel.findOrCreate({ where: { recipeId: recipe.id, userId }, defaults: { recipeId: recipe.id, userId, sharedByUserId: offer.senderUserId } });
    await RecipeShareOfferModel.update({ status: 'accepted', respondedAt: now }, { where: { recipeId: recipe.id, email: offer.email, status: 'offered' } });
  });
}

/** Withdraws one person's access to a recipe the user owns; copies they already made stay theirs. */
export async function revokeShare(recipeId: number, ownerId: number, personId: number): Promise<void> {
  await findOwnedRecipe(recipeId, ownerId);
  const removed = await RecipeShareModel.destroy({ where: { recipeId, userId: personId } });
  if (!removed) throw AppError.notFound('share');
}

/**
 * Copies the other people's pack foods among these ids for the user (values, measures and photo), so a copied recipe
 * never pins someone's private food and its owner can always delete it. Returns old id → new id.
 */
async function copyForeignPackFoods(foodIds: number[], userId: number, storage: FileStorage): Promise<Map<number, number>> {
  const foreign = await FoodModel.findAll({
    where: { id: { [Op.in]: [...new Set(foodIds)] }, source: 'pack', ownerUserId: { [Op.ne]: userId } },
    include: [{ model: FoodMeasureModel, as: 'measures' }],
  });
  const out = new Map<number, number>();
  for (const food of foreign) {
    let photoPath: string | null = null;
    const bytes = food.photoPath ? await storage.get(food.photoPath) : null;
    if (bytes) {
      photoPath = newStorageKey('label-photos', 'jpg');
      await storage.put(photoPath, bytes);
    }
    const { id: _id, createdAt: _c, updatedAt: _u, measures, ...values } = food.get({ plain: true }) as FoodModel;
    const copy = await FoodModel.create({ ...values, sourceCode: randomUUID(), ownerUserId: userId, sharedProfileId: null, contentHash: null, photoPath });
    if (measures?.length) await FoodMeasureModel.bulkCreate(measures.map((m) => ({ foodId: copy.id, label: m.label, grams: m.grams, seq: m.seq })));
    out.set(food.id, copy.id);
  }
  return out;
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
    const foodIds = await copyForeignPackFoods(lines.map((l) => l.foodId), userId, storage);
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
      lines.map((l) => ({ recipeId: copy.id, position: l.position, foodId: foodIds.get(l.foodId) ?? l.foodId, grams: l.grams, measureLabel: l.measureLabel, note: l.note })),
      { transaction },
    );
    return getRecipeForUser(copy.id, userId, {}, transaction);
  });
}
