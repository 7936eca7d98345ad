import { emptyNutrients, type Nutrients } from '../../shared/compute/nutrients';
import { completeEnergy, deriveCarbs } from '../../server/importers/food-rows';
import { normaliseSearchText, searchKeys } from '../../server/search/search-text';
import { packFoodNutrients } from '../../server/services/pack-foods.service';
import { createPackFoodInputSchema } from '../../shared/schemas/food';

const n = (patch: Partial<Nutrients>): Nutrients => ({ ...emptyNutrients(), ...patch });

describe('deriveCarbs', () => {
  it.each([
    // check-values.md §1.3: rolled oats SR Legacy 08120, 67.70 − 10.1 = 57.60
    { name: 'total with fibre gives available = total − fibre', input: n({ carbTotal: 67.7, fibre: 10.1 }), measured: 'total' as const, available: 57.6, total: 67.7, derived: ['carbAvailable'] },
    { name: 'total without fibre leaves available unknown', input: n({ carbTotal: 2.81 }), measured: 'total' as const, available: null, total: 2.81, derived: [] },
    // IFCT 2017 E012: 23.63 + 1.94 = 25.57
    { name: 'available with fibre gives total = available + fibre', input: n({ carbAvailable: 23.63, fibre: 1.94 }), measured: 'available' as const, available: 23.63, total: 25.57, derived: ['carbTotal'] },
    { name: 'available without fibre leaves total unknown', input: n({ carbAvailable: 12 }), measured: 'available' as const, available: 12, total: null, derived: [] },
    { name: 'fibre above a tiny total never gives negative available', input: n({ carbTotal: 0.5, fibre: 0.9 }), measured: 'total' as const, available: 0, total: 0.5, derived: ['carbAvailable'] },
    { name: 'an unknown carbohydrate stays unknown', input: n({ fibre: 3 }), measured: 'total' as const, available: null, total: null, derived: [] },
  ])('$name', ({ input, measured, available, total, derived }) => {
    const out = deriveCarbs(input, measured);

    expect(out.nutrients.carbAvailable).toBe(available);
    expect(out.nutrients.carbTotal).toBe(total);
    expect(out.derived).toEqual(derived);
  });
});

describe('completeEnergy', () => {
  it.each([
    { name: 'kJ from kcal (× 4.184)', input: n({ energyKcal: 100 }), kcal: 100, kj: 418.4, derived: ['energyKj'] },
    { name: 'kcal from kJ (÷ 4.184)', input: n({ energyKj: 418.4 }), kcal: 100, kj: 418.4, derived: ['energyKcal'] },
    { name: 'both published: nothing derived', input: n({ energyKcal: 89, energyKj: 371 }), kcal: 89, kj: 371, derived: [] },
    { name: 'neither known: both stay unknown', input: n({}), kcal: null, kj: null, derived: [] },
  ])('$name', ({ input, kcal, kj, derived }) => {
    const d: string[] = [];
    completeEnergy(input, d);

    expect(input.energyKcal).toBe(kcal);
    expect(input.energyKj).toBe(kj);
    expect(d).toEqual(derived);
  });
});

describe('searchKeys', () => {
  it.each([
    { name: 'Bananas, raw', rank: 0 },
    { name: 'Banana, ripe, robusta', rank: 0 },
    { name: 'Bananas, dehydrated, or banana powder', rank: 2 },
    { name: 'Rice, raw, milled', rank: 0 },
    { name: 'Rice flakes', rank: 2 },
    { name: 'Paneer', rank: 1 },
  ])('ranks "$name" with penalty $rank', ({ name, rank }) => {
    expect(searchKeys(name, []).rankPenalty).toBe(rank);
  });

  it('normalises accents, case and punctuation and keeps aliases in the search text', () => {
    expect(normaliseSearchText('  Crème-Fraîche (Full fat), 30%  ')).toBe('creme fraiche full fat 30');
    expect(searchKeys('Banana, ripe', ['Kela', 'Vazha pazham']).searchText).toBe('banana ripe kela vazha pazham');
  });
});

describe('packFoodNutrients', () => {
  const parse = (v: Record<string, unknown>) => createPackFoodInputSchema.parse({ name: 'x', ...v });

  it.each([
    // check-values.md §1.3: US label total 24 g, fibre 4 g → available 20 g; EU declares 20 g and fibre 4 g
    { name: 'US label per 100 g', input: { basis: 'per100g', convention: 'us', carbohydrate: 24, fibre: 4 }, available: 20, total: 24, measured: 'total' },
    { name: 'EU label per 100 g', input: { basis: 'per100g', convention: 'eu', carbohydrate: 20, fibre: 4 }, available: 20, total: 24, measured: 'available' },
    { name: 'EU label per 25 g serving', input: { basis: 'perServing', servingGrams: 25, convention: 'eu', carbohydrate: 5, fibre: 1 }, available: 20, total: 24, measured: 'available' },
    { name: 'US label per 60 g serving', input: { basis: 'perServing', servingGrams: 60, convention: 'us', carbohydrate: 24, fibre: 3 }, available: 35, total: 40, measured: 'total' },
  ])('$name', ({ input, available, total, measured }) => {
    const out = packFoodNutrients(parse(input));

    expect(out.carbMeasured).toBe(measured);
    expect(out.nutrients.carbAvailable).toBeCloseTo(available, 9);
    expect(out.nutrients.carbTotal).toBeCloseTo(total, 9);
  });
});
