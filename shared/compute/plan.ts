/**
 * The week plan's arithmetic: which kind of day a date is, a planned meal's carbohydrate and its planned meal dose
 * (meal part only: glucose is unknown in advance), day and week totals, and the plan's warnings. Pure: dates are
 * YYYY-MM-DD strings and `now` is passed in.
 */
import type { CarbBasis } from '../schemas/units';
import { findTimeOfDay, roundToIncrement, type DayKindRatios, type Rounding } from './dose';
import { defaultUseBy, type FoodSafetyRegion, type Storage } from './use-by';

const DAY_MS = 86_400_000;
const EPS = 1e-9;

/** The date `days` after (or before) an ISO date. */
export function addDaysIso(date: string, days: number): string {
  return new Date(Date.parse(`${date}T00:00:00Z`) + days * DAY_MS).toISOString().slice(0, 10);
}

/** ISO weekday of a date: 1 = Monday … 7 = Sunday (ISO 8601). */
export function isoWeekday(date: string): number {
  const d = new Date(`${date}T00:00:00Z`).getUTCDay();
  return d === 0 ? 7 : d;
}

/** The seven dates of the week holding `date`, starting on ISO weekday `weekStart` (1 = Monday). */
export function weekDates(date: string, weekStart: number): string[] {
  const back = (isoWeekday(date) - weekStart + 7) % 7;
  const first = addDaysIso(date, -back);
  return Array.from({ length: 7 }, (_, i) => addDaysIso(first, i));
}

export type DayKindSource = 'date' | 'pattern' | 'default';

/** The kind of day in force on a date: the one set for the date, else the weekly pattern's, else the default. */
export function dayKindFor(
  date: string,
  setForDate: ReadonlyMap<string, number>,
  pattern: ReadonlyMap<number, number>,
  defaultId: number | null,
): { dayKindId: number | null; from: DayKindSource | null } {
  const set = setForDate.get(date);
  if (set != null) return { dayKindId: set, from: 'date' };
  const usual = pattern.get(isoWeekday(date));
  if (usual != null) return { dayKindId: usual, from: 'pattern' };
  return { dayKindId: defaultId, from: defaultId == null ? null : 'default' };
}

/** What a planned meal holds, with carbohydrate already in the profile's basis (null = unknown). */
export type MealAmount =
  | { kind: 'portion'; carbGrams: number | null }
  | { kind: 'grams'; carbPer100g: number | null; grams: number }
  | { kind: 'portions'; carbPerPortion: number | null; portions: number }
  | { kind: 'plain'; carbGrams: number };

/** A planned meal's carbohydrate in grams: a portion's own value, per 100 g × grams ÷ 100, per portion × portions, or the typed amount. */
export function mealCarbGrams(amount: MealAmount): number | null {
  switch (amount.kind) {
    case 'portion':
    case 'plain':
      return amount.carbGrams;
    case 'grams':
      return amount.carbPer100g == null ? null : (amount.carbPer100g * amount.grams) / 100;
    case 'portions':
      return amount.carbPerPortion == null ? null : amount.carbPerPortion * amount.portions;
  }
}

export type PlanDoseSettings = { penIncrement: number; rounding: Rounding; maxDoseUnits: number };

export type PlannedDose =
  | { status: 'ok'; carbRatio: number; startMinute: number; endMinute: number; exactUnits: number; units: number; capped: boolean }
  | { status: 'no_settings' | 'no_ratio' | 'unknown_carb' };

/**
 * The planned meal dose, meal part only: carbohydrate ÷ the insulin-to-carb ratio of the day kind's time of day
 * holding the meal's clock time, rounded to the pen step as the dose engine rounds, capped at the largest single
 * dose. No correction and no insulin still active: glucose is unknown in advance.
 */
