import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { Op } from 'sequelize';
import { z } from 'zod';
import { createBatchInputSchema } from '../../shared/schemas/batch';
import { createPackFoodInputSchema } from '../../shared/schemas/food';
import { dayKindInputSchema, profileSettingsInputSchema } from '../../shared/schemas/profile-settings';
import { recipeInputSchema } from '../../shared/schemas/recipe';
import { DEFAULT_EXERCISE_REDUCTIONS } from '../../shared/compute/exercise';
import type { Config } from '../config';
import { REPO_ROOT } from '../config';
import { BatchModel, ContainerModel, FoodModel, ProfileModel, RecipeModel, UserModel } from '../models';
import type { FoodSource } from '../models/food.model';
import { signUp } from '../services/auth.service';
import { createBatch } from '../services/batches.service';
import { createContainer } from '../services/containers.service';
import { createPackFood } from '../services/pack-foods.service';
import { createDayKind, listDayKinds } from '../services/day-kinds.service';
import { getSettings, updateSettings } from '../services/profile-settings.service';
import { createRecipe } from '../services/recipes.service';

const ingredientSchema = z.object({
  ifct: z.string().optional(),
  usda: z.string().optional(),
  pack: z.string().optional(),
  grams: z.number().positive(),
  note: z.string().optional(),
});

/** The shape of data/demo/household.json. */
const scenarioSchema = z.object({
  member: z.object({ email: z.string(), displayName: z.string() }),
  profile: z.object({ carbBasis: z.enum(['available', 'total']), carbUnit: z.enum(['g', 'portion10', 'unit12', 'exchange15']) }),
  doseSettings: z.object({ note: z.string() }).passthrough(),
  dayKinds: z.array(z.object({ name: z.string() }).passthrough()),
  packFoods: z.array(z.object({ key: z.string() }).passthrough()),
  recipes: z.array(
    z.object({
      key: z.string(),
      title: z.string(),
      description: z.string(),
      methodSteps: z.array(z.string()),
      tags: z.array(z.string()),
      defaultPortions: z.number(),
      visibility: z.enum(['private', 'shared', 'public']),
      ingredients: z.array(ingredientSchema),
    }),
  ),
  containers: z.array(z.object({ name: z.string(), kind: z.enum(['pot', 'container']), tareGrams: z.number() })),
  batches: z.array(
    z.object({
      recipe: z.string(),
      storage: z.enum(['fridge', 'freezer']),
      region: z.enum(['uk', 'us']),
      actualGrams: z.array(z.number()),
      pot: z.object({ container: z.string(), grossGrams: z.number() }),
      portions: z.array(z.object({ container: z.string(), grossGrams: z.number() })),
    }),
  ),
});
type Ingredient = z.infer<typeof ingredientSchema>;

/** The key of an ingredient's food: a USDA SR28 or IFCT 2017 code, or a pack food of the scenario (`pack`). */
const foodKey = (i: Ingredient) => (i.usda ? `usda_sr28:${i.usda}` : i.ifct ? `ifct2017:${i.ifct}` : `pack:${i.pack}`);
export type DemoScenario = z.infer<typeof scenarioSchema>;

export const DEMO_FILE = path.join(REPO_ROOT, 'data', 'demo', 'household.json');

/** Reads and checks the invented demo scenario. */
export function loadScenario(file = DEMO_FILE): DemoScenario {
  return scenarioSchema.parse(JSON.parse(fs.readFileSync(file, 'utf8')));
}

export type DemoResult = { skipped?: string; created: string[]; email: string; password?: string };

/**
 * Seeds the invented demo household through the services: the member, invented dose settings and two day
 * kinds, two pack foods, a Sunday batch of overnight oats from USDA SR28 foods and two dishes from IFCT 2017 (one
 * public), saved containers, and two batches in the fridge (the oats and the dal) split into weighed, labelled portions.
 * Idempotent: each part is looked up first and only what is missing is created. The password comes from
 * `password` (DEMO_PASSWORD) or is generated and returned once, when the account is created.
 */
