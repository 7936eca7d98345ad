import { formatCarb } from '../../shared/compute/units';
import type { CarbAmount } from '../../shared/compute/recipe';
import type { CarbUnit } from '../../shared/schemas/units';

/** Carbohydrate for display (the shared formatCarb rule), or a dash when it cannot be known. */
export function showCarb(amount: CarbAmount | number | null, unit: CarbUnit): string {
  const grams = typeof amount === 'number' || amount === null ? amount : amount.grams;
  return grams == null ? '–' : formatCarb(grams, unit);
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
