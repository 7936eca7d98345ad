/**
 * The dose suggestion engine: the one implementation, used by the server (the authority) and for
 * display by the client. Pure: every time is passed in as epoch milliseconds.
 * Formulas (check-values §3): meal = carbohydrate ÷ insulin-to-carb ratio; correction =
 * (glucose − correction target) ÷ correction factor; active insulin from ./active-insulin;
 * exercise reduction from ./exercise; round to the pen increment (down by default), cap at the maximum.
 */
import type { GlucoseUnit } from '../schemas/units';
import { activeInsulin, recentDoses, type ActiveInsulinModel, type EarlierDose } from './active-insulin';
import { exerciseReduction, type ExerciseReductionTable, type PlannedExercise } from './exercise';
import { glucoseToMmol } from './units';

export type Rounding = 'down' | 'nearest';
/** correction_only: active insulin lowers the correction only, never below 0; total: it lowers the whole dose. */
export type IobConvention = 'correction_only' | 'total';

/** A profile's dose settings, glucose in mmol/L (the stored unit). */
export type DoseSettings = {
  penIncrement: number;
  rounding: Rounding;
  maxDoseUnits: number;
  actionTimeHours: number;
  /** How active insulin falls over the action time: a straight line (default) or the curve. */
  activeInsulinModel: ActiveInsulinModel;
  targetLowMmol: number;
  targetHighMmol: number;
  correctionTargetMmol: number;
  hypoThresholdMmol: number;
  veryHighMmol: number;
  allowNegativeCorrection: boolean;
  iobConvention: IobConvention;
  exerciseReductions: ExerciseReductionTable;
};

/** A time of day, minutes from midnight [startMinute, endMinute); ratio in g per unit. */
export type TimeOfDay = { startMinute: number; endMinute: number; carbRatio: number; correctionFactorMmol: number };
export type DayKindRatios = { id: number; name: string; timesOfDay: TimeOfDay[] };

export type DoseInput = {
  /** Carbohydrate in grams, in the profile's basis. */
  carbsGrams: number;
  glucose?: { value: number; unit: GlucoseUnit; takenAt: number } | null;
  mealAt: number;
  /** Local time of the meal, minutes from midnight (chooses the time of day). */
  mealMinuteOfDay: number;
  earlierDoses?: EarlierDose[];
  exercise?: PlannedExercise | null;
  split?: { nowPercent: number; laterMinutes: number } | null;
  fatGrams?: number | null;
  proteinGrams?: number | null;
};

export type DoseWarningCode =
  | 'no_settings'
  | 'treat_low'
  | 'ketone_check'
  | 'glucose_missing'
  | 'glucose_stale'
  | 'recent_insulin'
  | 'capped'
  | 'exercise_note'
  | 'negative_correction';
export type DoseWarning = { code: DoseWarningCode; tone: 'danger' | 'caution' | 'info'; message: string };

export type DoseBreakdown = {
  carbsGrams: number;
  carbRatio: number;
  mealUnits: number;
  exercisePercent: number;
  exerciseUnits: number;
  mealAfterExerciseUnits: number;
  glucoseMmol: number | null;
  correctionTargetMmol: number;
  correctionFactorMmol: number;
  correctionUnits: number;
  correctionReason: 'above_range' | 'in_range' | 'below_range_negative' | 'below_range_none' | 'no_glucose' | 'stale_glucose';
  activeInsulinModel: ActiveInsulinModel;
  actionTimeHours: number;
  activeInsulinUnits: number;
  activeInsulinSubtracted: number;
  totalBeforeRounding: number;
  roundedUnits: number;
  capped: boolean;
  doseUnits: number;
};

export type DoseResult =
  | { status: 'no_settings'; warnings: DoseWarning[] }
  | { status: 'treat_low'; glucoseMmol: number; warnings: DoseWarning[]; recentDoses: EarlierDose[] }
  | {
      status: 'ok';
      dayKind: { id: number; name: string };
      timeOfDay: { startMinute: number; endMinute: number };
      breakdown: DoseBreakdown;
      split: { nowUnits: number; laterUnits: number; laterMinutes: number; nowPercent: number } | null;
      fatProteinUnits: number | null;
      warnings: DoseWarning[];
      recentDoses: EarlierDose[];
    };

/** Glucose readings older (or newer) than this, relative to the meal, are not used for a correction. */
export const GLUCOSE_FRESH_MINUTES = 15;

