import { installPasswordEstimator, passwordProblem, utf8Bytes } from '../../shared/compute/password';
import { createPasswordEstimator } from '../../shared/compute/password-estimator';
import { changePasswordInputSchema, signUpInputSchema } from '../../shared/schemas/auth';

// Rules: NIST SP 800-63B §5.1.1.2 (length floor, no composition rules, refuse values from breach corpuses, dictionary
// words, repetitive or sequential characters and context-specific words such as the username); the floor of 10 and the
// 72-byte ceiling (bcrypt reads only the first 72 bytes, per the bcrypt paper and the bcryptjs README) are Carbwright's.
const EMAIL = 'jan.smith@example.org';
const cases: { name: string; password: string; refused: RegExp | null }[] = [
  { name: 'nine characters is too short', password: 'kq8#vz!pw', refused: /at least 10 characters/ },
  { name: 'ten accented characters (20 bytes) count as ten characters', password: 'éàüöçñøåßœ', refused: null },
  { name: 'a top-ten common password', password: '1234567890', refused: /most common/ },
  { name: 'a keyboard row', password: 'qwertyuiop', refused: /common|keyboard/i },
  { name: 'a common password with digits', password: 'password123', refused: /common/ },
  { name: 'one repeated character', password: 'aaaaaaaaaaaa', refused: /Repeated/ },
  { name: 'the e-mail address itself', password: EMAIL, refused: /e-mail address or name/ },
  { name: 'the local part of the e-mail address', password: 'JAN.SMITH', refused: /too short|at least|e-mail address or name|too easy|close/i },
  { name: 'the product name and a year', password: 'carbwright2026', refused: /close to your name|too easy|guess/i },
  { name: 'four unrelated words', password: 'quiet lantern orchard fig', refused: null },
  { name: 'exactly 72 bytes of letters', password: 'violet-harbour-7'.repeat(4) + 'grebe-mo', refused: null },
  { name: '73 bytes', password: 'violet-harbour-7'.repeat(4) + 'grebe-mos', refused: /at most 72 bytes/ },
  { name: 'emoji count as four bytes each: 19 of them are 76 bytes', password: '🍲'.repeat(19), refused: /at most 72 bytes/ },
];

// As the server does (server/lib/passwords.ts); the web app loads the same estimator on demand.
beforeAll(() => installPasswordEstimator(createPasswordEstimator()));

describe('passwordProblem', () => {
  it.each(cases)('$name', ({ password, refused }) => {
    const problem = passwordProblem(password, [EMAIL, 'Jan Smith']);

    if (refused === null) expect(problem).toBeNull();
    else expect(problem).toMatch(refused);
  });

  it.each([
    { value: 'abc', bytes: 3 },
    { value: 'é', bytes: 2 }, // U+00E9 is two bytes in UTF-8 (RFC 3629)
    { value: '🍲', bytes: 4 }, // U+1F372, outside the BMP: four bytes (RFC 3629)
  ])('counts "$value" as $bytes UTF-8 bytes', ({ value, bytes }) => {
    expect(utf8Bytes(value)).toBe(bytes);
  });
});

describe('the shared schemas use the rule', () => {
  it('refuses a sign-up whose password is the e-mail address, under the password field', () => {
    const result = signUpInputSchema.safeParse({ email: 'Cook@Example.org', displayName: 'Cook', password: 'cook@example.org' });

    expect(result.success).toBe(false);
    expect(result.error!.issues).toEqual([expect.objectContaining({ path: ['password'], message: expect.stringMatching(/e-mail address/) })]);
  });

  it('refuses the same password on change', () => {
    const result = changePasswordInputSchema.safeParse({ currentPassword: 'quiet lantern orchard fig', newPassword: 'quiet lantern orchard fig' });

    expect(result.error!.issues).toEqual([expect.objectContaining({ path: ['newPassword'], message: expect.stringMatching(/different/) })]);
  });
});