export function plannedMealDose(
  carbGrams: number | null,
  dayKind: DayKindRatios | null,
  minute: number,
  settings: PlanDoseSettings | null,
): PlannedDose {
  if (!settings) return { status: 'no_settings' };
  const timeOfDay = dayKind ? findTimeOfDay(dayKind.timesOfDay, minute) : undefined;
  if (!timeOfDay) return { status: 'no_ratio' };
  if (carbGrams == null) return { status: 'unknown_carb' };
  const exactUnits = carbGrams / timeOfDay.carbRatio;
  const rounded = roundToIncrement(exactUnits, settings.penIncrement, settings.rounding);
  const cap = roundToIncrement(settings.maxDoseUnits, settings.penIncrement, 'down');
  const capped = rounded > cap + EPS;
  return { status: 'ok', carbRatio: timeOfDay.carbRatio, startMinute: timeOfDay.startMinute, endMinute: timeOfDay.endMinute, exactUnits, units: capped ? cap : rounded, capped };
}

/** Where a planned portion comes from, for its safe-until date. */
export type PortionKeeping =
  | { kind: 'batch'; storage: Storage; useBy: string; region: FoodSafetyRegion; containsRice: boolean }
  | { kind: 'planned_cook'; cookOn: string | null; region: FoodSafetyRegion };

/**
 * The last day a planned portion is safe to eat: a fridge portion's use-by date; a frozen portion's fridge use-by
 * counted from its thaw day (none without a thaw day); a planned cook's portion by the fridge rule from its cook date.
 */
export function safeUntil(keeping: PortionKeeping, thawOn: string | null): { until: string | null; needsThaw: boolean } {
  if (keeping.kind === 'planned_cook') {
    return { until: keeping.cookOn ? defaultUseBy(keeping.cookOn, 'fridge', keeping.region).useBy : null, needsThaw: false };
  }
  if (keeping.storage === 'fridge') return { until: keeping.useBy, needsThaw: false };
  if (!thawOn) return { until: null, needsThaw: true };
  return { until: defaultUseBy(thawOn, 'fridge', keeping.region, keeping.containsRice).useBy, needsThaw: false };
}

export type PlanWarningCode = 'past_use_by' | 'needs_thaw' | 'over_placed' | 'no_ratio' | 'cook_no_date' | 'before_cook';
export type PlanWarning = { code: PlanWarningCode; message: string; date: string | null; mealId: number | null; batchId: number | null; plannedCookId: number | null };

/** A planned meal as the warnings see it. */
export type WarnMeal = {
  id: number;
  date: string;
  title: string;
  logged: boolean;
  doseStatus: PlannedDose['status'];
  thawOn: string | null;
  portion: { id: number; batchId: number; keeping: PortionKeeping } | null;
  plannedCook: { id: number; cookOn: string | null } | null;
};

/** A batch or planned cook and how many portions it holds for the plan (not eaten yet / to be cooked). */
export type Holder = { batchId: number | null; plannedCookId: number | null; title: string; holds: number };

/** Portions placed in meals not yet logged, per batch or planned cook, and how many are left. */
export function portionsUse(holders: readonly Holder[], meals: readonly WarnMeal[]) {
  return holders.map((h) => {
    const placed = meals.filter(
      (m) => !m.logged && (h.batchId != null ? m.portion?.batchId === h.batchId : m.plannedCook?.id === h.plannedCookId),
    ).length;
    return { ...h, placed, left: h.holds - placed };
  });
}

/**
 * The plan's warnings: a portion planned past its safe-until date, a frozen portion without a thaw day, more
 * portions placed than a batch or planned cook holds, a meal with no ratio for its time, a planned cook with no
 * date, and a planned cook's portion planned before the cook.
 */
