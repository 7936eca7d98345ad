import type { NutrientKey } from '../../shared/compute/nutrients';

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
