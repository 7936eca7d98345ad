import { QueryTypes, type InferAttributes } from 'sequelize';
import type { DayKindRatios, DoseSettings } from '../../shared/compute/dose';
import { minutesToTime } from '../../shared/schemas/profile-settings';
import type { LoggedDose } from '../../shared/schemas/dose';
import { AppError } from '../errors';
import type { CarbBasis, CarbUnit, GlucoseUnit } from '../../shared/schemas/units';
import { ProfileModel, type ProfileSettingsModel } from '../models';
import { timesOfDayJson } from './day-kinds.service';

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

type DoseContextRow = {
  glucoseUnit: GlucoseUnit;
  carbBasis: CarbBasis;
  carbUnit: CarbUnit;
  dayKindAsked: number | null;
  dayKind: { id: number; name: string; timesOfDay: DayKindRatios['timesOfDay'] } | null;
} & ({ hasSettings: true } & InferAttributes<ProfileSettingsModel> | { hasSettings: false });

/**
 * The engine's inputs for a profile: settings (mmol/L) and the day kind — the one asked for, else the one the date is
 * set to, else the default; null parts when not set up. One statement (a dose check is the busiest question asked).
 */
export async function loadDoseContext(
  profileId: number,
  dayKindId?: number | null,
  date?: string | null,
): Promise<{ profile: Pick<ProfileModel, 'glucoseUnit' | 'carbBasis' | 'carbUnit'>; settings: DoseSettings | null; dayKind: DayKindRatios | null }> {
  const [row] = await ProfileModel.sequelize!.query<DoseContextRow>(
    `WITH asked AS (
       SELECT COALESCE(CAST(:dayKindId AS integer),
                       (SELECT d.day_kind_id FROM day_kind_days d WHERE d.profile_id = :profileId AND d.date = CAST(:date AS date))) AS id
     )
     SELECT p.glucose_unit AS "glucoseUnit", p.carb_basis AS "carbBasis", p.carb_unit AS "carbUnit",
            (SELECT id FROM asked) AS "dayKindAsked",
            s.profile_id IS NOT NULL AS "hasSettings",
            s.pen_increment AS "penIncrement", s.rounding, s.max_dose_units AS "maxDoseUnits", s.action_time_hours AS "actionTimeHours",
            s.active_insulin_model AS "activeInsulinModel", s.target_low_mmol AS "targetLowMmol", s.target_high_mmol AS "targetHighMmol",
            s.correction_target_mmol AS "correctionTargetMmol", s.hypo_threshold_mmol AS "hypoThresholdMmol",
            s.very_high_mmol AS "veryHighMmol", s.allow_negative_correction AS "allowNegativeCorrection",
            s.iob_convention AS "iobConvention", s.exercise_reductions AS "exerciseReductions",
            (SELECT json_build_object('id', k.id, 'name', k.name, 'timesOfDay', ${timesOfDayJson('k')})
               FROM day_kinds k
              WHERE k.profile_id = p.id AND CASE WHEN (SELECT id FROM asked) IS NULL THEN k.is_default ELSE k.id = (SELECT id FROM asked) END
              LIMIT 1) AS "dayKind"
       FROM profiles p LEFT JOIN profile_settings s ON s.profile_id = p.id
      WHERE p.id = :profileId`,
    { replacements: { profileId, dayKindId: dayKindId ?? null, date: date ?? null }, type: QueryTypes.SELECT },
  );
  if (!row) throw AppError.notFound('profile');
  if (dayKindId && !row.dayKind) throw AppError.validation({ dayKindId: ['That day kind is not on this profile.'] });
  return {
    profile: { glucoseUnit: row.glucoseUnit, carbBasis: row.carbBasis, carbUnit: row.carbUnit },
    settings: row.hasSettings ? toDoseSettings(row) : null,
    dayKind: row.dayKind,
  };
}

/**
 * Rapid-acting doses logged on the profile within the action time before `at` (not deleted), oldest first: what the
 * dose check counts as insulin still active, listed with their times.
 */
export async function loggedRapidDoses(profileId: number, at: Date, actionTimeHours?: number): Promise<LoggedDose[]> {
  // Without the action time, the profile's own is read in the same statement (no settings: no row is in range).
  const rows = await ProfileModel.sequelize!.query<{ id: number; units: number; occurredAt: Date; localDate: string; localMinute: number }>(
    `SELECT e.id, e.units, e.occurred_at AS "occurredAt", e.local_date AS "localDate", e.local_minute AS "localMinute"
       FROM log_entries e
      WHERE e.profile_id = :profileId AND e.kind = 'rapid_dose' AND e.deleted_at IS NULL AND e.units > 0
        AND e.occurred_at <= :at
        AND e.occurred_at > CAST(:at AS timestamptz) - make_interval(secs => 3600 * COALESCE(CAST(:hours AS double precision),
              (SELECT action_time_hours FROM profile_settings WHERE profile_id = :profileId)))
      ORDER BY e.occurred_at, e.id`,
    { replacements: { profileId, at, hours: actionTimeHours ?? null }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ entryId: r.id, units: r.units, takenAt: new Date(r.occurredAt).toISOString(), localDate: r.localDate, localTime: minutesToTime(r.localMinute) }));
}
