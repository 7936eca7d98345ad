import { isTimeZone, toLocalTime, zonedToInstant } from '../../shared/compute/local-time';

// Summer time in the EU/UK starts on the last Sunday of March and ends on the last Sunday of October, both at
// 01:00 UTC (Directive 2000/84/EC; the UK's Summer Time Order follows it): 29 March and 25 October 2026.
// Japan keeps UTC+9 all year (from memory).
describe('toLocalTime (history side)', () => {
  const cases = [
    { name: 'London, 23:30 GMT the night before the change', at: '2026-03-28T23:30:00Z', zone: 'Europe/London', date: '2026-03-28', minute: 23 * 60 + 30 },
    { name: 'London, 00:30 GMT on the change night', at: '2026-03-29T00:30:00Z', zone: 'Europe/London', date: '2026-03-29', minute: 30 },
    { name: 'London, 01:30 UTC is 02:30 BST', at: '2026-03-29T01:30:00Z', zone: 'Europe/London', date: '2026-03-29', minute: 150 },
    { name: 'Tokyo, 15:30 UTC is 00:30 the next day', at: '2026-03-01T15:30:00Z', zone: 'Asia/Tokyo', date: '2026-03-02', minute: 30 },
  ];
  it.each(cases)('$name', ({ at, zone, date, minute }) => {
    expect(toLocalTime(Date.parse(at), zone)).toEqual({ localDate: date, localMinute: minute });
  });
});

describe('zonedToInstant', () => {
  const cases = [
    { name: 'Tokyo 00:30 → 15:30 UTC the day before', date: '2026-03-02', minute: 30, zone: 'Asia/Tokyo', at: '2026-03-01T15:30:00.000Z' },
    { name: 'London winter 08:00 → 08:00 UTC', date: '2026-01-15', minute: 480, zone: 'Europe/London', at: '2026-01-15T08:00:00.000Z' },
    { name: 'London summer 08:00 → 07:00 UTC', date: '2026-07-15', minute: 480, zone: 'Europe/London', at: '2026-07-15T07:00:00.000Z' },
    { name: 'London 01:30 on the spring night does not exist: read with the winter offset', date: '2026-03-29', minute: 90, zone: 'Europe/London', at: '2026-03-29T01:30:00.000Z' },
    { name: 'London 01:30 on the autumn night happens twice: the first one', date: '2026-10-25', minute: 90, zone: 'Europe/London', at: '2026-10-25T00:30:00.000Z' },
  ];
  it.each(cases)('$name', ({ date, minute, zone, at }) => {
    expect(new Date(zonedToInstant(date, minute, zone)).toISOString()).toBe(at);
  });

  it('knows real zone names and refuses made-up ones', () => {
    expect(isTimeZone('Europe/Berlin')).toBe(true);
    expect(isTimeZone('Mars/Olympus')).toBe(false);
  });
});
