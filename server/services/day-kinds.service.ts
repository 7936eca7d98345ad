import { QueryTypes, type Transaction } from 'sequelize';
import { glucoseToMmol } from '../../shared/compute/units';
import { minutesToTime, timeToMinutes, type DayKind, type DayKindInput } from '../../shared/schemas/profile-settings';
import type { GlucoseUnit } from '../../shared/schemas/units';
import { AppError } from '../errors';
import { DayKindModel, ProfileModel, TimeOfDayModel } from '../models';
import { loadProfile, show } from './profiles.service';
import { recordChange } from './settings-history.service';

type DayKindRow = Pick<DayKindModel, 'id' | 'name' | 'isDefault' | 'longActingUnits' | 'updatedAt'> & {
  timesOfDay?: Pick<TimeOfDayModel, 'startMinute' | 'endMinute' | 'carbRatio' | 'correctionFactorMmol'>[];
};

export function dayKindToView(kind: DayKindRow, unit: GlucoseUnit): DayKind {
  const timesOfDay = [...(kind.timesOfDay ?? [])].sort((a, b) => a.startMinute - b.startMinute);
  return {
    id: kind.id,
    name: kind.name,
    isDefault: kind.isDefault,
    longActingUnits: kind.longActingUnits,
    glucoseUnit: unit,
    timesOfDay: timesOfDay.map((b) => ({
      from: minutesToTime(b.startMinute),
      to: minutesToTime(b.endMinute),
      carbRatio: b.carbRatio,
      correctionFactor: show(b.correctionFactorMmol, unit),
    })),
    updatedAt: kind.updatedAt.toISOString(),
  };
}

/**
 * A day kind's times of day as one JSON array (`startMinute`, `endMinute`, `carbRatio`, `correctionFactorMmol`), in
 * the order of the day, for plain statements that read kinds with their times; `alias` names the day_kinds row.
 */
export function timesOfDayJson(alias: string): string {
  return `COALESCE((SELECT json_agg(json_build_object('startMinute', t.start_minute, 'endMinute', t.end_minute, 'carbRatio', t.carb_ratio,
      'correctionFactorMmol', t.correction_factor_mmol) ORDER BY t.start_minute, t.id) FROM times_of_day t WHERE t.day_kind_id = ${alias}.id), '[]'::json)`;
}

/** Loads a day kind's times of day with it. */
export const withTimesOfDay = { include: [{ model: TimeOfDayModel, as: 'timesOfDay' }] };

/** The profile's day kinds, default first, each with its times of day in the profile's glucose unit. */
export async function listDayKinds(profileId: number): Promise<DayKind[]> {
  // One plain statement: the profile's glucose unit beside each kind and its times of day (a profile without kinds gives one row of nulls).
  const rows = await DayKindModel.sequelize!.query<Omit<DayKindRow, 'id'> & { id: number | null; glucoseUnit: GlucoseUnit }>(
    `SELECT p.glucose_unit AS "glucoseUnit", k.id, k.name, k.is_default AS "isDefault", k.long_acting_units AS "longActingUnits",
            k.updated_at AS "updatedAt",
            ${timesOfDayJson('k')} AS "timesOfDay"
       FROM profiles p LEFT JOIN day_kinds k ON k.profile_id = p.id
      WHERE p.id = :profileId
      ORDER BY k.is_default DESC, k.name ASC`,
    { replacements: { profileId }, type: QueryTypes.SELECT },
  );
  if (!rows.length) throw AppError.notFound('profile');
  return rows.filter((r): r is typeof r & { id: number } => r.id !== null).map((k) => dayKindToView(k, k.glucoseUnit));
}

async function findDayKind(profileId: number, dayKindId: number, transaction?: Transaction) {
  const kind = await DayKindModel.findOne({ where: { id: dayKindId, profileId }, ...withTimesOfDay, transaction });
  if (!kind) throw AppError.notFound('day kind');
  return kind;
}

async function assertNameFree(profileId: number, name: string, exceptId: number | null, transaction: Transaction) {
  const kinds = await DayKindModel.findAll({ where: { profileId }, transaction });
  if (kinds.some((k) => k.id !== exceptId && k.name.toLowerCase() === name.toLowerCase())) {
    throw AppError.conflict('There is already a day kind with that name.', { name: ['Choose a name not used yet.'] });
  }
  return kinds;
}

