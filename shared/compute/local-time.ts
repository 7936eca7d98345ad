/**
 * Whose clock: entries are stored as UTC instants; the profile's IANA time zone turns each into the local date and
 * minute of the day that pick the day, the day kind and the time of day whose ratio applies. Uses Intl only.
 */

export type LocalTime = { localDate: string; localMinute: number };

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterFor(timeZone: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone,
      hourCycle: 'h23',
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      second: '2-digit',
    });
    formatters.set(timeZone, f);
  }
  return f;
}

/** True when the name is an IANA time zone this runtime knows (e.g. "Europe/London", "UTC"). */
export function isTimeZone(name: string): boolean {
  if (!name || name.length > 64) return false;
  try {
    formatterFor(name);
    return true;
  } catch {
    return false;
  }
}

/** The local date (YYYY-MM-DD) and minute of the day (0–1439) of a UTC instant in an IANA time zone. */
export function toLocalTime(instant: Date | number, timeZone: string): LocalTime {
  const parts = formatterFor(timeZone).formatToParts(typeof instant === 'number' ? new Date(instant) : instant);
  const get = (type: Intl.DateTimeFormatPartTypes) => Number(parts.find((p) => p.type === type)!.value);
  const pad = (n: number, w = 2) => String(n).padStart(w, '0');
  return {
    localDate: `${pad(get('year'), 4)}-${pad(get('month'))}-${pad(get('day'))}`,
    localMinute: get('hour') * 60 + get('minute'),
  };
}

function offsetMs(instantMs: number, timeZone: string): number {
  const parts = Object.fromEntries(formatterFor(timeZone).formatToParts(new Date(instantMs)).map((p) => [p.type, p.value]));
  const asUtc = Date.UTC(+parts.year, +parts.month - 1, +parts.day, +parts.hour, +parts.minute, +parts.second);
  return asUtc - Math.floor(instantMs / 1000) * 1000;
}

/**
 * The instant a local wall-clock time names in a zone. A time skipped when the clocks go forward is read with the
 * offset before the change (02:30 on a spring-forward night becomes 03:30); a repeated hour takes its first instant.
 */
export function zonedToInstant(date: string, minute: number, timeZone: string, second = 0): number {
  const [y, m, d] = date.split('-').map(Number);
  const wall = Date.UTC(y, m - 1, d, 0, minute, second);
  const before = wall - offsetMs(wall - 12 * 3_600_000, timeZone);
  const after = wall - offsetMs(wall + 12 * 3_600_000, timeZone);
  const fits = (t: number) => {
    const p = toLocalTime(t, timeZone);
    return p.localDate === date && p.localMinute === minute;
  };
  const matches = [before, after].filter(fits);
  return matches.length ? Math.min(...matches) : before;
}
