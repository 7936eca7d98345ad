import { Op, QueryTypes, type Transaction } from 'sequelize';
import type { Food } from '../../shared/schemas/food';
import type { CarbBasis, CarbUnit } from '../../shared/schemas/units';
import { RecipeIngredientModel, RecipeModel } from '../models';

// Plain-row reads of recipes.service: the recipe page's and the shelves' statements (no model instances).

/**
 * The SQL form of canViewRecipe, for statements that read a recipe and decide in the same round trip: owner, public,
 * or shared with the user while not private. `userParam` must be a bound parameter.
 */
export function viewableRecipeSql(alias: string, userParam: string): string {
  return `(${alias}.owner_user_id = ${userParam} OR ${alias}.visibility = 'public' OR (${alias}.visibility <> 'private'
    AND EXISTS (SELECT 1 FROM recipe_shares vs WHERE vs.recipe_id = ${alias}.id AND vs.user_id = ${userParam})))`;
}

export type Line = Pick<RecipeIngredientModel, 'id' | 'recipeId' | 'position' | 'foodId' | 'grams' | 'measureLabel' | 'note'>;

export async function loadIngredients(recipeIds: number[], transaction?: Transaction) {
  if (!recipeIds.length) return new Map<number, Line[]>();
  const rows = (await RecipeIngredientModel.findAll({
    where: { recipeId: { [Op.in]: recipeIds } },
    order: [['recipeId', 'ASC'], ['position', 'ASC']],
    raw: true,
    transaction,
  })) as Line[];
  const out = new Map<number, Line[]>();
  for (const row of rows) {
    const list = out.get(row.recipeId);
    if (list) list.push(row);
    else out.set(row.recipeId, [row]);
  }
  return out;
}

export type RecipePageRow = Pick<
  RecipeModel,
  | 'id' | 'ownerUserId' | 'title' | 'description' | 'methodSteps' | 'tags' | 'defaultPortions' | 'visibility'
  | 'photoLargeKey' | 'photoThumbKey' | 'copiedFromRecipeId' | 'updatedAt'
> & {
  viewable: boolean;
  ownerName: string | null;
  ownBasis: CarbBasis | null;
  ownUnit: CarbUnit | null;
  lastCookedAt: Date | null;
  sourceId: number | null;
  sourceTitle: string | null;
  sourceViewable: boolean | null;
};

/**
 * The recipe page's own row in one statement: the recipe, whether the user may see it, its owner's name, the user's
 * own carbohydrate basis and unit, when they (or anyone on a profile they can open) last cooked it, and the recipe
 * it was copied from with whether they may see that one.
 */
export async function recipePageRow(recipeId: number, userId: number, transaction?: Transaction): Promise<RecipePageRow | undefined> {
  const [row] = await RecipeModel.sequelize!.query<RecipePageRow>(
    `SELECT r.id, r.owner_user_id AS "ownerUserId", r.title, r.description, r.method_steps AS "methodSteps", r.tags,
            r.default_portions AS "defaultPortions", r.visibility, r.photo_large_key AS "photoLargeKey",
            r.photo_thumb_key AS "photoThumbKey", r.copied_from_recipe_id AS "copiedFromRecipeId", r.updated_at AS "updatedAt",
            ${viewableRecipeSql('r', ':userId')} AS viewable,
            u.display_name AS "ownerName", own.carb_basis AS "ownBasis", own.carb_unit AS "ownUnit",
            (SELECT max(b.created_at) FROM batches b WHERE b.recipe_id = r.id
               AND (b.cooked_by_user_id = :userId OR b.profile_id IN (SELECT profile_id FROM profile_access WHERE user_id = :userId))) AS "lastCookedAt",
            src.id AS "sourceId", src.title AS "sourceTitle", ${viewableRecipeSql('src', ':userId')} AS "sourceViewable"
       FROM recipes r
       LEFT JOIN users u ON u.id = r.owner_user_id
       LEFT JOIN recipes src ON src.id = r.copied_from_recipe_id
       LEFT JOIN LATERAL (SELECT carb_basis, carb_unit FROM profiles WHERE owner_user_id = :userId ORDER BY id LIMIT 1) own ON true
      WHERE r.id = :recipeId`,
    { replacements: { recipeId, userId }, type: QueryTypes.SELECT, transaction },
  );
  return row;
}

/** Who the owner shared a recipe with, oldest share first. */
export async function recipeShares(recipeId: number, transaction?: Transaction) {
  return RecipeModel.sequelize!.query<{ userId: number; displayName: string; email: string; createdAt: Date }>(
    `SELECT s.user_id AS "userId", u.display_name AS "displayName", u.email, s.created_at AS "createdAt"
       FROM recipe_shares s JOIN users u ON u.id = s.user_id
      WHERE s.recipe_id = :recipeId ORDER BY s.created_at, s.id`,
    { replacements: { recipeId }, type: QueryTypes.SELECT, transaction },
  );
}

export type ShelfFood = Pick<Food, 'name' | 'per100g'>;

/**
 * The lines of the shelf's recipes with the name and per-100 g values of their foods, in one plain statement (a shelf
 * shows ingredient names and carbohydrate per portion, nothing else of a food; a public shelf is 300 recipes).
 */
export async function shelfLines(recipeIds: number[]): Promise<{ lines: Map<number, Line[]>; foods: Map<number, ShelfFood> }> {
  const lines = new Map<number, Line[]>();
  const foods = new Map<number, ShelfFood>();
  if (!recipeIds.length) return { lines, foods };
  const rows = await RecipeModel.sequelize!.query<Line & { name: string } & ShelfFood['per100g']>(
    `SELECT ri.id, ri.recipe_id AS "recipeId", ri.position, ri.food_id AS "foodId", ri.grams, ri.measure_label AS "measureLabel", ri.note,
            f.name, f.energy_kcal AS "energyKcal", f.energy_kj AS "energyKj", f.carb_available AS "carbAvailable",
            f.carb_total AS "carbTotal", f.fibre, f.sugars, f.protein, f.fat, f.water
       FROM recipe_ingredients ri JOIN foods f ON f.id = ri.food_id
      WHERE ri.recipe_id IN (:recipeIds)
      ORDER BY ri.recipe_id, ri.position`,
    { replacements: { recipeIds }, type: QueryTypes.SELECT },
  );
  for (const r of rows) {
    const line: Line = { id: r.id, recipeId: r.recipeId, position: r.position, foodId: r.foodId, grams: r.grams, measureLabel: r.measureLabel, note: r.note };
    const list = lines.get(r.recipeId);
    if (list) list.push(line);
    else lines.set(r.recipeId, [line]);
    if (!foods.has(r.foodId)) {
      const per100g: ShelfFood['per100g'] = { energyKcal: r.energyKcal, energyKj: r.energyKj, carbAvailable: r.carbAvailable, carbTotal: r.carbTotal, fibre: r.fibre, sugars: r.sugars, protein: r.protein, fat: r.fat, water: r.water };
      foods.set(r.foodId, { name: r.name, per100g });
    }
  }
  return { lines, foods };
}
