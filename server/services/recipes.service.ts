import { Op, QueryTypes } from 'sequelize';
import type { Transaction, WhereOptions } from 'sequelize';
import { computeRecipe, scaleFactorForPortions } from '../../shared/compute/recipe';
import type { Food } from '../../shared/schemas/food';
import type {
  RecipeDetail,
  RecipeInputParsed,
  RecipeListQuery,
  RecipeSummary,
  RecipeViewQuery,
} from '../../shared/schemas/recipe';
import type { CarbBasis, CarbUnit } from '../../shared/schemas/units';
import { AppError } from '../errors';
import { ProfileModel, RecipeIngredientModel, RecipeModel, RecipeShareModel, UserModel } from '../models';
import { findProfileAccess } from './auth.service';
import { getUsableFoods, loadFoods } from './foods.service';
import { profileUnits } from './profiles.service';
import { photoUrls } from './photos.service';
import { currentTransaction } from '../lib/transaction-context';
import { together } from '../lib/together';
import { loadIngredients, recipePageRow, recipeShares, shelfLines, viewableRecipeSql, type Line } from './recipe-rows';

type Display = { basis: CarbBasis; unit: CarbUnit };

/** The carbohydrate basis and unit to answer in: the named profile (if the user may open it), else their own. */
export async function resolveDisplay(userId: number, profileId?: number): Promise<Display> {
  if (profileId !== undefined) {
    const access = await findProfileAccess(userId, profileId);
    if (!access) throw AppError.notFound('profile');
    const units = await profileUnits(profileId);
    return { basis: units.carbBasis, unit: units.carbUnit };
  }
  const own = await ProfileModel.findOne({ where: { ownerUserId: userId }, order: [['id', 'ASC']], attributes: ['carbBasis', 'carbUnit'], raw: true });
  return { basis: own?.carbBasis ?? 'available', unit: own?.carbUnit ?? 'g' };
}

/** Whether the user may see the recipe: owner, public, or shared with them (while not private). */
export async function canViewRecipe(recipe: Pick<RecipeModel, 'id' | 'ownerUserId' | 'visibility'>, userId: number): Promise<boolean> {
  if (recipe.ownerUserId === userId || recipe.visibility === 'public') return true;
  if (recipe.visibility === 'private') return false;
  return (await RecipeShareModel.count({ where: { recipeId: recipe.id, userId } })) > 0;
}

/** The recipe row if the user may see it, else a 404 (strangers cannot learn that it exists). */
export async function findViewableRecipe(recipeId: number, userId: number, transaction?: Transaction): Promise<RecipeModel> {
  const recipe = await RecipeModel.findByPk(recipeId, { transaction });
  if (!recipe || !(await canViewRecipe(recipe, userId))) throw AppError.notFound('recipe');
  return recipe;
}

/**
 * A recipe's id and title if the user may see it, else null: canViewRecipe's rule in one plain query (for writes
 * that only need to name the recipe, such as saving a batch).
 */
export async function findViewableRecipeRow(recipeId: number, userId: number): Promise<{ id: number; title: string } | null> {
  const [row] = await RecipeModel.sequelize!.query<{ id: number; title: string }>(
    `SELECT r.id, r.title FROM recipes r WHERE r.id = :recipeId AND ${viewableRecipeSql('r', ':userId')}`,
    { replacements: { recipeId, userId }, type: QueryTypes.SELECT },
  );
  return row ?? null;
}

/** The recipe row for its owner; 404 for people who cannot see it, 403 for those who can but do not own it. */
export async function findOwnedRecipe(recipeId: number, userId: number, transaction?: Transaction): Promise<RecipeModel> {
  const recipe = await findViewableRecipe(recipeId, userId, transaction);
  if (recipe.ownerUserId !== userId) throw AppError.forbidden('Only the owner can change this recipe. Copy it into your library to make your own version.');
  return recipe;
}

