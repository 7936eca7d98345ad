import type { CarbBasis, CarbUnit } from '../schemas/units';
import { carbInBasis, emptyNutrients, scaleNutrients, sumNutrients, type NutrientKey, type Nutrients } from './nutrients';
import { gramsToCarbUnit } from './units';

/** One weighed ingredient line: raw grams of a food whose composition is given per 100 g. */
export type RecipeLine = { grams: number; per100g: Nutrients };

/** Carbohydrate of an amount in the requested basis: grams (null = unknown) and the same in the counting unit. */
export type CarbAmount = { grams: number | null; inUnit: number | null };

export type IngredientBreakdown = { grams: number; nutrients: Nutrients; carb: CarbAmount };

/** The full recipe breakdown at full precision; rounding happens only where it is shown. */
export type RecipeNutrition = {
  basis: CarbBasis;
  unit: CarbUnit;
  portions: number;
  rawWeightGrams: number;
  ingredients: IngredientBreakdown[];
  totals: Nutrients;
  /** Nutrient keys where at least one ingredient's value is unknown: those totals understate the truth. */
  incomplete: NutrientKey[];
  /** True when some ingredient has no carbohydrate value in this basis (the carbohydrate figures are then too low). */
  carbIncomplete: boolean;
  carbTotal: CarbAmount;
  perPortion: Nutrients;
  carbPerPortion: CarbAmount;
  /** Per 100 g of the raw mixture (before any cooking); null values when the raw weight is 0. */
  per100gRaw: Nutrients;
  carbPer100gRaw: CarbAmount;
  portionGrams: number;
};

function divideNutrients(n: Nutrients, divisor: number): Nutrients {
  const out = emptyNutrients();
  if (!(divisor > 0)) return out;
  for (const k of Object.keys(n) as NutrientKey[]) out[k] = n[k] == null ? null : (n[k] as number) / divisor;
  return out;
}

/** Carbohydrate in the given basis and counting unit, or nulls when it cannot be known. */
export function carbAmount(n: Nutrients, basis: CarbBasis, unit: CarbUnit): CarbAmount {
  const grams = carbInBasis(n, basis);
  return { grams, inUnit: grams == null ? null : gramsToCarbUnit(grams, unit) };
}

/**
 * Recipe calculation (FAO recipe method, Greenfield & Southgate 2003): each ingredient's nutrients =
 * per-100 g × grams / 100; totals = their sum; per portion = totals / portions (equal split);
 * per 100 g raw = totals / raw weight × 100. Grams must be > 0 and portions a whole number ≥ 1,
 * otherwise a RangeError. No ingredients gives zero weight and unknown per-100 g values.
 */
export function computeRecipe(
  lines: RecipeLine[],
  options: { portions: number; basis: CarbBasis; unit?: CarbUnit },
): RecipeNutrition {
  const { portions, basis, unit = 'g' } = options;
  if (!Number.isInteger(portions) || portions < 1) throw new RangeError('portions must be a whole number of at least 1');
  for (const line of lines) {
    if (!Number.isFinite(line.grams) || line.grams <= 0) throw new RangeError('every ingredient needs more than 0 g');
  }
  const ingredients = lines.map((line) => {
    const nutrients = scaleNutrients(line.per100g, line.grams);
    return { grams: line.grams, nutrients, carb: carbAmount(nutrients, basis, unit) };
  });
  const { totals, incomplete } = sumNutrients(ingredients.map((i) => i.nutrients));
  const rawWeightGrams = lines.reduce((sum, l) => sum + l.grams, 0);
  const carbGrams = ingredients.reduce<number | null>(
    (sum, i) => (i.carb.grams == null ? sum : (sum ?? 0) + i.carb.grams),
    lines.length ? null : 0,
  );
  const carbTotal: CarbAmount = { grams: carbGrams, inUnit: carbGrams == null ? null : gramsToCarbUnit(carbGrams, unit) };
  const divide = (amount: CarbAmount, by: number): CarbAmount =>
    amount.grams == null || !(by > 0)
      ? { grams: null, inUnit: null }
      : { grams: amount.grams / by, inUnit: gramsToCarbUnit(amount.grams / by, unit) };
  return {
    basis,
    unit,
    portions,
    rawWeightGrams,
    ingredients,
    totals,
    incomplete,
    carbIncomplete: ingredients.some((i) => i.carb.grams == null),
    carbTotal,
    perPortion: divideNutrients(totals, portions),
    carbPerPortion: divide(carbTotal, portions),
    per100gRaw: divideNutrients(totals, rawWeightGrams / 100),
    carbPer100gRaw: divide(carbTotal, rawWeightGrams / 100),
    portionGrams: rawWeightGrams / portions,
  };
}

/** Multiplies every ingredient's grams by factor (> 0, finite); full precision, no rounding. */
export function scaleRecipeLines<T extends { grams: number }>(lines: T[], factor: number): T[] {
  if (!Number.isFinite(factor) || factor <= 0) throw new RangeError('the scale factor must be more than 0');
  return lines.map((line) => ({ ...line, grams: line.grams * factor }));
}

/** The factor that turns a recipe for `from` portions into one for `to` portions (both whole numbers ≥ 1). */
export function scaleFactorForPortions(from: number, to: number): number {
  if (!Number.isInteger(from) || from < 1 || !Number.isInteger(to) || to < 1) {
    throw new RangeError('portions must be whole numbers of at least 1');
  }
  return to / from;
}
