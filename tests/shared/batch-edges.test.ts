import { carbUnderstated, computeBatch, netGrams, splitEqually, splitExceedsBatch, weighedPortionCarb } from '../../shared/compute/batch';
import { emptyNutrients } from '../../shared/compute/nutrients';

// Edges of the batch arithmetic (FAO recipe method, check-values §2.2); the refusals name what is wrong.
describe('netGrams refusals and edges', () => {
  it.each([
    { name: 'gross 0 g: refused', gross: 0, tare: 0, error: 'gross must be above 0 g' },
    { name: 'a negative tare: refused', gross: 500, tare: -1, error: 'tare must be 0 g or more' },
    { name: 'tare equal to gross: refused', gross: 500, tare: 500, error: 'tare must be below gross' },
  ])('$name', ({ gross, tare, error }) => {
    expect(() => netGrams(gross, tare)).toThrow(error);
  });

  it('a tare of exactly 0 g (weighed straight on the scale) and a tare 1 g below the gross are fine', () => {
    expect(netGrams(500, 0)).toBe(500);
    expect(netGrams(500, 499)).toBe(1);
    expect(netGrams(0.5, 0)).toBe(0.5);
  });
});

describe('computeBatch refusals', () => {
  const line = { per100g: { ...emptyNutrients(), carbAvailable: 50 }, actualGrams: 100 };

  it('refuses a cooked weight of 0 g and a batch with nothing in it, naming which', () => {
    expect(() => computeBatch([line], 0, 'available')).toThrow('cooked weight must be above 0 g');
    expect(() => computeBatch([{ ...line, omitted: true }], 100, 'available')).toThrow('the batch needs at least one ingredient above 0 g');
  });
});

describe('carbUnderstated', () => {
  it.each([
    { name: 'direct value known and complete: not understated', totals: { carbAvailable: 10, carbTotal: null }, incomplete: [], out: false },
    { name: 'direct value missing, nothing incomplete: not understated', totals: { carbAvailable: null, carbTotal: 12 }, incomplete: [], out: false },
    { name: 'direct value missing, total incomplete: understated', totals: { carbAvailable: null, carbTotal: 12 }, incomplete: ['carbTotal'], out: true },
    { name: 'direct value missing, fibre incomplete: understated', totals: { carbAvailable: null, carbTotal: 12 }, incomplete: ['fibre'], out: true },
  ])('$name', ({ totals, incomplete, out }) => {
    expect(carbUnderstated(totals, incomplete, 'available')).toBe(out);
  });
});

describe('portions', () => {
  it('a weighed portion of a batch with unknown carbohydrate is unknown, not 0', () => {
    expect(weighedPortionCarb(null, 250)).toBeNull();
    // 15.273 g per 100 g × 250 g = 38.18 g (check-values §2.3, porridge, available).
    expect(weighedPortionCarb(15.273, 250)).toBeCloseTo(38.18, 2);
  });

  it('an equal split of one portion is the whole batch; 0 portions are refused with the reason', () => {
    expect(splitEqually({ cookedGrams: 600, carbTotal: 90 }, 1)).toEqual([{ netGrams: 600, carbGrams: 90 }]);
    expect(() => splitEqually({ cookedGrams: 600, carbTotal: 90 }, 0)).toThrow('portion count must be a whole number ≥ 1');
  });

  it('an equal split of a batch with unknown carbohydrate gives unknown portions', () => {
    expect(splitEqually({ cookedGrams: 600, carbTotal: null }, 3)).toEqual([
      { netGrams: 200, carbGrams: null },
      { netGrams: 200, carbGrams: null },
      { netGrams: 200, carbGrams: null },
    ]);
  });

  it.each([
    { name: '2 g over the pot (at the tolerance): not too much', portions: [301, 301], exceeds: false },
    { name: '2.5 g over (just past the tolerance): too much', portions: [301, 301.5], exceeds: true },
    { name: '1 g over (within it): not too much', portions: [300, 301], exceeds: false },
  ])('$name', ({ portions, exceeds }) => {
    expect(splitExceedsBatch(600, portions)).toBe(exceeds);
  });
});
