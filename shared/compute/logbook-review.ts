import type { LogEntryKind } from '../schemas/logbook';

/**
 * What people read from the logbook: time in range, per-day totals, glucose before meals and the ratio review.
 * Pure: entries come in with their instants in milliseconds and their local date and minute already worked out.
 */

/** One logbook entry as these rules need it (glucose in mmol/L, carbohydrate in grams of the profile's basis). */
export type ReviewEntry = {
  id: number;
  kind: LogEntryKind;
  at: number;
  localDate: string;
  localMinute: number;
  dayKindId: number | null;
  groupKey: string | null;
  glucoseMmol: number | null;
  carbG: number | null;
  units: number | null;
};

/** A day kind's time of day, whose ratio applies to meals from startMinute up to (not including) endMinute. */
export type ReviewTimeOfDay = { dayKindId: number; dayKindName: string; startMinute: number; endMinute: number };

const MINUTE = 60_000;
/** A reading counts as "before" a meal when taken up to this long before it (or saved with it). */
export const READING_BEFORE_MINUTES = 60;
/** The reading after a meal is the first one from 2 h to 4 h after it. */
export const READING_AFTER_MINUTES = { from: 120, to: 240 } as const;
/** A rapid-acting dose this close to a meal (either side), or saved with it, is that meal's own dose. */
export const MEAL_DOSE_MINUTES = 30;
/** Fewer meals than this behind a figure and the review marks it "too few" (README, ratio review). */
export const REVIEW_MINIMUM_MEALS = 5;

export type TimeInRange = { readings: number; belowPercent: number | null; inPercent: number | null; abovePercent: number | null };

/** Share of readings below, inside (bounds included) and above the target range. */
export function timeInRange(readingsMmol: number[], lowMmol: number, highMmol: number): TimeInRange {
  const n = readingsMmol.length;
  if (n === 0) return { readings: 0, belowPercent: null, inPercent: null, abovePercent: null };
  const below = readingsMmol.filter((v) => v < lowMmol).length;
  const above = readingsMmol.filter((v) => v > highMmol).length;
  return { readings: n, belowPercent: (below / n) * 100, inPercent: ((n - below - above) / n) * 100, abovePercent: (above / n) * 100 };
}

const ofKind = (entries: ReviewEntry[], kind: LogEntryKind) => entries.filter((e) => e.kind === kind);

/** The reading before a meal: one saved with it, else the latest from READING_BEFORE_MINUTES before up to the meal. */
export function readingBefore(meal: ReviewEntry, entries: ReviewEntry[]): ReviewEntry | null {
  // One pass, no copies: it runs once per meal over a period's readings (a month of sensor readings is thousands).
  const from = meal.at - READING_BEFORE_MINUTES * MINUTE;
  let latest: ReviewEntry | null = null;
  for (const r of entries) {
    if (r.kind !== 'reading' || r.glucoseMmol == null) continue;
    if (meal.groupKey && r.groupKey === meal.groupKey) return r;
    if (r.at <= meal.at && r.at >= from && (!latest || r.at > latest.at)) latest = r;
  }
  return latest;
}

/** The rapid-acting doses that belong to a meal: saved with it, or within MEAL_DOSE_MINUTES either side. */
export function mealDoses(meal: ReviewEntry, entries: ReviewEntry[]): ReviewEntry[] {
  return ofKind(entries, 'rapid_dose').filter(
    (d) => (meal.groupKey != null && d.groupKey === meal.groupKey) || (d.groupKey == null && Math.abs(d.at - meal.at) <= MEAL_DOSE_MINUTES * MINUTE),
  );
}

export type DayTotal = { date: string; carbG: number; rapidUnits: number; longUnits: number; meals: number };

function datesFrom(from: string, to: string): string[] {
  const out: string[] = [];
  for (let t = Date.parse(`${from}T00:00:00Z`); t <= Date.parse(`${to}T00:00:00Z`); t += 86_400_000) out.push(new Date(t).toISOString().slice(0, 10));
  return out;
}

