/** The shopping list's arithmetic: grams per food summed across recipes, grouped by food group, with a household measure. */

export type ShoppingUse = { foodId: number; grams: number; recipe: string };
export type ShoppingMeasure = { foodId: number; label: string; grams: number };

/** Rounds a count of household measures to the nearest half (common practice for a shopping list), at least a half. */
export function measureCount(grams: number, measureGrams: number): number {
  return Math.max(0.5, Math.round((grams / measureGrams) * 2) / 2);
}

/**
 * Sums grams per food across every recipe that uses it, groups the foods by their group (sorted by name, "Other"
 * last), and gives the first household measure of the food (in the table's order) as a rounded count.
 */
export function shoppingLines(
  uses: readonly ShoppingUse[],
  foods: ReadonlyMap<number, { name: string; group: string | null }>,
  measures: readonly ShoppingMeasure[],
  ticked: ReadonlySet<number>,
) {
  const byFood = new Map<number, { grams: number; recipes: Set<string> }>();
  for (const u of uses) {
    const line = byFood.get(u.foodId) ?? { grams: 0, recipes: new Set<string>() };
    line.grams += u.grams;
    line.recipes.add(u.recipe);
    byFood.set(u.foodId, line);
  }
  const groups = new Map<string, { foodId: number; foodName: string; group: string; grams: number; measure: { label: string; grams: number; count: number } | null; recipes: string[]; ticked: boolean }[]>();
  for (const [foodId, line] of byFood) {
    const food = foods.get(foodId);
    const group = food?.group || 'Other';
    const m = measures.find((x) => x.foodId === foodId && x.grams > 0);
    const list = groups.get(group) ?? [];
    list.push({
      foodId,
      foodName: food?.name ?? 'Unknown food',
      group,
      grams: line.grams,
      measure: m ? { label: m.label, grams: m.grams, count: measureCount(line.grams, m.grams) } : null,
      recipes: [...line.recipes].sort(),
      ticked: ticked.has(foodId),
    });
    groups.set(group, list);
  }
  return [...groups.entries()]
    .sort(([a], [b]) => (a === 'Other' ? 1 : b === 'Other' ? -1 : a.localeCompare(b)))
    .map(([group, lines]) => ({ group, lines: lines.sort((a, b) => a.foodName.localeCompare(b.foodName)) }));
}
