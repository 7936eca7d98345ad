import { z } from 'zod';
import { isTimeZone } from '../compute/local-time';

/** Which carbohydrate a profile counts: available (fibre excluded) or total (fibre included). */
export const carbBasisSchema = z.enum(['available', 'total']);
export type CarbBasis = z.infer<typeof carbBasisSchema>;

/** How carbohydrate is shown: grams, 10 g portions, 12 g units, 15 g exchanges. */
export const carbUnitSchema = z.enum(['g', 'portion10', 'unit12', 'exchange15']);
export type CarbUnit = z.infer<typeof carbUnitSchema>;

/** Glucose display unit; values are stored in mmol/L. */
export const glucoseUnitSchema = z.enum(['mmol_l', 'mg_dl']);
export type GlucoseUnit = z.infer<typeof glucoseUnitSchema>;

/** An IANA time zone name (e.g. "Europe/London"): the profile's clock, which decides the day and time of day of entries. */
export const timeZoneSchema = z
  .string()
  .trim()
  .min(1, 'Enter a time zone such as Europe/London.')
  .max(64, 'Use a time zone name such as Europe/London.')
  .refine(isTimeZone, 'Use a time zone name such as Europe/London or America/New_York.');

/** Which open food table search shows first when both have a match. */
export const preferredFoodTableSchema = z.enum(['usda_sr28', 'ifct2017']);
export type PreferredFoodTable = z.infer<typeof preferredFoodTableSchema>;
/** The choice as people see it, at sign-up and in settings. */
export const PREFERRED_FOOD_TABLE_CHOICES: { value: PreferredFoodTable; label: string }[] = [
  { value: 'usda_sr28', label: 'USDA first (US table, 8,789 foods)' },
  { value: 'ifct2017', label: 'IFCT first (Indian table, 542 foods)' },
];
