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

/** A minute of the day as HH:MM (the dose engine's local time). */
export function minuteToClock(minute: number): string {
  return `${String(Math.floor(minute / 60)).padStart(2, '0')}:${String(minute % 60).padStart(2, '0')}`;
}
