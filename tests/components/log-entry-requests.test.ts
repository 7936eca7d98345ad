import { occurredAtFrom, toEditRequest } from '@/components/logbook/entry-requests';
import type { LogEntry } from '@/shared/schemas/logbook';

// 29 March 2026 is the day UK clocks go forward: from 01:00 UTC, Europe/London is UTC+1 (IANA tz database, EU summer-time rule).
const NOW = Date.parse('2026-03-29T10:00:00Z');

describe('occurredAtFrom: now, minutes ago or a clock time today in the profile zone', () => {
  it.each([
    ['now', '', 'Europe/London', {}],
    ['ago', '20', 'Europe/London', { at: '2026-03-29T09:40:00.000Z' }],
    ['ago', '1.5', 'UTC', { error: 'Enter whole minutes, 0 to 1440.' }],
    ['ago', '', 'UTC', { error: 'Enter whole minutes, 0 to 1440.' }],
    ['clock', '07:30', 'Europe/London', { at: '2026-03-29T06:30:00.000Z' }],
    ['clock', '00:30', 'Europe/London', { at: '2026-03-29T00:30:00.000Z' }],
    ['clock', '07:30', 'UTC', { at: '2026-03-29T07:30:00.000Z' }],
    ['clock', '23:00', 'UTC', { error: 'That time is later than now. Use minutes ago for yesterday.' }],
    ['clock', '7.30', 'UTC', { error: 'Enter a clock time such as 07:30.' }],
  ] as const)('%s %p in %s', (when, text, zone, expected) => {
    expect(occurredAtFrom(when, text, NOW, zone)).toEqual(expected);
  });
});

describe('toEditRequest', () => {
  const dose = { id: 3, kind: 'long_dose', localDate: '2026-03-29', localTime: '08:00', timeZone: 'Europe/London', dose: { units: 12 }, meal: null } as unknown as LogEntry;
  const values = { time: '08:00', glucose: '', units: '13', intensity: 'moderate', durationMinutes: '', carbsGrams: '', note: '' } as const;

  it('sends the time only when it changed, as the instant on the entry local date in its zone', () => {
    expect(toEditRequest(values, dose, 'mmol_l').request).toEqual({ occurredAt: undefined, units: '13', note: null });
    expect(toEditRequest({ ...values, time: '07:15' }, dose, 'mmol_l').request).toMatchObject({ occurredAt: '2026-03-29T06:15:00.000Z' });
    expect(toEditRequest({ ...values, time: '7h' }, dose, 'mmol_l').errors).toEqual({ time: ['Enter a clock time such as 07:30.'] });
  });
});