export function planWarnings(meals: readonly WarnMeal[], holders: readonly Holder[], cooks: readonly { id: number; title: string; cookOn: string | null }[]): PlanWarning[] {
  const out: PlanWarning[] = [];
  const w = (code: PlanWarningCode, message: string, at: Partial<Omit<PlanWarning, 'code' | 'message'>> = {}) =>
    out.push({ code, message, date: at.date ?? null, mealId: at.mealId ?? null, batchId: at.batchId ?? null, plannedCookId: at.plannedCookId ?? null });
  for (const c of cooks) if (!c.cookOn) w('cook_no_date', `${c.title}: this planned cook has no date yet. Give it a day to see when its portions are safe.`, { plannedCookId: c.id });
  for (const u of portionsUse(holders, meals)) {
    if (u.left < 0) w('over_placed', `${u.title}: ${u.placed} portions are placed but it holds ${u.holds}.`, { batchId: u.batchId, plannedCookId: u.plannedCookId });
  }
  for (const m of meals) {
    if (m.logged) continue;
    const at = { date: m.date, mealId: m.id, batchId: m.portion?.batchId ?? null, plannedCookId: m.plannedCook?.id ?? null };
    if (m.doseStatus === 'no_ratio') w('no_ratio', `${m.title} on ${m.date}: no insulin-to-carb ratio covers this meal's time on that kind of day.`, at);
    if (m.plannedCook?.cookOn && m.date < m.plannedCook.cookOn) w('before_cook', `${m.title} on ${m.date} is planned before the cook on ${m.plannedCook.cookOn}.`, at);
    const keeping = m.portion?.keeping ?? (m.plannedCook ? ({ kind: 'planned_cook', cookOn: m.plannedCook.cookOn, region: 'uk' } as const) : null);
    if (!keeping) continue;
    const safe = safeUntil(keeping, m.thawOn);
    if (safe.needsThaw) w('needs_thaw', `${m.title} on ${m.date} is frozen: plan a thaw day in the fridge.`, at);
    else if (m.thawOn && m.date < m.thawOn) w('needs_thaw', `${m.title} on ${m.date} is planned before its thaw day (${m.thawOn}).`, at);
    if (safe.until && m.date > safe.until) w('past_use_by', `${m.title} on ${m.date} is past its use-by date (${safe.until}).`, at);
  }
  return out;
}

export type Totals = { carbGrams: number; carbIncomplete: boolean; rapidUnits: number; rapidIncomplete: boolean; longActingUnits: number | null };

/** A day's totals: known carbohydrate summed, planned rapid-acting units summed (incomplete when a meal has no dose), the day kind's long-acting units. */
export function dayTotals(meals: readonly { carbGrams: number | null; doseUnits: number | null }[], longActingUnits: number | null): Totals {
  return {
    carbGrams: meals.reduce((s, m) => s + (m.carbGrams ?? 0), 0),
    carbIncomplete: meals.some((m) => m.carbGrams == null),
    rapidUnits: meals.reduce((s, m) => s + (m.doseUnits ?? 0), 0),
    rapidIncomplete: meals.some((m) => m.doseUnits == null),
    longActingUnits,
  };
}

/** The week's totals: the days' sums (long-acting counted where the day kind has it). */
export function weekTotals(days: readonly Totals[]): Totals {
  return {
    carbGrams: days.reduce((s, d) => s + d.carbGrams, 0),
    carbIncomplete: days.some((d) => d.carbIncomplete),
    rapidUnits: days.reduce((s, d) => s + d.rapidUnits, 0),
    rapidIncomplete: days.some((d) => d.rapidIncomplete),
    longActingUnits: days.some((d) => d.longActingUnits != null) ? days.reduce((s, d) => s + (d.longActingUnits ?? 0), 0) : null,
  };
}

/** The next planned meal to offer: the first not yet logged from today on (today's earlier ones included), by date and time. */
export function nextPlannedMeal<T extends { date: string; minute: number; logged: boolean }>(meals: readonly T[], today: string): T | null {
  return [...meals].filter((m) => !m.logged && m.date >= today).sort((a, b) => a.date.localeCompare(b.date) || a.minute - b.minute)[0] ?? null;
}

/** Which carbohydrate of a pair a profile counts. */
export function inBasis(pair: { available: number | null; total: number | null }, basis: CarbBasis): number | null {
  return basis === 'available' ? pair.available : pair.total;
}
