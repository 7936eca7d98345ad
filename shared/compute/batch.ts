import type { CarbBasis } from '../schemas/units';
import { carbInBasis, scaleNutrients, sumNutrients, type NutrientKey, type Nutrients } from './nutrients';

/**
 * Batch arithmetic: the standard recipe calculation used in food-composition work (FAO/INFOODS,
 * Greenfield & Southgate 2003). Totals come from the weights actually used; carbohydrate is not lost
 * in cooking (retention 1), water is, so everything per gram divides by the COOKED weight, never the raw.
 */

/** One weighed ingredient as the batch snapshot keeps it. */
export type BatchIngredientLine = {
  per100g: Nutrients;
  /** What went in (g); ignored when omitted. */
  actualGrams: number;
  omitted?: boolean;
};

export type BatchComputation = {
  /** Sum of the actual raw weights (g). */
  rawGrams: number;
  cookedGrams: number;
  /** cooked ÷ raw; below 1 when water boiled off, above 1 when water was taken up. */
  yieldFactor: number;
  totals: Nutrients;
  /** Nutrients where some ingredient's value is unknown, so the total understates the truth. */
  incomplete: NutrientKey[];
  per100gCooked: Nutrients;
  /** Carbohydrate of the whole batch in the requested basis (g), null when unknown. */
  carbTotal: number | null;
  /** Carbohydrate per 100 g cooked in the requested basis (g), null when unknown. */
  carbPer100g: number | null;
};

/** Net grams on a scale: gross − container tare (g). Throws when the tare is not below the gross. */
export function netGrams(grossGrams: number, tareGrams: number): number {
  if (!(grossGrams > 0)) throw new RangeError('gross must be above 0 g');
  if (!(tareGrams >= 0)) throw new RangeError('tare must be 0 g or more');
  if (tareGrams >= grossGrams) throw new RangeError('tare must be below gross');
  return grossGrams - tareGrams;
}

/** Weight yield factor: cooked ÷ raw weight (Bognár 2002; EuroFIR D2.2.9). Below 1 when water cooks off. */
export function yieldFactor(cookedGrams: number, rawGrams: number): number {
  return cookedGrams / rawGrams;
}

/**
 * Computes a batch from actual ingredient weights and the cooked weight (g), in the given carbohydrate
 * basis. Omitted lines count for nothing. Throws when the cooked weight or the raw total is not above 0.
 */
export function computeBatch(lines: BatchIngredientLine[], cookedGrams: number, basis: CarbBasis): BatchComputation {
  if (!(cookedGrams > 0)) throw new RangeError('cooked weight must be above 0 g');
  const used = lines.filter((l) => !l.omitted);
  const rawGrams = used.reduce((sum, l) => sum + l.actualGrams, 0);
  if (!(rawGrams > 0)) throw new RangeError('the batch needs at least one ingredient above 0 g');
  const { totals, incomplete } = sumNutrients(used.map((l) => scaleNutrients(l.per100g, l.actualGrams)));
  const per100gCooked = scaleNutrients(totals, 10_000 / cookedGrams);
  return {
    rawGrams,
    cookedGrams,
    yieldFactor: yieldFactor(cookedGrams, rawGrams),
    totals,
    incomplete,
    per100gCooked,
    carbTotal: carbInBasis(totals, basis),
    carbPer100g: carbInBasis(per100gCooked, basis),
  };
}

/**
 * True when the batch's carbohydrate in `basis` is a partial sum (a used ingredient's value is unknown), so any
 * number from it understates the truth: portions and labels must then say "unknown", never a low number.
 */
export function carbUnderstated(totals: Pick<Nutrients, 'carbAvailable' | 'carbTotal'>, incomplete: readonly string[], basis: CarbBasis): boolean {
  const direct = basis === 'available' ? 'carbAvailable' : 'carbTotal';
  const other = basis === 'available' ? 'carbTotal' : 'carbAvailable';
  if (totals[direct] != null) return incomplete.includes(direct);
  return incomplete.includes(other) || incomplete.includes('fibre');
}

