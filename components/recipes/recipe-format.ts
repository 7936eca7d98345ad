import { formatCarb } from '../../shared/compute/units';
import type { CarbAmount } from '../../shared/compute/recipe';
import type { CarbUnit } from '../../shared/schemas/units';

/** Carbohydrate for display: the shared formatCarb rule ("unknown" when it cannot be known) on an amount or grams. */
export function showCarb(amount: CarbAmount | number | null, unit: CarbUnit): string {
  return formatCarb(typeof amount === 'number' || amount === null ? amount : amount.grams, unit);
}

/** Weights for display: whole grams from 10 g, tenths below (stored values keep full precision). */
export function showGrams(grams: number): string {
  return grams >= 10 ? `${Math.round(grams)} g` : `${(Math.round(grams * 10) / 10).toFixed(1)} g`;
}

export const BASIS_WORDS = { available: 'available carbohydrate (fibre not counted)', total: 'total carbohydrate (fibre counted)' } as const;

export const VISIBILITY_WORDS = {
  private: 'Only you',
  shared: 'You and the people you share it with',
  public: 'Everyone signed in (public library)',
} as const;
