import { emptyNutrients, type Nutrients } from '../../shared/compute/nutrients';
import { carbAmount, computeRecipe, scaleFactorForPortions, scaleRecipeLines, type RecipeLine } from '../../shared/compute/recipe';

// Edges of the recipe arithmetic (FAO recipe method, check-values §2.4) that mutation testing found untested:
// the refusals and their messages, the first accepted value beside each refusal, and unknown carbohydrate.
// Every expected number below is worked by hand in the comment beside it.
const food = (values: Partial<Nutrients>): Nutrients => ({ ...emptyNutrients(), ...values });
const oneLine: RecipeLine[] = [{ grams: 100, per100g: food({ carbTotal: 10, fibre: 1 }) }];

const PORTIONS_ERROR = 'portions must be a whole number of at least 1';
const GRAMS_ERROR = 'every ingredient needs more than 0 g';
const FACTOR_ERROR = 'the scale factor must be more than 0';
const SCALE_PORTIONS_ERROR = 'portions must be whole numbers of at least 1';

describe('computeRecipe refusals, by message', () => {
  it.each([
    { name: 'portions 0: refused', portions: 0 },
    { name: 'portions −1: refused', portions: -1 },
    { name: 'portions 0.5 (below 1, not whole): refused', portions: 0.5 },
    { name: 'portions 1.5 (above 1, not whole): refused', portions: 1.5 },
    { name: 'portions not a number: refused', portions: Number.NaN },
    { name: 'portions infinite: refused', portions: Number.POSITIVE_INFINITY },
  ])('$name', ({ portions }) => {
    expect(() => computeRecipe(oneLine, { portions, basis: 'total' })).toThrow(PORTIONS_ERROR);
  });

  it.each([
    { name: '0 g: refused', grams: 0 },
    { name: '−0.1 g: refused', grams: -0.1 },
    { name: 'not a number: refused', grams: Number.NaN },
    { name: 'infinite grams: refused', grams: Number.POSITIVE_INFINITY },
    { name: 'minus infinite grams: refused', grams: Number.NEGATIVE_INFINITY },
  ])('an ingredient of $name', ({ grams }) => {
    expect(() => computeRecipe([{ grams, per100g: food({ carbTotal: 10 }) }], { portions: 1, basis: 'total' })).toThrow(GRAMS_ERROR);
  });

  it('checks every line, not only the first: a good line followed by a 0 g line is refused', () => {
    const lines: RecipeLine[] = [...oneLine, { grams: 0, per100g: food({ carbTotal: 10 }) }];

    expect(() => computeRecipe(lines, { portions: 1, basis: 'total' })).toThrow(GRAMS_ERROR);
  });

  it('accepts the values just beside the refusals: 1 portion and 0.001 g', () => {
    // By hand: 0.001 g × 10 g/100 g = 0.0001 g carbohydrate; 1 portion holds all of it and all 0.001 g.
    const r = computeRecipe([{ grams: 0.001, per100g: food({ carbTotal: 10 }) }], { portions: 1, basis: 'total' });

    expect(r.portions).toBe(1);
    expect(r.portionGrams).toBeCloseTo(0.001, 12);
    expect(r.carbPerPortion.grams).toBeCloseTo(0.0001, 12);
  });
});

