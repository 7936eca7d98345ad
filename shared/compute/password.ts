import type { ZxcvbnFactory } from '@zxcvbn-ts/core';

/**
 * Password rules after NIST SP 800-63B section 5.1.1.2: a length floor, no composition rules, and a check against
 * common, guessable and context-specific passwords (zxcvbn-ts with its common dictionaries, all shipped: nothing is
 * fetched; see password-estimator.ts). The ceiling is bcrypt's: it reads only the first 72 bytes, so longer passwords
 * are refused rather than silently cut.
 */
export const PASSWORD_MIN_LENGTH = 10;
export const PASSWORD_MAX_BYTES = 72;
/** zxcvbn score from 0 (too guessable) to 4; 3 and up is "safely unguessable" in its own terms. */
export const PASSWORD_MIN_SCORE = 3;

/** What scores a password against the common dictionaries (made by password-estimator.ts). */
export type PasswordEstimator = Pick<ZxcvbnFactory, 'check'>;

let estimator: PasswordEstimator | undefined;

/**
 * Sets the estimator passwordProblem uses. The server installs it before it checks any password
 * (server/lib/passwords.ts); the web app loads it only on the screens that set a password (its dictionaries are
 * about 470 KB), and until it has, leaves the common-password check to the server, which always makes it.
 */
export function installPasswordEstimator(value: PasswordEstimator): void {
  estimator = value;
}

const WARNINGS: Record<string, string> = {
  topTen: 'This is one of the most common passwords.',
  topHundred: 'This is one of the most common passwords.',
  common: 'This is a commonly used password.',
  similarToCommon: 'This is too close to a commonly used password.',
  pwned: 'This password has appeared in data breaches.',
  simpleRepeat: 'Repeated characters like "aaa" are easy to guess.',
  extendedRepeat: 'Repeated patterns like "abcabc" are easy to guess.',
  sequences: 'Sequences like "abcd" or "1234" are easy to guess.',
  straightRow: 'Rows of keys on the keyboard are easy to guess.',
  keyPattern: 'Short keyboard patterns are easy to guess.',
  recentYears: 'Recent years are easy to guess.',
  dates: 'Dates are easy to guess.',
  wordByItself: 'A single word is easy to guess.',
  namesByThemselves: 'Names on their own are easy to guess.',
  commonNames: 'Common names are easy to guess.',
  userInputs: 'It is too close to your name or e-mail address.',
};

/** The UTF-8 length of a string in bytes (what bcrypt counts). */
export function utf8Bytes(value: string): number {
  return new TextEncoder().encode(value).length;
}

/**
 * What is wrong with a new password, as one sentence to show under the field, or null when it may be used.
 * `personal` holds the person's own words (e-mail address, name) that must not be the password or make it up.
 */
export function passwordProblem(password: string, personal: string[] = []): string | null {
  if ([...password].length < PASSWORD_MIN_LENGTH) return `Use at least ${PASSWORD_MIN_LENGTH} characters.`;
  if (utf8Bytes(password) > PASSWORD_MAX_BYTES) {
    return `Use at most ${PASSWORD_MAX_BYTES} bytes: about ${PASSWORD_MAX_BYTES} plain letters and digits, fewer with accents or emoji.`;
  }
  const words = personal.map((w) => w.trim().toLowerCase()).filter(Boolean);
  const lowered = password.trim().toLowerCase();
  const localParts = words.filter((w) => w.includes('@')).map((w) => w.split('@')[0]);
  if (words.includes(lowered) || localParts.includes(lowered)) return 'Do not use your e-mail address or name as your password.';
  if (!estimator) return null;
  const result = estimator.check(password, [...words, ...localParts, 'carbwright']);
  if (result.score >= PASSWORD_MIN_SCORE) return null;
  const warning = (result.feedback.warning && WARNINGS[result.feedback.warning]) || 'This password is too easy to guess.';
  return `${warning} Try three or four unrelated words.`;
}
