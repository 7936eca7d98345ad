import { carbInBasis, type Nutrients } from '../../shared/compute/nutrients';

/**
 * Completes the carbohydrate pair from what a source published (see shared/reference/datasets.md §4):
 * available = total − fibre, total = available + fibre, only where fibre is known. Returns the keys derived.
 */
export function deriveCarbs(n: Nutrients, measured: 'available' | 'total'): { nutrients: Nutrients; derived: string[] } {
  const out = { ...n };
  const derived: string[] = [];
  // The other basis comes from the one rule in shared/compute, applied to what the source published only.
  const other = measured === 'total' ? 'carbAvailable' : 'carbTotal';
  const published = measured === 'total' ? { carbTotal: n.carbTotal, carbAvailable: null } : { carbAvailable: n.carbAvailable, carbTotal: null };
  const value = carbInBasis({ ...published, fibre: n.fibre }, measured === 'total' ? 'available' : 'total');
  out[other] = value == null ? null : roundTo(value, 6);
  if (value != null) derived.push(other);
  return { nutrients: out, derived };
}

/** Energy from the other unit when a source gives only one (1 kcal = 4.184 kJ, the thermochemical calorie). */
export function completeEnergy(n: Nutrients, derived: string[]): void {
  if (n.energyKj == null && n.energyKcal != null) {
    n.energyKj = roundTo(n.energyKcal * 4.184, 3);
    derived.push('energyKj');
  } else if (n.energyKcal == null && n.energyKj != null) {
    n.energyKcal = roundTo(n.energyKj / 4.184, 3);
    derived.push('energyKcal');
  }
}

/** Rounds away floating-point dust from subtraction (not display rounding). */
export function roundTo(x: number, places: number): number {
  const f = 10 ** places;
  return Math.round(x * f) / f;
}
