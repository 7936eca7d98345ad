import { QueryTypes, type Transaction } from 'sequelize';
import { toLocalTime } from '../../shared/compute/local-time';
import { glucoseFromMmol } from '../../shared/compute/units';
import type { EditLogEntryInput, LogEntry, LogEntryChange, LogGroup } from '../../shared/schemas/logbook';
import type { GlucoseUnit } from '../../shared/schemas/units';
import { AppError } from '../errors';
import { DayKindModel, LogEntryChangeModel, LogEntryModel, UserModel } from '../models';
import { dayKindIdForDate } from './day-kind-days.service';
import { readingToMmol } from './dose.service';
import { viewEntries } from './log-entries.service';
import { LOG_ENTRY_INCLUDE, toLogEntry } from './log-view';
import { loadProfile } from './profiles.service';

/** Which corrections fit which kind of entry (occurredAt and note fit all). */
const EDITABLE: Record<LogEntry['kind'], (keyof EditLogEntryInput)[]> = {
  meal: ['carbsGrams'],
  reading: ['glucose', 'glucoseUnit'],
  rapid_dose: ['units'],
  long_dose: ['units'],
  exercise: ['intensity', 'durationMinutes'],
};

/** Snapshots are kept in mmol/L, the stored unit; they are shown in the profile's unit when read. */
const snapshot = (row: LogEntryModel) => toLogEntry(row, 'mmol_l');

async function lockEntry(profileId: number, id: number, transaction: Transaction): Promise<LogEntryModel> {
  const row = await LogEntryModel.findOne({ where: { id, profileId }, transaction, lock: transaction.LOCK.UPDATE });
  if (!row) throw AppError.notFound('log entry');
  if (row.deletedAt) throw AppError.conflict('This entry has been deleted; it can no longer be changed.');
  await row.reload({ include: LOG_ENTRY_INCLUDE, transaction });
  return row;
}

/** Puts a logged portion back to "not eaten yet" when the meal that ate it is deleted or undone. */
async function releasePortion(row: LogEntryModel, userId: number, transaction: Transaction) {
  if (row.kind !== 'meal' || row.portionId == null) return;
  await LogEntryModel.sequelize!.query(
    `UPDATE portions SET status = 'available', status_changed_at = now(), status_changed_by_user_id = :userId, updated_at = now()
     WHERE id = :id AND status = 'eaten'`,
    { replacements: { userId, id: row.portionId }, type: QueryTypes.UPDATE, transaction },
  );
}

async function softDelete(row: LogEntryModel, userId: number, transaction: Transaction) {
  const before = snapshot(row);
  await row.update({ deletedAt: new Date() }, { transaction });
  await releasePortion(row, userId, transaction);
  await LogEntryChangeModel.create({ entryId: row.id, changedByUserId: userId, action: 'delete', before, after: null }, { transaction });
}

