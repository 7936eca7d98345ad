import { toLocalTime } from '../../shared/compute/local-time';
import { minutesToTime } from '../../shared/schemas/profile-settings';
import { dayText } from '../ui/date-format';
import { Callout } from '../ui/callout';
import { Text } from '../ui/text';

/** Said in place of a planned dose offline: a dose from an old copy could be wrong, so none is shown. */
export const DOSE_NOT_SHOWN_OFFLINE = 'not shown offline';

/** "Offline — as of 14:05" in the profile's clock; the date too ("Tue 1 Dec 18:30") when the copy is from another day. */
export function offlineStampText(asOf: number | null, now: number, timeZone: string): string {
  if (asOf == null) return 'Offline — nothing saved on this device yet';
  const at = toLocalTime(asOf, timeZone);
  const sameDay = at.localDate === toLocalTime(now, timeZone).localDate;
  return `Offline — as of ${sameDay ? '' : `${dayText(at.localDate)} `}${minutesToTime(at.localMinute)}`;
}

/** Above a screen shown from its offline copy: when the copy is from, and that nothing is saved or worked out offline. */
export function OfflineNotice({ asOf, timeZone }: { asOf: number | null; timeZone: string }) {
  return (
    <Callout tone="caution" title={offlineStampText(asOf, Date.now(), timeZone)}>
      <Text>
        This is what this device kept when it was last online, read-only. Nothing can be saved and no dose is worked out
        until you are back online.
      </Text>
    </Callout>
  );
}
