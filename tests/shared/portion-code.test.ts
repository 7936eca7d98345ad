import {
  formatPortionCode,
  generatePortionCode,
  normalizePortionCode,
  PORTION_CODE_ALPHABET,
  PORTION_CODE_LENGTH,
} from '../../shared/compute/portion-code';
import { randomInt } from 'node:crypto';

describe('portion codes', () => {
  it('uses no characters that look like others', () => {
    for (const ch of '0O1IL2Z5S8BUV') expect(PORTION_CODE_ALPHABET).not.toContain(ch);
    expect(new Set(PORTION_CODE_ALPHABET).size).toBe(PORTION_CODE_ALPHABET.length);
  });

  it('generates codes of the fixed length from the alphabet only', () => {
    for (let i = 0; i < 200; i += 1) {
      const code = generatePortionCode(randomInt);
      expect(code).toHaveLength(PORTION_CODE_LENGTH);
      expect(normalizePortionCode(code)).toBe(code);
    }
  });

  it('rarely repeats across ten thousand random codes', () => {
    const codes = new Set(Array.from({ length: 10_000 }, () => generatePortionCode(randomInt)));

    // 23^6 ≈ 1.48e8 codes: the expected number of collisions in 10 000 draws is about 0.34.
    expect(codes.size).toBeGreaterThan(9_995);
  });

  it.each([
    { input: 'k7m-q4p', expected: 'K7MQ4P' },
    { input: ' K7M Q4P ', expected: 'K7MQ4P' },
    { input: 'K7MQ4', expected: null },
    { input: 'K7MQ4PA', expected: null },
    { input: 'K0MQ4P', expected: null },
    { input: 'KIMQ4P', expected: null },
  ])('normalises "$input" to $expected', ({ input, expected }) => {
    expect(normalizePortionCode(input)).toBe(expected);
  });

  it('formats as two groups of three', () => {
    expect(formatPortionCode('K7MQ4P')).toBe('K7M-Q4P');
  });

  it('maps the extremes of the random source to the first and last symbols', () => {
    expect(generatePortionCode(() => 0)).toBe(PORTION_CODE_ALPHABET[0].repeat(PORTION_CODE_LENGTH));
    expect(generatePortionCode((n) => n - 1)).toBe(PORTION_CODE_ALPHABET.at(-1)!.repeat(PORTION_CODE_LENGTH));
  });
});