/** Corrects an entry; the version before is kept in its change history (who, when, before → after). */
export async function editLogEntry(profileId: number, id: number, userId: number, input: EditLogEntryInput, now: Date = new Date()): Promise<LogEntry> {
  const profile = await loadProfile(profileId);
  await LogEntryModel.sequelize!.transaction(async (transaction) => {
    const row = await lockEntry(profileId, id, transaction);
    const wrong = (Object.keys(input) as (keyof EditLogEntryInput)[]).filter(
      (k) => input[k] !== undefined && k !== 'occurredAt' && k !== 'note' && !EDITABLE[row.kind].includes(k),
    );
    if (wrong.length) throw AppError.validation(Object.fromEntries(wrong.map((k) => [k, [`A ${row.kind.replace('_', ' ')} entry has no ${k}.`]])));
    const before = snapshot(row);
    const changes: Partial<LogEntryModel['_creationAttributes']> = {};
    if (input.occurredAt) {
      const at = new Date(input.occurredAt);
      if (at.getTime() > now.getTime() + 5 * 60_000) throw AppError.validation({ occurredAt: ['That time is in the future.'] });
      const local = toLocalTime(at, row.timeZone);
      const kindId = (await dayKindIdForDate(profileId, local.localDate)) ??
        (await DayKindModel.findOne({ where: { profileId, isDefault: true }, transaction }))?.id ?? null;
      Object.assign(changes, { occurredAt: at, ...local, dayKindId: kindId });
    }
    if (input.note !== undefined) changes.note = input.note || null;
    if (input.units !== undefined) changes.units = input.units;
    if (input.glucose !== undefined) changes.glucoseMmol = readingToMmol(input.glucose, input.glucoseUnit ?? profile.glucoseUnit);
    if (input.intensity !== undefined) changes.intensity = input.intensity;
    if (input.durationMinutes !== undefined) changes.durationMinutes = input.durationMinutes;
    if (input.carbsGrams !== undefined) {
      if (row.mealSource !== 'typed') throw AppError.validation({ carbsGrams: ['Only a typed meal has its carbohydrate typed; delete this meal and log it again.'] });
      Object.assign(changes, profile.carbBasis === 'available' ? { carbAvailableG: input.carbsGrams } : { carbTotalG: input.carbsGrams });
    }
    await row.update(changes, { transaction });
    await row.reload({ include: LOG_ENTRY_INCLUDE, transaction });
    await LogEntryChangeModel.create({ entryId: id, changedByUserId: userId, action: 'edit', before, after: snapshot(row) }, { transaction });
  });
  return (await viewEntries([id], profile))[0];
}

/** Deletes an entry (kept, marked deleted, with its history); a logged portion goes back to not eaten yet. */
export async function deleteLogEntry(profileId: number, id: number, userId: number): Promise<LogEntry> {
  const profile = await loadProfile(profileId);
  await LogEntryModel.sequelize!.transaction(async (transaction) => softDelete(await lockEntry(profileId, id, transaction), userId, transaction));
  return (await viewEntries([id], profile))[0];
}

/**
 * Undo right after saving: reverts everything saved together (meal, reading, doses) and the portion's eaten state, in
 * one transaction. 404 when nothing of the group is left to undo.
 */
export async function undoLogGroup(profileId: number, groupKey: string, userId: number): Promise<LogGroup> {
  const profile = await loadProfile(profileId);
  const ids = await LogEntryModel.sequelize!.transaction(async (transaction) => {
    const rows = await LogEntryModel.findAll({
      where: { profileId, groupKey, deletedAt: null }, include: LOG_ENTRY_INCLUDE, transaction, lock: { level: transaction.LOCK.UPDATE, of: LogEntryModel },
    });
    if (!rows.length) throw AppError.notFound('saved entries to undo');
    for (const row of rows) await softDelete(row, userId, transaction);
    return rows.map((r) => r.id);
  });
  return { groupKey, entries: await viewEntries(ids, profile) };
}

function inUnit(entry: LogEntry, unit: GlucoseUnit): LogEntry {
  return entry.reading ? { ...entry, reading: { ...entry.reading, glucose: glucoseFromMmol(entry.reading.glucose, unit) } } : entry;
}

/** An entry's corrections, oldest first: who changed it, when, and before → after (glucose in the profile's unit). */
export async function listEntryChanges(profileId: number, id: number): Promise<LogEntryChange[]> {
  const profile = await loadProfile(profileId);
  const entry = await LogEntryModel.findOne({ where: { id, profileId }, attributes: ['id'] });
  if (!entry) throw AppError.notFound('log entry');
  const rows = await LogEntryChangeModel.findAll({
    where: { entryId: id },
    include: [{ model: UserModel, as: 'changedBy', attributes: ['id', 'displayName'] }],
    order: [['createdAt', 'ASC'], ['id', 'ASC']],
  });
  return rows.map((c) => {
    const by = (c as LogEntryChangeModel & { changedBy?: UserModel | null }).changedBy;
    return {
      id: c.id,
      action: c.action,
      changedBy: by ? { id: by.id, name: by.displayName } : null,
      changedAt: c.createdAt.toISOString(),
      before: inUnit(c.before as unknown as LogEntry, profile.glucoseUnit),
      after: c.after ? inUnit(c.after as unknown as LogEntry, profile.glucoseUnit) : null,
    };
  });
}
