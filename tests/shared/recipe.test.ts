import { emptyNutrients, type Nutrients } from '../../shared/compute/nutrients';
import { computeRecipe, scaleFactorForPortions, scaleRecipeLines, type RecipeLine } from '../../shared/compute/recipe';
import { formatCarb } from '../../shared/compute/units';

const food = (carbTotal: number, fibre: number, extra: Partial<Nutrients> = {}): Nutrients => ({
  ...emptyNutrients(),
  carbTotal,
  fibre,
  ...extra,
});

// check-values §2.4, worked example B (overnight oats), per-100 g values from USDA SR Legacy:
// oats 08120 67.70 / fibre 10.1; whole milk 01077 4.80 / 0; nonfat Greek yogurt 01256 3.60 / 0
// (8.640 g in 240 g); apple with skin 09003 13.81 / 2.4 (20.715 g, 3.60 g in 150 g);
// raisins 09298 79.18 / 3.7 (31.672 g, 1.48 g in 40 g).
const overnightOats: RecipeLine[] = [
  { grams: 240, per100g: food(67.7, 10.1, { protein: 13.15 }) },
  { grams: 480, per100g: food(4.8, 0, { protein: 3.15 }) },
  { grams: 240, per100g: food(3.6, 0) },
  { grams: 150, per100g: food(13.81, 2.4) },
  { grams: 40, per100g: food(79.18, 3.7) },
];

describe('computeRecipe', () => {
  it('matches the hand calculation for six overnight-oats portions in total carbohydrate', () => {
    // By hand: 162.48 + 23.04 + 8.64 + 20.715 + 31.672 = 246.547 g in 1150 g;
    // 246.547 / 6 = 41.091 g per portion; 246.547 / 1150 × 100 = 21.439 g per 100 g (check-values §2.4).
    const r = computeRecipe(overnightOats, { portions: 6, basis: 'total' });

    expect(r.rawWeightGrams).toBe(1150);
    expect(r.carbTotal.grams).toBeCloseTo(246.547, 6);
    expect(r.carbPerPortion.grams).toBeCloseTo(41.09, 2);
    expect(r.carbPer100gRaw.grams).toBeCloseTo(21.439, 3);
    expect(r.ingredients.map((i) => i.carb.grams)).toEqual([
      expect.closeTo(162.48, 6),
      expect.closeTo(23.04, 6),
      expect.closeTo(8.64, 6),
      expect.closeTo(20.715, 6),
      expect.closeTo(31.672, 6),
    ]);
  });

  it('matches the hand calculation for the same portions in available carbohydrate', () => {
    // By hand: fibre 24.24 + 3.60 + 1.48 = 29.32 g; available 246.547 − 29.32 = 217.227 g;
    // 217.227 / 6 = 36.20 g per portion; 217.227 / 1150 × 100 = 18.889 g per 100 g (check-values §2.4).
    const r = computeRecipe(overnightOats, { portions: 6, basis: 'available' });

    expect(r.carbTotal.grams).toBeCloseTo(217.227, 6);
    expect(r.carbPerPortion.grams).toBeCloseTo(36.2, 2);
    expect(r.carbPer100gRaw.grams).toBeCloseTo(18.889, 3);
    expect(r.totals.fibre).toBeCloseTo(29.32, 6);
  });

  it.each([
    // 246.547 / 6 = 41.0912 g; CP 10 g (UK NHS), BE 12 g (Diätverordnung), exchange 15 g (ADA exchange lists) — check-values §6.
    { name: 'grams', unit: 'g' as const, expected: 41.09117, shown: '41 g' },
    { name: '10 g carbohydrate portions', unit: 'portion10' as const, expected: 4.109117, shown: '4.1 CP' },
    { name: '12 g bread units', unit: 'unit12' as const, expected: 3.424264, shown: '3.4 BU' },
    { name: '15 g exchanges', unit: 'exchange15' as const, expected: 2.739411, shown: '2.7 ex' },
  ])('gives the per-portion carbohydrate in $name', ({ unit, expected, shown }) => {
    const r = computeRecipe(overnightOats, { portions: 6, basis: 'total', unit });

    expect(r.carbPerPortion.inUnit).toBeCloseTo(expected, 5);
    expect(formatCarb(r.carbPerPortion.grams!, unit)).toBe(shown);
  });

  it('gives per 100 g raw for the porridge batch as total ÷ raw weight (check-values §2.3: 386.5 / 2500 × 100)', () => {
    const porridge: RecipeLine[] = [
      { grams: 500, per100g: food(67.7, 10.1) },
      { grams: 1000, per100g: food(4.8, 0) },
      { grams: 1000, per100g: food(0, 0) },
    ];

    const r = computeRecipe(porridge, { portions: 8, basis: 'total' });

    expect(r.carbPer100gRaw.grams).toBeCloseTo(15.46, 2);
    expect(r.carbPerPortion.grams).toBeCloseTo(48.3125, 4);
    expect(r.portionGrams).toBeCloseTo(312.5, 9);
  });

  it('flags carbohydrate as incomplete and counts only known parts when a food lacks its value', () => {
    const lines: RecipeLine[] = [
      { grams: 100, per100g: food(50, 5) },
      { grams: 100, per100g: { ...emptyNutrients(), carbTotal: 20 } },
    ];

    const r = computeRecipe(lines, { portions: 2, basis: 'available' });

    expect(r.carbIncomplete).toBe(true);
    expect(r.ingredients[1].carb.grams).toBeNull();
    expect(r.carbTotal.grams).toBeCloseTo(45, 9);
    expect(r.incomplete).toContain('fibre');
  });

  it('gives zero carbohydrate and unknown per-100 g values for no ingredients', () => {
    const r = computeRecipe([], { portions: 1, basis: 'available' });

    expect(r.carbTotal.grams).toBe(0);
    expect(r.carbPer100gRaw.grams).toBeNull();
  });

  it.each([
    { name: 'zero grams', lines: [{ grams: 0, per100g: food(10, 1) }], portions: 1 },
    { name: 'negative grams', lines: [{ grams: -5, per100g: food(10, 1) }], portions: 1 },
    { name: 'not-a-number grams', lines: [{ grams: Number.NaN, per100g: food(10, 1) }], portions: 1 },
    { name: 'zero portions', lines: [{ grams: 10, per100g: food(10, 1) }], portions: 0 },
    { name: 'fractional portions', lines: [{ grams: 10, per100g: food(10, 1) }], portions: 2.5 },
  ])('refuses $name', ({ lines, portions }) => {
    expect(() => computeRecipe(lines, { portions, basis: 'total' })).toThrow(RangeError);
  });
});

