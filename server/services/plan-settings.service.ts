import { Op } from 'sequelize';
import { minutesToTime, timeToMinutes } from '../../shared/schemas/profile-settings';
import type { PlanSettings, PlanSettingsInput } from '../../shared/schemas/plan';
import { AppError } from '../errors';
import { DayKindModel, PlanMealNameModel, PlanSettingsModel, PlanWeekdayModel } from '../models';

/** A profile's week start (Monday when never set), weekly pattern (Monday first) and named meals (by clock time). */
export async function getPlanSettings(profileId: number): Promise<PlanSettings> {
  const [settings, days, names] = await Promise.all([
    PlanSettingsModel.findByPk(profileId),
    PlanWeekdayModel.findAll({ where: { profileId } }),
    PlanMealNameModel.findAll({ where: { profileId }, order: [['minute', 'ASC'], ['id', 'ASC']] }),
  ]);
  const byDay = new Map(days.map((d) => [d.weekday, d.dayKindId]));
  return {
    weekStart: settings?.weekStart ?? 1,
    pattern: [1, 2, 3, 4, 5, 6, 7].map((weekday) => ({ weekday, dayKindId: byDay.get(weekday) ?? null })),
    mealNames: names.map((n) => ({ id: n.id, name: n.name, time: minutesToTime(n.minute) })),
  };
}

/**
 * Saves the week start, the weekly pattern and the named meals in one transaction. Meals keep their id when sent
 * with it; one left out is deleted (its planned meals keep their own clock time).
 */
export async function savePlanSettings(profileId: number, input: PlanSettingsInput): Promise<PlanSettings> {
  const kindIds = [...new Set(input.pattern.map((p) => p.dayKindId).filter((id): id is number => id != null))];
  const kinds = await DayKindModel.count({ where: { profileId, id: { [Op.in]: kindIds } } });
  if (kinds !== kindIds.length) {
    const errors: Record<string, string[]> = {};
    input.pattern.forEach((p, i) => {
      if (p.dayKindId != null) errors[`pattern.${i}.dayKindId`] = ['That kind of day is not on this profile.'];
    });
    throw AppError.validation(errors);
  }
  const existing = await PlanMealNameModel.findAll({ where: { profileId } });
  const known = new Set(existing.map((n) => n.id));
  const unknown = input.mealNames.findIndex((n) => n.id != null && !known.has(n.id));
  if (unknown >= 0) throw AppError.validation({ [`mealNames.${unknown}.id`]: ['That meal is not on this profile.'] });

  await PlanSettingsModel.sequelize!.transaction(async (transaction) => {
    await PlanSettingsModel.upsert({ profileId, weekStart: input.weekStart }, { transaction });
    await PlanWeekdayModel.destroy({ where: { profileId }, transaction });
    const lines = input.pattern.filter((p) => p.dayKindId != null).map((p) => ({ profileId, weekday: p.weekday, dayKindId: p.dayKindId! }));
    if (lines.length) await PlanWeekdayModel.bulkCreate(lines, { transaction });
    const kept = new Set(input.mealNames.map((n) => n.id).filter((id) => id != null));
    await PlanMealNameModel.destroy({ where: { profileId, id: { [Op.notIn]: [...kept, 0] as number[] } }, transaction });
    for (const n of input.mealNames) {
      const values = { name: n.name, minute: timeToMinutes(n.time) };
      if (n.id != null) await PlanMealNameModel.update(values, { where: { id: n.id, profileId }, transaction });
      else await PlanMealNameModel.create({ profileId, ...values }, { transaction });
    }
  });
  return getPlanSettings(profileId);
}
