import { carbUnderstated, computeBatch, gramsLeftToSplit, netGrams, splitBatch, type BatchComputation, type BatchSplit } from '../../shared/compute/batch';
import { batchContainsRice } from '../../shared/compute/use-by';
import type { Nutrients } from '../../shared/compute/nutrients';
import { defaultUseBy } from '../../shared/compute/use-by';
import type { RecipeDetail } from '../../shared/schemas/recipe';
import type { CarbBasis } from '../../shared/schemas/units';

/** One line of the weighing checklist while cooking. */
export type CookLine = {
  foodId: number;
  foodName: string;
  per100g: Nutrients;
  plannedGrams: number;
  reading: string;
  omitted: boolean;
  swappedFrom: { foodId: number; foodName: string } | null;
};

/** A scale reading of something in a container, as typed; containerId is a saved container's id, '' for another. */
export type Weighing = { containerId: string; tare: string; gross: string };

/** The whole cook as one form: the weighing checklist, the pot, the portions, storage. */
export type CookFormValues = {
  recipeId: number;
  factor: string;
  lines: CookLine[];
  pot: Weighing;
  splitMode: 'equal' | 'weighed';
  count: string;
  /** Weighed portions, one container each. */
  portions: Weighing[];
  storage: 'fridge' | 'freezer';
  region: 'uk' | 'us';
  cookedOn: string;
  useBy: string;
};

export const EMPTY_WEIGHING: Weighing = { containerId: '', tare: '', gross: '' };

/** A typed number, or null when it is empty or not a number. */
export function num(text: string): number | null {
  const t = text.trim().replace(',', '.');
  if (t === '') return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : null;
}

/** The checklist of a recipe at a scale factor (nothing weighed yet). */
export function plannedLines(recipe: RecipeDetail, factor: number): CookLine[] {
  return recipe.ingredients.map((i) => ({
    foodId: i.foodId,
    foodName: i.food.name,
    per100g: i.food.per100g,
    plannedGrams: i.grams * factor,
    reading: '',
    omitted: false,
    swappedFrom: null,
  }));
}

/** The starting values of a cook of `recipe` on `today` (YYYY-MM-DD), with the food-safety advice of `region`. */
export function cookFormDefaults(recipe: RecipeDetail, today: string, region: 'uk' | 'us'): CookFormValues {
  return {
    recipeId: recipe.id,
    factor: '1',
    lines: plannedLines(recipe, 1),
    pot: EMPTY_WEIGHING,
    splitMode: 'weighed',
    count: String(recipe.defaultPortions),
    portions: [EMPTY_WEIGHING],
    storage: 'fridge',
    region,
    cookedOn: today,
    useBy: defaultUseBy(today, 'fridge', region).useBy,
  };
}

/** Whether a rice ingredient is in the pot (the use-by advice is shorter for cooked rice). */
export const hasRice = (lines: Partial<CookLine>[]) =>
  batchContainsRice(lines.filter(Boolean).map((l) => ({ foodName: l.foodName ?? '', omitted: l.omitted })));

/** True once anything has been weighed or left out (the plan is then fixed). */
export const cookStarted = (lines: CookLine[]) => lines.some((l) => l.reading !== '' || l.omitted);

/** Net grams of a weighing (the shared gross − tare rule), or null until both numbers are sensible. */
export function netOf(w: Weighing): number | null {
  const gross = num(w.gross);
  if (gross == null) return null;
  try {
    return netGrams(gross, num(w.tare) ?? 0);
  } catch {
    return null;
  }
}

/** Each portion of a split in the counted basis (the server's splitBatch), or null when the split is not valid yet. */
export function previewSplit(batch: BatchComputation, split: BatchSplit, basis: CarbBasis): { netGrams: number; carbGrams: number | null }[] | null {
  const unknown = carbUnderstated(batch.totals, batch.incomplete, basis);
  try {
    return splitBatch(batch, split).map((s) => ({ netGrams: s.netGrams, carbGrams: unknown ? null : basis === 'available' ? s.carbAvailable : s.carbTotal }));
  } catch {
    return null;
  }
}

/** The batch arithmetic for what is typed so far (same shared functions as the server), or null. */
export function previewBatch(v: Pick<CookFormValues, 'lines' | 'pot'>, basis: CarbBasis): BatchComputation | null {
  const cooked = netOf(v.pot);
  const lines = v.lines.map((l) => ({ per100g: l.per100g, actualGrams: num(l.reading) ?? 0, omitted: l.omitted }));
  if (cooked == null) return null;
  try {
    const batch = computeBatch(lines, cooked, basis);
    // Like the server: a partial sum in the counted basis is shown as unknown, never as a low number.
    return carbUnderstated(batch.totals, batch.incomplete, basis) ? { ...batch, carbTotal: null, carbPer100g: null } : batch;
  } catch {
    return null;
  }
}

/** Grams not yet put into containers, and each weighed portion's carbohydrate (g) so far. */
export function previewPortions(portions: Weighing[], batch: BatchComputation | null, basis: CarbBasis) {
  const nets = portions.map(netOf);
  const left = batch ? gramsLeftToSplit(batch.cookedGrams, nets.map((n) => n ?? 0)) : null;
  const carbOf = (w: Weighing, n: number | null) =>
    n == null || !batch ? null : (previewSplit(batch, { mode: 'weighed', portions: [{ grossGrams: num(w.gross)!, tareGrams: num(w.tare) ?? 0 }] }, basis)?.[0].carbGrams ?? null);
  return { nets, left, carbs: portions.map((w, i) => carbOf(w, nets[i])) };
}