describe('scaling', () => {
  it.each([
    { name: 'doubles every weight for × 2', factor: 2, expected: [480, 960, 480, 300, 80] },
    { name: 'halves every weight for × 0.5', factor: 0.5, expected: [120, 240, 120, 75, 20] },
  ])('$name and keeps carbohydrate per portion when portions scale too', ({ factor, expected }) => {
    const scaled = scaleRecipeLines(overnightOats, factor);

    expect(scaled.map((l) => l.grams)).toEqual(expected);
    const before = computeRecipe(overnightOats, { portions: 6, basis: 'total' });
    const after = computeRecipe(scaled, { portions: 6 * factor, basis: 'total' });
    expect(after.carbPerPortion.grams).toBeCloseTo(before.carbPerPortion.grams!, 9);
  });

  it.each([
    { name: '6 → 9 portions is × 1.5', from: 6, to: 9, expected: 1.5 },
    { name: '4 → 1 portion is × 0.25', from: 4, to: 1, expected: 0.25 },
  ])('$name', ({ from, to, expected }) => {
    expect(scaleFactorForPortions(from, to)).toBe(expected);
  });

  it.each([
    { name: 'a zero factor', run: () => scaleRecipeLines(overnightOats, 0) },
    { name: 'a negative factor', run: () => scaleRecipeLines(overnightOats, -1) },
    { name: 'zero target portions', run: () => scaleFactorForPortions(6, 0) },
  ])('refuses $name', ({ run }) => {
    expect(run).toThrow(RangeError);
  });
});