/** When the user (or anyone on a profile they can open) last cooked each recipe (migration 0350 made the batches table). */
async function lastCooked(recipeIds: number[], userId: number): Promise<Map<number, string>> {
  if (!recipeIds.length) return new Map();
  const sequelize = RecipeModel.sequelize!;
  const rows = await sequelize.query<{ recipe_id: number; at: Date }>(
    `SELECT recipe_id, max(created_at) AS at FROM batches
     WHERE recipe_id IN (:recipeIds)
       AND (cooked_by_user_id = :userId OR profile_id IN (SELECT profile_id FROM profile_access WHERE user_id = :userId))
     GROUP BY recipe_id`,
    { replacements: { recipeIds, userId }, type: QueryTypes.SELECT },
  );
  return new Map(rows.map((r) => [r.recipe_id, new Date(r.at).toISOString()]));
}

function summarise(
  recipe: Pick<RecipeModel, 'id' | 'title' | 'description' | 'tags' | 'defaultPortions' | 'visibility' | 'ownerUserId' | 'photoLargeKey' | 'photoThumbKey' | 'copiedFromRecipeId' | 'updatedAt'>,
  owner: { displayName: string } | null | undefined,
  lines: Line[],
  foods: ReadonlyMap<number, Pick<Food, 'name' | 'per100g'>>,
  display: Display,
  userId: number,
  cookedAt: string | null,
  scale = { factor: 1, portions: recipe.defaultPortions },
) {
  const nutrition = computeRecipe(
    lines.map((l) => ({ grams: l.grams * scale.factor, per100g: foods.get(l.foodId)!.per100g })),
    { portions: scale.portions, basis: display.basis, unit: display.unit },
  );
  const summary: RecipeSummary = {
    id: recipe.id,
    title: recipe.title,
    description: recipe.description,
    tags: recipe.tags,
    defaultPortions: recipe.defaultPortions,
    visibility: recipe.visibility,
    owner: { id: recipe.ownerUserId, displayName: owner?.displayName ?? 'Someone' },
    isOwner: recipe.ownerUserId === userId,
    photo: photoUrls(recipe),
    ingredientNames: lines.map((l) => foods.get(l.foodId)!.name),
    carbPerPortionGrams: nutrition.carbPerPortion.grams,
    carbIncomplete: nutrition.carbIncomplete,
    basis: display.basis,
    unit: display.unit,
    copiedFromRecipeId: recipe.copiedFromRecipeId,
    lastCookedAt: cookedAt,
    updatedAt: recipe.updatedAt.toISOString(),
  };
  return { summary, nutrition };
}


/**
 * One recipe with its ingredients (each with its food), method and the full computed breakdown, in the
 * profile's carbohydrate basis and unit; optionally scaled by a factor or to a number of portions.
 * 404 when the user may not see it. Outside a transaction its four reads run at once (the recipe page is one round
 * trip after the sign-in check); the ingredients and shares are dropped unread when the recipe is not theirs to see.
 */
export async function getRecipeForUser(
  recipeId: number,
  userId: number,
  view: RecipeViewQuery = {},
  transaction?: Transaction,
): Promise<RecipeDetail> {
  // Inside a transaction every query shares one connection, which runs one at a time; outside, they run together.
  const [recipe, lineMap, foods, shareRows, named] = await together(transaction, [
    () => recipePageRow(recipeId, userId, transaction),
    () => loadIngredients([recipeId], transaction),
    () => loadFoods([], { inRecipe: recipeId, transaction }),
    () => recipeShares(recipeId, transaction),
    () => (view.profileId !== undefined ? resolveDisplay(userId, view.profileId) : Promise.resolve(null)),
  ] as const);
  if (!recipe || !recipe.viewable) throw AppError.notFound('recipe');
  const isOwner = recipe.ownerUserId === userId;
  const display: Display = named ?? { basis: recipe.ownBasis ?? 'available', unit: recipe.ownUnit ?? 'g' };
  const lines = lineMap.get(recipe.id) ?? [];
  const scale =
    view.portions !== undefined
      ? { factor: scaleFactorForPortions(recipe.defaultPortions, view.portions), portions: view.portions }
      : { factor: view.factor ?? 1, portions: recipe.defaultPortions };
  const cookedAt = recipe.lastCookedAt ? new Date(recipe.lastCookedAt).toISOString() : null;
  const owner = recipe.ownerName === null ? null : { displayName: recipe.ownerName };
  return toDetail([recipe, owner, lines, foods, display, userId, cookedAt, scale], {
    sharedWith: isOwner
      ? shareRows.map((s) => ({ userId: s.userId, displayName: s.displayName, email: s.email, sharedAt: new Date(s.createdAt).toISOString() }))
      : null,
    copiedFrom: recipe.sourceId !== null && recipe.sourceViewable ? { id: recipe.sourceId, title: recipe.sourceTitle! } : null,
  });
}

