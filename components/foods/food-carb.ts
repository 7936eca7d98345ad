import { carbInBasis, carbToShow } from '../../shared/compute/nutrients';
import { formatCarb } from '../../shared/compute/units';
import type { FoodSummary } from '../../shared/schemas/food';
import type { CarbBasis, CarbUnit } from '../../shared/schemas/units';
import { FOOD_SOURCE_LABELS } from '../../shared/schemas/food';

export const BASIS_WORDS: Record<CarbBasis, string> = {
  available: 'available carbohydrate (fibre not included)',
  total: 'total carbohydrate (fibre included)',
};
export const BASIS_SHORT: Record<CarbBasis, string> = { available: 'available carb', total: 'total carb' };

/** Carbohydrate in `grams` of a food in the profile's basis and unit, or null when the table does not know it. */
export function carbFor(food: Pick<FoodSummary, 'per100g'>, grams: number, basis: CarbBasis): number | null {
  const per100 = carbInBasis(food.per100g, basis);
  return per100 == null ? null : (per100 * grams) / 100;
}

/** The short note beside a total shown in the available basis because fibre was not measured. */
export const FIBRE_NOT_MEASURED = 'total, fibre not measured';

/**
 * "23.6 g" (or "2.4 CP"…), or "unknown". In the available basis a food whose fibre was not measured shows its
 * total instead of "unknown" (carbToShow); say so with `fibreNotMeasured` beside it.
 */
export function carbText(food: Pick<FoodSummary, 'per100g'>, grams: number, basis: CarbBasis, unit: CarbUnit): string {
  const shown = carbToShow(food.per100g, basis);
  return formatCarb(shown.grams == null ? null : (shown.grams * grams) / 100, unit);
}

/** True when the carbohydrate shown in this basis is the total because fibre was not measured. */
export function fibreNotMeasured(food: Pick<FoodSummary, 'per100g'>, basis: CarbBasis): boolean {
  return carbToShow(food.per100g, basis).fibreNotMeasured;
}

/** Short source name ("IFCT 2017", "USDA SR28", "Pack food"). */
export function sourceShort(food: Pick<FoodSummary, 'source'>): string {
  if (food.source === 'ifct2017') return 'IFCT 2017';
  if (food.source === 'pack') return 'Pack food';
  return FOOD_SOURCE_LABELS[food.source];
}

/** The one-line caption under a food's name in search results: its group ("Pack food" for yours); the source is on the food's page. */
export function rowCaption(food: Pick<FoodSummary, 'source' | 'group'>): string {
  if (food.source === 'pack') return 'Pack food';
  return food.group ?? sourceShort(food);
}
