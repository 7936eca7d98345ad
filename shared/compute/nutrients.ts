import type { CarbBasis } from '../schemas/units';

/** The nutrient keys Carbwright carries, per 100 g edible portion (g, except energy). null = not known. */
export const NUTRIENT_KEYS = [
  'energyKcal',
  'energyKj',
  'carbAvailable',
  'carbTotal',
  'fibre',
  'sugars',
  'protein',
  'fat',
  'water',
] as const;
export type NutrientKey = (typeof NUTRIENT_KEYS)[number];
export type Nutrients = Record<NutrientKey, number | null>;

/**
 * All-null nutrients (nothing known). A literal, keys in NUTRIENT_KEYS order: every nutrient object then shares one
 * shape, and a recipe shelf makes thousands of them per request (building it from the key list cost most of
 * computeRecipe's time).
 */
export function emptyNutrients(): Nutrients {
  return { energyKcal: null, energyKj: null, carbAvailable: null, carbTotal: null, fibre: null, sugars: null, protein: null, fat: null, water: null };
}

/** Nutrients in `grams` of a food given per 100 g: value × grams / 100 (null stays null). */
export function scaleNutrients(per100g: Nutrients, grams: number): Nutrients {
  const out = emptyNutrients();
  for (const k of NUTRIENT_KEYS) out[k] = per100g[k] == null ? null : (per100g[k] * grams) / 100;
  return out;
}

/**
 * Sums nutrient amounts. A total is null only when no part knows it; `incomplete` lists the keys
 * where at least one part was unknown (the total then understates the truth and must say so).
 */
export function sumNutrients(parts: Nutrients[]): { totals: Nutrients; incomplete: NutrientKey[] } {
  const totals = emptyNutrients();
  const incomplete: NutrientKey[] = [];
  for (const k of NUTRIENT_KEYS) {
    let known = false;
    let unknown = false;
    let sum = 0;
    for (const p of parts) {
      if (p[k] == null) unknown = true;
      else {
        known = true;
        sum += p[k];
      }
    }
    totals[k] = known ? sum : null;
    if (known && unknown) incomplete.push(k);
  }
  return { totals, incomplete };
}

/**
 * Carbohydrate in the requested basis. Available = carbohydrate without fibre; total = with fibre
 * (21 CFR 101.9(c)(6) "by difference" includes fibre; Reg. (EU) 1169/2011 Annex I excludes it).
 * Uses the stored value for that basis, else derives it: available = total − fibre, total = available + fibre.
 * Returns null when neither can be had.
 */
export function carbInBasis(n: Pick<Nutrients, 'carbAvailable' | 'carbTotal' | 'fibre'>, basis: CarbBasis): number | null {
  if (basis === 'available') {
    if (n.carbAvailable != null) return n.carbAvailable;
    if (n.carbTotal != null && n.fibre != null) return Math.max(0, n.carbTotal - n.fibre);
    return null;
  }
  if (n.carbTotal != null) return n.carbTotal;
  if (n.carbAvailable != null && n.fibre != null) return n.carbAvailable + n.fibre;
  return null;
}

/** Carbohydrate per 100 g as shown for a food, with the plain note it may need. */
export type CarbShown = { grams: number | null; basisShown: CarbBasis | null; fibreNotMeasured: boolean };

/**
 * What to show for a food's carbohydrate in a basis. Where the basis value is known (stored or derived) it is
 * shown. In the available basis, a food with total carbohydrate but no fibre value (594 USDA SR28 foods) has
 * unknown available carbohydrate: the total is shown instead, marked `fibreNotMeasured`, so the person can use it
 * knowingly — the missing fibre is never counted as 0, and `carbInBasis` stays unknown for sums.
 */
export function carbToShow(n: Pick<Nutrients, 'carbAvailable' | 'carbTotal' | 'fibre'>, basis: CarbBasis): CarbShown {
  const grams = carbInBasis(n, basis);
  if (grams != null) return { grams, basisShown: basis, fibreNotMeasured: false };
  if (basis === 'available' && n.carbTotal != null && n.fibre == null) {
    return { grams: n.carbTotal, basisShown: 'total', fibreNotMeasured: true };
  }
  return { grams: null, basisShown: null, fibreNotMeasured: false };
}