/** Carbohydrate eaten and insulin taken on each local date from..to (every date listed, empty ones as 0). */
export function dailyTotals(entries: ReviewEntry[], from: string, to: string): DayTotal[] {
  const days = new Map(datesFrom(from, to).map((date) => [date, { date, carbG: 0, rapidUnits: 0, longUnits: 0, meals: 0 }]));
  for (const e of entries) {
    const day = days.get(e.localDate);
    if (!day) continue;
    if (e.kind === 'meal') {
      day.meals += 1;
      day.carbG += e.carbG ?? 0;
    }
    if (e.kind === 'rapid_dose') day.rapidUnits += e.units ?? 0;
    if (e.kind === 'long_dose') day.longUnits += e.units ?? 0;
  }
  return [...days.values()];
}

export type BeforeMealGlucose = { dayKindId: number | null; dayKindName: string | null; readings: number; averageMmol: number; lowestMmol: number; highestMmol: number };

/** Glucose before meals, per day kind (the meal's): how many, average, lowest, highest. */
export function glucoseBeforeMeals(entries: ReviewEntry[], dayKindNames: Map<number, string>): BeforeMealGlucose[] {
  const groups = new Map<number | null, number[]>();
  const readings = ofKind(entries, 'reading');
  for (const meal of ofKind(entries, 'meal')) {
    const r = readingBefore(meal, readings);
    if (!r) continue;
    groups.set(meal.dayKindId, [...(groups.get(meal.dayKindId) ?? []), r.glucoseMmol!]);
  }
  return [...groups.entries()].map(([dayKindId, values]) => ({
    dayKindId,
    dayKindName: dayKindId == null ? null : (dayKindNames.get(dayKindId) ?? null),
    readings: values.length,
    averageMmol: values.reduce((a, b) => a + b, 0) / values.length,
    lowestMmol: Math.min(...values),
    highestMmol: Math.max(...values),
  }));
}

export type ReviewGroup = {
  dayKindId: number | null;
  dayKindName: string | null;
  startMinute: number | null;
  endMinute: number | null;
  meals: number;
  averageChangeMmol: number | null;
  averageCarbG: number | null;
  averageUnits: number | null;
  tooFew: boolean;
};

export type RatioReview = {
  groups: ReviewGroup[];
  mealsInPeriod: number;
  mealsUsed: number;
  skipped: { noReadingBefore: number; noReadingAfter: number; somethingBetween: number };
};

type Sums = { meals: number; change: number; carb: number; units: number; withUnits: number };

/**
 * The evidence for a ratio review: meals with a reading before and a reading 2–4 h after, and no other meal or
 * rapid-acting dose between those readings, grouped by day kind and time of day with the average change in glucose.
 * It describes; it never proposes a ratio.
 */
