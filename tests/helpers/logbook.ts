import type { CreationAttributes } from 'sequelize';
import { LogEntryModel, ProfileModel } from '../../server/models';

/**
 * Logbook rows written straight into the table, for tests of what is read from it. The caller gives the UTC instant
 * and the local date and time it falls on in the zone, worked out by hand (so the test does not lean on the code
 * that converts them). On a UTC profile the local time is the instant's own.
 */
export type TestEntry = Partial<CreationAttributes<LogEntryModel>> & {
  kind: LogEntryModel['kind'];
  /** UTC instant, e.g. '2026-01-14T22:30:00Z'. */
  at: string;
  /** Local date and time "YYYY-MM-DD HH:MM" in `zone`; defaults to the instant's UTC date and time. */
  local?: string;
  zone?: string;
};

/** Inserts log entries for a profile (not deleted, entered by nobody unless given). */
export async function addLogEntries(profileId: number, entries: TestEntry[]): Promise<LogEntryModel[]> {
  const rows = entries.map(({ at, local, zone, ...rest }) => {
    const [date, time] = (local ?? at.slice(0, 16).replace('T', ' ')).split(' ');
    const [h, m] = time.split(':').map(Number);
    return { profileId, occurredAt: new Date(at), localDate: date, localMinute: h * 60 + m, timeZone: zone ?? 'UTC', ...rest };
  });
  return LogEntryModel.bulkCreate(rows);
}

/** Sets a profile's time zone (IANA name). */
export async function setProfileTimeZone(profileId: number, timeZone: string): Promise<void> {
  await ProfileModel.update({ timeZone }, { where: { id: profileId } });
}