type SummaryArgs = Required<Parameters<typeof summarise>>;

/** The recipe page's answer from what is in hand (summarise's arguments, the foods in full, the scale given) and who it is shared with. */
function toDetail(
  parts: [SummaryArgs[0] & Pick<RecipeModel, 'methodSteps'>, SummaryArgs[1], SummaryArgs[2], ReadonlyMap<number, Food>, SummaryArgs[4], SummaryArgs[5], SummaryArgs[6], SummaryArgs[7]],
  links: Pick<RecipeDetail, 'sharedWith' | 'copiedFrom'>,
): RecipeDetail {
  const [recipe, , lines, foods, , , , scale] = parts;
  const { summary, nutrition } = summarise(...parts);
  return {
    ...summary,
    methodSteps: recipe.methodSteps,
    ingredients: lines.map((l) => ({
      id: l.id,
      position: l.position,
      foodId: l.foodId,
      grams: l.grams * scale.factor,
      measureLabel: l.measureLabel,
      note: l.note,
      food: foods.get(l.foodId)!,
    })),
    nutrition,
    scale,
    sharedWith: links.sharedWith,
    copiedFrom: links.copiedFrom,
  };
}

const escapeLike = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

/** The shelf's recipe rows with their owner's name, newest change first, 300 at most (migration 0810 reads them in this order). */
async function shelfRows(query: RecipeListQuery, userId: number): Promise<RecipeModel[]> {
  const sharedIds =
    query.scope === 'shared' ? (await RecipeShareModel.findAll({ where: { userId }, attributes: ['recipeId'], raw: true })).map((s) => s.recipeId) : [];
  const scopeWhere: WhereOptions<RecipeModel> =
    query.scope === 'mine'
      ? { ownerUserId: userId }
      : query.scope === 'shared'
        ? { id: { [Op.in]: sharedIds }, visibility: { [Op.in]: ['shared', 'public'] }, ownerUserId: { [Op.ne]: userId } }
        : { visibility: 'public' };
  const and: WhereOptions<RecipeModel>[] = [scopeWhere];
  if (query.q) {
    const like = `%${escapeLike(query.q)}%`;
    const sequelize = RecipeModel.sequelize!;
    and.push({
      [Op.or]: [
        { title: { [Op.iLike]: like } },
        sequelize.literal(`EXISTS (SELECT 1 FROM unnest("RecipeModel"."tags") t WHERE t ILIKE ${sequelize.escape(like)})`),
        sequelize.literal(
          `EXISTS (SELECT 1 FROM recipe_ingredients ri JOIN foods f ON f.id = ri.food_id WHERE ri.recipe_id = "RecipeModel"."id" AND f.name ILIKE ${sequelize.escape(like)})`,
        ),
      ],
    });
  }
  // Plain rows throughout: a public shelf is 300 recipes and their foods.
  return (await RecipeModel.findAll({
    where: { [Op.and]: and },
    include: [{ model: UserModel, as: 'owner', attributes: ['id', 'displayName'] }],
    // Newest change first; the id orders recipes changed in the same instant (a bulk write), so a page is always the same.
    order: [['updatedAt', 'DESC'], ['id', 'DESC']],
    limit: 300,
    raw: true,
    nest: true,
  })) as RecipeModel[];
}

