import { minutesToTime } from '../../shared/schemas/profile-settings';
import { literal, Op, type WhereOptions } from 'sequelize';
import {
  dailyTotals,
  glucoseBeforeMeals,
  MEAL_DOSE_MINUTES,
  mealDoses,
  ratioReview,
  READING_BEFORE_MINUTES,
  readingBefore,
  REVIEW_MINIMUM_MEALS,
  timeInRange,
  type ReviewEntry,
  type ReviewTimeOfDay,
} from '../../shared/compute/logbook-review';
import { glucoseFromMmol } from '../../shared/compute/units';
import {
  RATIO_REVIEW_CAUTION,
  type LogCharts,
  type LogHistoryPage,
  type LogHistoryQuery,
  type LogPeriodQuery,
  type LogReview,
  type MealContext,
} from '../../shared/schemas/logbook-read';
import type { CarbBasis } from '../../shared/schemas/units';
import { DayKindModel, LogEntryModel, ProfileSettingsModel } from '../models';
import { dayKindToView, withTimesOfDay } from './day-kinds.service';
import { LOG_ENTRY_INCLUDE, plainIncludes, toLogEntry } from './log-view';
import { loadProfile } from './profiles.service';

const MINUTE = 60_000;
/** The 2019 international consensus target range (Battelino et al.), used when the profile has no settings yet. */
const CONSENSUS_RANGE = { lowMmol: 3.9, highMmol: 10.0 };

/** A stored entry as the pure review rules take it (carbohydrate in the profile's basis). */
export function toReviewEntry(row: LogEntryModel, basis: CarbBasis): ReviewEntry {
  return {
    id: row.id,
    kind: row.kind,
    at: row.occurredAt.getTime(),
    localDate: row.localDate,
    localMinute: row.localMinute,
    dayKindId: row.dayKindId,
    groupKey: row.groupKey,
    glucoseMmol: row.glucoseMmol,
    carbG: basis === 'available' ? row.carbAvailableG : row.carbTotalG,
    units: row.units,
  };
}


function suggestedUnits(suggestion: Record<string, unknown> | null): number | null {
  const breakdown = suggestion?.breakdown as { doseUnits?: unknown } | undefined;
  const units = breakdown?.doseUnits ?? suggestion?.doseUnits;
  return typeof units === 'number' ? units : null;
}

/** The columns the meal context reads: the review fields and the dose's suggestion. */
const CONTEXT_ATTRIBUTES = ['id', 'kind', 'occurredAt', 'localDate', 'localMinute', 'dayKindId', 'groupKey', 'glucoseMmol', 'carbAvailableG', 'carbTotalG', 'units', 'suggestion'] as const;

async function mealContexts(profileId: number, meals: LogEntryModel[], basis: CarbBasis, unit: LogHistoryPage['glucoseUnit']) {
  const out = new Map<number, MealContext>();
  if (!meals.length) return out;
  const groups = meals.map((m) => m.groupKey).filter((g): g is string => g != null);
  // Only the windows the rules look in (READING_BEFORE_MINUTES before to MEAL_DOSE_MINUTES after each meal), not the
  // whole span from the first meal to the last: a page of meals over a month is otherwise every sensor reading of it.
  const windows = meals.map((m) => {
    const t = m.occurredAt.getTime();
    return { occurredAt: { [Op.between]: [new Date(t - READING_BEFORE_MINUTES * MINUTE), new Date(t + MEAL_DOSE_MINUTES * MINUTE)] } };
  });
  const nearby = (await LogEntryModel.findAll({
    where: {
      profileId,
      deletedAt: null,
      kind: { [Op.in]: ['reading', 'rapid_dose'] },
      [Op.or]: [...windows, ...(groups.length ? [{ groupKey: { [Op.in]: groups } }] : [])],
    },
    attributes: [...CONTEXT_ATTRIBUTES],
    order: [['occurredAt', 'ASC'], ['id', 'ASC']],
    raw: true,
  })) as LogEntryModel[];
  const context = nearby.map((r) => toReviewEntry(r, basis));
  const byId = new Map(nearby.map((r) => [r.id, r]));
  for (const meal of meals) {
    const m = toReviewEntry(meal, basis);
    const before = readingBefore(m, context);
    const doses = mealDoses(m, context).map((d) => byId.get(d.id)!);
    const suggested = doses.map((d) => suggestedUnits(d.suggestion)).find((u) => u != null) ?? null;
    out.set(meal.id, {
      readingBefore: before ? { glucose: glucoseFromMmol(before.glucoseMmol!, unit), localTime: minutesToTime(before.localMinute) } : null,
      suggestedUnits: suggested,
      takenUnits: doses.length ? doses.reduce((a, d) => a + (d.units ?? 0), 0) : null,
    });
  }
  return out;
}

