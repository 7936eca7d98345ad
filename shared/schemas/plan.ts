import { z } from 'zod';
import type { PlanWarning, PlannedDose, Totals } from '../compute/plan';
import { isoDateSchema } from './batch';
import { positiveIdSchema, profileIdParamSchema } from './common';
import { numberField, optionalNumberField, timeOfDaySchema } from './profile-settings';
import type { CarbBasis, CarbUnit } from './units';

/** What a planned meal holds: a portion of a batch, a planned cook's portion, a recipe amount, a pack food, or plain carbohydrate. */
export const PLAN_MEAL_SOURCES = ['portion', 'planned_cook', 'recipe', 'food', 'carb'] as const;
export const planMealSourceSchema = z.enum(PLAN_MEAL_SOURCES);
export type PlanMealSource = z.infer<typeof planMealSourceSchema>;

/** ISO weekdays, Monday first (ISO 8601). */
export const WEEKDAY_NAMES = ['Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'] as const;

const optionalId = z.preprocess((v) => (v === '' || v == null ? null : typeof v === 'string' ? Number(v) : v), z.number().int().positive('Pick one.').nullable());
const requiredId = (message: string) => z.preprocess((v) => (v === '' || v == null ? undefined : typeof v === 'string' ? Number(v) : v), z.number({ error: message }).int(message).positive(message));

/** PUT /profiles/:profileId/plan/settings — the week start, the weekly pattern and the named meals in one go. */
export const planSettingsInputSchema = z.object({
  weekStart: z.coerce.number().int().min(1, 'Pick a weekday.').max(7, 'Pick a weekday.'),
  /** Seven lines, Monday first: the kind of day each weekday usually is (null or 0: the default kind). */
  pattern: z
    .array(z.object({ weekday: z.number().int().min(1).max(7), dayKindId: z.preprocess((v) => (v === 0 ? null : v), optionalId) }))
    .length(7, 'Give all seven weekdays.'),
  mealNames: z
    .array(
      z.object({
        id: optionalId.optional(),
        name: z.string().trim().min(1, 'Name this meal.').max(40, 'Use at most 40 characters.'),
        time: timeOfDaySchema.refine((t) => t !== '24:00', 'Use a time before midnight.'),
      }),
    )
    .max(12, 'Use at most 12 meals.'),
});
export type PlanSettingsInput = z.infer<typeof planSettingsInputSchema>;
export type PlanSettingsFormValues = z.input<typeof planSettingsInputSchema>;

export type PlanSettings = {
  weekStart: number;
  pattern: { weekday: number; dayKindId: number | null }[];
  mealNames: { id: number; name: string; time: string }[];
};

/** POST/PUT /profiles/:profileId/plan/meals — one planned meal; which fields count depends on `source`. */
export const planMealInputSchema = z
  .object({
    date: isoDateSchema,
    mealNameId: requiredId('Pick a meal.'),
    /** Its own clock time; empty: the meal's usual time. */
    time: z.preprocess((v) => (v === '' ? null : v), timeOfDaySchema.nullish()).transform((v) => v ?? null),
    source: planMealSourceSchema,
    portionId: optionalId.optional(),
    plannedCookId: optionalId.optional(),
    recipeId: optionalId.optional(),
    foodId: optionalId.optional(),
    grams: optionalNumberField('Enter grams.').optional(),
    portions: optionalNumberField('Enter the number of portions.').optional(),
    carbGrams: optionalNumberField('Enter the carbohydrate in grams.').optional(),
    thawOn: z.preprocess((v) => (v === '' ? null : v), isoDateSchema.nullish()).transform((v) => v ?? null),
    note: z.string().trim().max(200, 'At most 200 characters.').nullish().transform((v) => v || null),
    /** Plan the same meal on this many days in a row (a batch: its next portions not planned yet). */
    repeatDays: z.preprocess((v) => (v === '' || v == null ? 1 : typeof v === 'string' ? Number(v) : v), z.number().int('Use a whole number of days.').min(1, 'At least 1 day.').max(7, 'At most 7 days.')),
  })
  .superRefine((m, ctx) => {
    const need = (field: keyof typeof m, message: string) => {
      if (m[field] == null) ctx.addIssue({ code: 'custom', path: [field], message });
    };
    const positive = (field: 'grams' | 'portions' | 'carbGrams', max: number) => {
      const v = m[field];
      if (v != null && !(v > 0 && v <= max)) ctx.addIssue({ code: 'custom', path: [field], message: `Use more than 0 and at most ${max}.` });
    };
    if (m.source === 'portion') need('portionId', 'Pick a portion.');
    if (m.source === 'planned_cook') need('plannedCookId', 'Pick a planned cook.');
    if (m.source === 'recipe') {
      need('recipeId', 'Pick a recipe.');
      if (m.grams == null && m.portions == null) ctx.addIssue({ code: 'custom', path: ['grams'], message: 'Enter grams or portions of the recipe.' });
    }
    if (m.source === 'food') {
      need('foodId', 'Pick a food.');
      need('grams', 'Enter grams.');
    }
    if (m.source === 'carb') need('carbGrams', 'Enter the carbohydrate in grams.');
    positive('grams', 5000);
    positive('portions', 20);
    positive('carbGrams', 500);
  });
