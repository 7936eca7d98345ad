import { z } from 'zod';
import { positiveIdSchema, profileIdParamSchema } from './common';
import { ACTIVE_INSULIN_MODELS, RAPID_PEAK_MINUTES } from '../compute/active-insulin';
import { EXERCISE_INTENSITIES } from '../compute/exercise';
import { formatGlucose, glucoseToMmol } from '../compute/units';
import { carbBasisSchema, carbUnitSchema, glucoseUnitSchema, preferredFoodTableSchema, type GlucoseUnit, type PreferredFoodTable } from './units';

/** A number from JSON or a form field ("4,5" accepted); empty is missing. */
export function numberField(required: string) {
  return z.preprocess(
    (v) => (v === '' || v == null ? undefined : typeof v === 'string' ? Number(v.trim().replace(',', '.')) : v),
    z.number({ error: required }).refine(Number.isFinite, required),
  );
}

/** Like numberField, but empty means null (not set). */
export function optionalNumberField(message: string) {
  return z.preprocess(
    (v) => (v === '' || v == null ? null : typeof v === 'string' ? Number(v.trim().replace(',', '.')) : v),
    z.number({ error: message }).refine(Number.isFinite, message).nullable(),
  );
}

/** Limits for glucose settings, mmol/L (checked after converting from the profile's unit). */
export const GLUCOSE_LIMITS_MMOL = {
  targetLow: [3.5, 10],
  targetHigh: [4.5, 15],
  correctionTarget: [3.5, 15],
  hypoThreshold: [3.0, 5.0],
  veryHigh: [10, 30],
  correctionFactor: [0.2, 20],
} as const;

/**
 * Hypoglycaemia alert value: 3.9 mmol/L (70 mg/dL) or less — International Hypoglycaemia Study Group,
 * Diabetes Care 2017;40:155–157. Glucose at or below the threshold gives no dose.
 */
export const DEFAULT_HYPO_THRESHOLD_MMOL = 3.9;
/** Ketone check above 15 mmol/L (270 mg/dL) before exercise: Riddell et al. 2017 consensus (secondary source). */
export const DEFAULT_VERY_HIGH_MMOL = 15;

export const roundingSchema = z.enum(['down', 'nearest']);
export const iobConventionSchema = z.enum(['correction_only', 'total']);
/** linear is the default: it never counts less active insulin than the cited anchor (README, dose section). */
export const activeInsulinModelSchema = z.enum(ACTIVE_INSULIN_MODELS);
/** How each active-insulin model is named on the settings and dose screens. */
export const ACTIVE_INSULIN_MODEL_WORDS: Record<(typeof ACTIVE_INSULIN_MODELS)[number], string> = {
  linear: 'Straight line over the action time',
  curve: `Curve with its peak at ${RAPID_PEAK_MINUTES} minutes`,
};

const percentCell = optionalNumberField('Enter a percentage from 0 to 90, or leave empty for no reduction.').refine(
  (v) => v == null || (v >= 0 && v <= 90),
  'Use a percentage from 0 to 90, or leave it empty.',
);
export const exerciseReductionsSchema = z.object(
  Object.fromEntries(EXERCISE_INTENSITIES.map((k) => [k, z.object({ min30: percentCell, min60: percentCell })])) as Record<
    (typeof EXERCISE_INTENSITIES)[number],
    z.ZodObject<{ min30: typeof percentCell; min60: typeof percentCell }>
  >,
);

function checkGlucose(
  ctx: z.RefinementCtx,
  unit: GlucoseUnit,
  key: keyof typeof GLUCOSE_LIMITS_MMOL,
  path: (string | number)[],
  value: number | undefined,
  label: string,
) {
  if (value == null || !Number.isFinite(value)) return;
  const [lo, hi] = GLUCOSE_LIMITS_MMOL[key];
  const mmol = glucoseToMmol(value, unit);
  if (mmol < lo - 1e-9 || mmol > hi + 1e-9) {
    const suffix = key === 'correctionFactor' ? ' per unit' : '';
    ctx.addIssue({
      code: 'custom',
      path,
      message: `${label} must be between ${formatGlucose(lo, unit)} and ${formatGlucose(hi, unit)}${suffix}.`,
    });
  }
}

