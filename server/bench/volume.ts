/**
 * Realistic volume for npm run bench, generated on demand into the bench database (never committed): other people's
 * accounts, profiles, recipes, batches and portions around the bench member, and a food table, so that every query is
 * measured against full tables and their indexes rather than an empty database. Set sizes with BENCH_VOLUME_USERS,
 * BENCH_VOLUME_RECIPES, BENCH_VOLUME_FOODS; BENCH_VOLUME=0 skips it.
 * Run alone against any database: DATABASE_URL=… tsx server/bench/volume.ts
 */
import { QueryTypes, type Sequelize } from 'sequelize';
import { emptyNutrients } from '../../shared/compute/nutrients';
import type { FoodInput } from '../importers/dataset';
import { createSequelize } from '../db';
import { writeFoods } from '../importers/write-foods';

export type VolumeSizes = { users: number; recipes: number; foods: number; batchesPerProfile: number; portionsPerBatch: number; logEntries: number };

export const DEFAULT_VOLUME: VolumeSizes = {
  users: Number(process.env.BENCH_VOLUME_USERS ?? 1_000),
  recipes: Number(process.env.BENCH_VOLUME_RECIPES ?? 20_000),
  foods: Number(process.env.BENCH_VOLUME_FOODS ?? 10_000),
  batchesPerProfile: 10,
  portionsPerBatch: 8,
  logEntries: Number(process.env.BENCH_VOLUME_LOG_ENTRIES ?? 200_000),
};

/** What a volume step made, printed by the bench and kept in its JSON. */
export type VolumeCounts = Record<string, number>;

/**
 * One generator of bench volume. The steps run in order after the accounts exist; `ctx.userIds` and `ctx.profileIds`
 * are the generated people.
 */
export type VolumeStep = {
  name: string;
  run: (sequelize: Sequelize, ctx: { sizes: VolumeSizes; userIds: [number, number]; profileIds: [number, number]; foodIds: [number, number] }) => Promise<VolumeCounts>;
};

// Invented words for food and recipe names; the figures only need names of realistic length and spread.
const FOOD_HEADS = ['Rice', 'Oats', 'Lentils', 'Beans', 'Bread', 'Pasta', 'Potato', 'Apple', 'Banana', 'Yogurt', 'Milk', 'Cheese', 'Chickpeas', 'Peas', 'Carrot', 'Onion', 'Tomato', 'Squash', 'Barley', 'Millet'];
const FOOD_KINDS = ['raw', 'cooked', 'boiled', 'baked', 'dried', 'canned', 'frozen', 'whole', 'plain', 'sweetened'];
const FOOD_VARIETY = ['garden', 'market', 'organic', 'local', 'heritage', 'valley', 'hill', 'coastal', 'northern', 'southern', 'winter', 'summer'];
const DISHES = ['stew', 'curry', 'soup', 'bake', 'porridge', 'salad', 'dal', 'pilaf', 'pie', 'muffins'];

function volumeFoods(n: number): FoodInput[] {
  return Array.from({ length: n }, (_, i) => {
    const carbTotal = 2 + ((i * 37) % 80);
    const fibre = (i * 7) % 12;
    return {
      sourceCode: `vol-${i}`,
      name: `${FOOD_HEADS[i % FOOD_HEADS.length]}, ${FOOD_KINDS[Math.floor(i / 20) % FOOD_KINDS.length]}, ${FOOD_VARIETY[Math.floor(i / 200) % FOOD_VARIETY.length]} ${Math.floor(i / 2400)}`,
      foodGroup: 'Bench volume',
      altNames: [],
      nutrients: { ...emptyNutrients(), carbTotal, fibre, carbAvailable: Math.max(0, carbTotal - fibre), protein: 3, fat: 2, energyKcal: 4 * carbTotal + 30 },
      carbMeasured: 'total',
      derived: ['carbAvailable'],
      carbNote: null,
      extra: {},
      measures: [{ label: '1 cup', grams: 150 }],
    };
  });
}

const range = async (sequelize: Sequelize, sql: string): Promise<[number, number]> => {
  const [row] = await sequelize.query<{ lo: number; hi: number }>(sql, { type: QueryTypes.SELECT });
  return [Number(row.lo), Number(row.hi)];
};

