import { carbInBasis, carbToShow, emptyNutrients, scaleNutrients, sumNutrients, type Nutrients } from '../../shared/compute/nutrients';

// Rolled oats, USDA SR Legacy NDB 08120 (FDC 173904), per 100 g: carbohydrate by difference 67.70 g,
// fibre 10.1 g, protein 13.15 g, fat 6.52 g, 379 kcal — check-values §11 ([C2] macros, fibre [M]).
const oats: Nutrients = {
  ...emptyNutrients(),
  energyKcal: 379,
  carbTotal: 67.7,
  fibre: 10.1,
  protein: 13.15,
  fat: 6.52,
};

describe('scaleNutrients', () => {
  it('scales per-100 g values to the weighed grams and keeps unknowns unknown', () => {
    const n = scaleNutrients(oats, 500);

    // 500 g × 67.70 / 100 = 338.50 g (check-values §2.3 worked example A).
    expect(n.carbTotal).toBeCloseTo(338.5, 9);
    expect(n.fibre).toBeCloseTo(50.5, 9);
    expect(n.sugars).toBeNull();
  });
});

describe('carbInBasis', () => {
  it.each([
    // check-values §1.1: available = total − fibre; oats 67.70 − 10.1 = 57.60 g/100 g.
    { name: 'derives available from total minus fibre (oats 08120)', n: { carbAvailable: null, carbTotal: 67.7, fibre: 10.1 }, basis: 'available' as const, expected: 57.6 },
    // T5: US label total 24 g, fibre 4 g → available 20 g (21 CFR 101.9(c)(6)).
    { name: 'US label 24 g total with 4 g fibre gives 20 g available', n: { carbAvailable: null, carbTotal: 24, fibre: 4 }, basis: 'available' as const, expected: 20 },
    { name: 'derives total from available plus fibre', n: { carbAvailable: 20, carbTotal: null, fibre: 4 }, basis: 'total' as const, expected: 24 },
    { name: 'prefers a stored available value', n: { carbAvailable: 55, carbTotal: 67.7, fibre: 10.1 }, basis: 'available' as const, expected: 55 },
    { name: 'is unknown without fibre to derive from', n: { carbAvailable: null, carbTotal: 67.7, fibre: null }, basis: 'available' as const, expected: null },
  ])('$name', ({ n, basis, expected }) => {
    const got = carbInBasis(n, basis);
    if (expected === null) expect(got).toBeNull();
    else expect(got).toBeCloseTo(expected, 9);
  });
});

describe('carbToShow', () => {
  it.each([
    // USDA SR28 NDB 08120 oats: 205 = 67.70 g, 291 = 10.1 g → available 57.60 g (datasets.md §4: available = total − fibre).
    { name: 'shows the derived available value when fibre is known', n: { carbAvailable: null, carbTotal: 67.7, fibre: 10.1 }, basis: 'available' as const, expected: { grams: 57.6, basisShown: 'available', fibreNotMeasured: false } },
    // USDA SR28 NDB 20069 triticale: 205 = 72.13 g and no 291 (fibre) row — available unknown, the total shown with the note.
    { name: 'shows the total with the note when fibre was not measured', n: { carbAvailable: null, carbTotal: 72.13, fibre: null }, basis: 'available' as const, expected: { grams: 72.13, basisShown: 'total', fibreNotMeasured: true } },
    { name: 'needs no note in the total basis', n: { carbAvailable: null, carbTotal: 72.13, fibre: null }, basis: 'total' as const, expected: { grams: 72.13, basisShown: 'total', fibreNotMeasured: false } },
    { name: 'is unknown when no carbohydrate is known', n: { carbAvailable: null, carbTotal: null, fibre: null }, basis: 'available' as const, expected: { grams: null, basisShown: null, fibreNotMeasured: false } },
    // IFCT 2017 available 20 g with unknown fibre: the total is unknown, never available + 0.
    { name: 'does not count missing fibre as 0 in the total basis either', n: { carbAvailable: 20, carbTotal: null, fibre: null }, basis: 'total' as const, expected: { grams: null, basisShown: null, fibreNotMeasured: false } },
  ])('$name', ({ n, basis, expected }) => {
    const got = carbToShow(n, basis);
    expect(got.basisShown).toBe(expected.basisShown);
    expect(got.fibreNotMeasured).toBe(expected.fibreNotMeasured);
    if (expected.grams === null) expect(got.grams).toBeNull();
    else expect(got.grams).toBeCloseTo(expected.grams, 9);
    // The strict value used in sums never takes the shown total as available.
    if (got.fibreNotMeasured) expect(carbInBasis(n, basis)).toBeNull();
  });
});

describe('sumNutrients', () => {
  it('adds known parts and lists keys where some part was unknown', () => {
    const a = { ...emptyNutrients(), carbTotal: 10, sugars: 2 };
    const b = { ...emptyNutrients(), carbTotal: 5 };

    const { totals, incomplete } = sumNutrients([a, b]);

    expect(totals.carbTotal).toBe(15);
    expect(totals.sugars).toBe(2);
    expect(totals.fat).toBeNull();
    expect(incomplete).toEqual(['sugars']);
  });

  it('returns all-null totals for no parts', () => {
    expect(sumNutrients([]).totals).toEqual(emptyNutrients());
  });
});
