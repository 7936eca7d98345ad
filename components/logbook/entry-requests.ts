import { toLocalTime, zonedToInstant } from '../../shared/compute/local-time';
import { EXERCISE_INTENSITIES, type ExerciseIntensity } from '../../shared/compute/exercise';
import { createLogEntryInputSchema, editLogEntryInputSchema, type LogEntry } from '../../shared/schemas/logbook';
import { timeToMinutes } from '../../shared/schemas/profile-settings';
import type { GlucoseUnit } from '../../shared/schemas/units';
import { requestFormSchema } from '../ui/request-form-schema';

/** What the Add-an-entry form can log (a meal here is typed carbohydrate with a note). */
export type AddKind = 'reading' | 'rapid_dose' | 'long_dose' | 'exercise' | 'meal';
export type WhenChoice = 'now' | 'ago' | 'clock';

/** The form holds text; the request builders turn it into the API's shapes. */
export type EntryFields = { glucose: string; units: string; intensity: ExerciseIntensity; durationMinutes: string; carbsGrams: string; note: string };
export type AddEntryValues = EntryFields & { kind: AddKind; when: WhenChoice; whenValue: string };
export type EditEntryValues = EntryFields & { time: string };

const INTENSITY_WORDS: Record<ExerciseIntensity, string> = { light: 'Light', moderate: 'Moderate', hard: 'Hard' };
/** The exercise intensity choices for both forms. */
export const INTENSITY_CHOICES = EXERCISE_INTENSITIES.map((i) => ({ value: i, label: INTENSITY_WORDS[i] }));

const blank = (s: string) => (s.trim() === '' ? undefined : s);
const CLOCK = /^([01]?\d|2[0-3]):([0-5]\d)$/;

/** Where each request path lands in the form (a typed meal's fields sit under "meal"). */
const fieldOf = (timeField: string) => (path: string) =>
  path === 'occurredAt' ? timeField : (['glucose', 'units', 'intensity', 'durationMinutes', 'carbsGrams', 'note'].find((f) => path === f || path === `meal.${f}`) ?? undefined);

/** The instant of "now", "N minutes ago" or a clock time today in the profile's zone (undefined means now). */
export function occurredAtFrom(when: WhenChoice, text: string, now: number, timeZone: string): { at?: string; error?: string } {
  if (when === 'now') return {};
  if (when === 'ago') {
    const minutes = Number(text.trim());
    if (text.trim() === '' || !Number.isInteger(minutes) || minutes < 0 || minutes > 1440) return { error: 'Enter whole minutes, 0 to 1440.' };
    return { at: new Date(now - minutes * 60_000).toISOString() };
  }
  if (!CLOCK.test(text.trim())) return { error: 'Enter a clock time such as 07:30.' };
  const at = zonedToInstant(toLocalTime(now, timeZone).localDate, timeToMinutes(text.trim()), timeZone);
  return at > now ? { error: 'That time is later than now. Use minutes ago for yesterday.' } : { at: new Date(at).toISOString() };
}

/** The body of POST …/log-entries for the chosen kind. */
export function toCreateRequest(v: AddEntryValues, glucoseUnit: GlucoseUnit, timeZone: string, now: number) {
  const { at, error } = occurredAtFrom(v.when, v.whenValue, now, timeZone);
  const note = blank(v.note);
  const request =
    v.kind === 'reading'
      ? { kind: v.kind, glucose: blank(v.glucose), glucoseUnit, occurredAt: at }
      : v.kind === 'rapid_dose' || v.kind === 'long_dose'
        ? { kind: v.kind, units: blank(v.units), occurredAt: at, note }
        : v.kind === 'exercise'
          ? { kind: v.kind, intensity: v.intensity, durationMinutes: blank(v.durationMinutes), occurredAt: at, note }
          : { kind: v.kind, occurredAt: at, meal: { source: 'typed', carbsGrams: blank(v.carbsGrams), note: v.note } };
  return { request, errors: error ? { whenValue: [error] } : undefined, fieldOf: fieldOf('whenValue') };
}

/** A form schema per profile unit and zone: the shared create schema checks the built request. */
export const addEntryFormSchema = (glucoseUnit: GlucoseUnit, timeZone: string) =>
  requestFormSchema(createLogEntryInputSchema, (v: AddEntryValues) => toCreateRequest(v, glucoseUnit, timeZone, Date.now()));

/** The body of PATCH …/log-entries/:id: the fields of the entry's kind, and the time when it was changed. */
export function toEditRequest(v: EditEntryValues, entry: LogEntry, glucoseUnit: GlucoseUnit) {
  const time = v.time.trim();
  const errors = time !== entry.localTime && !CLOCK.test(time) ? { time: ['Enter a clock time such as 07:30.'] } : undefined;
  const occurredAt = time !== entry.localTime && !errors ? new Date(zonedToInstant(entry.localDate, timeToMinutes(time), entry.timeZone)).toISOString() : undefined;
  const note = v.note.trim() === '' ? null : v.note;
  const byKind =
    entry.kind === 'reading'
      ? { glucose: v.glucose, glucoseUnit }
      : entry.kind === 'rapid_dose' || entry.kind === 'long_dose'
        ? { units: v.units, note }
        : entry.kind === 'exercise'
          ? { intensity: v.intensity, durationMinutes: v.durationMinutes, note }
          : entry.meal?.source === 'typed'
            ? { carbsGrams: v.carbsGrams }
            : {};
  return { request: { occurredAt, ...byKind }, errors, fieldOf: fieldOf('time') };
}

export const editEntryFormSchema = (entry: LogEntry, glucoseUnit: GlucoseUnit) =>
  requestFormSchema(editLogEntryInputSchema, (v: EditEntryValues) => toEditRequest(v, entry, glucoseUnit));