/** The built-in steps: recipes with ingredient lines, then batches with portions for every generated profile. */
export const VOLUME_STEPS: VolumeStep[] = [
  {
    name: 'recipes',
    run: async (sequelize, { sizes, userIds, foodIds }) => {
      const users = userIds[1] - userIds[0] + 1;
      const foods = foodIds[1] - foodIds[0] + 1;
      await sequelize.query(
        `INSERT INTO recipes (owner_user_id, title, description, tags, default_portions, visibility, created_at, updated_at)
         SELECT :u0 + (g % :users), 'Volume ' || (ARRAY[${DISHES.map((d) => `'${d}'`).join(',')}])[1 + g % ${DISHES.length}] || ' ' || g,
                '', ARRAY['bench'], 2 + g % 8, (CASE WHEN g % 5 = 0 THEN 'public' ELSE 'private' END)::enum_recipes_visibility,
                now() - (g || ' minutes')::interval, now()
           FROM generate_series(1, :n) g`,
        { replacements: { u0: userIds[0], users, n: sizes.recipes } },
      );
      const [lo, hi] = await range(sequelize, `SELECT min(id) lo, max(id) hi FROM recipes WHERE title LIKE 'Volume %'`);
      await sequelize.query(
        `INSERT INTO recipe_ingredients (recipe_id, position, food_id, grams)
         SELECT r, p, :f0 + ((r * 31 + p * 17) % :foods), 40 + (r + p) % 200
           FROM generate_series(CAST(:lo AS int), CAST(:hi AS int)) r, generate_series(0, 3 + (r % 6)) p`,
        { replacements: { f0: foodIds[0], foods, lo, hi } },
      );
      const [{ n }] = await sequelize.query<{ n: number }>('SELECT count(*)::int n FROM recipe_ingredients', { type: QueryTypes.SELECT });
      return { recipes: hi - lo + 1, recipeIngredients: n };
    },
  },
  {
    name: 'batches',
    run: async (sequelize, { sizes, profileIds }) => {
      const per = JSON.stringify({ carbAvailable: 20, carbTotal: 23 });
      await sequelize.query(
        `INSERT INTO batches (profile_id, recipe_title, cooked_on, storage, use_by, use_by_source, raw_grams, cooked_gross_grams,
                              pot_tare_grams, cooked_grams, split_mode, totals, per100g, created_at, updated_at)
         SELECT p, 'Volume batch ' || b, current_date - b, (CASE WHEN b % 3 = 0 THEN 'freezer' ELSE 'fridge' END)::enum_batches_storage,
                current_date - b + 3, 'bench', 1000, 1900, 1000, 900, 'equal', CAST(:per AS jsonb), CAST(:per AS jsonb), now(), now()
           FROM generate_series(CAST(:p0 AS int), CAST(:p1 AS int)) p, generate_series(1, :b) b`,
        { replacements: { p0: profileIds[0], p1: profileIds[1], b: sizes.batchesPerProfile, per } },
      );
      const [lo, hi] = await range(sequelize, `SELECT min(id) lo, max(id) hi FROM batches WHERE recipe_title LIKE 'Volume batch %'`);
      await sequelize.query(
        `INSERT INTO batch_ingredients (batch_id, position, food_name, food_source, per100g, planned_grams, actual_grams)
         SELECT b.id, i, 'Volume food ' || i, 'usda_fdc', CAST(:per AS jsonb), 200, 200
           FROM batches b, generate_series(0, 4) i WHERE b.id BETWEEN :lo AND :hi`,
        { replacements: { lo, hi, per } },
      );
      await sequelize.query(
        `INSERT INTO portions (batch_id, profile_id, code, position, net_grams, carb_available, carb_total, status, created_at, updated_at)
         SELECT b.id, b.profile_id, lpad(to_hex(b.id * 16 + i), 6, '0'), i, 112.5, 22.5, 25.9,
                (CASE WHEN i < 3 THEN 'eaten' ELSE 'available' END)::enum_portions_status, now(), now()
           FROM batches b, generate_series(0, :k - 1) i WHERE b.id BETWEEN :lo AND :hi`,
        { replacements: { lo, hi, k: sizes.portionsPerBatch } },
      );
      return { batches: hi - lo + 1, portions: (hi - lo + 1) * sizes.portionsPerBatch };
    },
  },
  {
    // The other people's logbooks (the bench member's own year is made by logbook.bench.ts): entries spread evenly over
    // the generated profiles, one every 90 minutes going back from now, in turn a reading, a meal, a rapid dose and a
    // sensor reading, so every logbook index holds other people's rows beside the member's.
    name: 'logbook',
    run: async (sequelize, { sizes, profileIds }) => {
      const profiles = profileIds[1] - profileIds[0] + 1;
      await sequelize.query(
        `INSERT INTO log_entries (profile_id, kind, occurred_at, local_date, local_minute, time_zone, title, meal_source,
                                  carb_available_g, carb_total_g, glucose_mmol, reading_source, units, created_at, updated_at)
         SELECT :p0 + (g % :profiles), k.kind::enum_log_entries_kind, t.at, (t.at AT TIME ZONE 'UTC')::date,
                extract(hour FROM t.at AT TIME ZONE 'UTC')::int * 60 + extract(minute FROM t.at AT TIME ZONE 'UTC')::int, 'UTC',
                CASE WHEN k.kind = 'meal' THEN 'Volume meal' END, CASE WHEN k.kind = 'meal' THEN 'typed'::enum_log_entries_meal_source END,
                CASE WHEN k.kind = 'meal' THEN 30 + g % 60 END, CASE WHEN k.kind = 'meal' THEN 34 + g % 60 END,
                CASE WHEN k.kind = 'reading' THEN 4 + (g % 80) / 10.0 END,
                CASE WHEN k.kind = 'reading' THEN (CASE WHEN g % 4 = 3 THEN 'imported' ELSE 'typed' END)::enum_log_entries_reading_source END,
                CASE WHEN k.kind = 'rapid_dose' THEN 2 + g % 6 END, now(), now()
           FROM generate_series(0, :n - 1) g
          CROSS JOIN LATERAL (SELECT now() - ((g / :profiles) * interval '90 minutes') AS at) t
          CROSS JOIN LATERAL (SELECT (ARRAY['reading', 'meal', 'rapid_dose', 'reading'])[1 + (g / :profiles) % 4] AS kind) k`,
        { replacements: { p0: profileIds[0], profiles, n: sizes.logEntries } },
      );
      const [{ n }] = await sequelize.query<{ n: number }>('SELECT count(*)::int n FROM log_entries', { type: QueryTypes.SELECT });
      return { logEntries: n };
    },
  },
];

