import { Op } from 'sequelize';
import type { DayKindDay, DayKindDayInput } from '../../shared/schemas/profile-settings';
import { AppError } from '../errors';
import { DayKindDayModel, DayKindModel } from '../models';

function datesBetween(from: string, to: string): string[] {
  const out: string[] = [];
  for (let t = Date.parse(`${from}T00:00:00Z`); t <= Date.parse(`${to}T00:00:00Z`); t += 86_400_000) out.push(new Date(t).toISOString().slice(0, 10));
  return out;
}

/** The day kind in force on each date from..to (inclusive): the one set for the date, else the default. */
export async function listDayKindDays(profileId: number, from: string, to: string): Promise<DayKindDay[]> {
  const kinds = await DayKindModel.findAll({ where: { profileId } });
  const byId = new Map(kinds.map((k) => [k.id, k]));
  const fallback = kinds.find((k) => k.isDefault) ?? null;
  const rows = await DayKindDayModel.findAll({ where: { profileId, date: { [Op.between]: [from, to] } } });
  const set = new Map(rows.map((r) => [r.date, r.dayKindId]));
  return datesBetween(from, to).map((date) => {
    const kind = (set.has(date) ? byId.get(set.get(date)!) : undefined) ?? fallback;
    return { date, dayKindId: kind?.id ?? null, dayKindName: kind?.name ?? null, isSet: set.has(date) };
  });
}

/** Gives a date a day kind of this profile, or (null) puts it back to the default. */
export async function setDayKindDay(profileId: number, date: string, userId: number, input: DayKindDayInput): Promise<DayKindDay> {
  if (input.dayKindId == null) {
    await DayKindDayModel.destroy({ where: { profileId, date } });
  } else {
    const kind = await DayKindModel.findOne({ where: { id: input.dayKindId, profileId } });
    if (!kind) throw AppError.validation({ dayKindId: ['That day kind is not on this profile.'] });
    // One statement, so two people setting the same date at once cannot trip over the unique index.
    await DayKindDayModel.sequelize!.query(
      `INSERT INTO day_kind_days (profile_id, date, day_kind_id, set_by_user_id, created_at, updated_at)
       VALUES (:profileId, :date, :dayKindId, :userId, now(), now())
       ON CONFLICT (profile_id, date) DO UPDATE SET day_kind_id = EXCLUDED.day_kind_id, set_by_user_id = EXCLUDED.set_by_user_id, updated_at = now()`,
      { replacements: { profileId, date, dayKindId: kind.id, userId } },
    );
  }
  return (await listDayKindDays(profileId, date, date))[0];
}

/** The id of the day kind set for a date, or null when the date uses the default. */
export async function dayKindIdForDate(profileId: number, date: string): Promise<number | null> {
  const row = await DayKindDayModel.findOne({ where: { profileId, date } });
  return row?.dayKindId ?? null;
}
