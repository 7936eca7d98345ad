import { doseRequestSchema } from '../../shared/schemas/dose';
import type { GlucoseUnit } from '../../shared/schemas/units';
import { requestFormSchema } from '../ui/request-form-schema';
import { earlierDoseField, earlierDosesRequest, type EarlierDoseRow } from './earlier-doses-fields';

/** The dose check as typed: text exactly as entered, minutes relative to the moment of asking. */
export type DoseFormValues = {
  portionCode: string;
  carbsGrams: string;
  glucose: string;
  /** Empty until the person says how old the reading is: a blank never claims a fresh reading. */
  glucoseMinutesAgo: string;
  localTime: string;
  dayKindId: number | null;
  exerciseIntensity: 'none' | 'light' | 'moderate' | 'hard';
  exerciseDuration: string;
  exerciseStartsIn: string;
  splitOn: boolean;
  splitNow: string;
  splitLater: string;
  earlierDoses: EarlierDoseRow[];
  fatGrams: string;
  proteinGrams: string;
};

/** What the request needs besides the typed values: the moment of asking and the profile's unit and date. */
export type DoseRequestContext = { now: number; glucoseUnit: GlucoseUnit; date: string };

const hhmm = (d: Date) => `${String(d.getHours()).padStart(2, '0')}:${String(d.getMinutes()).padStart(2, '0')}`;
const blank = (s: string) => s.trim() === '';

/** The form's starting values; `carbs` comes from a portion link ("28.83" → "28.8"). */
export function doseFormDefaults(carbs: string | undefined, now: Date): DoseFormValues {
  return {
    portionCode: '',
    carbsGrams: carbs && Number.isFinite(Number(carbs)) ? String(Math.round(Number(carbs) * 10) / 10) : '',
    glucose: '',
    glucoseMinutesAgo: '',
    localTime: hhmm(now),
    dayKindId: null,
    exerciseIntensity: 'none',
    exerciseDuration: '45',
    exerciseStartsIn: '60',
    splitOn: false,
    splitNow: '60',
    splitLater: '60',
    earlierDoses: [],
    fatGrams: '',
    proteinGrams: '',
  };
}

/** Where an error on a request field lands in the form. */
const FIELD_OF: Record<string, keyof DoseFormValues> = {
  carbsGrams: 'carbsGrams',
  glucose: 'glucose',
  glucoseTakenAt: 'glucoseMinutesAgo',
  localTime: 'localTime',
  dayKindId: 'dayKindId',
  'exercise.durationMinutes': 'exerciseDuration',
  'exercise.startsInMinutes': 'exerciseStartsIn',
  'split.nowPercent': 'splitNow',
  'split.laterMinutes': 'splitLater',
  fatGrams: 'fatGrams',
  proteinGrams: 'proteinGrams',
};

/**
 * The request body from the typed values at `now` (minutes ago become times), plus the errors (by request path) of
 * values that cannot become a request at all, and the form field each request path belongs to.
 */
export function toDoseRequest(v: DoseFormValues, { now, glucoseUnit, date }: DoseRequestContext) {
  const errors: Record<string, string[]> = {};
  let glucoseTakenAt: string | null = null;
  if (!blank(v.glucose)) {
    const minutes = Number(v.glucoseMinutesAgo.trim().replace(',', '.'));
    if (blank(v.glucoseMinutesAgo) || !Number.isFinite(minutes) || minutes < 0) {
      errors.glucoseTakenAt = ['Enter how many minutes ago the reading was taken (0 or more).'];
    } else glucoseTakenAt = new Date(now - minutes * 60_000).toISOString();
  }
  const earlier = earlierDosesRequest(v.earlierDoses, now);
  Object.assign(errors, earlier.errors);
  const rowOfDose = earlier.doses.map((d) => d.row);
  const request = {
    carbsGrams: v.carbsGrams,
    glucose: blank(v.glucose) ? null : v.glucose,
    glucoseUnit,
    glucoseTakenAt,
    mealAt: new Date(now).toISOString(),
    localTime: v.localTime,
    dayKindId: v.dayKindId,
    date,
    earlierDoses: earlier.doses.map(({ units, takenAt }) => ({ units, takenAt })),
    exercise: v.exerciseIntensity === 'none' ? null : { intensity: v.exerciseIntensity, durationMinutes: v.exerciseDuration, startsInMinutes: v.exerciseStartsIn },
    split: v.splitOn ? { nowPercent: v.splitNow, laterMinutes: v.splitLater } : null,
    fatGrams: v.fatGrams,
    proteinGrams: v.proteinGrams,
  };
  const fieldOf = (path: string): string | undefined => FIELD_OF[path] ?? earlierDoseField(path, rowOfDose);
  return { request, errors, fieldOf };
}

/** The form's schema for zodResolver: the shared doseRequestSchema on the built request; `context` is read at validation time. */
export const doseFormSchema = (context: () => DoseRequestContext) =>
  requestFormSchema(doseRequestSchema, (values: DoseFormValues) => toDoseRequest(values, context()));
