import { z } from 'zod';
import { EXERCISE_INTENSITIES } from '../compute/exercise';

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
