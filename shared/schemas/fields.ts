import { z } from 'zod';

// A plain decimal as people type it: digits with one optional "." or "," (no hex, exponent, sign words or spaces inside).
const DECIMAL = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)$/;

/**
 * Reads a form's text as a number when it is a plain decimal ("4.5", "4,5", " 12 "); blank text is missing. Anything
 * else (`[]`, `true`, `"0x10"`, `"1e3"`, an object) is left as it is, so the number check refuses it instead of
 * JavaScript coercing it to 0, 1 or 16.
 */
export function readDecimal(v: unknown): unknown {
  if (v == null) return undefined;
  if (typeof v !== 'string') return v;
  const text = v.trim();
  if (text === '') return undefined;
  return DECIMAL.test(text) ? Number(text.replace(',', '.')) : v;
}

/** A finite number from JSON, or a plain decimal string from a form; missing or blank gives `required`. */
export function decimalField(required: string) {
  return z.preprocess(readDecimal, z.number({ error: required }).refine(Number.isFinite, required));
}

/** A whole number from a URL or query string: digits only (no "0x10", "1e3" or blanks). */
export function wholeNumberText(message: string) {
  return z.preprocess((v) => (typeof v === 'string' && /^\d{1,15}$/.test(v) ? Number(v) : v), z.number({ error: message }).int(message));
}

/** Years a date may fall in: anything else is a typing slip or hostile (year 0000 broke the database). */
export const DATE_YEARS = { min: 1900, max: 2200 } as const;
const yearOk = (iso: string) => {
  const year = Number(iso.slice(0, 4));
  return year >= DATE_YEARS.min && year <= DATE_YEARS.max;
};
export const saneYearMessage = `Use a year from ${DATE_YEARS.min} to ${DATE_YEARS.max}.`;

/** A calendar date "YYYY-MM-DD" that exists, within DATE_YEARS. */
export function calendarDate(message: string) {
  return z.iso.date(message).refine(yearOk, saneYearMessage);
}

/** A date and time with its offset, within DATE_YEARS. */
export function dateTime(message: string) {
  return z.iso.datetime({ offset: true, error: message }).refine(yearOk, saneYearMessage);
}

// C0 controls except tab, line feed and carriage return; DEL; a high surrogate not followed by a low one, or a low one alone.
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/;
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** True for text that is valid Unicode without control characters (tab and line breaks allowed). */
export function isCleanText(s: string): boolean {
  return !CONTROL.test(s) && !LONE_SURROGATE.test(s);
}

/** The dot paths of every string (value or key) in a request part that is not clean text, e.g. `tags.2`. */
export function uncleanTextPaths(value: unknown, path: string[] = [], out: string[] = []): string[] {
  if (typeof value === 'string') {
    if (!isCleanText(value)) out.push(path.join('.') || '_');
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => uncleanTextPaths(v, [...path, String(i)], out));
  } else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      if (!isCleanText(k)) out.push([...path, '_key'].join('.'));
      else uncleanTextPaths(v, [...path, k], out);
    }
  }
  return out;
}

/** The message for text with control characters or broken Unicode. */
export const UNCLEAN_TEXT_MESSAGE = 'Use plain text: no control characters or broken characters.';
