import type { NutrientKey } from '../../shared/compute/nutrients';
import type { FoodInput } from './dataset';
import { completeEnergy, deriveCarbs } from './food-rows';

/** SR nutrient numbers (NUTR_DEF Nutr_No; FDC nutrient.csv nutrient_nbr) of the values Carbwright keeps, with their unit. */
export const SR_NUTRIENTS: Record<string, { key: NutrientKey; unit: string }> = {
  '208': { key: 'energyKcal', unit: 'kcal' },
  '268': { key: 'energyKj', unit: 'kj' },
  '205': { key: 'carbTotal', unit: 'g' },
  '291': { key: 'fibre', unit: 'g' },
  '269': { key: 'sugars', unit: 'g' },
  '203': { key: 'protein', unit: 'g' },
  '204': { key: 'fat', unit: 'g' },
  '255': { key: 'water', unit: 'g' },
};

export const USDA_CARB_NOTE =
  'USDA publishes carbohydrate by difference, which includes fibre (total); available = total − fibre is derived here.';

/** Formats a household amount without trailing zeros: 1.0 → "1", .333 → "0.333". */
export function formatAmount(n: number): string {
  return String(Number(n.toFixed(3)));
}

/**
 * The last step both USDA layouts share: household measures attached in the file's order (by sequence
 * number), and carbohydrate by difference (total) completed with the derived available value and energy.
 */
export function finishUsdaFoods(foods: Map<string, FoodInput>, measures: { key: string; seq: number; label: string; grams: number }[]): void {
  measures.sort((a, b) => a.seq - b.seq);
  for (const m of measures) foods.get(m.key)!.measures.push({ label: m.label, grams: m.grams });
  for (const food of foods.values()) {
    const { nutrients, derived } = deriveCarbs(food.nutrients, 'total');
    completeEnergy(nutrients, derived);
    food.nutrients = nutrients;
    food.derived = derived;
  }
}
