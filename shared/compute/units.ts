import type { CarbUnit, GlucoseUnit } from '../schemas/units';

/**
 * Grams of carbohydrate in one counting unit. Sources: 10 g carbohydrate portion (UK NHS education,
 * also DE/AT KE, CH BW); 12 g Broteinheit (German Diätverordnung, until 2010); 15 g exchange
 * (Choose Your Foods: Exchange Lists for Diabetes, ADA/AND 2008).
 */
export const CARB_UNIT_GRAMS: Record<CarbUnit, number> = { g: 1, portion10: 10, unit12: 12, exchange15: 15 };

/** Short names for display. */
export const CARB_UNIT_LABEL: Record<CarbUnit, { short: string; long: string }> = {
  g: { short: 'g', long: 'grams of carbohydrate' },
  portion10: { short: 'CP', long: 'carbohydrate portions of 10 g' },
  unit12: { short: 'BU', long: 'bread units of 12 g' },
  exchange15: { short: 'ex', long: 'exchanges of 15 g' },
};

/** Converts grams of carbohydrate to the given counting unit (full precision). */
export function gramsToCarbUnit(grams: number, unit: CarbUnit): number {
  return grams / CARB_UNIT_GRAMS[unit];
}

/** Converts an amount in a counting unit back to grams (full precision). */
export function carbUnitToGrams(amount: number, unit: CarbUnit): number {
  return amount * CARB_UNIT_GRAMS[unit];
}

/**
 * mg/dL per mmol/L for glucose: molar mass of C6H12O6 = 180.156 g/mol
 * (6×12.011 + 12×1.008 + 6×15.999), so 1 mmol/L = 18.0156 mg/dL.
 */
export const GLUCOSE_MGDL_PER_MMOL = 18.0156;

/** mg/dL → mmol/L (full precision). */
export function mgdlToMmol(mgdl: number): number {
  return mgdl / GLUCOSE_MGDL_PER_MMOL;
}

/** mmol/L → mg/dL (full precision). */
export function mmolToMgdl(mmol: number): number {
  return mmol * GLUCOSE_MGDL_PER_MMOL;
}

/** A glucose value in the given display unit → mmol/L (the stored unit). */
export function glucoseToMmol(value: number, unit: GlucoseUnit): number {
  return unit === 'mmol_l' ? value : mgdlToMmol(value);
}

/** A stored mmol/L value → the given display unit. */
export function glucoseFromMmol(mmol: number, unit: GlucoseUnit): number {
  return unit === 'mmol_l' ? mmol : mmolToMgdl(mmol);
}

/** Rounds for display only: mmol/L to 0.1, mg/dL to whole numbers. */
export function formatGlucose(mmol: number, unit: GlucoseUnit): string {
  return unit === 'mmol_l' ? `${(Math.round(mmol * 10) / 10).toFixed(1)} mmol/L` : `${Math.round(mmolToMgdl(mmol))} mg/dL`;
}

/** The one word for a value nobody measured (README glossary). */
export const UNKNOWN = 'unknown';

/**
 * The one display rule for carbohydrate: grams ≥ 10 to the nearest 1 g, under 10 g to 0.1 g
 * (the EU label tolerance guidance pattern, from memory); counting units to 0.1; a value that rounds to a whole number
 * shows no ".0" ("0 g", "5 g", "2 CP"); null → "unknown". `withGrams` adds the grams after a counting unit ("2.4 CP (24 g)").
 */
export function formatCarb(grams: number | null, unit: CarbUnit = 'g', opts: { withGrams?: boolean } = {}): string {
  if (grams == null) return UNKNOWN;
  // String() of a value rounded to a tenth drops a trailing ".0" (and turns -0 into "0").
  const tenth = (v: number) => String(Math.round(v * 10) / 10 || 0);
  if (unit === 'g') return grams >= 10 ? `${Math.round(grams)} g` : `${tenth(grams)} g`;
  const text = `${tenth(gramsToCarbUnit(grams, unit))} ${CARB_UNIT_LABEL[unit].short}`;
  return opts.withGrams ? `${text} (${formatCarb(grams, 'g')})` : text;
}