/** Units and safety limits, glucose values in the given glucoseUnit (stored as mmol/L). */
export const profileSettingsInputSchema = z
  .object({
    glucoseUnit: glucoseUnitSchema,
    carbBasis: carbBasisSchema,
    carbUnit: carbUnitSchema,
    /** Which food table search shows first; unchanged when not given. */
    preferredFoodTable: preferredFoodTableSchema.optional(),
    penIncrement: numberField('Enter the pen increment.').refine((v) => [0.5, 1].includes(v), 'The pen increment must be 0.5 or 1 unit.'),
    rounding: roundingSchema,
    maxDoseUnits: numberField('Enter the maximum single dose.').refine((v) => v >= 1 && v <= 100, 'Use a maximum from 1 to 100 units.'),
    actionTimeHours: numberField('Enter the insulin action time.').refine((v) => v >= 2 && v <= 8, 'The action time must be 2 to 8 hours.'),
    activeInsulinModel: activeInsulinModelSchema.default('linear'),
    targetLow: numberField('Enter the bottom of the target range.'),
    targetHigh: numberField('Enter the top of the target range.'),
    correctionTarget: numberField('Enter the correction target.'),
    hypoThreshold: numberField('Enter the low-glucose threshold.'),
    veryHigh: numberField('Enter the very-high threshold.'),
    allowNegativeCorrection: z.boolean(),
    iobConvention: iobConventionSchema,
    exerciseReductions: exerciseReductionsSchema,
  })
  .superRefine((s, ctx) => {
    const u = s.glucoseUnit;
    checkGlucose(ctx, u, 'targetLow', ['targetLow'], s.targetLow, 'The bottom of the range');
    checkGlucose(ctx, u, 'targetHigh', ['targetHigh'], s.targetHigh, 'The top of the range');
    checkGlucose(ctx, u, 'correctionTarget', ['correctionTarget'], s.correctionTarget, 'The correction target');
    checkGlucose(ctx, u, 'hypoThreshold', ['hypoThreshold'], s.hypoThreshold, 'The low threshold');
    checkGlucose(ctx, u, 'veryHigh', ['veryHigh'], s.veryHigh, 'The very-high threshold');
    if (s.targetLow >= s.targetHigh) ctx.addIssue({ code: 'custom', path: ['targetHigh'], message: 'The top of the range must be above the bottom.' });
    if (s.correctionTarget < s.targetLow || s.correctionTarget > s.targetHigh) {
      ctx.addIssue({ code: 'custom', path: ['correctionTarget'], message: 'The correction target must be within the target range.' });
    }
    if (s.hypoThreshold >= s.targetLow) ctx.addIssue({ code: 'custom', path: ['hypoThreshold'], message: 'The low threshold must be below the target range.' });
    if (s.veryHigh <= s.targetHigh) ctx.addIssue({ code: 'custom', path: ['veryHigh'], message: 'The very-high threshold must be above the target range.' });
    if (s.maxDoseUnits < s.penIncrement) ctx.addIssue({ code: 'custom', path: ['maxDoseUnits'], message: 'The maximum must be at least one pen step.' });
  });
export type ProfileSettingsInput = z.infer<typeof profileSettingsInputSchema>;
export type ProfileSettingsFormValues = z.input<typeof profileSettingsInputSchema>;

/** What GET /settings returns: units always, dose settings (display unit) only once set up. */
export type ProfileSettingsView = {
  glucoseUnit: GlucoseUnit;
  carbBasis: z.infer<typeof carbBasisSchema>;
  carbUnit: z.infer<typeof carbUnitSchema>;
  preferredFoodTable: PreferredFoodTable;
  settings: Omit<ProfileSettingsInput, 'glucoseUnit' | 'carbBasis' | 'carbUnit' | 'preferredFoodTable'> | null;
  updatedAt: string | null;
};

const TIME_RE = /^([01]\d|2[0-3]):[0-5]\d$|^24:00$/;
export const timeOfDaySchema = z.string().trim().regex(TIME_RE, 'Use a 24-hour time such as 07:30 (24:00 for midnight at the end).');

/** "HH:MM" → minutes from midnight (24:00 → 1440). */
export function timeToMinutes(time: string): number {
  const [h, m] = time.split(':').map(Number);
  return h * 60 + m;
}

/** Minutes from midnight → "HH:MM". */
export function minutesToTime(minutes: number): string {
  return `${String(Math.floor(minutes / 60)).padStart(2, '0')}:${String(minutes % 60).padStart(2, '0')}`;
}

export const timeOfDayInputSchema = z.object({
  from: timeOfDaySchema,
  to: timeOfDaySchema,
  carbRatio: numberField('Enter the insulin-to-carb ratio.').refine(
    (v) => v >= 1 && v <= 150,
    'The ratio must be from 1 to 150 grams per unit (not 0).',
  ),
  correctionFactor: numberField('Enter the correction factor.').refine((v) => v > 0, 'The correction factor must be above 0.'),
});

