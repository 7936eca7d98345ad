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
type SavingProfile = Pick<ProfileModel, 'id' | 'timeZone' | 'carbBasis' | 'glucoseUnit'>;
type Pending = { kind: LogEntryModel['kind']; occurredAt: Date; values: NewEntry };
type Saving = { profile: SavingProfile; userId: number; groupKey: string; transaction?: Transaction; now: Date };

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

/** One entry to write (written with the others of its save by insertEntries). */
function entry(kind: LogEntryModel['kind'], occurredAt: Date, values: NewEntry): Pending {
  return { kind, occurredAt, values };
}

// The columns an entry may set, in the order of the VALUES rows below.
const ENTRY_COLUMNS = [
  'title', 'mealSource', 'portionId', 'recipeId', 'foodId', 'grams', 'plateTareGrams', 'carbAvailableG', 'carbTotalG', 'planMealId',
  'glucoseMmol', 'readingSource', 'units', 'plannedUnits', 'suggestion', 'intensity', 'durationMinutes', 'note',
] as const;

// Every entry of a save in one statement, each with the day kind of its local date (the one set for the date, else the
// profile's default, as dayKindFor reads it), answered with what toLogEntry shows (LOG_ENTRY_INCLUDE's names and code).
const INSERT_ENTRIES = `WITH e AS (
  INSERT INTO log_entries (profile_id, kind, occurred_at, local_date, local_minute, time_zone, day_kind_id, group_key, entered_by_user_id,
    title, meal_source, portion_id, recipe_id, food_id, grams, plate_tare_grams, carb_available_g, carb_total_g, plan_meal_id,
    glucose_mmol, reading_source, units, planned_units, suggestion, intensity, duration_minutes, note, created_at, updated_at)
  SELECT :profileId, CAST(x.kind AS enum_log_entries_kind), CAST(x.occurred_at AS timestamptz), CAST(x.local_date AS date), x.local_minute::int, :timeZone,
    COALESCE((SELECT d.day_kind_id FROM day_kind_days d WHERE d.profile_id = :profileId AND d.date = CAST(x.local_date AS date) LIMIT 1),
             (SELECT k.id FROM day_kinds k WHERE k.profile_id = :profileId AND k.is_default LIMIT 1)),
    CAST(:groupKey AS uuid), :userId,
    x.title::text, CAST(x.meal_source AS enum_log_entries_meal_source), x.portion_id::int, x.recipe_id::int, x.food_id::int, x.grams::float8,
    x.plate_tare_grams::float8, x.carb_available_g::float8, x.carb_total_g::float8, x.plan_meal_id::int, x.glucose_mmol::float8,
    CAST(x.reading_source AS enum_log_entries_reading_source), x.units::float8, x.planned_units::float8, CAST(x.suggestion AS jsonb), x.intensity::text,
    x.duration_minutes::int, x.note::text, CAST(:now AS timestamptz), CAST(:now AS timestamptz)
  FROM (VALUES :rows) AS x(kind, occurred_at, local_date, local_minute, title, meal_source, portion_id, recipe_id, food_id, grams, plate_tare_grams,
    carb_available_g, carb_total_g, plan_meal_id, glucose_mmol, reading_source, units, planned_units, suggestion, intensity, duration_minutes, note)
  RETURNING id, profile_id AS "profileId", kind, occurred_at AS "occurredAt", local_date AS "localDate", local_minute AS "localMinute",
    time_zone AS "timeZone", day_kind_id AS "dayKindId", group_key AS "groupKey", entered_by_user_id AS "enteredByUserId", title,
    meal_source AS "mealSource", portion_id AS "portionId", recipe_id AS "recipeId", food_id AS "foodId", grams, plate_tare_grams AS "plateTareGrams",
    carb_available_g AS "carbAvailableG", carb_total_g AS "carbTotalG", plan_meal_id AS "planMealId", glucose_mmol AS "glucoseMmol",
    reading_source AS "readingSource", units, planned_units AS "plannedUnits", suggestion, intensity, duration_minutes AS "durationMinutes", note,
    deleted_at AS "deletedAt", created_at AS "createdAt", updated_at AS "updatedAt"
)
SELECT e.*,
    -- One primary-key lookup per entry (joins made the planner hash the whole portions table).
    (SELECT u.display_name FROM users u WHERE u.id = e."enteredByUserId") AS "enteredByName",
    (SELECT k.name FROM day_kinds k WHERE k.id = e."dayKindId") AS "dayKindName",
    (SELECT p.code FROM portions p WHERE p.id = e."portionId") AS "portionCode"
  FROM e
 ORDER BY e."occurredAt" DESC, e.id DESC`;

type SavedEntry = LogEntryModel & { enteredByName: string | null; dayKindName: string | null; portionCode: string | null };

/**
 * Writes the entries of one save in one INSERT statement (all or nothing), each with its local date and minute from
 * the profile's time zone, and answers them as viewEntries does, newest first (new entries have no edits yet).
 */
