import { z } from 'zod';
import { dateTime } from './fields';
import type { DoseResult } from '../compute/dose';
import { EXERCISE_INTENSITIES } from '../compute/exercise';
import { localDateSchema, numberField, optionalNumberField, timeOfDaySchema } from './profile-settings';
import { carbBasisSchema, carbUnitSchema, glucoseUnitSchema } from './units';

const isoDate = dateTime('Use a date and time such as 2026-03-01T12:30:00Z.');

/** What POST /api/profiles/:profileId/dose-suggestions accepts. Glucose is in glucoseUnit (default: the profile's). */
export const doseRequestSchema = z
  .object({
    carbsGrams: numberField('Enter the carbohydrate in grams.').refine((v) => v >= 0 && v <= 500, 'Use 0 to 500 g of carbohydrate.'),
    glucose: optionalNumberField('Enter the glucose reading, or leave it empty.')
      .refine((v) => v == null || (v > 0 && v <= 1000), 'Enter a glucose reading above 0.')
      .optional(),
    glucoseUnit: glucoseUnitSchema.optional(),
    glucoseTakenAt: isoDate.nullable().optional(),
    mealAt: isoDate.optional(),
    localTime: timeOfDaySchema.refine((t) => t !== '24:00', 'Use a time from 00:00 to 23:59.'),
    dayKindId: z.number().int().positive('Not a valid day kind.').nullable().optional(),
    /** The person's local date of the meal: picks the day kind set for it (the plan's), when dayKindId is not given. */
    date: localDateSchema.optional(),
    earlierDoses: z
      .array(
        z.object({
          units: numberField('Enter the units taken.').refine((v) => v > 0 && v <= 100, 'Use more than 0 and at most 100 units.'),
          takenAt: isoDate,
        }),
      )
      .max(20, 'At most 20 earlier doses.')
      .optional(),
    exercise: z
      .object({
        intensity: z.enum(EXERCISE_INTENSITIES),
        durationMinutes: numberField('Enter how long, in minutes.').refine((v) => v >= 1 && v <= 600, 'Use 1 to 600 minutes.'),
        startsInMinutes: numberField('Enter when it starts, in minutes.').refine((v) => v >= 0 && v <= 1440, 'Use 0 to 1440 minutes.'),
      })
      .nullable()
      .optional(),
    split: z
      .object({
        nowPercent: numberField('Enter the part to take now.').refine((v) => v >= 10 && v <= 90, 'Take 10 to 90 % now.'),
        laterMinutes: numberField('Enter when to take the rest.').refine((v) => v >= 15 && v <= 480, 'Use 15 to 480 minutes.'),
      })
      .nullable()
      .optional(),
    fatGrams: optionalNumberField('Enter fat in grams.').refine((v) => v == null || (v >= 0 && v <= 500), 'Use 0 to 500 g.').optional(),
    proteinGrams: optionalNumberField('Enter protein in grams.').refine((v) => v == null || (v >= 0 && v <= 500), 'Use 0 to 500 g.').optional(),
  })
  .superRefine((r, ctx) => {
    if (r.glucoseTakenAt && r.glucose == null) {
      ctx.addIssue({ code: 'custom', path: ['glucose'], message: 'A reading time was given without a glucose value.' });
    }
  });
export type DoseRequest = z.infer<typeof doseRequestSchema>;

/** A rapid-acting dose from the logbook that the dose check counted as still active. */
export type LoggedDose = { entryId: number; units: number; takenAt: string; localDate: string; localTime: string };

/**
 * What the API answers: the engine's result (every part, warnings), the profile's units for display, the standing
 * caution with its version, the engine version, and the logged doses counted as insulin still active.
 */
export type DoseSuggestion = DoseResult & {
  caution: { version: string; title: string; text: string };
  engineVersion: string;
  loggedDoses: LoggedDose[];
  glucoseUnit: z.infer<typeof glucoseUnitSchema>;
  carbBasis: z.infer<typeof carbBasisSchema>;
  carbUnit: z.infer<typeof carbUnitSchema>;
  mealAt: string;
  glucoseTakenAt: string | null;
};
