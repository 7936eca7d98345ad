/**
 * Meal-dose reductions when aerobic exercise follows the meal.
 *
 * Percentages: Rabasa-Lhoret R et al., Diabetes Care 2001;24(4):625–630 (exercise 90 min after the
 * meal), as tabulated in ADA's Diabetes Spectrum "within 2–3 hours after a meal":
 * light 25 % (30 min) / 50 % (60 min); moderate 50 % / 75 %; hard 75 % (30 min).
 * Hard exercise for 60 min is "not established" in the 2017 consensus table (Riddell et al., Lancet
 * Diabetes Endocrinol 2017) — that cell is from memory, so no automatic reduction is made there.
 * Every profile may edit the table; these are only the starting values.
 */

export const EXERCISE_INTENSITIES = ['light', 'moderate', 'hard'] as const;
export type ExerciseIntensity = (typeof EXERCISE_INTENSITIES)[number];

/** Percent reductions per intensity for about 30 and about 60 minutes; null = not established. */
export type ExerciseReductionTable = Record<ExerciseIntensity, { min30: number | null; min60: number | null }>;

export const DEFAULT_EXERCISE_REDUCTIONS: ExerciseReductionTable = {
  light: { min30: 25, min60: 50 },
  moderate: { min30: 50, min60: 75 },
  // min60: "not established" (Riddell 2017, from memory).
  hard: { min30: 75, min60: null },
};

/** The table covers exercise that starts within 3 hours of the meal (Diabetes Spectrum wording). */
export const EXERCISE_WINDOW_MINUTES = 180;
/** Shorter sessions are outside the published 30/60-minute columns. */
export const EXERCISE_MIN_MINUTES = 20;

export type PlannedExercise = { intensity: ExerciseIntensity; durationMinutes: number; startsInMinutes: number };

export type ExerciseReduction = {
  /** Percent taken off the meal dose (0 when none applies). */
  percent: number;
  /** Which column was used, or why none was. */
  basis: 'min30' | 'min60' | 'not_established' | 'too_short' | 'too_late';
  note: string;
};

/**
 * The reduction (percent of the meal dose) for planned exercise: 20–45 minutes uses the 30-minute
 * column, longer uses the 60-minute column; starting more than 180 minutes after the meal, shorter
 * than 20 minutes, or a "not established" cell gives 0 with a note saying why.
 */
export function exerciseReduction(
  exercise: PlannedExercise,
  table: ExerciseReductionTable = DEFAULT_EXERCISE_REDUCTIONS,
): ExerciseReduction {
  if (exercise.startsInMinutes > EXERCISE_WINDOW_MINUTES) {
    return { percent: 0, basis: 'too_late', note: 'Exercise starting more than 3 hours after the meal does not change the meal dose in the table.' };
  }
  if (exercise.durationMinutes < EXERCISE_MIN_MINUTES) {
    return { percent: 0, basis: 'too_short', note: 'Exercise under 20 minutes is shorter than the table covers; no reduction made.' };
  }
  const column = exercise.durationMinutes <= 45 ? 'min30' : 'min60';
  const percent = table[exercise.intensity][column];
  if (percent == null) {
    return {
      percent: 0,
      basis: 'not_established',
      note: 'No reduction is established for this intensity and length; none made. Ask your diabetes team.',
    };
  }
  const length = column === 'min30' ? 'about 30 minutes' : 'about 60 minutes';
  const extra = exercise.durationMinutes > 90 ? ' Longer sessions than the table covers may need more; ask your diabetes team.' : '';
  return { percent, basis: column, note: `${exercise.intensity} exercise for ${length}, starting within 3 hours.${extra}` };
}