async function insertEntries(s: Saving, pending: Pending[]): Promise<LogEntry[]> {
  const zone = s.profile.timeZone;
  const rows = pending.map(({ kind, occurredAt, values }) => {
    const { localDate, localMinute } = toLocalTime(occurredAt, zone);
    const v = values as Record<string, unknown>;
    return [kind, occurredAt, localDate, localMinute, ...ENTRY_COLUMNS.map((c) => (c === 'suggestion' && v[c] != null ? JSON.stringify(v[c]) : (v[c] ?? null)))];
  });
  const saved = await LogEntryModel.sequelize!.query<SavedEntry>(INSERT_ENTRIES, {
    replacements: { profileId: s.profile.id, timeZone: zone, groupKey: s.groupKey, userId: s.userId, now: new Date(), rows },
    type: QueryTypes.SELECT,
    transaction: s.transaction,
  });
  return saved.map(({ enteredByName, dayKindName, portionCode, ...row }) => {
    const view = {
      ...row,
      enteredBy: row.enteredByUserId != null && enteredByName != null ? { id: row.enteredByUserId, displayName: enteredByName } : null,
      dayKind: row.dayKindId != null && dayKindName != null ? { id: row.dayKindId, name: dayKindName } : null,
      portion: row.portionId != null && portionCode != null ? { id: row.portionId, code: portionCode } : null,
    };
    return toLogEntry(view as unknown as LogEntryModel, s.profile.glucoseUnit, false);
  });
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

/** A profile's time zone, units and basis for a save (plain, not locked: two devices may save side by side), or 404. */
async function savingProfile(profileId: number): Promise<SavingProfile> {
  const [row] = await LogEntryModel.sequelize!.query<SavingProfile>(
    'SELECT id, time_zone AS "timeZone", carb_basis AS "carbBasis", glucose_unit AS "glucoseUnit" FROM profiles WHERE id = :profileId',
    { replacements: { profileId }, type: QueryTypes.SELECT },
  );
  if (!row) throw AppError.notFound('profile');
  return row;
}

/**
 * Saves a group of entries: `collect` checks the input and names the entries (reads only, unless it eats a portion),
 * then they are written in one statement. Eating a portion is a second write, so that save runs in one transaction.
 */
async function saveGroup(profileId: number, userId: number, now: Date, eatsPortion: boolean, collect: (s: Saving) => Promise<Pending[]>): Promise<LogGroup> {
  const groupKey = randomUUID();
  try {
    const profile = await savingProfile(profileId);
    const save = async (transaction?: Transaction) => {
      const s: Saving = { profile, userId, groupKey, transaction, now };
      return insertEntries(s, await collect(s));
    };
    const entries = eatsPortion ? await LogEntryModel.sequelize!.transaction((transaction) => save(transaction)) : await save();
    return { groupKey, entries };
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
  return saveGroup(profileId, userId, now, input.meal.source === 'portion', async (s) => {
    const mealAt = instant(input.occurredAt, now);
    if (input.planMealId != null && !(await PlanMealModel.findOne({ where: { id: input.planMealId, profileId }, attributes: ['id'], raw: true, transaction: s.transaction }))) {
      throw AppError.validation({ planMealId: ['That planned meal is not on this profile’s plan.'] });
    }
    const rows = [entry('meal', mealAt, { ...(await resolveMeal(s, input.meal)), planMealId: input.planMealId ?? null })];
    if (input.reading) {
      const unit = input.reading.glucoseUnit ?? s.profile.glucoseUnit;
      const mmol = readingToMmol(input.reading.glucose, unit, 'reading.glucose');
      rows.push(entry('reading', instant(input.reading.occurredAt, now, 'reading.occurredAt'), { glucoseMmol: mmol, readingSource: 'typed' }));
    }
    for (const [i, dose] of (input.doses ?? []).entries()) {
      const at = instant(dose.occurredAt, now, `doses.${i}.occurredAt`, i > 0 ? LATER_PART_MS : FUTURE_SLACK_MS);
      rows.push(entry('rapid_dose', at, { units: dose.units, suggestion: input.suggestion ?? null }));
    }
    return rows;
  });
}

/** Logs one entry of any kind (a meal here also marks its portion eaten, in the same transaction). */
export async function createLogEntry(profileId: number, userId: number, input: CreateLogEntryInput, now: Date = new Date()): Promise<LogGroup> {
  return saveGroup(profileId, userId, now, input.kind === 'meal' && input.meal.source === 'portion', async (s) => {
    const at = instant(input.occurredAt, now);
    switch (input.kind) {
      case 'meal':
        return [entry('meal', at, await resolveMeal(s, input.meal))];
      case 'reading': {
        const mmol = readingToMmol(input.glucose, input.glucoseUnit ?? s.profile.glucoseUnit);
        return [entry('reading', at, { glucoseMmol: mmol, readingSource: 'typed' })];
      }
      case 'rapid_dose':
        return [entry('rapid_dose', at, { units: input.units, suggestion: input.suggestion ?? null, note: input.note || null })];
      case 'long_dose': {
        const { localDate } = toLocalTime(at, s.profile.timeZone);
        const kindId = await dayKindFor(s.profile.id, localDate, s.transaction);
        const kind = kindId ? await DayKindModel.findByPk(kindId, { transaction: s.transaction }) : null;
        return [entry('long_dose', at, { units: input.units, plannedUnits: kind?.longActingUnits ?? null, note: input.note || null })];
      }
      case 'exercise':
        return [entry('exercise', at, { intensity: input.intensity, durationMinutes: input.durationMinutes, note: input.note || null })];
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
