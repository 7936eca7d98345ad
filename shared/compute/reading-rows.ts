import { glucoseToMmol } from './units';
import { zonedToInstant } from './local-time';
import type { GlucoseUnit } from '../schemas/units';

/**
 * How one row of a glucose-readings file is read: the time (with or without a zone, day-month or month-day), the
 * value (decimal point or comma) and its unit. Pure; the server decodes the file and splits it into rows.
 */

export type DateOrder = 'day_month' | 'month_day';

/** Plausible glucose for a meter or sensor reading, in mmol/L (meters read about 1.1–33.3 mmol/L, from memory). */
export const IMPORT_GLUCOSE_LIMITS_MMOL = { min: 0.5, max: 40 } as const;

const ISO = /^(\d{4})-(\d{1,2})-(\d{1,2})[T ](\d{1,2}):(\d{2})(?::(\d{2})(?:\.\d+)?)?\s*(Z|[+-]\d{2}:?\d{2})?$/i;
const NUMERIC = /^(\d{1,2})[./-](\d{1,2})[./-](\d{4}|\d{2}),?[ T]+(\d{1,2}):(\d{2})(?::(\d{2}))?\s*([ap]\.?m\.?)?$/i;

/** What the first two numbers of a "dd/mm/yyyy"-style date allow: which orders fit (both when neither is above 12). */
export function dateOrdersFor(raw: string): DateOrder[] | null {
  const m = NUMERIC.exec(raw.trim());
  if (!m) return null;
  const [a, b] = [Number(m[1]), Number(m[2])];
  const out: DateOrder[] = [];
  if (a <= 31 && b <= 12) out.push('day_month');
  if (a <= 12 && b <= 31) out.push('month_day');
  return out;
}

/** The date order a whole column allows: one order, `ambiguous` when both fit every row, or null when none needs it. */
export function columnDateOrder(values: string[]): DateOrder | 'ambiguous' | 'conflict' | null {
  let day = true;
  let month = true;
  let any = false;
  for (const v of values) {
    const orders = dateOrdersFor(v);
    if (!orders) continue;
    any = true;
    day &&= orders.includes('day_month');
    month &&= orders.includes('month_day');
  }
  if (!any) return null;
  if (day && month) return 'ambiguous';
  if (day) return 'day_month';
  if (month) return 'month_day';
  return 'conflict';
}

const validDate = (y: number, mo: number, d: number) => {
  const t = new Date(Date.UTC(y, mo - 1, d));
  return t.getUTCFullYear() === y && t.getUTCMonth() === mo - 1 && t.getUTCDate() === d;
};
const iso = (y: number, mo: number, d: number) => `${y}-${String(mo).padStart(2, '0')}-${String(d).padStart(2, '0')}`;

/** The instant a time cell names; a time without a zone is read in `zone`. Returns a reason when it cannot be read. */
export function parseReadingTime(raw: string, zone: string, order: DateOrder | null): { at: number } | { error: string } {
  const text = raw.trim();
  const m = ISO.exec(text);
  let y: number, mo: number, d: number, h: number, mi: number, s: number;
  let offset: string | undefined;
  if (m) {
    [y, mo, d, h, mi, s] = [m[1], m[2], m[3], m[4], m[5], m[6] ?? '0'].map(Number);
    offset = m[7];
  } else {
    const n = NUMERIC.exec(text);
    if (!n) return { error: `"${text}" is not a date and time this import reads (for example 2026-03-01 07:30 or 01/03/2026 07:30).` };
    if (!order) return { error: 'Choose whether dates are day-month or month-day.' };
    const [a, b] = [Number(n[1]), Number(n[2])];
    [d, mo] = order === 'day_month' ? [a, b] : [b, a];
    y = n[3].length === 2 ? 2000 + Number(n[3]) : Number(n[3]);
    [h, mi, s] = [Number(n[4]), Number(n[5]), Number(n[6] ?? 0)];
    const ampm = n[7]?.toLowerCase().replace(/\./g, '');
    if (ampm) {
      if (h < 1 || h > 12) return { error: `"${text}": ${h} is not an hour on a 12-hour clock.` };
      h = (h % 12) + (ampm === 'pm' ? 12 : 0);
    }
  }
  if (!validDate(y, mo, d)) return { error: `"${text}" is not a date that exists.` };
  if (h > 23 || mi > 59 || s > 59) return { error: `"${text}" is not a time of day.` };
  if (offset) {
    const zoneText = offset.toUpperCase() === 'Z' ? 'Z' : offset.replace(/^([+-]\d{2})(\d{2})$/, '$1:$2');
    return { at: Date.parse(`${iso(y, mo, d)}T${String(h).padStart(2, '0')}:${String(mi).padStart(2, '0')}:${String(s).padStart(2, '0')}${zoneText}`) };
  }
  return { at: zonedToInstant(iso(y, mo, d), h * 60 + mi, zone, s) };
}

/** A number written with a decimal point or a decimal comma ("5.6", "5,6", "101"); null when it is not one. */
export function parseDecimal(raw: string): number | null {
  const text = raw.trim().replace(/\s/g, '');
  if (!/^\d+([.,]\d+)?$/.test(text)) return null;
  return Number(text.replace(',', '.'));
}

/** The unit a unit cell names ("mmol/L", "mg/dL", any case); null when it names neither. */
export function parseGlucoseUnit(raw: string): GlucoseUnit | null {
  const text = raw.trim().toLowerCase().replace(/\s/g, '');
  if (/^mmol(\/l)?$/.test(text)) return 'mmol_l';
  if (/^mg(\/dl)?$/.test(text)) return 'mg_dl';
  return null;
}

/** One reading's value in mmol/L, or the reason it cannot be imported. */
export function parseReadingValue(raw: string, unitCell: string | null, fallback: GlucoseUnit): { mmol: number } | { error: string } {
  const value = parseDecimal(raw);
  if (value == null) return { error: `"${raw.trim()}" is not a glucose value.` };
  const unit = unitCell && unitCell.trim() ? parseGlucoseUnit(unitCell) : fallback;
  if (!unit) return { error: `"${unitCell!.trim()}" is not a glucose unit (mmol/L or mg/dL).` };
  const mmol = glucoseToMmol(value, unit);
  const { min, max } = IMPORT_GLUCOSE_LIMITS_MMOL;
  if (mmol < min || mmol > max) return { error: `${raw.trim()} ${unit === 'mmol_l' ? 'mmol/L' : 'mg/dL'} is outside what a meter reads.` };
  return { mmol };
}