/** Generates the volume (accounts, foods, then every step) and refreshes the planner's statistics. */
export async function generateVolume(sequelize: Sequelize, sizes: VolumeSizes = DEFAULT_VOLUME, steps: VolumeStep[] = VOLUME_STEPS) {
  const started = Date.now();
  // A real bcrypt hash is not needed: nobody signs in as these people.
  await sequelize.query(
    `INSERT INTO users (email, display_name, password_hash, role, created_at, updated_at)
     SELECT 'volume-' || g || '@bench.example', 'Volume ' || g, 'x', 'member', now(), now() FROM generate_series(1, :n) g`,
    { replacements: { n: sizes.users } },
  );
  const userIds = await range(sequelize, `SELECT min(id) lo, max(id) hi FROM users WHERE email LIKE 'volume-%@bench.example'`);
  await sequelize.query(
    `INSERT INTO profiles (display_name, owner_user_id, created_at, updated_at)
     SELECT display_name, id, now(), now() FROM users WHERE id BETWEEN :lo AND :hi`,
    { replacements: { lo: userIds[0], hi: userIds[1] } },
  );
  const profileIds = await range(sequelize, `SELECT min(p.id) lo, max(p.id) hi FROM profiles p WHERE owner_user_id BETWEEN ${userIds[0]} AND ${userIds[1]}`);
  await sequelize.query(
    `INSERT INTO profile_access (profile_id, user_id, role, granted_by_user_id, created_at, updated_at)
     SELECT id, owner_user_id, 'owner', owner_user_id, now(), now() FROM profiles WHERE id BETWEEN :lo AND :hi`,
    { replacements: { lo: profileIds[0], hi: profileIds[1] } },
  );
  const counts: VolumeCounts = { users: sizes.users, profiles: profileIds[1] - profileIds[0] + 1 };
  if (sizes.foods > 0) {
    const written = await sequelize.transaction((t) =>
      writeFoods(sequelize, t, { source: 'usda_fdc', attribution: 'Invented bench volume', licence: 'none', importId: null as unknown as number, foods: volumeFoods(sizes.foods) }),
    );
    counts.foods = written.inserted + written.updated + written.unchanged;
  }
  const foodIds = await range(sequelize, `SELECT min(id) lo, max(id) hi FROM foods WHERE source_code LIKE 'vol-%'`);
  for (const step of steps) Object.assign(counts, await step.run(sequelize, { sizes, userIds, profileIds, foodIds }));
  await sequelize.query('ANALYZE');
  return { counts, ms: Date.now() - started };
}

if (require.main === module) {
  void (async () => {
    const sequelize = createSequelize(process.env.DATABASE_URL ?? '');
    const { counts, ms } = await generateVolume(sequelize);
    console.log(`volume: ${JSON.stringify(counts)} in ${ms} ms`);
    await sequelize.close();
  })();
}
