import { z } from 'zod';
import { EXERCISE_INTENSITIES } from '../compute/exercise';
import { numberField } from './profile-settings';

/**
 * The logbook's shapes, shared by the API and the app. Times are ISO instants (stored in UTC); the profile's time zone
 * gives each entry its local date and minute, which pick the day kind and the time of day.
 */
export const LOG_ENTRY_KINDS = ['meal', 'reading', 'rapid_dose', 'long_dose', 'exercise'] as const;
export const logEntryKindSchema = z.enum(LOG_ENTRY_KINDS);
export type LogEntryKind = z.infer<typeof logEntryKindSchema>;

/** What a meal was: a portion from a batch, a recipe weighed on a plate, a food by grams, or a typed amount. */
export const mealSourceSchema = z.enum(['portion', 'recipe', 'food', 'typed']);
export type MealSource = z.infer<typeof mealSourceSchema>;

export const readingSourceSchema = z.enum(['typed', 'imported']);
export type ReadingSource = z.infer<typeof readingSourceSchema>;

/** One entry as the API answers it (glucose in the profile's unit, carbohydrate in grams in both bases). */
export const logEntrySchema = z.object({
  id: z.number().int(),
  profileId: z.number().int(),
  kind: logEntryKindSchema,
  occurredAt: z.string(),
  localDate: z.string(),
  /** Local clock time HH:MM in the entry's time zone. */
  localTime: z.string(),
  timeZone: z.string(),
  dayKindId: z.number().int().nullable(),
  dayKindName: z.string().nullable(),
  groupKey: z.string().nullable(),
  enteredBy: z.object({ id: z.number().int(), name: z.string() }).nullable(),
  meal: z
    .object({
      source: mealSourceSchema,
      portionCode: z.string().nullable(),
      recipeId: z.number().int().nullable(),
      foodId: z.number().int().nullable(),
      title: z.string(),
      grams: z.number().nullable(),
      plateTareGrams: z.number().nullable(),
      carbAvailableG: z.number().nullable(),
      carbTotalG: z.number().nullable(),
      planMealId: z.number().int().nullable(),
    })
    .nullable(),
  reading: z.object({ glucose: z.number(), source: readingSourceSchema }).nullable(),
  dose: z
    .object({
      units: z.number(),
      /** rapid_dose: the suggestion shown (inputs, parts, warnings, engine and caution versions), when there was one. */
      suggestion: z.record(z.string(), z.unknown()).nullable(),
      /** long_dose: the day kind's planned long-acting units. */
      plannedUnits: z.number().nullable(),
    })
    .nullable(),
  exercise: z.object({ intensity: z.enum(EXERCISE_INTENSITIES), durationMinutes: z.number().int() }).nullable(),
  note: z.string().nullable(),
  /** True when the entry has been edited since it was saved (its changes are listed by the changes endpoint). */
  changed: z.boolean(),
  deleted: z.boolean(),
  createdAt: z.string(),
});
export type LogEntry = z.infer<typeof logEntrySchema>;

// ---- What the logbook accepts ----

const instantSchema = z.iso.datetime({ offset: true, error: 'Use a date and time such as 2026-03-01T07:30:00Z.' });
const gramsField = (what: string, max = 5000) =>
  numberField(`Enter ${what} in grams.`).refine((v) => v > 0 && v <= max, `Use more than 0 and at most ${max} g.`);
const noteSchema = z.string().trim().max(500, 'Use at most 500 characters.');

/** What was eaten: a portion by its code, a recipe weighed on a plate (gross − plate tare), a food by grams, or typed carbohydrate. */
export const mealInputSchema = z.discriminatedUnion('source', [
  z.object({ source: z.literal('portion'), portionCode: z.string().trim().min(1, 'Enter the code on the label.').max(20) }),
  z.object({
    source: z.literal('recipe'),
    recipeId: z.number().int().positive('Choose a recipe.'),
    grossGrams: gramsField('the plate with the food'),
    plateTareGrams: numberField('Enter the empty plate in grams.').refine((v) => v >= 0 && v <= 5000, 'Use 0 to 5000 g.'),
  }),
  z.object({ source: z.literal('food'), foodId: z.number().int().positive('Choose a food.'), grams: gramsField('the amount') }),
  z.object({
    source: z.literal('typed'),
    /** Carbohydrate in grams, in the profile's basis. */
    carbsGrams: numberField('Enter the carbohydrate in grams.').refine((v) => v >= 0 && v <= 500, 'Use 0 to 500 g of carbohydrate.'),
    note: z.string().trim().min(1, 'Say what it was.').max(200, 'Use at most 200 characters.'),
  }),
]);
export type MealInput = z.infer<typeof mealInputSchema>;