/** Whether the entry was ever edited, deleted or restored (log_entry_changes), as a column of the page query. */
const CHANGED_SQL = 'EXISTS (SELECT 1 FROM log_entry_changes c WHERE c.entry_id = "LogEntryModel"."id")';

/** One page of the logbook, newest or oldest first, filtered; each meal with its reading before and its doses. */
export async function listLogHistory(profileId: number, q: LogHistoryQuery): Promise<LogHistoryPage> {
  const desc = q.sort === 'newest';
  const and: WhereOptions[] = [{ profileId, deletedAt: null }];
  if (q.from) and.push({ localDate: { [Op.gte]: q.from } });
  if (q.to) and.push({ localDate: { [Op.lte]: q.to } });
  if (q.dayKindId) and.push({ dayKindId: q.dayKindId });
  if (q.kinds) and.push({ kind: { [Op.in]: q.kinds } });
  if (q.cursor) {
    const [ms, id] = q.cursor.split('.').map(Number);
    const at = new Date(ms);
    const cmp = desc ? Op.lt : Op.gt;
    and.push({ [Op.or]: [{ occurredAt: { [cmp]: at } }, { occurredAt: at, id: { [cmp]: id } }] });
  }
  const dir = desc ? 'DESC' : 'ASC';
  // The profile and the page together; plain rows, with "has a change" asked in the same query.
  const [profile, rows] = await Promise.all([
    loadProfile(profileId),
    LogEntryModel.findAll({
      where: { [Op.and]: and },
      attributes: { include: [[literal(CHANGED_SQL), 'changed']] },
      include: LOG_ENTRY_INCLUDE,
      order: [['occurredAt', dir], ['id', dir]],
      limit: q.limit + 1,
      raw: true,
      nest: true,
    }) as unknown as Promise<(LogEntryModel & { changed: boolean })[]>,
  ]);
  const page = rows.slice(0, q.limit).map(plainIncludes);
  const last = page[page.length - 1];
  const nextCursor = rows.length > q.limit && last ? `${last.occurredAt.getTime()}.${last.id}` : null;
  const contexts = await mealContexts(profileId, page.filter((r) => r.kind === 'meal'), profile.carbBasis, profile.glucoseUnit);
  return {
    entries: page.map((r) => ({ ...toLogEntry(r, profile.glucoseUnit, r.changed), mealContext: contexts.get(r.id) ?? null })),
    nextCursor,
    glucoseUnit: profile.glucoseUnit,
    carbBasis: profile.carbBasis,
    carbUnit: profile.carbUnit,
  };
}

/** One profile's period of local dates, with the basis its carbohydrate is counted in. */
export type ProfilePeriod = { profileId: number; from: string; to: string; basis: CarbBasis };

/** Plain rows (review columns) of each profile's period, oldest first, in one query. */
async function periodRows(periods: Omit<ProfilePeriod, 'basis'>[]): Promise<LogEntryModel[]> {
  if (!periods.length) return [];
  // Plain rows: a month of sensor readings is thousands of entries, and a model instance each costs more than the query.
  return (await LogEntryModel.findAll({
    where: { deletedAt: null, [Op.or]: periods.map((p) => ({ profileId: p.profileId, localDate: { [Op.between]: [p.from, p.to] } })) },
    attributes: ['id', 'profileId', 'kind', 'occurredAt', 'localDate', 'localMinute', 'dayKindId', 'groupKey', 'glucoseMmol', 'carbAvailableG', 'carbTotalG', 'units'],
    order: [['occurredAt', 'ASC'], ['id', 'ASC']],
    raw: true,
  })) as LogEntryModel[];
}

