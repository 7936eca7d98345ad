import { z } from 'zod';
import type { BeforeMealGlucose, DayTotal, RatioReview, TimeInRange } from '../compute/logbook-review';
import { profileIdParamSchema } from './common';
import { LOG_ENTRY_KINDS, logEntryKindSchema, type LogEntry, type LogEntryKind } from './logbook';
import { localDateSchema } from './profile-settings';
import type { CarbBasis, CarbUnit, GlucoseUnit } from './units';

/** What people read from the logbook: history, charts data, the ratio review, export and the readings import. */

const periodShape = { from: localDateSchema, to: localDateSchema };
const fromBeforeTo = (q: { from?: string; to?: string }) => !q.from || !q.to || q.from <= q.to;

/** A period of local dates (the profile's time zone), at most a year. */
export const logPeriodQuerySchema = z
  .object(periodShape)
  .refine(fromBeforeTo, { path: ['to'], message: 'The end date must not be before the start date.' })
  .refine((q) => (Date.parse(q.to) - Date.parse(q.from)) / 86_400_000 < 366, { path: ['to'], message: 'Ask for at most a year at a time.' });
export type LogPeriodQuery = z.infer<typeof logPeriodQuerySchema>;

const kindsSchema = z.string().transform((s, ctx) => {
  const parts = s.split(',').filter(Boolean);
  const unknown = parts.filter((p) => !(LOG_ENTRY_KINDS as readonly string[]).includes(p));
  if (!parts.length || unknown.length) {
    ctx.addIssue({ code: 'custom', message: `Unknown entry type ${unknown.join(', ') || '(none)'}: use ${LOG_ENTRY_KINDS.join(', ')}.` });
    return z.NEVER;
  }
  return parts as LogEntryKind[];
});

/** History filters: local date range, day kind, entry types; newest or oldest first; a cursor from the page before. */
export const logHistoryQuerySchema = z
  .object({
    from: localDateSchema.optional(),
    to: localDateSchema.optional(),
    dayKindId: z.coerce.number().int().positive().optional(),
    kinds: kindsSchema.optional(),
    sort: z.enum(['newest', 'oldest']).default('newest'),
    cursor: z.string().regex(/^\d+\.\d+$/, 'Not a cursor from this list.').optional(),
    limit: z.coerce.number().int().min(1).max(200).default(50),
  })
  .refine(fromBeforeTo, { path: ['to'], message: 'The end date must not be before the start date.' });
export type LogHistoryQuery = z.infer<typeof logHistoryQuerySchema>;
/** The history filters as the app sends them (kinds comma separated). */
export type LogHistoryFilters = { from?: string; to?: string; dayKindId?: number; kinds?: string; sort?: 'newest' | 'oldest'; limit?: number };

/** A meal's context in the history: the reading before it and the dose suggested and taken with it. */
export type MealContext = {
  readingBefore: { glucose: number; localTime: string } | null;
  suggestedUnits: number | null;
  takenUnits: number | null;
};
export type LogHistoryRow = LogEntry & { mealContext: MealContext | null };
export type LogHistoryPage = { entries: LogHistoryRow[]; nextCursor: string | null; glucoseUnit: GlucoseUnit; carbBasis: CarbBasis; carbUnit: CarbUnit };

/** Chart data for a period: per-day totals, glucose before meals per day kind, time in range (glucose in mmol/L). */
export type LogCharts = {
  from: string;
  to: string;
  glucoseUnit: GlucoseUnit;
  carbBasis: CarbBasis;
  carbUnit: CarbUnit;
  targetRange: { lowMmol: number; highMmol: number; fromProfile: boolean };
  days: DayTotal[];
  beforeMeals: BeforeMealGlucose[];
  timeInRange: TimeInRange;
};

/** The ratio review: evidence only, with the caution and the minimum number of meals behind a figure. */
export type LogReview = RatioReview & {
  from: string;
  to: string;
  glucoseUnit: GlucoseUnit;
  carbBasis: CarbBasis;
  minimumMeals: number;
  caution: string;
  dayKinds: { id: number; name: string; isDefault: boolean; longActingUnits: number | null; timesOfDay: { from: string; to: string; carbRatio: number; correctionFactor: number }[] }[];
};

/** The one caution the review shows wherever it is read (screen, printed sheet). */
export const RATIO_REVIEW_CAUTION =
  'This review shows what happened; it does not suggest a new ratio. Talk about any change to ratios or correction factors with your diabetes team before making it.';

export const readingsImportColumnsSchema = z.object({
  timeColumn: z.string().trim().min(1, 'Choose the column with the time.'),
  valueColumn: z.string().trim().min(1, 'Choose the column with the glucose value.'),
  unitColumn: z.string().trim().optional(),
  /** The unit of every value when there is no unit column (or a row leaves it empty). */
  unit: z.enum(['mmol_l', 'mg_dl']),
  dateOrder: z.enum(['day_month', 'month_day']).optional(),
});
/** The column mapping the person chooses in the preview (all text fields, as a form holds them). */
export type ReadingsImportColumns = z.infer<typeof readingsImportColumnsSchema>;
export const readingsImportParamSchema = profileIdParamSchema;

export type ImportedRow = { line: number; occurredAt: string; localDate: string; localTime: string; glucose: number; duplicate: boolean };
export type ImportRowError = { line: number; message: string };

/** What the preview answers: the file as read, the mapping used and the first rows as they will be stored. */
export type ReadingsImportPreview = {
  encoding: 'utf-8' | 'latin-1';
  delimiter: ',' | ';' | '\t';
  columns: string[];
  mapping: Partial<ReadingsImportColumns>;
  dateOrderNeeded: boolean;
  timeZone: string;
  glucoseUnit: GlucoseUnit;
  rows: number;
  firstRows: ImportedRow[];
  duplicates: number;
  errors: ImportRowError[];
};
export type ReadingsImportResult = { imported: number; duplicatesSkipped: number; groupKey: string | null };

export const LOG_KIND_WORDS: Record<z.infer<typeof logEntryKindSchema>, string> = {
  meal: 'Meal',
  reading: 'Glucose reading',
  rapid_dose: 'Rapid-acting dose',
  long_dose: 'Long-acting dose',
  exercise: 'Exercise',
};

/** The history screen's filter form: a period, a day kind ('' for every one) and an entry type ('' for all). */
export const logFilterFormSchema = z
  .object({
    from: localDateSchema,
    to: localDateSchema,
    dayKindId: z.string(),
    kind: z.union([z.literal(''), logEntryKindSchema]),
  })
  .refine(fromBeforeTo, { path: ['to'], message: 'The end date must not be before the start date.' });
export type LogFilterFormValues = z.infer<typeof logFilterFormSchema>;