/** One shelf of the library (mine, shared with me, public), searched by title, tag and ingredient name, sorted. */
export async function listRecipes(query: RecipeListQuery, userId: number): Promise<RecipeSummary[]> {
  // The display units are read beside the shelf; the user's shares only for the shelf of recipes shared with them.
  const [display, recipes] = await Promise.all([resolveDisplay(userId, query.profileId), shelfRows(query, userId)]);
  const ids = recipes.map((r) => r.id);
  const [{ lines, foods }, cooked] = await Promise.all([shelfLines(ids), lastCooked(ids, userId)]);
  const items = recipes.map(
    (r) => summarise(r, r.owner, lines.get(r.id) ?? [], foods, display, userId, cooked.get(r.id) ?? null).summary,
  );
  const byNumber = (a: number | null, b: number | null) => (a ?? Infinity) - (b ?? Infinity);
  if (query.sort === 'title') items.sort((a, b) => a.title.localeCompare(b.title));
  if (query.sort === 'carbPerPortion') items.sort((a, b) => byNumber(a.carbPerPortionGrams, b.carbPerPortionGrams));
  if (query.sort === 'cooked') items.sort((a, b) => (b.lastCookedAt ?? '').localeCompare(a.lastCookedAt ?? ''));
  return items;
}

/** A 400 naming ingredients.N.foodId for every line whose food the user may not use (and that is not already in the recipe). */
function checkIngredientFoods(input: RecipeInputParsed['ingredients'], usable: Map<number, Food>, allowed: Set<number>): void {
  const fieldErrors: Record<string, string[]> = {};
  input.forEach((line, index) => {
    if (!usable.has(line.foodId) && !allowed.has(line.foodId)) fieldErrors[`ingredients.${index}.foodId`] = ['That food was not found.'];
  });
  if (Object.keys(fieldErrors).length) throw AppError.validation(fieldErrors);
}

/**
 * Checks every ingredient's food (usable by the user, or already in this recipe) and writes the lines in order.
 * Unknown foods give a 400 naming ingredients.N.foodId.
 */
async function writeIngredients(recipeId: number, input: RecipeInputParsed['ingredients'], userId: number, transaction: Transaction) {
  const existing = await RecipeIngredientModel.findAll({ where: { recipeId }, attributes: ['foodId'], transaction });
  const allowed = new Set(existing.map((e) => e.foodId));
  const usable = await getUsableFoods(input.map((i) => i.foodId), userId);
  checkIngredientFoods(input, usable, allowed);
  await RecipeIngredientModel.destroy({ where: { recipeId }, transaction });
  await RecipeIngredientModel.bulkCreate(
    input.map((line, position) => ({ recipeId, position, foodId: line.foodId, grams: line.grams, measureLabel: line.measureLabel, note: line.note })),
    { transaction },
  );
}

/** The recipe's own columns from the input (ingredients are written separately). */
function recipeFields(input: RecipeInputParsed) {
  const { title, description, methodSteps, tags, defaultPortions, visibility } = input;
  return { title, description, methodSteps, tags, defaultPortions, visibility };
}

