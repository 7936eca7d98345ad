/**
 * Portion codes are typed by hand from a label, often in a kitchen: no 0/O, 1/I/L, U/V, 2/Z, 5/S or 8/B look-alikes.
 * 23 symbols, 6 long = 148 million codes, shown as two groups of three ("K7M-Q4P").
 */
export const PORTION_CODE_ALPHABET = '34679ACDEFGHJKMNPQRTWXY';
export const PORTION_CODE_LENGTH = 6;

/** A new random code; `randomInt(n)` must return a whole number in [0, n) (crypto.randomInt on the server). */
export function generatePortionCode(randomInt: (n: number) => number): string {
  let code = '';
  for (let i = 0; i < PORTION_CODE_LENGTH; i += 1) code += PORTION_CODE_ALPHABET[randomInt(PORTION_CODE_ALPHABET.length)];
  return code;
}

/** Upper-cases a typed code and drops spaces and dashes; returns null when it cannot be a portion code. */
export function normalizePortionCode(input: string): string | null {
  const code = input.toUpperCase().replace(/[\s-]/g, '');
  if (code.length !== PORTION_CODE_LENGTH) return null;
  for (const ch of code) if (!PORTION_CODE_ALPHABET.includes(ch)) return null;
  return code;
}

/** Display form "ABC-DEF". */
export function formatPortionCode(code: string): string {
  return `${code.slice(0, 3)}-${code.slice(3)}`;
}
