import { glucoseToMmol } from '../../shared/compute/units';
import type { ProfileSettingsInput, ProfileSettingsView } from '../../shared/schemas/profile-settings';
import { ProfileModel, ProfileSettingsModel } from '../models';
import { loadProfile, show } from './profiles.service';
import { recordChange } from './settings-history.service';

function toView(profile: ProfileModel, row: ProfileSettingsModel | null): ProfileSettingsView {
  const u = profile.glucoseUnit;
  return {
    glucoseUnit: u,
    carbBasis: profile.carbBasis,
    carbUnit: profile.carbUnit,
    preferredFoodTable: profile.preferredFoodTable,
    timeZone: profile.timeZone,
    settings: row && {
      penIncrement: row.penIncrement,
      rounding: row.rounding,
      maxDoseUnits: row.maxDoseUnits,
      actionTimeHours: row.actionTimeHours,
      activeInsulinModel: row.activeInsulinModel,
      targetLow: show(row.targetLowMmol, u),
      targetHigh: show(row.targetHighMmol, u),
      correctionTarget: show(row.correctionTargetMmol, u),
      hypoThreshold: show(row.hypoThresholdMmol, u),
      veryHigh: show(row.veryHighMmol, u),
      allowNegativeCorrection: row.allowNegativeCorrection,
      iobConvention: row.iobConvention,
      exerciseReductions: row.exerciseReductions,
    },
    updatedAt: row ? row.updatedAt.toISOString() : null,
  };
}

/** The profile's units and dose settings (settings is null until set up). */
export async function getSettings(profileId: number): Promise<ProfileSettingsView> {
  const profile = await loadProfile(profileId);
  return toView(profile, await ProfileSettingsModel.findByPk(profileId));
}

/** Saves units and safety limits in one transaction and records the change (old and new values). */
export async function updateSettings(profileId: number, userId: number, input: ProfileSettingsInput): Promise<ProfileSettingsView> {
  const sequelize = ProfileModel.sequelize!;
  return sequelize.transaction(async (transaction) => {
    const profile = await loadProfile(profileId, transaction);
    const existing = await ProfileSettingsModel.findByPk(profileId, { transaction });
    const before = toView(profile, existing);
    const u = input.glucoseUnit;
    await profile.update(
      { glucoseUnit: u, carbBasis: input.carbBasis, carbUnit: input.carbUnit, preferredFoodTable: input.preferredFoodTable ?? profile.preferredFoodTable, timeZone: input.timeZone ?? profile.timeZone },
      { transaction },
    );
    const values = {
      profileId,
      penIncrement: input.penIncrement,
      rounding: input.rounding,
      maxDoseUnits: input.maxDoseUnits,
      actionTimeHours: input.actionTimeHours,
      activeInsulinModel: input.activeInsulinModel,
      targetLowMmol: glucoseToMmol(input.targetLow, u),
      targetHighMmol: glucoseToMmol(input.targetHigh, u),
      correctionTargetMmol: glucoseToMmol(input.correctionTarget, u),
      hypoThresholdMmol: glucoseToMmol(input.hypoThreshold, u),
      veryHighMmol: glucoseToMmol(input.veryHigh, u),
      allowNegativeCorrection: input.allowNegativeCorrection,
      iobConvention: input.iobConvention,
      exerciseReductions: input.exerciseReductions,
      updatedByUserId: userId,
    };
    const row = existing ? await existing.update(values, { transaction }) : await ProfileSettingsModel.create(values, { transaction });
    const after = toView(profile, row);
    await recordChange(
      { profileId, userId, subject: 'settings', subjectId: null, subjectName: 'Units and safety limits', action: existing ? 'updated' : 'created' },
      { ...before, updatedAt: undefined },
      { ...after, updatedAt: undefined },
      transaction,
    );
    return after;
  });
}