export const TREAT_LOW_GUIDANCE =
  'Treat the low first: take 15–20 g of fast-acting carbohydrate (glucose is best), check again after 15 minutes, ' +
  'and repeat if still low; then eat your meal and check again before any insulin (ADA Standards of Care, hypoglycaemia treatment).';

const EPS = 1e-9;

/** Without settings a low reading is still called out, at the IHSG 2017 alert value (3.9 mmol/L, 70 mg/dL). */
const FALLBACK_HYPO_MMOL = 3.9;

/** Rounds a dose to the pen increment: down (never up) or to the nearest step; tolerant of float noise. */
export function roundToIncrement(units: number, increment: number, rounding: Rounding): number {
  if (!(units > 0)) return 0;
  const steps = units / increment;
  const n = rounding === 'down' ? Math.floor(steps + EPS) : Math.floor(steps + 0.5 + EPS);
  return Math.max(0, n * increment);
}

/** The time of day holding a minute of the day (times of day are [start, end)); undefined when none does. */
export function findTimeOfDay(timesOfDay: readonly TimeOfDay[], minuteOfDay: number): TimeOfDay | undefined {
  const m = ((Math.floor(minuteOfDay) % 1440) + 1440) % 1440;
  return timesOfDay.find((b) => m >= b.startMinute && m < b.endMinute);
}

/** Fat-protein units (Pańkowska 2009): (9 kcal × fat g + 4 kcal × protein g) ÷ 100; null when neither is given. */
export function fatProteinUnits(fatGrams?: number | null, proteinGrams?: number | null): number | null {
  if (fatGrams == null && proteinGrams == null) return null;
  return (9 * (fatGrams ?? 0) + 4 * (proteinGrams ?? 0)) / 100;
}

/**
 * Computes a dose suggestion with every part shown. Without settings or a day kind with a time of day for the
 * meal time it suggests nothing; glucose at or below the hypoglycaemia threshold gives no dose.
 * The result is never negative and never above the maximum dose.
 */
