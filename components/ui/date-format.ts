/** The one way a moment is shown: "2 Mar 2026, 09:30" in the reader's locale and clock. */
export function dateTimeText(iso: string): string {
  return new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });
}
