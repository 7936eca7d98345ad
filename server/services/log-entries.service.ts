import { randomUUID } from 'node:crypto';
import { Op, QueryTypes, UniqueConstraintError, type Transaction } from 'sequelize';
import { carbUnderstated, netGrams, weighedPortionCarb } from '../../shared/compute/batch';
import { toLocalTime } from '../../shared/compute/local-time';
import { carbInBasis } from '../../shared/compute/nutrients';
import type { CreateLogEntryInput, LogEntry, LogGroup, LogMealInput, MealInput } from '../../shared/schemas/logbook';
import { AppError } from '../errors';
import { BatchModel, DayKindModel, LogEntryChangeModel, LogEntryModel, PlanMealModel, PortionModel, type ProfileModel } from '../models';
import { dayKindIdForDate } from './day-kind-days.service';
import { readingToMmol } from './dose.service';
import { getFood } from './foods.service';
import { LOG_ENTRY_INCLUDE, toLogEntry } from './log-view';
import { findPortionForUser } from './portions.service';
import { loadProfile } from './profiles.service';

type NewEntry = Partial<Omit<LogEntryModel['_creationAttributes'], 'profileId' | 'kind' | 'occurredAt'>>;
type Saving = { profile: ProfileModel; userId: number; groupKey: string; transaction: Transaction; now: Date; kinds?: Map<string, Promise<number | null>> };

/** Entries may be logged up to this long ahead of now (clock drift between devices), no more. */
const FUTURE_SLACK_MS = 5 * 60_000;
/** The later part of a two-part dose may be logged at its planned time, at most 8 hours ahead (the split's limit). */
const LATER_PART_MS = 8 * 3_600_000;

function instant(iso: string | undefined, now: Date, field = 'occurredAt', slack = FUTURE_SLACK_MS): Date {
  const at = iso ? new Date(iso) : now;
  if (at.getTime() > now.getTime() + slack) throw AppError.validation({ [field]: ['That time is in the future.'] });
  return at;
}

/** The profile's day kind for a local date: the one set for the date, else the default. */
async function dayKindFor(profileId: number, localDate: string, transaction?: Transaction): Promise<number | null> {
  const set = await dayKindIdForDate(profileId, localDate);
  if (set) return set;
  const fallback = await DayKindModel.findOne({ where: { profileId, isDefault: true }, attributes: ['id'], transaction });
  return fallback?.id ?? null;
}

/** Writes one entry with its local date and minute from the profile's time zone and the day kind of that date. */
async function insertEntry(s: Saving, kind: LogEntryModel['kind'], occurredAt: Date, values: NewEntry): Promise<LogEntryModel> {
  const zone = s.profile.timeZone;
  const { localDate, localMinute } = toLocalTime(occurredAt, zone);
  // Entries saved together mostly share a local date: look its day kind up once.
  s.kinds ??= new Map();
  if (!s.kinds.has(localDate)) s.kinds.set(localDate, dayKindFor(s.profile.id, localDate, s.transaction));
  const dayKindId = await s.kinds.get(localDate)!;
  return LogEntryModel.create(
    { ...values, profileId: s.profile.id, kind, occurredAt, localDate, localMinute, timeZone: zone, dayKindId, groupKey: s.groupKey, enteredByUserId: s.userId },
    { transaction: s.transaction },
  );
}

/**
 * Marks a portion eaten inside the saving transaction: one conditional UPDATE, so of two devices eating it at once
 * exactly one succeeds and the other gets 409 (and its transaction, with everything else, is rolled back).
 */
async function eatPortion(s: Saving, portionId: number): Promise<void> {
  const [, affected] = await PortionModel.sequelize!.query(
    `UPDATE portions SET status = 'eaten', status_changed_at = now(), status_changed_by_user_id = :userId, updated_at = now()
     WHERE id = :id AND status = 'available'`,
    { replacements: { userId: s.userId, id: portionId }, type: QueryTypes.UPDATE, transaction: s.transaction },
  );
  if (affected !== 1) throw AppError.conflict('This portion has already been eaten or thrown away, so it was not logged again. Nothing was saved.');
}

