import type { DoseSettings } from '../../shared/compute/dose';
import { DEFAULT_EXERCISE_REDUCTIONS } from '../../shared/compute/exercise';

/**
 * Invented dose settings for tests (nobody's real ratios): mmol/L, 0.5-unit pen rounded down, 15 U cap,
 * 4 h action time, target 5–8 with correction to 6, low at 3.9 (IHSG 2017), ketone caution at 15.
 * The exercise table is written out (Rabasa-Lhoret et al., Diabetes Care 2001, as tabulated by ADA's
 * Diabetes Spectrum; hard for 60 minutes "not established", from memory) rather than taken from the code under test.
 */
export const TEST_DOSE_SETTINGS = {
  glucoseUnit: 'mmol_l',
  carbBasis: 'available',
  carbUnit: 'g',
  penIncrement: 0.5,
  rounding: 'down',
  maxDoseUnits: 15,
  actionTimeHours: 4,
  targetLow: 5,
  targetHigh: 8,
  correctionTarget: 6,
  hypoThreshold: 3.9,
  veryHigh: 15,
  allowNegativeCorrection: false,
  iobConvention: 'correction_only',
  exerciseReductions: { light: { min30: 25, min60: 50 }, moderate: { min30: 50, min60: 75 }, hard: { min30: 75, min60: null } },
} as const;

/**
 * The same invented settings as the dose engine takes them (glucose in mmol/L), with the product's default exercise
 * table; tests override what they vary.
 */
export function engineSettings(over: Partial<DoseSettings> = {}): DoseSettings {
  return {
    penIncrement: 0.5,
    rounding: 'down',
    maxDoseUnits: 15,
    actionTimeHours: 4,
    targetLowMmol: 5,
    targetHighMmol: 8,
    correctionTargetMmol: 6,
    hypoThresholdMmol: 3.9,
    veryHighMmol: 15,
    allowNegativeCorrection: false,
    iobConvention: 'correction_only',
    exerciseReductions: DEFAULT_EXERCISE_REDUCTIONS,
    ...over,
  };
}
