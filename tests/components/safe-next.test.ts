import { safeNext } from '@/components/auth/safe-next';

describe('safeNext', () => {
  it.each([
    { name: 'keeps an inner path with its query', next: '/kitchen?x=1', expected: '/kitchen?x=1' },
    { name: 'refuses another origin', next: 'https://elsewhere.example/', expected: '/' },
    { name: 'refuses a protocol-relative address', next: '//elsewhere.example/', expected: '/' },
    { name: 'refuses a backslash trick', next: '/\\elsewhere.example', expected: '/' },
    { name: 'does not loop back to sign-in', next: '/sign-in', expected: '/' },
    { name: 'falls back for nothing', next: undefined, expected: '/' },
  ])('$name', ({ next, expected }) => {
    expect(safeNext(next)).toBe(expected);
  });
});