/** What a meal was and its carbohydrate in both bases, computed now from the portion, batch or food. */
async function resolveMeal(s: Saving, meal: MealInput): Promise<NewEntry> {
  if (meal.source === 'typed') {
    const basis = s.profile.carbBasis;
    return {
      mealSource: 'typed', title: meal.note,
      carbAvailableG: basis === 'available' ? meal.carbsGrams : null,
      carbTotalG: basis === 'total' ? meal.carbsGrams : null,
    };
  }
  if (meal.source === 'food') {
    const food = await getFood(meal.foodId, s.userId);
    const per = (b: 'available' | 'total') => weighedPortionCarb(carbInBasis(food.per100g, b), meal.grams);
    return { mealSource: 'food', foodId: food.id, title: food.name, grams: meal.grams, carbAvailableG: per('available'), carbTotalG: per('total') };
  }
  if (meal.source === 'recipe') {
    // A recipe weighed on a plate uses its latest batch on this profile: per 100 g cooked, after the pot's yield.
    const batch = await BatchModel.findOne({ where: { profileId: s.profile.id, recipeId: meal.recipeId }, order: [['cookedOn', 'DESC'], ['id', 'DESC']] });
    if (!batch) throw AppError.validation({ 'meal.recipeId': ['This recipe has not been cooked on this profile yet: log it by its portion, a food or typed carbohydrate.'] });
    if (meal.grossGrams <= meal.plateTareGrams) throw AppError.validation({ 'meal.grossGrams': ['The plate with the food must weigh more than the empty plate.'] });
    const net = netGrams(meal.grossGrams, meal.plateTareGrams);
    const per = (b: 'available' | 'total') =>
      carbUnderstated(batch.totals, batch.incomplete, b) ? null : weighedPortionCarb(carbInBasis(batch.per100g, b), net);
    return {
      mealSource: 'recipe', recipeId: meal.recipeId, title: batch.recipeTitle, grams: net, plateTareGrams: meal.plateTareGrams,
      carbAvailableG: per('available'), carbTotalG: per('total'),
    };
  }
  const portion = await findPortionForUser(meal.portionCode, s.userId, 'kitchen.write');
  const batch = portion.batch!;
  const known = (b: 'available' | 'total', v: number | null) => (carbUnderstated(batch.totals, batch.incomplete, b) ? null : v);
  await eatPortion(s, portion.id);
  return {
    mealSource: 'portion', portionId: portion.id, recipeId: batch.recipeId, title: batch.recipeTitle, grams: portion.netGrams,
    carbAvailableG: known('available', portion.carbAvailable), carbTotalG: known('total', portion.carbTotal),
  };
}

/** Entries by id as the API answers them, with whether each has been edited. */
export async function viewEntries(ids: number[], profile: ProfileModel): Promise<LogEntry[]> {
  if (!ids.length) return [];
  const rows = await LogEntryModel.findAll({ where: { id: { [Op.in]: ids } }, include: LOG_ENTRY_INCLUDE, order: [['occurredAt', 'DESC'], ['id', 'DESC']] });
  const edited = new Set(
    (await LogEntryChangeModel.findAll({ where: { entryId: { [Op.in]: ids }, action: 'edit' }, attributes: ['entryId'] })).map((c) => c.entryId),
  );
  return rows.map((r) => toLogEntry(r, profile.glucoseUnit, edited.has(r.id)));
}

async function saveGroup(profileId: number, userId: number, now: Date, write: (s: Saving) => Promise<LogEntryModel[]>): Promise<LogGroup> {
  const groupKey = randomUUID();
  try {
    const { profile, ids } = await LogEntryModel.sequelize!.transaction(async (transaction) => {
      // Read, not locked: entries of one profile may be saved side by side (two devices, a carer and the person).
      const p = await loadProfile(profileId);
      const rows = await write({ profile: p, userId, groupKey, transaction, now });
      return { profile: p, ids: rows.map((r) => r.id) };
    });
    return { groupKey, entries: await viewEntries(ids, profile) };
  } catch (err) {
    // The partial unique index is the backstop: a portion is eaten by at most one live meal entry.
    if (err instanceof UniqueConstraintError) throw AppError.conflict('This portion has already been logged as eaten. Nothing was saved.');
    throw err;
  }
}

