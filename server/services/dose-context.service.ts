import type { DayKindRatios, DoseSettings } from '../../shared/compute/dose';
import { AppError } from '../errors';
import { DayKindModel, ProfileModel, ProfileSettingsModel } from '../models';
import { withTimesOfDay } from './day-kinds.service';
import { loadProfile } from './profiles.service';

/** The engine's inputs for a profile: settings (mmol/L) and the chosen or default day kind; null parts when not set up. */
export async function loadDoseContext(
  profileId: number,
  dayKindId?: number | null,
): Promise<{ profile: ProfileModel; settings: DoseSettings | null; dayKind: DayKindRatios | null }> {
  const profile = await loadProfile(profileId);
  const row = await ProfileSettingsModel.findByPk(profileId);
  const where = dayKindId ? { profileId, id: dayKindId } : { profileId, isDefault: true };
  const kind = await DayKindModel.findOne({ where, ...withTimesOfDay });
  if (dayKindId && !kind) throw AppError.validation({ dayKindId: ['That day kind is not on this profile.'] });
  const settings: DoseSettings | null = row && {
    penIncrement: row.penIncrement,
    rounding: row.rounding,
    maxDoseUnits: row.maxDoseUnits,
    actionTimeHours: row.actionTimeHours,
    activeInsulinModel: row.activeInsulinModel,
    targetLowMmol: row.targetLowMmol,
    targetHighMmol: row.targetHighMmol,
    correctionTargetMmol: row.correctionTargetMmol,
    hypoThresholdMmol: row.hypoThresholdMmol,
    veryHighMmol: row.veryHighMmol,
    allowNegativeCorrection: row.allowNegativeCorrection,
    iobConvention: row.iobConvention,
    exerciseReductions: row.exerciseReductions,
  };
  const dayKind: DayKindRatios | null = kind && {
    id: kind.id,
    name: kind.name,
    timesOfDay: (kind.timesOfDay ?? []).map((b) => ({
      startMinute: b.startMinute,
      endMinute: b.endMinute,
      carbRatio: b.carbRatio,
      correctionFactorMmol: b.correctionFactorMmol,
    })),
  };
  return { profile, settings, dayKind };
}
