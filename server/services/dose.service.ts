import { computeDose } from '../../shared/compute/dose';
import { glucoseToMmol } from '../../shared/compute/units';
import type { DoseRequest, DoseSuggestion } from '../../shared/schemas/dose';
import { timeToMinutes } from '../../shared/schemas/profile-settings';
import { AppError } from '../errors';
import { dayKindIdForDate } from './day-kind-days.service';
import { loadDoseContext } from './dose-context.service';

/** Plausible glucose readings, mmol/L; anything outside is a typing slip, not a reading. */
const GLUCOSE_READING_MMOL = [1, 40] as const;

/**
 * Computes a dose suggestion for a profile with the shared engine (nothing is saved). Glucose comes in
 * the request's unit (default the profile's); a missing reading time means "now".
 */
export async function suggestDose(profileId: number, input: DoseRequest, now: Date = new Date()): Promise<DoseSuggestion> {
  const dayKindId = input.dayKindId ?? (input.date ? await dayKindIdForDate(profileId, input.date) : null);
  const { profile, settings, dayKind } = await loadDoseContext(profileId, dayKindId);
  const unit = input.glucoseUnit ?? profile.glucoseUnit;
  const mealAt = input.mealAt ? new Date(input.mealAt) : now;
  const glucoseTakenAt = input.glucose != null ? (input.glucoseTakenAt ? new Date(input.glucoseTakenAt) : now) : null;
  if (input.glucose != null) {
    const mmol = glucoseToMmol(input.glucose, unit);
    if (mmol < GLUCOSE_READING_MMOL[0] || mmol > GLUCOSE_READING_MMOL[1]) {
      throw AppError.validation({ glucose: [`That reading is outside what a meter shows. Check the number and the unit (${unit === 'mmol_l' ? 'mmol/L' : 'mg/dL'}).`] });
    }
  }
  const result = computeDose(settings, dayKind, {
    carbsGrams: input.carbsGrams,
    glucose: input.glucose != null ? { value: input.glucose, unit, takenAt: glucoseTakenAt!.getTime() } : null,
    mealAt: mealAt.getTime(),
    mealMinuteOfDay: timeToMinutes(input.localTime),
    earlierDoses: (input.earlierDoses ?? []).map((d) => ({ units: d.units, takenAt: new Date(d.takenAt).getTime() })),
    exercise: input.exercise ?? null,
    split: input.split ?? null,
    fatGrams: input.fatGrams ?? null,
    proteinGrams: input.proteinGrams ?? null,
  });
  return {
    ...result,
    glucoseUnit: profile.glucoseUnit,
    carbBasis: profile.carbBasis,
    carbUnit: profile.carbUnit,
    mealAt: mealAt.toISOString(),
    glucoseTakenAt: glucoseTakenAt ? glucoseTakenAt.toISOString() : null,
  };
}
