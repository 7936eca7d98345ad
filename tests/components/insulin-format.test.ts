import { formatDoseUnits, formatInsulinUnits } from '@/components/dose/insulin-format';

// "units" in full and no trailing zeros: ISMP list of error-prone abbreviations, symbols and dose designations;
// Joint Commission "Do Not Use" list ("U", trailing zero).
describe('formatInsulinUnits', () => {
  it.each([
    { name: 'a whole number', units: 3, expected: '3 units' },
    { name: 'one', units: 1, expected: '1 unit' },
    { name: 'zero', units: 0, expected: '0 units' },
    { name: 'a half', units: 1.5, expected: '1.5 units' },
    { name: 'a trailing zero dropped', units: 2.1, expected: '2.1 units' },
    { name: 'two decimals kept for a part of the sum', units: 2.333333, expected: '2.33 units' },
    { name: 'rounding that lands on a whole number', units: 1.999, expected: '2 units' },
    { name: 'a negative correction', units: -0.75, expected: '−0.75 units' },
  ])('$name', ({ units, expected }) => {
    expect(formatInsulinUnits(units)).toBe(expected);
  });
});

describe('formatDoseUnits (a dose on a 0.5 or 1 unit pen step)', () => {
  it.each([
    { units: 4, expected: '4 units' },
    { units: 2.5, expected: '2.5 units' },
    { units: 0.5, expected: '0.5 units' },
  ])('$units → $expected', ({ units, expected }) => {
    expect(formatDoseUnits(units)).toBe(expected);
  });
});
