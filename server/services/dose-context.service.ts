import { Op, type InferAttributes } from 'sequelize';
import type { DayKindRatios, DoseSettings } from '../../shared/compute/dose';
import { minutesToTime } from '../../shared/schemas/profile-settings';
import type { LoggedDose } from '../../shared/schemas/dose';
import { AppError } from '../errors';
import { DayKindModel, LogEntryModel, ProfileModel, ProfileSettingsModel } from '../models';
import { withTimesOfDay } from './day-kinds.service';
import { loadProfile } from './profiles.service';

/** The dose settings of a profile's settings row (a model or a plain row). */
export function toDoseSettings(row: InferAttributes<ProfileSettingsModel>): DoseSettings {
  return {
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
}

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
  const settings = row && toDoseSettings(row);
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

/**
 * Rapid-acting doses logged on the profile within the action time before `at` (not deleted), oldest first: what the
 * dose check counts as insulin still active, listed with their times.
 */
export async function loggedRapidDoses(profileId: number, at: Date, actionTimeHours: number): Promise<LoggedDose[]> {
  const from = new Date(at.getTime() - actionTimeHours * 3_600_000);
  const rows = await LogEntryModel.findAll({
    where: { profileId, kind: 'rapid_dose', deletedAt: null, occurredAt: { [Op.gt]: from, [Op.lte]: at } },
    order: [['occurredAt', 'ASC'], ['id', 'ASC']],
  });
  return rows
    .filter((r) => r.units != null && r.units > 0)
    .map((r) => ({ entryId: r.id, units: r.units!, takenAt: r.occurredAt.toISOString(), localDate: r.localDate, localTime: minutesToTime(r.localMinute) }));
}