export function ratioReview(entries: ReviewEntry[], timesOfDay: ReviewTimeOfDay[], minimumMeals = REVIEW_MINIMUM_MEALS): RatioReview {
  const sorted = [...entries].sort((a, b) => a.at - b.at || a.id - b.id);
  const meals = ofKind(sorted, 'meal');
  // Each rule below looks only at the entries it needs: a year of sensor readings makes the full list long.
  const readings = ofKind(sorted, 'reading');
  const doses = ofKind(sorted, 'rapid_dose');
  const mealsAndDoses = sorted.filter((e) => e.kind === 'meal' || e.kind === 'rapid_dose');
  const skipped = { noReadingBefore: 0, noReadingAfter: 0, somethingBetween: 0 };
  const sums = new Map<string, Sums>();
  const keyOf = (dayKindId: number | null, start: number | null) => `${dayKindId}:${start}`;
  for (const t of timesOfDay) sums.set(keyOf(t.dayKindId, t.startMinute), { meals: 0, change: 0, carb: 0, units: 0, withUnits: 0 });
  for (const meal of meals) {
    const before = readingBefore(meal, readings);
    if (!before) {
      skipped.noReadingBefore += 1;
      continue;
    }
    const after = readings.find(
      (r) => r.glucoseMmol != null && r.at >= meal.at + READING_AFTER_MINUTES.from * MINUTE && r.at <= meal.at + READING_AFTER_MINUTES.to * MINUTE,
    );
    if (!after) {
      skipped.noReadingAfter += 1;
      continue;
    }
    const own = mealDoses(meal, doses);
    const ownIds = new Set([meal.id, before.id, ...own.map((d) => d.id)]);
    const start = Math.min(before.at, meal.at);
    const between = mealsAndDoses.some((e) => !ownIds.has(e.id) && e.at >= start && e.at <= after.at);
    if (between) {
      skipped.somethingBetween += 1;
      continue;
    }
    const tod = timesOfDay.find((t) => t.dayKindId === meal.dayKindId && meal.localMinute >= t.startMinute && meal.localMinute < t.endMinute);
    const key = keyOf(tod?.dayKindId ?? meal.dayKindId, tod?.startMinute ?? null);
    const s = sums.get(key) ?? { meals: 0, change: 0, carb: 0, units: 0, withUnits: 0 };
    s.meals += 1;
    s.change += after.glucoseMmol! - before.glucoseMmol!;
    s.carb += meal.carbG ?? 0;
    if (own.length) {
      s.units += own.reduce((a, d) => a + (d.units ?? 0), 0);
      s.withUnits += 1;
    }
    sums.set(key, s);
  }
  const names = new Map(timesOfDay.map((t) => [t.dayKindId, t.dayKindName]));
  const groups: ReviewGroup[] = [...sums.entries()].map(([key, s]) => {
    const [kindPart, startPart] = key.split(':');
    const dayKindId = kindPart === 'null' ? null : Number(kindPart);
    const startMinute = startPart === 'null' ? null : Number(startPart);
    const tod = timesOfDay.find((t) => t.dayKindId === dayKindId && t.startMinute === startMinute);
    return {
      dayKindId,
      dayKindName: dayKindId == null ? null : (names.get(dayKindId) ?? null),
      startMinute,
      endMinute: tod?.endMinute ?? null,
      meals: s.meals,
      averageChangeMmol: s.meals ? s.change / s.meals : null,
      averageCarbG: s.meals ? s.carb / s.meals : null,
      averageUnits: s.withUnits ? s.units / s.withUnits : null,
      tooFew: s.meals < minimumMeals,
    };
  });
  const used = groups.reduce((a, g) => a + g.meals, 0);
  return { groups, mealsInPeriod: meals.length, mealsUsed: used, skipped };
}

/**
 * How far the average glucose change after meals may go (mmol/L, either way) before a figure is flagged for the
 * diabetes team: "back within about ±2 mmol/L of the pre-meal value" (check-values §13.4, common practice; teams differ).
 */
export const REVIEW_FLAG_CHANGE_MMOL = 2;

export type ReviewFlag = {
  dayKindId: number | null;
  dayKindName: string | null;
  startMinute: number | null;
  endMinute: number | null;
  /** "rose": the average change is above +limit; "fell": below −limit. */
  direction: 'rose' | 'fell';
  meals: number;
  averageChangeMmol: number;
};

/**
 * The ratio review's figures worth a look: each group with enough meals (not "too few") whose average change after
 * meals lies beyond ±limitMmol (a change of exactly the limit is within). Evidence to talk about, never a new ratio.
 */
export function reviewFlags(review: Pick<RatioReview, 'groups'>, limitMmol = REVIEW_FLAG_CHANGE_MMOL): ReviewFlag[] {
  return review.groups.flatMap((g) => {
    const change = g.averageChangeMmol;
    if (g.tooFew || change == null || Math.abs(change) <= limitMmol) return [];
    return [{ dayKindId: g.dayKindId, dayKindName: g.dayKindName, startMinute: g.startMinute, endMinute: g.endMinute, direction: change > 0 ? 'rose' : 'fell', meals: g.meals, averageChangeMmol: change }];
  });
}
