/**
 * Wall-clock time in an IANA time zone, from the platform's time zone database (Intl). Entries are stored in UTC; the
 * profile's zone gives each its local date and minute.
 */

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatter(zone: string): Intl.DateTimeFormat {
  let f = formatters.get(zone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-GB', {
      timeZone: zone,
      hourCycle: 'h23',
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      second: '2-digit',
    });
    formatters.set(zone, f);
  }
  return f;
}

/** True when the platform knows the IANA zone name. */
export function isKnownTimeZone(zone: string): boolean {
  try {
    formatter(zone);
    return true;
  } catch {
    return false;
  }
}

/** The local date ("YYYY-MM-DD") and minute of the day (0–1439) of an instant in a zone. */
export function localParts(instantMs: number, zone: string): { date: string; minute: number } {
  const parts = Object.fromEntries(formatter(zone).formatToParts(new Date(instantMs)).map((p) => [p.type, p.value]));
  return { date: `${parts.year}-${parts.month}-${parts.day}`, minute: Number(parts.hour) * 60 + Number(parts.minute) };
}

function offsetMs(instantMs: number, zone: string): number {
  const parts = Object.fromEntries(formatter(zone).formatToParts(new Date(instantMs)).map((p) => [p.type, p.value]));
  const asUtc = Date.UTC(+parts.year, +parts.month - 1, +parts.day, +parts.hour, +parts.minute, +parts.second);
  return asUtc - Math.floor(instantMs / 1000) * 1000;
}

/**
 * The instant a local wall-clock time names in a zone. A time skipped when the clocks go forward is read with the
 * offset before the change (02:30 on a spring-forward night becomes 03:30); a repeated hour takes its first instant.
 */
export function zonedToInstant(date: string, minute: number, zone: string, second = 0): number {
  const [y, m, d] = date.split('-').map(Number);
  const wall = Date.UTC(y, m - 1, d, 0, minute, second);
  const before = wall - offsetMs(wall - 12 * 3_600_000, zone);
  const after = wall - offsetMs(wall + 12 * 3_600_000, zone);
  const fits = (t: number) => {
    const p = localParts(t, zone);
    return p.date === date && p.minute === minute;
  };
  const matches = [before, after].filter(fits);
  return matches.length ? Math.min(...matches) : before;
}