async function writeTimesOfDay(kind: DayKindModel, input: DayKindInput, transaction: Transaction) {
  await TimeOfDayModel.destroy({ where: { dayKindId: kind.id }, transaction });
  await TimeOfDayModel.bulkCreate(
    input.timesOfDay.map((b) => ({
      dayKindId: kind.id,
      startMinute: timeToMinutes(b.from),
      endMinute: timeToMinutes(b.to),
      carbRatio: b.carbRatio,
      correctionFactorMmol: glucoseToMmol(b.correctionFactor, input.glucoseUnit),
    })),
    { transaction },
  );
}

function stripTime(kind: DayKind | null) {
  if (!kind) return null;
  const { updatedAt: _ignored, id: _id, ...rest } = kind;
  return rest;
}

/** Creates a day kind with its times of day; the first day kind of a profile becomes its default. */
export async function createDayKind(profileId: number, userId: number, input: DayKindInput): Promise<DayKind> {
  return ProfileModel.sequelize!.transaction(async (transaction) => {
    const profile = await loadProfile(profileId, transaction);
    const others = await assertNameFree(profileId, input.name, null, transaction);
    const isDefault = input.isDefault || others.length === 0;
    if (isDefault) await DayKindModel.update({ isDefault: false }, { where: { profileId }, transaction });
    const kind = await DayKindModel.create({ profileId, name: input.name, isDefault, longActingUnits: input.longActingUnits }, { transaction });
    await writeTimesOfDay(kind, input, transaction);
    const view = dayKindToView(await findDayKind(profileId, kind.id, transaction), profile.glucoseUnit);
    await recordChange({ profileId, userId, subject: 'day_kind', subjectId: kind.id, subjectName: kind.name, action: 'created' }, null, stripTime(view), transaction);
    return view;
  });
}

/** Replaces a day kind's name, default flag, long-acting dose and times of day, and records the change. */
export async function updateDayKind(profileId: number, dayKindId: number, userId: number, input: DayKindInput): Promise<DayKind> {
  return ProfileModel.sequelize!.transaction(async (transaction) => {
    const profile = await loadProfile(profileId, transaction);
    const kind = await findDayKind(profileId, dayKindId, transaction);
    const before = dayKindToView(kind, profile.glucoseUnit);
    await assertNameFree(profileId, input.name, kind.id, transaction);
    if (kind.isDefault && !input.isDefault) {
      throw AppError.validation({ isDefault: ['Make another day kind the default instead.'] });
    }
    if (input.isDefault && !kind.isDefault) await DayKindModel.update({ isDefault: false }, { where: { profileId }, transaction });
    await kind.update({ name: input.name, isDefault: input.isDefault, longActingUnits: input.longActingUnits }, { transaction });
    kind.changed('updatedAt', true);
    await kind.save({ transaction });
    await writeTimesOfDay(kind, input, transaction);
    const after = dayKindToView(await findDayKind(profileId, kind.id, transaction), profile.glucoseUnit);
    await recordChange({ profileId, userId, subject: 'day_kind', subjectId: kind.id, subjectName: input.name, action: 'updated' }, stripTime(before), stripTime(after), transaction);
    return after;
  });
}

/** Deletes a day kind; the default can only go when it is the last one. */
export async function deleteDayKind(profileId: number, dayKindId: number, userId: number): Promise<void> {
  await ProfileModel.sequelize!.transaction(async (transaction) => {
    const profile = await loadProfile(profileId, transaction);
    const kind = await findDayKind(profileId, dayKindId, transaction);
    const count = await DayKindModel.count({ where: { profileId }, transaction });
    if (kind.isDefault && count > 1) throw AppError.conflict('Make another day kind the default before deleting this one.');
    const before = dayKindToView(kind, profile.glucoseUnit);
    await kind.destroy({ transaction });
    await recordChange({ profileId, userId, subject: 'day_kind', subjectId: kind.id, subjectName: kind.name, action: 'deleted' }, stripTime(before), null, transaction);
  });
}