describe('scaling refusals, by message', () => {
  it.each([
    { name: 'factor 0: refused', factor: 0 },
    { name: 'factor −0.5: refused', factor: -0.5 },
    { name: 'factor not a number: refused', factor: Number.NaN },
    { name: 'factor infinite: refused', factor: Number.POSITIVE_INFINITY },
  ])('scaleRecipeLines $name', ({ factor }) => {
    expect(() => scaleRecipeLines(oneLine, factor)).toThrow(FACTOR_ERROR);
  });

  it('scaleRecipeLines accepts a small factor just above 0 and keeps the rest of each line', () => {
    // By hand: 100 g × 0.01 = 1 g.
    const scaled = scaleRecipeLines(oneLine, 0.01);

    expect(scaled).toEqual([{ grams: 1, per100g: oneLine[0].per100g }]);
  });

  it.each([
    { name: 'from 0: refused', from: 0, to: 4 },
    { name: 'from −2: refused', from: -2, to: 4 },
    { name: 'from 1.5 (not whole): refused', from: 1.5, to: 4 },
    { name: 'from 0.5 (below 1, not whole): refused', from: 0.5, to: 4 },
    { name: 'to 0: refused', from: 4, to: 0 },
    { name: 'to −1: refused', from: 4, to: -1 },
    { name: 'to 2.5 (not whole): refused', from: 4, to: 2.5 },
    { name: 'to 0.5 (below 1, not whole): refused', from: 4, to: 0.5 },
    { name: 'from not a number: refused', from: Number.NaN, to: 4 },
    { name: 'to infinite: refused', from: 4, to: Number.POSITIVE_INFINITY },
  ])('scaleFactorForPortions $name', ({ from, to }) => {
    expect(() => scaleFactorForPortions(from, to)).toThrow(SCALE_PORTIONS_ERROR);
  });

  it.each([
    // By hand: to ÷ from.
    { name: '1 → 3 portions (from at its lowest) is × 3', from: 1, to: 3, expected: 3 },
    { name: '1 → 1 portion (both at their lowest) is × 1', from: 1, to: 1, expected: 1 },
    { name: '8 → 2 portions is × 0.25', from: 8, to: 2, expected: 0.25 },
  ])('scaleFactorForPortions accepts $name', ({ from, to, expected }) => {
    expect(scaleFactorForPortions(from, to)).toBe(expected);
  });
});

describe('unknown carbohydrate', () => {
  it.each([
    // CP = 10 g (check-values §6, UK NHS); exchange = 15 g (check-values §6, ADA exchange lists).
    { name: 'no carbohydrate value at all: unknown in grams and in the unit', n: food({ protein: 5 }), basis: 'total' as const, out: { grams: null, inUnit: null } },
    { name: 'available basis with total but no fibre: unknown', n: food({ carbTotal: 20 }), basis: 'available' as const, out: { grams: null, inUnit: null } },
    { name: 'available 30 g: 30 g = 2 exchanges of 15 g', n: food({ carbAvailable: 30 }), basis: 'available' as const, out: { grams: 30, inUnit: 2 } },
    { name: 'total from available 30 g + fibre 3 g = 33 g = 2.2 exchanges', n: food({ carbAvailable: 30, fibre: 3 }), basis: 'total' as const, out: { grams: 33, inUnit: 2.2 } },
  ])('carbAmount in exchanges: $name', ({ n, basis, out }) => {
    const a = carbAmount(n, basis, 'exchange15');

    expect(a.grams).toEqual(out.grams);
    if (out.inUnit == null) expect(a.inUnit).toBeNull();
    else expect(a.inUnit).toBeCloseTo(out.inUnit, 12);
  });

  it('gives unknown (not 0) carbohydrate everywhere when no ingredient has a value', () => {
    const lines: RecipeLine[] = [
      { grams: 100, per100g: food({ protein: 5 }) },
      { grams: 50, per100g: food({ carbTotal: 20 }) },
    ];

    const r = computeRecipe(lines, { portions: 2, basis: 'available', unit: 'portion10' });
    const unknown = { grams: null, inUnit: null };

    expect(r.carbIncomplete).toBe(true);
    expect(r.ingredients.map((i) => i.carb)).toEqual([unknown, unknown]);
    expect(r.carbTotal).toEqual(unknown);
    expect(r.carbPerPortion).toEqual(unknown);
    expect(r.carbPer100gRaw).toEqual(unknown);
    // The weight is still known: 100 + 50 = 150 g, 75 g a portion.
    expect(r.rawWeightGrams).toBe(150);
    expect(r.portionGrams).toBe(75);
  });

  it('counts the known part in the counting unit when one ingredient is unknown (CP = 10 g, check-values §6)', () => {
    // By hand, available basis: 100 g × (50 − 5) / 100 = 45 g = 4.5 CP; the second line has total but no fibre,
    // so its available carbohydrate is unknown. 3 portions: 45 / 3 = 15 g = 1.5 CP.
    // Raw weight 100 + 100 = 200 g: 45 / 200 × 100 = 22.5 g per 100 g = 2.25 CP.
    const lines: RecipeLine[] = [
      { grams: 100, per100g: food({ carbTotal: 50, fibre: 5 }) },
      { grams: 100, per100g: food({ carbTotal: 20 }) },
    ];

    const r = computeRecipe(lines, { portions: 3, basis: 'available', unit: 'portion10' });

    expect(r.carbIncomplete).toBe(true);
    expect(r.ingredients[0].carb.grams).toBeCloseTo(45, 12);
    expect(r.ingredients[0].carb.inUnit).toBeCloseTo(4.5, 12);
    expect(r.ingredients[1].carb).toEqual({ grams: null, inUnit: null });
    expect(r.carbTotal.grams).toBeCloseTo(45, 12);
    expect(r.carbTotal.inUnit).toBeCloseTo(4.5, 12);
    expect(r.carbPerPortion.grams).toBeCloseTo(15, 12);
    expect(r.carbPerPortion.inUnit).toBeCloseTo(1.5, 12);
    expect(r.carbPer100gRaw.grams).toBeCloseTo(22.5, 12);
    expect(r.carbPer100gRaw.inUnit).toBeCloseTo(2.25, 12);
  });

  it('does not flag carbohydrate as incomplete when every ingredient has it', () => {
    const lines: RecipeLine[] = [
      { grams: 100, per100g: food({ carbAvailable: 10 }) },
      { grams: 100, per100g: food({ carbTotal: 12, fibre: 2 }) },
    ];

    const r = computeRecipe(lines, { portions: 1, basis: 'available' });

    // By hand: 10 + (12 − 2) = 20 g.
    expect(r.carbIncomplete).toBe(false);
    expect(r.carbTotal.grams).toBeCloseTo(20, 12);
  });
});

