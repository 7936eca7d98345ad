import { minutesToTime } from '../../shared/schemas/profile-settings';
import { formatCarb, formatGlucose, glucoseFromMmol, glucoseToMmol } from '../../shared/compute/units';
import type { LogHistoryRow } from '../../shared/schemas/logbook-read';
import type { CarbBasis, CarbUnit, GlucoseUnit } from '../../shared/schemas/units';
import { formatInsulinUnits } from '../dose/insulin-format';
import { localToday } from '../kitchen/kitchen-format';

/** Units in full by the one insulin formatter ("4.5 units", "1 unit"); a dash when there is none. */
export function unitsText(units: number | null): string {
  return units == null ? '—' : formatInsulinUnits(units);
}

/** A glucose value already in the display unit, formatted by the one glucose formatter. */
export function glucoseText(value: number | null | undefined, unit: GlucoseUnit): string {
  return value == null ? '—' : formatGlucose(glucoseToMmol(value, unit), unit);
}

/** A share of readings as a whole percent ("45 %"); a dash when there were no readings. */
export function percentText(value: number | null): string {
  return value == null ? '—' : `${Math.round(value)} %`;
}

/** A change in glucose (stored in mmol/L) with its sign, in the profile's unit. */
export function glucoseChangeText(mmol: number | null, unit: GlucoseUnit): string {
  if (mmol == null) return '—';
  const shown = formatGlucose(Math.abs(mmol), unit);
  const zero = Math.round(glucoseFromMmol(mmol, unit) * (unit === 'mmol_l' ? 10 : 1)) === 0;
  return zero ? `±${shown}` : `${mmol > 0 ? '+' : '−'}${shown}`;
}

/** A meal's carbohydrate in the profile's basis and counting unit. */
export function mealCarbText(meal: NonNullable<LogHistoryRow['meal']>, basis: CarbBasis, unit: CarbUnit): string {
  return formatCarb(basis === 'available' ? meal.carbAvailableG : meal.carbTotalG, unit);
}

/** What an entry holds, in a line (the meal's name and carbohydrate, a reading, a dose, exercise). */
export function entrySummary(row: LogHistoryRow, glucoseUnit: GlucoseUnit, basis: CarbBasis, carbUnit: CarbUnit): string {
  if (row.meal) return `${row.meal.title || 'Meal'} · ${mealCarbText(row.meal, basis, carbUnit)}`;
  if (row.reading) return `${glucoseText(row.reading.glucose, glucoseUnit)}${row.reading.source === 'imported' ? ' (imported)' : ''}`;
  if (row.dose) return unitsText(row.dose.units);
  if (row.exercise) return `${row.exercise.intensity}, ${row.exercise.durationMinutes} min`;
  return row.note ?? '';
}

/** The default period: the last 14 local days up to today. */
export function defaultPeriod(now: Date = new Date()): { from: string; to: string } {
  const to = localToday(now);
  const from = new Date(Date.parse(`${to}T00:00:00Z`) - 13 * 86_400_000).toISOString().slice(0, 10);
  return { from, to };
}

/** "07:00–11:00" for a time of day given in minutes. */
export function minutesRange(start: number | null, end: number | null): string {
  return start == null || end == null ? 'Outside any time of day' : `${minutesToTime(start)}–${minutesToTime(end)}`;
}