export function computeDose(settings: DoseSettings | null, dayKind: DayKindRatios | null, input: DoseInput): DoseResult {
  const timeOfDay = dayKind ? findTimeOfDay(dayKind.timesOfDay, input.mealMinuteOfDay) : undefined;
  if (!settings || !dayKind || !timeOfDay) {
    const warnings: DoseWarning[] = [
      {
        code: 'no_settings',
        tone: 'caution',
        message: 'No dose can be suggested until the ratios, targets and limits from your diabetes team are set up.',
      },
    ];
    const mmol = input.glucose ? glucoseToMmol(input.glucose.value, input.glucose.unit) : null;
    if (mmol != null && mmol <= (settings?.hypoThresholdMmol ?? FALLBACK_HYPO_MMOL) + EPS) {
      warnings.push({ code: 'treat_low', tone: 'danger', message: TREAT_LOW_GUIDANCE });
    }
    return { status: 'no_settings', warnings };
  }
  const warnings: DoseWarning[] = [];
  const earlier = input.earlierDoses ?? [];
  const recent = recentDoses(earlier, input.mealAt, settings.actionTimeHours);

  const glucoseMmol = input.glucose ? glucoseToMmol(input.glucose.value, input.glucose.unit) : null;
  const fresh =
    !!input.glucose && Math.abs(input.mealAt - input.glucose.takenAt) <= GLUCOSE_FRESH_MINUTES * 60_000 + EPS;

  if (glucoseMmol != null && glucoseMmol <= settings.hypoThresholdMmol + EPS) {
    return {
      status: 'treat_low',
      glucoseMmol,
      recentDoses: recent,
      warnings: [{ code: 'treat_low', tone: 'danger', message: `No insulin now. ${TREAT_LOW_GUIDANCE}` }],
    };
  }
  if (glucoseMmol != null && glucoseMmol >= settings.veryHighMmol) {
    warnings.push({
      code: 'ketone_check',
      tone: 'danger',
      message:
        'Glucose is very high: check ketones before eating or exercising, and follow your diabetes team’s sick-day or high-glucose plan.',
    });
  }
  if (glucoseMmol == null) {
    warnings.push({ code: 'glucose_missing', tone: 'caution', message: 'No glucose reading: the correction is left out. Check your glucose before you inject.' });
  } else if (!fresh) {
    warnings.push({
      code: 'glucose_stale',
      tone: 'caution',
      message: `The glucose reading is more than ${GLUCOSE_FRESH_MINUTES} minutes from the meal time: the correction is left out. Check again for a correction.`,
    });
  }

  const carbRatio = timeOfDay.carbRatio;
  const mealUnits = input.carbsGrams / carbRatio;
  const reduction = input.exercise ? exerciseReduction(input.exercise, settings.exerciseReductions) : null;
  const exercisePercent = reduction?.percent ?? 0;
  const exerciseUnits = (mealUnits * exercisePercent) / 100;
  const mealAfterExerciseUnits = mealUnits - exerciseUnits;
  if (reduction) warnings.push({ code: 'exercise_note', tone: 'info', message: reduction.note });

  let correctionUnits = 0;
  let correctionReason: DoseBreakdown['correctionReason'];
  if (glucoseMmol == null) correctionReason = 'no_glucose';
  else if (!fresh) correctionReason = 'stale_glucose';
  else if (glucoseMmol > settings.targetHighMmol) {
    correctionReason = 'above_range';
    correctionUnits = (glucoseMmol - settings.correctionTargetMmol) / timeOfDay.correctionFactorMmol;
  } else if (glucoseMmol < settings.targetLowMmol) {
    if (settings.allowNegativeCorrection) {
      correctionReason = 'below_range_negative';
      correctionUnits = (glucoseMmol - settings.correctionTargetMmol) / timeOfDay.correctionFactorMmol;
      warnings.push({ code: 'negative_correction', tone: 'info', message: 'Glucose is below your target range, so the dose is lowered (negative correction).' });
    } else correctionReason = 'below_range_none';
  } else correctionReason = 'in_range';

  const activeInsulinUnits = activeInsulin(earlier, input.mealAt, settings.actionTimeHours, settings.activeInsulinModel);
  let activeInsulinSubtracted: number;
  let totalBeforeRounding: number;
  if (settings.iobConvention === 'total') {
    activeInsulinSubtracted = activeInsulinUnits;
    totalBeforeRounding = Math.max(0, mealAfterExerciseUnits + correctionUnits - activeInsulinUnits);
  } else {
    activeInsulinSubtracted = correctionUnits > 0 ? Math.min(correctionUnits, activeInsulinUnits) : 0;
    totalBeforeRounding = Math.max(0, mealAfterExerciseUnits + correctionUnits - activeInsulinSubtracted);
  }
  if (recent.length) {
    warnings.push({
      code: 'recent_insulin',
      tone: 'caution',
      message: `Insulin taken in the last ${settings.actionTimeHours} hours is still working: about ${activeInsulinUnits.toFixed(1)} units active.`,
    });
  }

  const roundedUnits = roundToIncrement(totalBeforeRounding, settings.penIncrement, settings.rounding);
  const cap = roundToIncrement(settings.maxDoseUnits, settings.penIncrement, 'down');
  const capped = roundedUnits > cap + EPS;
  const doseUnits = capped ? cap : roundedUnits;
  if (capped) {
    warnings.push({
      code: 'capped',
      tone: 'danger',
      message: `The sum (${roundedUnits} units) is above your maximum single dose, so it is capped at ${cap} units. Check the numbers and talk to your diabetes team.`,
    });
  }

  let split = null;
  if (input.split && doseUnits > 0) {
    const nowUnits = roundToIncrement((doseUnits * input.split.nowPercent) / 100, settings.penIncrement, 'down');
    split = { nowUnits, laterUnits: doseUnits - nowUnits, laterMinutes: input.split.laterMinutes, nowPercent: input.split.nowPercent };
  }

  return {
    status: 'ok',
    dayKind: { id: dayKind.id, name: dayKind.name },
    timeOfDay: { startMinute: timeOfDay.startMinute, endMinute: timeOfDay.endMinute },
    breakdown: {
      carbsGrams: input.carbsGrams,
      carbRatio,
      mealUnits,
      exercisePercent,
      exerciseUnits,
      mealAfterExerciseUnits,
      glucoseMmol,
      correctionTargetMmol: settings.correctionTargetMmol,
      correctionFactorMmol: timeOfDay.correctionFactorMmol,
      correctionUnits,
      correctionReason,
      activeInsulinModel: settings.activeInsulinModel,
      actionTimeHours: settings.actionTimeHours,
      activeInsulinUnits,
      activeInsulinSubtracted,
      totalBeforeRounding,
      roundedUnits,
      capped,
      doseUnits,
    },
    split,
    fatProteinUnits: fatProteinUnits(input.fatGrams, input.proteinGrams),
    warnings,
    recentDoses: recent,
  };
}