/** A day kind with its times of day, which must cover 00:00–24:00 in order, without gaps or overlaps. */
export const dayKindInputSchema = z
  .object({
    name: z.string().trim().min(1, 'Give this kind of day a name.').max(40, 'Use at most 40 characters.'),
    isDefault: z.boolean(),
    longActingUnits: optionalNumberField('Enter the planned long-acting dose in units, or leave it empty.').refine(
      (v) => v == null || (v >= 0 && v <= 200),
      'Use 0 to 200 units, or leave it empty.',
    ),
    glucoseUnit: glucoseUnitSchema,
    timesOfDay: z.array(timeOfDayInputSchema).min(1, 'Add at least one time of day.').max(24, 'Use at most 24 times of day.'),
  })
  .superRefine((d, ctx) => {
    d.timesOfDay.forEach((b, i) => {
      checkGlucose(ctx, d.glucoseUnit, 'correctionFactor', ['timesOfDay', i, 'correctionFactor'], b.correctionFactor, 'The correction factor');
      if (!TIME_RE.test(b.from) || !TIME_RE.test(b.to)) return;
      const from = timeToMinutes(b.from);
      const to = timeToMinutes(b.to);
      if (from >= to) ctx.addIssue({ code: 'custom', path: ['timesOfDay', i, 'to'], message: 'This time of day must end after it starts.' });
      if (i === 0 && from !== 0) ctx.addIssue({ code: 'custom', path: ['timesOfDay', 0, 'from'], message: 'The first time of day must start at 00:00.' });
      if (i > 0 && TIME_RE.test(d.timesOfDay[i - 1].to)) {
        const prevEnd = timeToMinutes(d.timesOfDay[i - 1].to);
        if (from < prevEnd) ctx.addIssue({ code: 'custom', path: ['timesOfDay', i, 'from'], message: `This time of day overlaps the one before (it ends at ${d.timesOfDay[i - 1].to}).` });
        else if (from > prevEnd) ctx.addIssue({ code: 'custom', path: ['timesOfDay', i, 'from'], message: `There is a gap: the time of day before ends at ${d.timesOfDay[i - 1].to}.` });
      }
      if (i === d.timesOfDay.length - 1 && to !== 1440) ctx.addIssue({ code: 'custom', path: ['timesOfDay', i, 'to'], message: 'The last time of day must end at 24:00.' });
    });
  });
export type DayKindInput = z.infer<typeof dayKindInputSchema>;
export type DayKindFormValues = z.input<typeof dayKindInputSchema>;

export type DayKind = {
  id: number;
  name: string;
  isDefault: boolean;
  longActingUnits: number | null;
  glucoseUnit: GlucoseUnit;
  timesOfDay: { from: string; to: string; carbRatio: number; correctionFactor: number }[];
  updatedAt: string;
};

export const dayKindIdParamSchema = profileIdParamSchema.extend({ dayKindId: positiveIdSchema });

export type SettingsChange = {
  id: number;
  subject: 'settings' | 'day_kind';
  subjectId: number | null;
  subjectName: string;
  action: 'created' | 'updated' | 'deleted';
  changedBy: { id: number | null; displayName: string };
  createdAt: string;
  changes: { field: string; from: unknown; to: unknown }[];
};

/** A local calendar date, "YYYY-MM-DD". */
export const localDateSchema = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date such as 2026-03-01.')
  .refine((d) => !Number.isNaN(Date.parse(`${d}T00:00:00Z`)) && new Date(`${d}T00:00:00Z`).toISOString().startsWith(d), 'That date does not exist.');

export const dayKindDayParamSchema = profileIdParamSchema.extend({ date: localDateSchema });

/** Give a date a day kind; null puts it back to the default kind. */
export const dayKindDayInputSchema = z.object({
  dayKindId: z.number({ error: 'Choose a day kind, or null for the default.' }).int().positive('Not a valid day kind.').nullable(),
});
export type DayKindDayInput = z.infer<typeof dayKindDayInputSchema>;

export const dayKindDaysQuerySchema = z
  .object({ from: localDateSchema, to: localDateSchema })
  .refine((q) => q.from <= q.to, { path: ['to'], message: 'The end date must not be before the start date.' })
  .refine((q) => (Date.parse(q.to) - Date.parse(q.from)) / 86_400_000 < 62, { path: ['to'], message: 'Ask for at most 62 days at a time.' });

/** The day kind in force on a date: set for that date, or the default (dayKindId null when there are no day kinds). */
export type DayKindDay = { date: string; dayKindId: number | null; dayKindName: string | null; isSet: boolean };
