import { isTimeZone, toLocalTime } from '../../shared/compute/local-time';
import { minutesToTime } from '../../shared/schemas/profile-settings';

// Summer time in the EU (and the UK, which follows the same dates): Directive 2000/84/EC, art. 2 and 3 — starts and
// ends at 01:00 UTC on the last Sunday of March and of October. 2026: Sunday 29 March and Sunday 25 October.
// Europe/London is UTC+0 in winter and UTC+1 in summer; Europe/Berlin UTC+1 / UTC+2.
// US zones: 15 U.S.C. 260a (as amended 2005) — second Sunday of March, first Sunday of November, at 02:00 local;
// America/New_York is UTC−5 / UTC−4. Asia/Kolkata has no summer time (UTC+5:30) — from memory.
describe('toLocalTime', () => {
  it.each([
    { name: 'London, 00:59 UTC on 29 March 2026 is 00:59 GMT (before the change)', at: '2026-03-29T00:59:00Z', tz: 'Europe/London', date: '2026-03-29', time: '00:59' },
    { name: 'London, 01:00 UTC on 29 March 2026 is 02:00 BST (clocks go forward)', at: '2026-03-29T01:00:00Z', tz: 'Europe/London', date: '2026-03-29', time: '02:00' },
    { name: 'London, 07:30 UTC on 29 March 2026 is breakfast at 08:30 BST', at: '2026-03-29T07:30:00Z', tz: 'Europe/London', date: '2026-03-29', time: '08:30' },
    { name: 'London, 00:30 UTC on 25 October 2026 is 01:30 BST (first 01:30)', at: '2026-10-25T00:30:00Z', tz: 'Europe/London', date: '2026-10-25', time: '01:30' },
    { name: 'London, 01:30 UTC on 25 October 2026 is 01:30 GMT (the hour repeats)', at: '2026-10-25T01:30:00Z', tz: 'Europe/London', date: '2026-10-25', time: '01:30' },
    { name: 'London, 07:30 UTC on 25 October 2026 is breakfast at 07:30 GMT', at: '2026-10-25T07:30:00Z', tz: 'Europe/London', date: '2026-10-25', time: '07:30' },
    { name: 'Berlin, 00:59 UTC on 29 March 2026 is 01:59 CET', at: '2026-03-29T00:59:00Z', tz: 'Europe/Berlin', date: '2026-03-29', time: '01:59' },
    { name: 'Berlin, 01:00 UTC on 29 March 2026 is 03:00 CEST', at: '2026-03-29T01:00:00Z', tz: 'Europe/Berlin', date: '2026-03-29', time: '03:00' },
    { name: 'New York, 06:59 UTC on 8 March 2026 is 01:59 EST', at: '2026-03-08T06:59:00Z', tz: 'America/New_York', date: '2026-03-08', time: '01:59' },
    { name: 'New York, 07:00 UTC on 8 March 2026 is 03:00 EDT', at: '2026-03-08T07:00:00Z', tz: 'America/New_York', date: '2026-03-08', time: '03:00' },
    // Day boundaries: a late supper and a midnight snack fall on different local days.
    { name: 'London summer, 22:30 UTC is 23:30 the same day', at: '2026-07-14T22:30:00Z', tz: 'Europe/London', date: '2026-07-14', time: '23:30' },
    { name: 'London summer, 23:30 UTC is 00:30 the next day', at: '2026-07-14T23:30:00Z', tz: 'Europe/London', date: '2026-07-15', time: '00:30' },
    { name: 'New York winter, 04:30 UTC is 23:30 the day before', at: '2026-01-15T04:30:00Z', tz: 'America/New_York', date: '2026-01-14', time: '23:30' },
    { name: 'New York winter, 05:30 UTC is 00:30 the same day', at: '2026-01-15T05:30:00Z', tz: 'America/New_York', date: '2026-01-15', time: '00:30' },
    { name: 'Kolkata, 18:00 UTC is 23:30 IST', at: '2026-01-15T18:00:00Z', tz: 'Asia/Kolkata', date: '2026-01-15', time: '23:30' },
    { name: 'Kolkata, 19:00 UTC is 00:30 IST the next day', at: '2026-01-15T19:00:00Z', tz: 'Asia/Kolkata', date: '2026-01-16', time: '00:30' },
    { name: 'UTC, midnight is minute 0', at: '2026-01-01T00:00:00Z', tz: 'UTC', date: '2026-01-01', time: '00:00' },
    { name: 'UTC, year end 23:59', at: '2026-12-31T23:59:59Z', tz: 'UTC', date: '2026-12-31', time: '23:59' },
  ])('$name', ({ at, tz, date, time }) => {
    const local = toLocalTime(new Date(at), tz);

    expect(local.localDate).toBe(date);
    expect(minutesToTime(local.localMinute)).toBe(time);
  });

  it('accepts epoch milliseconds as well as a Date', () => {
    expect(toLocalTime(Date.parse('2026-03-29T01:00:00Z'), 'Europe/London')).toEqual({ localDate: '2026-03-29', localMinute: 120 });
  });
});

describe('isTimeZone', () => {
  it.each([
    { name: 'Europe/London', ok: true },
    { name: 'America/New_York', ok: true },
    { name: 'UTC', ok: true },
    { name: 'Mars/Olympus_Mons', ok: false },
    { name: '', ok: false },
    { name: 'Europe/London; DROP TABLE', ok: false },
  ])('$name → $ok', ({ name, ok }) => {
    expect(isTimeZone(name)).toBe(ok);
  });
});