/** Carbohydrate (g) in a weighed portion: per-100 g cooked × net grams / 100. Null stays null. */
export function weighedPortionCarb(carbPer100g: number | null, netPortionGrams: number): number | null {
  return carbPer100g == null ? null : (carbPer100g * netPortionGrams) / 100;
}

/**
 * An equal split into `count` portions: each gets cooked ÷ N grams and batch carbohydrate ÷ N.
 * Throws unless count is a whole number ≥ 1.
 */
export function splitEqually(batch: Pick<BatchComputation, 'cookedGrams' | 'carbTotal'>, count: number) {
  if (!Number.isInteger(count) || count < 1) throw new RangeError('portion count must be a whole number ≥ 1');
  const netGrams = batch.cookedGrams / count;
  const carbGrams = batch.carbTotal == null ? null : batch.carbTotal / count;
  return Array.from({ length: count }, () => ({ netGrams, carbGrams }));
}

/** How a batch is divided: N equal portions, or portions each weighed (gross on the scale, container tare). */
export type BatchSplit =
  | { mode: 'equal'; count: number }
  | { mode: 'weighed'; portions: readonly { grossGrams: number; tareGrams: number }[] };

/** One portion of a split: its net grams and its carbohydrate in both bases (g; null when unknown). */
export type SplitShare = { netGrams: number; carbAvailable: number | null; carbTotal: number | null };

/**
 * Divides a computed batch into portions, counting carbohydrate in both bases at once (FAO recipe method,
 * Greenfield & Southgate 2003: per gram of the cooked dish). Equal: each gets cooked ÷ N grams and the
 * batch's carbohydrate ÷ N. Weighed: each gets its net grams (gross − tare) × carbohydrate per 100 g cooked ÷ 100.
 * Throws a RangeError for a count that is not a whole number ≥ 1 or a tare not below its gross.
 */
export function splitBatch(batch: Pick<BatchComputation, 'cookedGrams' | 'totals' | 'per100gCooked'>, split: BatchSplit): SplitShare[] {
  if (split.mode === 'equal') {
    const available = splitEqually({ cookedGrams: batch.cookedGrams, carbTotal: carbInBasis(batch.totals, 'available') }, split.count);
    const total = splitEqually({ cookedGrams: batch.cookedGrams, carbTotal: carbInBasis(batch.totals, 'total') }, split.count);
    return available.map((share, i) => ({ netGrams: share.netGrams, carbAvailable: share.carbGrams, carbTotal: total[i].carbGrams }));
  }
  const per100Available = carbInBasis(batch.per100gCooked, 'available');
  const per100Total = carbInBasis(batch.per100gCooked, 'total');
  return split.portions.map((w) => {
    const net = netGrams(w.grossGrams, w.tareGrams);
    return { netGrams: net, carbAvailable: weighedPortionCarb(per100Available, net), carbTotal: weighedPortionCarb(per100Total, net) };
  });
}

/**
 * Scales and weighing are not exact: weighed portions may add up to this many grams more than the
 * cooked weight before we call it a mistake (common practice for 1 g kitchen scales read several times).
 */
export const SPLIT_TOLERANCE_GRAMS = 2;

/** Grams of the batch not yet put into portions (may be slightly negative within the tolerance). */
export function gramsLeftToSplit(cookedGrams: number, portionNetGrams: number[]): number {
  return cookedGrams - portionNetGrams.reduce((sum, g) => sum + g, 0);
}

/** True when weighed portions hold more than the batch (beyond SPLIT_TOLERANCE_GRAMS). */
export function splitExceedsBatch(cookedGrams: number, portionNetGrams: number[]): boolean {
  return gramsLeftToSplit(cookedGrams, portionNetGrams) < -SPLIT_TOLERANCE_GRAMS;
}

/** Difference between what the scale read and what the recipe planned (g): actual − planned. */
export function weighingDifference(plannedGrams: number, actualGrams: number): number {
  return actualGrams - plannedGrams;
}
