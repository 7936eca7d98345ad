import { carbInBasis } from '../../shared/compute/nutrients';
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

/** "23.6 g" (or "2.4 CP"…), or "not known". */
export function carbText(food: Pick<FoodSummary, 'per100g'>, grams: number, basis: CarbBasis, unit: CarbUnit): string {
  const value = carbFor(food, grams, basis);
  return value == null ? 'not known' : formatCarb(value, unit);
}

/** Short source name for lists ("IFCT 2017", "USDA SR28", "Your label"). */
export function sourceShort(food: Pick<FoodSummary, 'source'>): string {
  if (food.source === 'ifct2017') return 'IFCT 2017';
  if (food.source === 'label') return 'Label food';
  return FOOD_SOURCE_LABELS[food.source];
}