/**
 * Logs a meal in one transaction (the breakfast flow): the portion's eaten state first, then the meal, the reading and
 * the doses actually taken with the suggestion shown. All or nothing; a portion already eaten gives 409.
 */
export async function logMeal(profileId: number, userId: number, input: LogMealInput, now: Date = new Date()): Promise<LogGroup> {
  return saveGroup(profileId, userId, now, async (s) => {
    const mealAt = instant(input.occurredAt, now);
    if (input.planMealId != null && !(await PlanMealModel.findOne({ where: { id: input.planMealId, profileId }, transaction: s.transaction }))) {
      throw AppError.validation({ planMealId: ['That planned meal is not on this profile’s plan.'] });
    }
    const meal = await insertEntry(s, 'meal', mealAt, { ...(await resolveMeal(s, input.meal)), planMealId: input.planMealId ?? null });
    const rows = [meal];
    if (input.reading) {
      const unit = input.reading.glucoseUnit ?? s.profile.glucoseUnit;
      const mmol = readingToMmol(input.reading.glucose, unit, 'reading.glucose');
      rows.push(await insertEntry(s, 'reading', instant(input.reading.occurredAt, now, 'reading.occurredAt'), { glucoseMmol: mmol, readingSource: 'typed' }));
    }
    for (const [i, dose] of (input.doses ?? []).entries()) {
      const at = instant(dose.occurredAt, now, `doses.${i}.occurredAt`, i > 0 ? LATER_PART_MS : FUTURE_SLACK_MS);
      rows.push(await insertEntry(s, 'rapid_dose', at, { units: dose.units, suggestion: input.suggestion ?? null }));
    }
    return rows;
  });
}

/** Logs one entry of any kind (a meal here also marks its portion eaten, in the same transaction). */
export async function createLogEntry(profileId: number, userId: number, input: CreateLogEntryInput, now: Date = new Date()): Promise<LogGroup> {
  return saveGroup(profileId, userId, now, async (s) => {
    const at = instant(input.occurredAt, now);
    switch (input.kind) {
      case 'meal':
        return [await insertEntry(s, 'meal', at, await resolveMeal(s, input.meal))];
      case 'reading': {
        const mmol = readingToMmol(input.glucose, input.glucoseUnit ?? s.profile.glucoseUnit);
        return [await insertEntry(s, 'reading', at, { glucoseMmol: mmol, readingSource: 'typed' })];
      }
      case 'rapid_dose':
        return [await insertEntry(s, 'rapid_dose', at, { units: input.units, suggestion: input.suggestion ?? null, note: input.note || null })];
      case 'long_dose': {
        const { localDate } = toLocalTime(at, s.profile.timeZone);
        const kindId = await dayKindFor(s.profile.id, localDate, s.transaction);
        const kind = kindId ? await DayKindModel.findByPk(kindId, { transaction: s.transaction }) : null;
        return [await insertEntry(s, 'long_dose', at, { units: input.units, plannedUnits: kind?.longActingUnits ?? null, note: input.note || null })];
      }
      case 'exercise':
        return [await insertEntry(s, 'exercise', at, { intensity: input.intensity, durationMinutes: input.durationMinutes, note: input.note || null })];
    }
  });
}

/** The most recent live entries of a profile, newest first (the full History query lives elsewhere). */
export async function listRecentEntries(profileId: number, query: { limit: number; kind?: LogEntry['kind'] }): Promise<LogEntry[]> {
  const profile = await loadProfile(profileId);
  const rows = await LogEntryModel.findAll({
    where: { profileId, deletedAt: null, ...(query.kind ? { kind: query.kind } : {}) },
    order: [['occurredAt', 'DESC'], ['id', 'DESC']],
    limit: query.limit,
    attributes: ['id'],
  });
  return viewEntries(rows.map((r) => r.id), profile);
}