/** The entries of each profile's period as the pure review rules take them, in one query (profile id → entries, oldest first). */
export async function periodEntriesOf(periods: ProfilePeriod[]): Promise<Map<number, ReviewEntry[]>> {
  const out = new Map<number, ReviewEntry[]>(periods.map((p) => [p.profileId, []]));
  const basis = new Map(periods.map((p) => [p.profileId, p.basis]));
  for (const r of await periodRows(periods)) out.get(r.profileId)!.push(toReviewEntry(r, basis.get(r.profileId)!));
  return out;
}

/** The range time in range counts against: the profile's targets, else the 2019 consensus range. */
export function targetRangeOf(settings: Pick<ProfileSettingsModel, 'targetLowMmol' | 'targetHighMmol'> | null): LogCharts['targetRange'] {
  return settings ? { lowMmol: settings.targetLowMmol, highMmol: settings.targetHighMmol, fromProfile: true } : { ...CONSENSUS_RANGE, fromProfile: false };
}

/** Time in range of a period's readings (the charts' figure). */
export function periodTimeInRange(entries: ReviewEntry[], range: LogCharts['targetRange']) {
  const readings = entries.filter((e) => e.kind === 'reading' && e.glucoseMmol != null).map((e) => e.glucoseMmol!);
  return timeInRange(readings, range.lowMmol, range.highMmol);
}

/** The order the review reads day kinds in: the default first, then by name. */
export const REVIEW_DAY_KIND_ORDER: [string, string][] = [['isDefault', 'DESC'], ['name', 'ASC']];

/** The times of day the ratio review groups meals by, from day kinds loaded with theirs (in REVIEW_DAY_KIND_ORDER). */
export function reviewTimesOfDay(kinds: DayKindModel[]): ReviewTimeOfDay[] {
  return kinds.flatMap((k) =>
    [...(k.timesOfDay ?? [])].sort((a, b) => a.startMinute - b.startMinute).map((b) => ({ dayKindId: k.id, dayKindName: k.name, startMinute: b.startMinute, endMinute: b.endMinute })),
  );
}

/** Chart data for a period: carbohydrate and insulin per day, glucose before meals per day kind, time in range. */
export async function logCharts(profileId: number, q: LogPeriodQuery): Promise<LogCharts> {
  // The profile is read beside the entries (not before them): its carbohydrate basis is applied after.
  const [profile, settings, kinds, rows] = await Promise.all([
    loadProfile(profileId),
    ProfileSettingsModel.findByPk(profileId, { attributes: ['targetLowMmol', 'targetHighMmol'], raw: true }),
    DayKindModel.findAll({ where: { profileId }, attributes: ['id', 'name'], raw: true }),
    periodRows([{ profileId, ...q }]),
  ]);
  const entries = rows.map((r) => toReviewEntry(r, profile.carbBasis));
  const range = targetRangeOf(settings);
  return {
    from: q.from,
    to: q.to,
    glucoseUnit: profile.glucoseUnit,
    carbBasis: profile.carbBasis,
    carbUnit: profile.carbUnit,
    targetRange: range,
    days: dailyTotals(entries, q.from, q.to),
    beforeMeals: glucoseBeforeMeals(entries, new Map(kinds.map((k) => [k.id, k.name]))),
    timeInRange: periodTimeInRange(entries, range),
  };
}

/** The ratio review for a period: average change after meals per day kind and time of day, never a new ratio. */
export async function logReview(profileId: number, q: LogPeriodQuery): Promise<LogReview> {
  // The day kinds are read once: the review's times of day and the list it answers come from the same rows.
  const [profile, kinds, rows] = await Promise.all([
    loadProfile(profileId),
    DayKindModel.findAll({ where: { profileId }, ...withTimesOfDay, order: REVIEW_DAY_KIND_ORDER }),
    periodRows([{ profileId, ...q }]),
  ]);
  const entries = rows.map((r) => toReviewEntry(r, profile.carbBasis));
  const times = reviewTimesOfDay(kinds);
  const views = kinds.map((k) => dayKindToView(k, profile.glucoseUnit));
  return {
    from: q.from,
    to: q.to,
    glucoseUnit: profile.glucoseUnit,
    carbBasis: profile.carbBasis,
    minimumMeals: REVIEW_MINIMUM_MEALS,
    caution: RATIO_REVIEW_CAUTION,
    ...ratioReview(entries, times),
    dayKinds: views.map((v) => ({ id: v.id, name: v.name, isDefault: v.isDefault, longActingUnits: v.longActingUnits, timesOfDay: v.timesOfDay })),
  };
}