export type PlanMealInput = z.infer<typeof planMealInputSchema>;
export const planMealCreatedSchema = z.object({ ids: z.array(z.number().int()) });
export type PlanMealFormValues = z.input<typeof planMealInputSchema>;

/** POST/PUT /profiles/:profileId/plan/cooks — a recipe to cook on a date (or no date yet) into portions. */
export const plannedCookInputSchema = z.object({
  recipeId: requiredId('Pick a recipe.'),
  cookOn: z.preprocess((v) => (v === '' ? null : v), isoDateSchema.nullish()).transform((v) => v ?? null),
  portions: numberField('Enter the number of portions.').refine((v) => Number.isInteger(v) && v >= 1 && v <= 100, 'Use a whole number from 1 to 100.'),
});
export type PlannedCookInput = z.infer<typeof plannedCookInputSchema>;
export type PlannedCookFormValues = z.input<typeof plannedCookInputSchema>;

/** `?date=` any date of the wanted week (default: today in the profile's time zone). */
export const planWeekQuerySchema = z.object({ date: isoDateSchema.optional() });

export const planItemParamSchema = profileIdParamSchema.extend({ id: positiveIdSchema });

/** PUT /profiles/:profileId/plan/shopping-list/ticks — tick a food off (or back on) the list of a week. */
export const shoppingTickInputSchema = z.object({ weekStart: isoDateSchema, foodId: z.number().int().positive(), ticked: z.boolean() });
export type ShoppingTickInput = z.infer<typeof shoppingTickInputSchema>;

type Carb = { grams: number | null; inUnit: number | null };

/** One planned meal with its numbers. */
export type PlanMealView = {
  id: number;
  date: string;
  mealNameId: number | null;
  mealName: string;
  time: string;
  source: PlanMealSource;
  title: string;
  /** What it is in a few words: "portion K7P-2Q", "150 g", "1.5 portions", "typed amount". */
  detail: string;
  portionId: number | null;
  /** The portion's label code, for the dose check and the logging flow. */
  portionCode: string | null;
  batchId: number | null;
  plannedCookId: number | null;
  recipeId: number | null;
  foodId: number | null;
  grams: number | null;
  portions: number | null;
  thawOn: string | null;
  carb: Carb;
  /** For a planned cook's portion once cooked: the carbohydrate planned from the recipe, beside the weighed one. */
  plannedCarb: Carb | null;
  dose: PlannedDose;
  /** The log entry that fulfilled this meal, when it has been logged. */
  logged: { entryId: number; occurredAt: string; carbGrams: number | null } | null;
};

export type PlanDay = {
  date: string;
  weekday: number;
  dayKind: { id: number; name: string; from: 'date' | 'pattern' | 'default' } | null;
  meals: PlanMealView[];
  totals: Totals;
};

export type PlannedCookView = { id: number; recipeId: number; recipeTitle: string; cookOn: string | null; portions: number; placed: number; batchId: number | null; carbPerPortion: Carb };

export type PlanBatchUse = { batchId: number | null; plannedCookId: number | null; title: string; holds: number; placed: number; left: number };

/** GET /profiles/:profileId/plan/week */
export type PlanWeek = {
  weekStart: string;
  today: string;
  timeZone: string;
  basis: CarbBasis;
  unit: CarbUnit;
  /** False until the profile has dose settings: no planned dose is shown without them. */
  doseReady: boolean;
  days: PlanDay[];
  cooks: PlannedCookView[];
  use: PlanBatchUse[];
  totals: Totals;
  warnings: PlanWarning[];
};

/** GET /profiles/:profileId/plan/next-meal */
export type NextPlanMeal = { meal: PlanMealView | null; dayKind: PlanDay['dayKind'] };

export type ShoppingLine = { foodId: number; foodName: string; group: string; grams: number; measure: { label: string; grams: number; count: number } | null; recipes: string[]; ticked: boolean };

/** GET /profiles/:profileId/plan/shopping-list */
export type ShoppingList = { weekStart: string; groups: { group: string; lines: ShoppingLine[] }[]; cooks: { id: number; recipeTitle: string; cookOn: string | null; portions: number }[] };
