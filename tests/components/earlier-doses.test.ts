import { earlierDoseField, earlierDosesRequest } from '@/components/dose/earlier-doses-fields';
import { doseCheckHref } from '@/components/dose/dose-href';
import { availablePortions } from '@/components/today/today-portions';
import type { BatchSummary } from '@/shared/schemas/batch';

const NOW = Date.UTC(2026, 2, 1, 12, 0);

describe('earlierDosesRequest', () => {
  it('turns each typed row into units and a time that many minutes before now, skipping empty rows', () => {
    const { doses, errors } = earlierDosesRequest(
      [
        { units: '2', minutesAgo: '30' },
        { units: '', minutesAgo: '' },
        { units: '1,5', minutesAgo: '90' },
      ],
      NOW,
    );

    expect(errors).toEqual({});
    expect(doses).toEqual([
      { units: '2', takenAt: new Date(NOW - 30 * 60_000).toISOString(), row: 0 },
      { units: '1,5', takenAt: new Date(NOW - 90 * 60_000).toISOString(), row: 2 },
    ]);
  });

  it.each([
    { name: 'empty minutes', minutesAgo: '' },
    { name: 'words', minutesAgo: 'soon' },
    { name: 'negative minutes', minutesAgo: '-5' },
    { name: 'more than a day', minutesAgo: '1441' },
  ])('names the minutes field of the row for $name', ({ minutesAgo }) => {
    const { doses, errors } = earlierDosesRequest([{ units: '1', minutesAgo: '10' }, { units: '2', minutesAgo }], NOW);

    expect(doses.map((d) => d.row)).toEqual([0]);
    expect(Object.keys(errors)).toEqual(['earlierDoses.1.minutesAgo']);
  });
});

describe('earlierDoseField', () => {
  it.each([
    // The second dose sent came from form row 2 (row 1 was empty).
    { path: 'earlierDoses.1.units', expected: 'earlierDoses.2.units' },
    { path: 'earlierDoses.1.takenAt', expected: 'earlierDoses.2.minutesAgo' },
    { path: 'earlierDoses.0.units', expected: 'earlierDoses.0.units' },
    { path: 'earlierDoses.1.minutesAgo', expected: 'earlierDoses.1.minutesAgo' },
    { path: 'earlierDoses', expected: 'earlierDoses.0.units' },
    { path: 'carbsGrams', expected: undefined },
  ])('places $path on $expected', ({ path, expected }) => {
    expect(earlierDoseField(path, [0, 2])).toBe(expected);
  });
});

describe('doseCheckHref', () => {
  it('builds the dose-check link with the code, grams and an encoded title', () => {
    expect(doseCheckHref({ code: 'K7Q2', carbGrams: 28.8, label: 'Lentil & leek soup' })).toBe(
      '/dose-check?portion=K7Q2&carbs=28.8&label=Lentil%20%26%20leek%20soup',
    );
  });
});

describe('availablePortions', () => {
  const portion = (code: string, status: 'available' | 'eaten', grams: number) =>
    ({ id: 0, code, batchId: 0, profileId: 1, position: 0, containerName: null, grossGrams: null, tareGrams: null, netGrams: 200, carb: { grams, inUnit: grams }, status, statusChangedAt: null }) as const;
  const batch = (title: string, storage: 'fridge' | 'freezer', useBy: string, portions: ReturnType<typeof portion>[]) =>
    ({ recipeTitle: title, storage, useBy, portions: [...portions] }) as unknown as BatchSummary;

  it('lists only available portions, soonest use-by first, fridge before freezer on the same date', () => {
    const rows = availablePortions([
      batch('Chilli', 'freezer', '2026-03-05', [portion('C1', 'available', 30)]),
      batch('Soup', 'fridge', '2026-03-05', [portion('S1', 'eaten', 20), portion('S2', 'available', 20)]),
      batch('Oats', 'fridge', '2026-03-02', [portion('O1', 'available', 40)]),
    ]);

    expect(rows.map((r) => r.code)).toEqual(['O1', 'S2', 'C1']);
    expect(rows[1]).toMatchObject({ title: 'Soup', carbGrams: 20, storage: 'fridge' });
  });
});
