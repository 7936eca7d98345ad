/** The one way a moment is shown: "2 Mar 2026, 09:30" in the reader's locale and clock. */
export function dateTimeText(iso: string): string {
  return new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });
}

/** The one way a local date is shown: "Mon 9 Mar" for a YYYY-MM-DD date (the date as written, whatever the device's zone). */
export function dayText(date: string): string {
  return new Date(`${date}T12:00:00Z`).toLocaleDateString('en-GB', { weekday: 'short', day: 'numeric', month: 'short', timeZone: 'UTC' });
}
