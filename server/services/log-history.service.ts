import { minutesToTime } from '../../shared/schemas/profile-settings';
import { Op, type WhereOptions } from 'sequelize';
import {
  dailyTotals,
  glucoseBeforeMeals,
  mealDoses,
  ratioReview,
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
import { DayKindModel, LogEntryChangeModel, LogEntryModel, ProfileSettingsModel } from '../models';
import { listDayKinds, withTimesOfDay } from './day-kinds.service';
import { LOG_ENTRY_INCLUDE, toLogEntry } from './log-view';
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

async function mealContexts(profileId: number, meals: LogEntryModel[], basis: CarbBasis, unit: LogHistoryPage['glucoseUnit']) {
  const out = new Map<number, MealContext>();
  if (!meals.length) return out;
  const times = meals.map((m) => m.occurredAt.getTime());
  const groups = meals.map((m) => m.groupKey).filter((g): g is string => g != null);
  const nearby = await LogEntryModel.findAll({
    where: {
      profileId,
      deletedAt: null,
      kind: { [Op.in]: ['reading', 'rapid_dose'] },
      [Op.or]: [
        { occurredAt: { [Op.between]: [new Date(Math.min(...times) - 60 * MINUTE), new Date(Math.max(...times) + 30 * MINUTE)] } },
        ...(groups.length ? [{ groupKey: { [Op.in]: groups } }] : []),
      ],
    },
  });
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

/** One page of the logbook, newest or oldest first, filtered; each meal with its reading before and its doses. */
export async function listLogHistory(profileId: number, q: LogHistoryQuery): Promise<LogHistoryPage> {
  const profile = await loadProfile(profileId);
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
  const rows = await LogEntryModel.findAll({
    where: { [Op.and]: and },
    include: LOG_ENTRY_INCLUDE,
    order: [['occurredAt', dir], ['id', dir]],
    limit: q.limit + 1,
  });
  const page = rows.slice(0, q.limit);
  const last = page[page.length - 1];
  const nextCursor = rows.length > q.limit && last ? `${last.occurredAt.getTime()}.${last.id}` : null;
  const changed = page.length
    ? new Set((await LogEntryChangeModel.findAll({ where: { entryId: { [Op.in]: page.map((r) => r.id) } }, attributes: ['entryId'] })).map((c) => c.entryId))
    : new Set<number>();
  const contexts = await mealContexts(profileId, page.filter((r) => r.kind === 'meal'), profile.carbBasis, profile.glucoseUnit);
  return {
    entries: page.map((r) => ({ ...toLogEntry(r, profile.glucoseUnit, changed.has(r.id)), mealContext: contexts.get(r.id) ?? null })),
    nextCursor,
    glucoseUnit: profile.glucoseUnit,
    carbBasis: profile.carbBasis,
    carbUnit: profile.carbUnit,
  };
}

/** One profile's period of local dates, with the basis its carbohydrate is counted in. */
export type ProfilePeriod = { profileId: number; from: string; to: string; basis: CarbBasis };

/** The entries of each profile's period as the pure review rules take them, in one query (profile id → entries, oldest first). */
export async function periodEntriesOf(periods: ProfilePeriod[]): Promise<Map<number, ReviewEntry[]>> {
  const out = new Map<number, ReviewEntry[]>(periods.map((p) => [p.profileId, []]));
  if (!periods.length) return out;
  const rows = await LogEntryModel.findAll({
    where: { deletedAt: null, [Op.or]: periods.map((p) => ({ profileId: p.profileId, localDate: { [Op.between]: [p.from, p.to] } })) },
    attributes: ['id', 'profileId', 'kind', 'occurredAt', 'localDate', 'localMinute', 'dayKindId', 'groupKey', 'glucoseMmol', 'carbAvailableG', 'carbTotalG', 'units'],
    order: [['occurredAt', 'ASC'], ['id', 'ASC']],
  });
  const basis = new Map(periods.map((p) => [p.profileId, p.basis]));
  for (const r of rows) out.get(r.profileId)!.push(toReviewEntry(r, basis.get(r.profileId)!));
  return out;
}

async function periodEntries(profileId: number, q: LogPeriodQuery, basis: CarbBasis): Promise<ReviewEntry[]> {
  return (await periodEntriesOf([{ profileId, ...q, basis }])).get(profileId)!;
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
  const profile = await loadProfile(profileId);
  const [settings, kinds, entries] = await Promise.all([
    ProfileSettingsModel.findByPk(profileId),
    DayKindModel.findAll({ where: { profileId }, attributes: ['id', 'name'] }),
    periodEntries(profileId, q, profile.carbBasis),
  ]);
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
  const profile = await loadProfile(profileId);
  const [kinds, views, entries] = await Promise.all([
    DayKindModel.findAll({ where: { profileId }, ...withTimesOfDay, order: REVIEW_DAY_KIND_ORDER }),
    listDayKinds(profileId),
    periodEntries(profileId, q, profile.carbBasis),
  ]);
  const times = reviewTimesOfDay(kinds);
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
