import { FoodModel } from '../../server/models';
import type { FoodSource } from '../../shared/schemas/food';

/** A test food: the name and the carbohydrate values the test needs (per 100 g); everything else has a default. */
export type FoodFixture = {
  name: string;
  carbTotal?: number | null;
  fibre?: number | null;
  /** Unknown (null) unless given; `withAvailable` derives it as total − fibre. */
  carbAvailable?: number | null;
  carbMeasured?: 'available' | 'total';
  energyKcal?: number | null;
  protein?: number | null;
  fat?: number | null;
  source?: FoodSource;
  sourceCode?: string;
  foodGroup?: string | null;
  altNames?: string[];
  /** A pack food of this member (source `pack` unless given). */
  ownerUserId?: number | null;
  sharedProfileId?: number | null;
  attribution?: string;
  licence?: string;
};

let counter = 0;

/** The one way tests, browser tests and the benchmark put a food in the table (straight into the database). */
export async function createFood(f: FoodFixture): Promise<FoodModel> {
  counter += 1;
  const owner = f.ownerUserId ?? null;
  return FoodModel.create({
    source: f.source ?? (owner ? 'pack' : 'usda_sr28'),
    sourceCode: f.sourceCode ?? `fixture-${process.pid}-${Date.now()}-${counter}`,
    name: f.name,
    foodGroup: f.foodGroup ?? null,
    altNames: f.altNames ?? [],
    energyKcal: f.energyKcal ?? null,
    energyKj: null,
    carbAvailable: f.carbAvailable ?? null,
    carbTotal: f.carbTotal ?? null,
    fibre: f.fibre ?? null,
    sugars: null,
    protein: f.protein ?? null,
    fat: f.fat ?? null,
    water: null,
    carbMeasured: f.carbMeasured ?? 'total',
    attribution: f.attribution ?? 'Test fixture (values named where the test uses them)',
    licence: f.licence ?? 'Test fixture',
    ownerUserId: owner,
    sharedProfileId: f.sharedProfileId ?? null,
  });
}

/** Creates the foods one after another (stable ids in list order). */
export async function createFoods(list: FoodFixture[]): Promise<FoodModel[]> {
  const out: FoodModel[] = [];
  for (const f of list) out.push(await createFood(f));
  return out;
}

/** The fixture with available carbohydrate derived as total − fibre (as a table that publishes both would store it). */
export function withAvailable(f: FoodFixture & { carbTotal: number; fibre: number }): FoodFixture {
  return { ...f, carbAvailable: f.carbTotal - f.fibre };
}

/**
 * Per 100 g, USDA SR Legacy via check-values §11 ([C2]) and §2.4 ([D]): carbohydrate by difference and fibre.
 * The overnight-oats foods most kitchen and recipe tests use.
 */
export const SR_LEGACY = {
  oats: { name: 'Oats, rolled, dry', carbTotal: 67.7, fibre: 10.1 }, // NDB 08120
  wholeMilk: { name: 'Milk, whole', carbTotal: 4.8, fibre: 0 }, // NDB 01077
  greekYogurt: { name: 'Yogurt, Greek, plain, nonfat', carbTotal: 3.6, fibre: 0 }, // NDB 01256
  apple: { name: 'Apple, raw, with skin', carbTotal: 13.81, fibre: 2.4 }, // NDB 09003 (20.715 g carb, 3.60 g fibre in 150 g, §2.4)
  raisins: { name: 'Raisins, seedless', carbTotal: 79.18, fibre: 3.7 }, // NDB 09298 (31.672 g carb, 1.48 g fibre in 40 g, §2.4)
  rice: { name: 'Rice, white, long-grain, cooked', carbTotal: 28.17, fibre: 0.4 }, // NDB 20045 (check-values §11)
  water: { name: 'Water', carbTotal: 0, fibre: 0 },
} as const;