// A new recipe and its lines in one statement, answered from what it returns (plain rows, no second read).
const INSERT_RECIPE = `WITH r AS (
  INSERT INTO recipes (owner_user_id, title, description, method_steps, tags, default_portions, visibility, created_at, updated_at)
  VALUES (:userId, :title, :description, :methodSteps, ARRAY(SELECT jsonb_array_elements_text(CAST(:tags AS jsonb))), :defaultPortions, :visibility, :now, :now)
  RETURNING id, owner_user_id AS "ownerUserId", title, description, method_steps AS "methodSteps", tags, default_portions AS "defaultPortions",
    visibility, photo_large_key AS "photoLargeKey", photo_thumb_key AS "photoThumbKey", copied_from_recipe_id AS "copiedFromRecipeId",
    created_at AS "createdAt", updated_at AS "updatedAt"
), i AS (
  INSERT INTO recipe_ingredients (recipe_id, position, food_id, grams, measure_label, note)
  SELECT r.id, x.position::int, x.food_id::int, x.grams::float8, x.measure_label::text, x.note::text
    FROM r, (VALUES :lines) AS x(position, food_id, grams, measure_label, note)
  RETURNING id, recipe_id AS "recipeId", position, food_id AS "foodId", grams, measure_label AS "measureLabel", note
)
SELECT r.*, u.display_name AS "ownerName", (SELECT json_agg(i ORDER BY i.position) FROM i) AS "lineRows"
  FROM r LEFT JOIN users u ON u.id = r."ownerUserId"`;

/**
 * Creates a recipe with its ingredients: the foods and the answer's units are read first (together), then the recipe
 * and its lines are one INSERT statement (all or nothing) and the answer is built from what it returns, so a failure
 * after the save can never turn a saved recipe into an error (and a retried duplicate). A new recipe has no batches,
 * shares or source yet.
 */
export async function createRecipe(input: RecipeInputParsed, userId: number): Promise<RecipeDetail> {
  const [usable, display] = await together(currentTransaction(), [
    () => getUsableFoods(input.ingredients.map((i) => i.foodId), userId),
    () => resolveDisplay(userId),
  ] as const);
  checkIngredientFoods(input.ingredients, usable, new Set());
  const [row] = await RecipeModel.sequelize!.query<RecipeModel & { ownerName: string | null; lineRows: Line[] }>(INSERT_RECIPE, {
    replacements: {
      userId,
      ...recipeFields(input),
      methodSteps: JSON.stringify(input.methodSteps),
      tags: JSON.stringify(input.tags),
      now: new Date(),
      lines: input.ingredients.map((line, position) => [position, line.foodId, line.grams, line.measureLabel ?? null, line.note ?? null]),
    },
    type: QueryTypes.SELECT,
  });
  const { ownerName, lineRows, ...recipe } = row;
  const owner = ownerName == null ? null : { displayName: ownerName };
  const scale = { factor: 1, portions: recipe.defaultPortions };
  return toDetail([recipe as RecipeModel, owner, lineRows, usable, display, userId, null, scale], { sharedWith: [], copiedFrom: null });
}

/**
 * Replaces a recipe's fields and ingredients (owner only), in one transaction. Batches already cooked keep
 * their own weighed snapshot, so they do not change. Making a recipe private withdraws every share.
 */
export async function updateRecipe(recipeId: number, input: RecipeInputParsed, userId: number): Promise<RecipeDetail> {
  return RecipeModel.sequelize!.transaction(async (transaction) => {
    const recipe = await findOwnedRecipe(recipeId, userId, transaction);
    await recipe.update(recipeFields(input), { transaction });
    recipe.changed('updatedAt', true);
    await recipe.save({ transaction });
    if (input.visibility === 'private') await RecipeShareModel.destroy({ where: { recipeId }, transaction });
    await writeIngredients(recipe.id, input.ingredients, userId, transaction);
    return getRecipeForUser(recipeId, userId, {}, transaction);
  });
}

/** Deletes a recipe the user owns (its lines and shares go with it); returns the photo keys to remove. */
export async function deleteRecipe(recipeId: number, userId: number): Promise<string[]> {
  return RecipeModel.sequelize!.transaction(async (transaction) => {
    const recipe = await findOwnedRecipe(recipeId, userId, transaction);
    const keys = [recipe.photoLargeKey, recipe.photoThumbKey].filter((k): k is string => Boolean(k));
    await recipe.destroy({ transaction });
    return keys;
  });
}