export async function seedDemo(config: Config, options: { password?: string; today: string; scenario?: DemoScenario }): Promise<DemoResult> {
  const s = options.scenario ?? loadScenario();
  const created: string[] = [];
  const tableKeys = [...new Set(s.recipes.flatMap((r) => r.ingredients.filter((i) => i.usda || i.ifct).map(foodKey)))];
  const tableFoods = await FoodModel.findAll({
    where: { [Op.or]: tableKeys.map((k) => ({ source: k.split(':')[0] as FoodSource, sourceCode: k.split(':')[1] })) },
  });
  if (tableFoods.length < tableKeys.length) {
    return { skipped: 'the food tables (IFCT 2017 and USDA SR28) are not imported yet', created, email: s.member.email };
  }
  const foodId = new Map(tableFoods.map((f) => [`${f.source}:${f.sourceCode}`, f.id]));

  let password: string | undefined;
  let user = await UserModel.findOne({ where: { email: s.member.email } });
  if (!user) {
    password = options.password ?? randomBytes(12).toString('base64url');
    await signUp(config, { email: s.member.email, displayName: s.member.displayName, password });
    user = (await UserModel.findOne({ where: { email: s.member.email } }))!;
    created.push('member');
  }
  const profile = (await ProfileModel.findOne({ where: { ownerUserId: user.id } }))!;
  if (profile.carbBasis !== s.profile.carbBasis || profile.carbUnit !== s.profile.carbUnit) {
    await profile.update({ carbBasis: s.profile.carbBasis, carbUnit: s.profile.carbUnit });
  }

  // Invented demo ratios and limits (marked so in the scenario), so the dose check can be tried.
  if ((await getSettings(profile.id)).settings === null) {
    const { note: _note, ...settings } = s.doseSettings;
    await updateSettings(profile.id, user.id, profileSettingsInputSchema.parse({ ...settings, exerciseReductions: DEFAULT_EXERCISE_REDUCTIONS }));
    created.push('dose settings');
  }
  const kindNames = new Set((await listDayKinds(profile.id)).map((k) => k.name));
  for (const kind of s.dayKinds) {
    if (kindNames.has(kind.name)) continue;
    await createDayKind(profile.id, user.id, dayKindInputSchema.parse(kind));
    created.push(`day kind ${kind.name}`);
  }

  for (const lf of s.packFoods) {
    const input = createPackFoodInputSchema.parse(Object.fromEntries(Object.entries(lf).filter(([k]) => k !== 'key')));
    let food = await FoodModel.findOne({ where: { source: 'pack', ownerUserId: user.id, name: input.name } });
    if (!food) {
      await createPackFood(user.id, input);
      food = (await FoodModel.findOne({ where: { source: 'pack', ownerUserId: user.id, name: input.name } }))!;
      created.push(`pack food ${input.name}`);
    }
    foodId.set(`pack:${lf.key}`, food.id);
  }

  const recipeIds = new Map<string, number>();
  for (const r of s.recipes) {
    let recipe = await RecipeModel.findOne({ where: { ownerUserId: user.id, title: r.title } });
    if (!recipe) {
      const input = recipeInputSchema.parse({
        ...r,
        ingredients: r.ingredients.map((i) => ({
          foodId: foodId.get(foodKey(i)),
          grams: i.grams,
          note: i.note ?? null,
        })),
      });
      const detail = await createRecipe(input, user.id);
      recipe = (await RecipeModel.findByPk(detail.id))!;
      created.push(`recipe ${r.title}`);
    }
    recipeIds.set(r.key, recipe.id);
  }

  const containers = new Map<string, ContainerModel>();
  for (const c of s.containers) {
    let row = await ContainerModel.findOne({ where: { profileId: profile.id, name: c.name } });
    if (!row) {
      await createContainer(profile.id, c);
      row = (await ContainerModel.findOne({ where: { profileId: profile.id, name: c.name } }))!;
      created.push(`container ${c.name}`);
    }
    containers.set(c.name, row);
  }

  for (const b of s.batches) {
    const recipeId = recipeIds.get(b.recipe)!;
    if (await BatchModel.findOne({ where: { profileId: profile.id, recipeId } })) continue;
    const recipe = s.recipes.find((r) => r.key === b.recipe)!;
    const weigh = (name: string, grossGrams: number) => {
      const c = containers.get(name)!;
      return { containerId: c.id, grossGrams, tareGrams: c.tareGrams };
    };
    const input = createBatchInputSchema.parse({
      recipeId,
      cookedOn: options.today,
      storage: b.storage,
      region: b.region,
      ingredients: recipe.ingredients.map((i, k) => ({ foodId: foodId.get(foodKey(i)), plannedGrams: i.grams, actualGrams: b.actualGrams[k] })),
      cookedWeight: weigh(b.pot.container, b.pot.grossGrams),
      split: { mode: 'weighed', portions: b.portions.map((p) => weigh(p.container, p.grossGrams)) },
      note: 'Demo batch (invented weighings).',
    });
    await createBatch(profile.id, user.id, input);
    created.push(`batch of ${recipe.title}`);
  }
  return { created, email: s.member.email, password };
}

/** npm start's demo step: skipped with SKIP_DEMO=1; prints what it created and a generated password once. */
export async function runDemoStep(config: Config, env: NodeJS.ProcessEnv = process.env): Promise<void> {
  if (env.SKIP_DEMO === '1') {
    console.log('Demo household skipped (SKIP_DEMO=1).');
    return;
  }
  if (env.DEMO_PASSWORD && env.DEMO_PASSWORD.length < 10) throw new Error('DEMO_PASSWORD must have at least 10 characters.');
  const result = await seedDemo(config, { password: env.DEMO_PASSWORD, today: new Date().toISOString().slice(0, 10) });
  if (result.skipped) {
    console.log(`Demo household not seeded: ${result.skipped}.`);
    return;
  }
  console.log(result.created.length ? `Demo household: created ${result.created.join(', ')}.` : 'Demo household is already present.');
  if (result.password && !env.DEMO_PASSWORD) {
    console.log(`Demo sign-in: ${result.email} / ${result.password}  (generated now and shown only this once; set DEMO_PASSWORD to choose it)`);
  } else if (result.created.includes('member')) {
    console.log(`Demo sign-in: ${result.email} with the password from DEMO_PASSWORD.`);
  }
}