describe('computeRecipe outputs beside carbohydrate', () => {
  it('counts in grams when no unit is given', () => {
    // By hand: 200 g × 30 / 100 = 60 g total; 4 portions: 15 g each; 60 / 200 × 100 = 30 g per 100 g.
    const r = computeRecipe([{ grams: 200, per100g: food({ carbTotal: 30, fibre: 0 }) }], { portions: 4, basis: 'total' });

    expect(r.unit).toBe('g');
    expect(r.basis).toBe('total');
    expect(r.carbTotal).toEqual({ grams: 60, inUnit: 60 });
    expect(r.carbPerPortion).toEqual({ grams: 15, inUnit: 15 });
    expect(r.carbPer100gRaw).toEqual({ grams: 30, inUnit: 30 });
  });

  it('divides every other nutrient per portion and per 100 g raw, keeping unknown ones unknown', () => {
    // By hand: protein 200 g × 10/100 + 300 g × 20/100 = 20 + 60 = 80 g; fat known only in the second line:
    // 300 × 5/100 = 15 g (incomplete); energy unknown in both. 4 portions: protein 20 g, fat 3.75 g.
    // Raw weight 500 g: protein 80 / 500 × 100 = 16 g, fat 15 / 500 × 100 = 3 g per 100 g.
    const lines: RecipeLine[] = [
      { grams: 200, per100g: food({ protein: 10 }) },
      { grams: 300, per100g: food({ protein: 20, fat: 5 }) },
    ];

    const r = computeRecipe(lines, { portions: 4, basis: 'total' });

    expect(r.incomplete).toContain('fat');
    expect(r.perPortion.protein).toBeCloseTo(20, 12);
    expect(r.perPortion.fat).toBeCloseTo(3.75, 12);
    expect(r.perPortion.energyKcal).toBeNull();
    expect(r.per100gRaw.protein).toBeCloseTo(16, 12);
    expect(r.per100gRaw.fat).toBeCloseTo(3, 12);
    expect(r.per100gRaw.energyKcal).toBeNull();
  });
});
