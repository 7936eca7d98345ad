import { computeDose } from '../../shared/compute/dose';
import { glucoseToMmol } from '../../shared/compute/units';
import type { DoseRequest, DoseSuggestion } from '../../shared/schemas/dose';
import type { GlucoseUnit } from '../../shared/schemas/units';
import { timeToMinutes } from '../../shared/schemas/profile-settings';
import { AppError } from '../errors';
import { loadDoseContext, loggedRapidDoses } from './dose-context.service';
import { DOSE_CAUTION, DOSE_ENGINE_VERSION } from '../../shared/compute/dose-caution';

/** Plausible glucose readings, mmol/L; anything outside is a typing slip, not a reading. */
const GLUCOSE_READING_MMOL = [1, 40] as const;

/** A typed glucose reading in mmol/L, or a 422 on `field` when it is outside what a meter shows. */
export function readingToMmol(value: number, unit: GlucoseUnit, field = 'glucose'): number {
  const mmol = glucoseToMmol(value, unit);
  if (mmol < GLUCOSE_READING_MMOL[0] || mmol > GLUCOSE_READING_MMOL[1]) {
    throw AppError.validation({ [field]: [`That reading is outside what a meter shows. Check the number and the unit (${unit === 'mmol_l' ? 'mmol/L' : 'mg/dL'}).`] });
  }
  return mmol;
}

/**
 * Computes a dose suggestion for a profile with the shared engine (nothing is saved). Glucose comes in
 * the request's unit (default the profile's); a missing reading time means "now".
 */
export async function suggestDose(profileId: number, input: DoseRequest, now: Date = new Date()): Promise<DoseSuggestion> {
  const mealAt = input.mealAt ? new Date(input.mealAt) : now;
  // Insulin still active: the doses logged in the action time (read beside the settings), plus any typed ones given elsewhere.
  const [{ profile, settings, dayKind }, loggedInRange] = await Promise.all([
    loadDoseContext(profileId, input.dayKindId, input.date),
    loggedRapidDoses(profileId, mealAt),
  ]);
  const unit = input.glucoseUnit ?? profile.glucoseUnit;
  const glucoseTakenAt = input.glucose != null ? (input.glucoseTakenAt ? new Date(input.glucoseTakenAt) : now) : null;
  if (input.glucose != null) readingToMmol(input.glucose, unit);
  const logged = settings ? loggedInRange : [];
  const typed = (input.earlierDoses ?? []).map((d) => ({ units: d.units, takenAt: new Date(d.takenAt).getTime() }));
  const result = computeDose(settings, dayKind, {
    carbsGrams: input.carbsGrams,
    glucose: input.glucose != null ? { value: input.glucose, unit, takenAt: glucoseTakenAt!.getTime() } : null,
    mealAt: mealAt.getTime(),
    mealMinuteOfDay: timeToMinutes(input.localTime),
    earlierDoses: [...logged.map((d) => ({ units: d.units, takenAt: Date.parse(d.takenAt) })), ...typed],
    exercise: input.exercise ?? null,
    split: input.split ?? null,
    fatGrams: input.fatGrams ?? null,
    proteinGrams: input.proteinGrams ?? null,
  });
  return {
    ...result,
    caution: { ...DOSE_CAUTION },
    engineVersion: DOSE_ENGINE_VERSION,
    loggedDoses: logged,
    glucoseUnit: profile.glucoseUnit,
    carbBasis: profile.carbBasis,
    carbUnit: profile.carbUnit,
    mealAt: mealAt.toISOString(),
    glucoseTakenAt: glucoseTakenAt ? glucoseTakenAt.toISOString() : null,
  };
}