/** A glucose reading in glucoseUnit (default: the profile's). */
export const readingInputSchema = z.object({
  glucose: numberField('Enter the glucose reading.').refine((v) => v > 0 && v <= 1000, 'Enter a glucose reading above 0.'),
  glucoseUnit: z.enum(['mmol_l', 'mg_dl']).optional(),
  occurredAt: instantSchema.optional(),
});

/**
 * The suggestion that was shown, stored beside the dose taken: the dose API's whole answer (inputs, parts, warnings),
 * which must carry the caution version and engine version it was shown with.
 */
export const shownSuggestionSchema = z.looseObject({
  caution: z.looseObject({ version: z.string().min(1).max(40) }),
  engineVersion: z.string().min(1).max(60),
});

const unitsField = numberField('Enter the units taken.').refine((v) => v > 0 && v <= 100, 'Use more than 0 and at most 100 units.');

/** A rapid-acting dose actually taken (one part of a two-part dose is one dose). */
export const takenDoseInputSchema = z.object({ units: unitsField, occurredAt: instantSchema.optional() });

/** One entry of any kind; occurredAt defaults to now. */
export const createLogEntryInputSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('meal'), occurredAt: instantSchema.optional(), meal: mealInputSchema }),
  z.object({ kind: z.literal('reading'), ...readingInputSchema.shape }),
  z.object({ kind: z.literal('rapid_dose'), units: unitsField, occurredAt: instantSchema.optional(), suggestion: shownSuggestionSchema.nullable().optional(), note: noteSchema.optional() }),
  z.object({ kind: z.literal('long_dose'), units: unitsField, occurredAt: instantSchema.optional(), note: noteSchema.optional() }),
  z.object({
    kind: z.literal('exercise'),
    occurredAt: instantSchema.optional(),
    intensity: z.enum(EXERCISE_INTENSITIES),
    durationMinutes: numberField('Enter how long, in minutes.').refine((v) => Number.isInteger(v) && v >= 1 && v <= 600, 'Use 1 to 600 whole minutes.'),
    note: noteSchema.optional(),
  }),
]);
export type CreateLogEntryInput = z.infer<typeof createLogEntryInputSchema>;

/**
 * Log a meal (the breakfast flow), saved in one transaction: the meal, an optional reading, the rapid-acting doses
 * actually taken with the suggestion shown, and a portion's eaten state — all or nothing.
 */
export const logMealInputSchema = z.object({
  occurredAt: instantSchema.optional(),
  meal: mealInputSchema,
  reading: readingInputSchema.nullable().optional(),
  doses: z.array(takenDoseInputSchema).max(2, 'At most two parts of one dose.').optional(),
  suggestion: shownSuggestionSchema.nullable().optional(),
  /** The week plan's meal this fulfils: the plan then shows it as logged. */
  planMealId: z.number().int().positive('Not a valid planned meal.').optional(),
});
export type LogMealInput = z.infer<typeof logMealInputSchema>;

/** What saving entries answers: the group (for undo) and its entries. */
export const logGroupSchema = z.object({ groupKey: z.string(), entries: z.array(logEntrySchema) });
export type LogGroup = z.infer<typeof logGroupSchema>;

/** A correction: any of these, as fits the entry's kind (glucose in glucoseUnit, default the profile's). */
export const editLogEntryInputSchema = z
  .object({
    occurredAt: instantSchema.optional(),
    note: noteSchema.nullable().optional(),
    units: unitsField.optional(),
    glucose: numberField('Enter the glucose reading.').refine((v) => v > 0 && v <= 1000, 'Enter a glucose reading above 0.').optional(),
    glucoseUnit: z.enum(['mmol_l', 'mg_dl']).optional(),
    carbsGrams: numberField('Enter the carbohydrate in grams.').refine((v) => v >= 0 && v <= 500, 'Use 0 to 500 g of carbohydrate.').optional(),
    intensity: z.enum(EXERCISE_INTENSITIES).optional(),
    durationMinutes: numberField('Enter how long, in minutes.').refine((v) => Number.isInteger(v) && v >= 1 && v <= 600, 'Use 1 to 600 whole minutes.').optional(),
  })
  .refine((v) => Object.values(v).some((x) => x !== undefined), 'Change at least one thing.');
export type EditLogEntryInput = z.infer<typeof editLogEntryInputSchema>;

export const recentLogQuerySchema = z.object({
  limit: z.coerce.number().int().min(1).max(100).default(20),
  kind: logEntryKindSchema.optional(),
});

/** One correction of an entry: who, when, and the entry before → after (after is null for a delete). */
export const logEntryChangeSchema = z.object({
  id: z.number().int(),
  action: z.enum(['edit', 'delete', 'restore']),
  changedBy: z.object({ id: z.number().int(), name: z.string() }).nullable(),
  changedAt: z.string(),
  before: logEntrySchema,
  after: logEntrySchema.nullable(),
});
export type LogEntryChange = z.infer<typeof logEntryChangeSchema>;
