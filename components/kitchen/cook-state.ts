import { computeBatch, gramsLeftToSplit, weighedPortionCarb, type BatchComputation } from '../../shared/compute/batch';
import type { Nutrients } from '../../shared/compute/nutrients';
import type { CreateBatchInput } from '../../shared/schemas/batch';
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

/** A scale reading of something in a container, as typed. */
export type Weighing = { containerId: number | null; tare: string; gross: string };

export type CookState = {
  lines: CookLine[];
  pot: Weighing;
  splitMode: 'equal' | 'weighed';
  count: string;
  jars: Weighing[];
  storage: 'fridge' | 'freezer';
  region: 'uk' | 'us';
  cookedOn: string;
  useBy: string;
};

/** A typed number, or null when it is empty or not a number. */
export function num(text: string): number | null {
  const t = text.trim().replace(',', '.');
  if (t === '') return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : null;
}

/** Net grams of a weighing, or null until both numbers are sensible. */
export function netOf(w: Weighing): number | null {
  const gross = num(w.gross);
  const tare = num(w.tare) ?? 0;
  return gross != null && gross > 0 && tare >= 0 && tare < gross ? gross - tare : null;
}

/** The batch arithmetic for what is typed so far (same shared functions as the server), or null. */
export function previewBatch(state: CookState, basis: CarbBasis): BatchComputation | null {
  const cooked = netOf(state.pot);
  const lines = state.lines.map((l) => ({ per100g: l.per100g, actualGrams: num(l.reading) ?? 0, omitted: l.omitted }));
  if (cooked == null) return null;
  try {
    return computeBatch(lines, cooked, basis);
  } catch {
    return null;
  }
}

/** Grams not yet put into jars, and each jar's carbohydrate (g) so far. */
export function previewJars(state: CookState, batch: BatchComputation | null) {
  const nets = state.jars.map(netOf);
  const left = batch ? gramsLeftToSplit(batch.cookedGrams, nets.map((n) => n ?? 0)) : null;
  return { nets, left, carbs: nets.map((n) => (n == null || !batch ? null : weighedPortionCarb(batch.carbPer100g, n))) };
}

/** The request body the server validates (it re-checks everything and computes the numbers it stores). */
export function toCreateInput(recipeId: number, scaleFactor: number, s: CookState): CreateBatchInput {
  const weighing = (w: Weighing) => ({ containerId: w.containerId, grossGrams: num(w.gross) ?? 0, tareGrams: num(w.tare) ?? 0 });
  return {
    recipeId,
    scaleFactor,
    cookedOn: s.cookedOn,
    storage: s.storage,
    region: s.region,
    useBy: s.useBy || null,
    ingredients: s.lines.map((l) => ({
      foodId: l.foodId,
      plannedGrams: l.plannedGrams,
      actualGrams: l.omitted ? null : num(l.reading),
      omitted: l.omitted,
      swappedFromFoodId: l.swappedFrom?.foodId ?? null,
    })),
    cookedWeight: weighing(s.pot),
    split: s.splitMode === 'equal' ? { mode: 'equal', count: num(s.count) ?? 0 } : { mode: 'weighed', portions: s.jars.map(weighing) },
  };
}

/** Which step a server field error belongs to. */
export function stepOfField(field: string): 'weigh' | 'cooked' | 'split' | 'store' {
  if (field.startsWith('ingredients') || field === 'recipeId') return 'weigh';
  if (field.startsWith('cookedWeight')) return 'cooked';
  if (field.startsWith('split')) return 'split';
  return 'store';
}
