import { isTimeZone } from '../../shared/compute/local-time';

/** The device's IANA time zone, sent at sign-up so the profile's day starts where the person lives; UTC if unknown. */
export function browserTimeZone(): string {
  try {
    const zone = Intl.DateTimeFormat().resolvedOptions().timeZone;
    return zone && isTimeZone(zone) ? zone : 'UTC';
  } catch {
    return 'UTC';
  }
}
