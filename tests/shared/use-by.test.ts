import { batchContainsRice, daysUntil, defaultUseBy, regionForLocale } from '../../shared/compute/use-by';

describe('defaultUseBy', () => {
  it.each([
    // T26 (check-values §9): USDA FSIS leftovers 3–4 days → D+3.
    { name: 'US fridge: cook day + 3 (USDA FSIS)', cooked: '2026-03-10', storage: 'fridge' as const, region: 'us' as const, rice: false, expected: '2026-03-13', source: /USDA/ },
    // T26: UK FSA 2 days; rice 1 day ([C2]/[M]).
    { name: 'UK fridge: cook day + 2 (FSA)', cooked: '2026-03-10', storage: 'fridge' as const, region: 'uk' as const, rice: false, expected: '2026-03-12', source: /Food Standards Agency/ },
    { name: 'UK fridge with rice: cook day + 1 (FSA)', cooked: '2026-03-10', storage: 'fridge' as const, region: 'uk' as const, rice: true, expected: '2026-03-11', source: /rice/ },
    { name: 'US fridge with rice stays at + 3 (USDA gives no rice rule)', cooked: '2026-03-10', storage: 'fridge' as const, region: 'us' as const, rice: true, expected: '2026-03-13', source: /USDA/ },
    // USDA FSIS frozen leftovers 3–4 months best quality ([C2]).
    { name: 'freezer: + 3 months', cooked: '2026-03-10', storage: 'freezer' as const, region: 'us' as const, rice: false, expected: '2026-06-10', source: /USDA/ },
    { name: 'freezer across a month end clamps to the last day', cooked: '2026-11-30', storage: 'freezer' as const, region: 'uk' as const, rice: false, expected: '2027-02-28', source: /USDA/ },
    { name: 'fridge across a year end', cooked: '2026-12-30', storage: 'fridge' as const, region: 'us' as const, rice: false, expected: '2027-01-02', source: /USDA/ },
    { name: 'fridge across a leap day', cooked: '2028-02-28', storage: 'fridge' as const, region: 'uk' as const, rice: false, expected: '2028-03-01', source: /Food Standards/ },
  ])('$name', ({ cooked, storage, region, rice, expected, source }) => {
    const result = defaultUseBy(cooked, storage, region, rice);

    expect(result.useBy).toBe(expected);
    expect(result.source).toMatch(source);
    expect(result.note.length).toBeGreaterThan(10);
  });
});

describe('batchContainsRice', () => {
  // Which foods count as rice is our own word rule (common practice: match the word, not a substring).
  it.each([
    { name: 'a rice line', lines: [{ foodName: 'Rice, white, long-grain, cooked' }], expected: true },
    { name: 'rice within a name', lines: [{ foodName: 'Beans and Rice, canned' }], expected: true },
    { name: 'rice left out', lines: [{ foodName: 'Rice, brown, cooked', omitted: true }, { foodName: 'Lentils' }], expected: false },
    { name: 'a word that only contains "rice"', lines: [{ foodName: 'Licorice' }, { foodName: 'Price-checked oats' }], expected: false },
    { name: 'no lines', lines: [], expected: false },
  ])('$name → $expected', ({ lines, expected }) => {
    expect(batchContainsRice(lines)).toBe(expected);
  });
});

describe('regionForLocale', () => {
  it.each([
    { locale: 'en-US', expected: 'us' },
    { locale: 'es_US', expected: 'us' },
    { locale: 'en-GB', expected: 'uk' },
    { locale: 'de-DE', expected: 'uk' },
    { locale: undefined, expected: 'uk' },
  ])('maps $locale to $expected', ({ locale, expected }) => {
    expect(regionForLocale(locale)).toBe(expected);
  });
});

describe('daysUntil', () => {
  it.each([
    { useBy: '2026-03-12', today: '2026-03-10', expected: 2 },
    { useBy: '2026-03-12', today: '2026-03-12', expected: 0 },
    { useBy: '2026-03-12', today: '2026-03-14', expected: -2 },
  ])('counts $expected days from $today to $useBy', ({ useBy, today, expected }) => {
    expect(daysUntil(useBy, today)).toBe(expected);
  });
});
