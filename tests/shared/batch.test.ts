import {
  computeBatch,
  gramsLeftToSplit,
  netGrams,
  splitEqually,
  splitBatch,
  splitExceedsBatch,
  weighedPortionCarb,
  weighingDifference,
  type BatchIngredientLine,
} from '../../shared/compute/batch';
import { emptyNutrients, type Nutrients } from '../../shared/compute/nutrients';
import { gramsToCarbUnit } from '../../shared/compute/units';

// Per 100 g, USDA SR Legacy via check-values §11 ([C2]) and §2.4 ([D]): carbohydrate by difference, fibre.
const per100 = (carbTotal: number, fibre: number): Nutrients => ({ ...emptyNutrients(), carbTotal, fibre });
const oats = per100(67.7, 10.1); // NDB 08120
const wholeMilk = per100(4.8, 0); // NDB 01077
const water = per100(0, 0);
const greekYogurt = per100(3.6, 0); // NDB 01256
const apple = per100(13.81, 2.4); // NDB 09003: 20.715 g carb, 3.60 g fibre in 150 g (§2.4)
const raisins = per100(79.18, 3.7); // NDB 09298: 31.672 g carb, 1.48 g fibre in 40 g (§2.4)

const line = (n: Nutrients, actualGrams: number, omitted = false): BatchIngredientLine => ({ per100g: n, actualGrams, omitted });

// Worked example A (check-values §2.3), FAO recipe method (Greenfield & Southgate 2003) on SR Legacy.
const porridge = [line(oats, 500), line(wholeMilk, 1000), line(water, 1000)];
// Worked example B (check-values §2.4), 1150 g uncooked.
const t4Lines = [line(oats, 240), line(wholeMilk, 480), line(greekYogurt, 240), line(apple, 150), line(raisins, 40)];

describe('computeBatch against the worked examples of check-values §2 (T1–T4)', () => {
  it.each([
    { name: 'T1 porridge, total basis, 8 portions', lines: porridge, cooked: 2200, basis: 'total' as const, n: 8, yf: 0.88, per100: 17.568, perPortion: 48.3125 },
    { name: 'T1 porridge, available basis, 8 portions', lines: porridge, cooked: 2200, basis: 'available' as const, n: 8, yf: 0.88, per100: 15.273, perPortion: 42.0 },
    { name: 'T4 overnight oats, total basis, 6 portions', lines: t4Lines, cooked: 1150, basis: 'total' as const, n: 6, yf: 1, per100: 21.439, perPortion: 41.09 },
    { name: 'T4 overnight oats, available basis, 6 portions', lines: t4Lines, cooked: 1150, basis: 'available' as const, n: 6, yf: 1, per100: 18.889, perPortion: 36.2 },
  ])('$name', ({ lines, cooked, basis, n, yf, per100: expectedPer100, perPortion }) => {
    const batch = computeBatch(lines, cooked, basis);
    const split = splitEqually(batch, n);

    expect(batch.yieldFactor).toBeCloseTo(yf, 6);
    // Tolerance ±0.01 g from check-values T1/T4.
    expect(Math.abs(batch.carbPer100g! - expectedPer100)).toBeLessThan(0.01);
    expect(Math.abs(split[0].carbGrams! - perPortion)).toBeLessThan(0.01);
    expect(split).toHaveLength(n);
  });

  it.each([
    { name: 'T2 weighed 250 g, total', basis: 'total' as const, net: 250, expected: 43.92 },
    { name: 'T2 weighed 250 g, available', basis: 'available' as const, net: 250, expected: 38.18 },
    { name: '§2.3 weighed 300 g, total', basis: 'total' as const, net: 300, expected: 52.7 },
    { name: '§2.3 weighed 300 g, available', basis: 'available' as const, net: 300, expected: 45.82 },
  ])('$name portion of the porridge batch', ({ basis, net, expected }) => {
    const batch = computeBatch(porridge, 2200, basis);

    expect(Math.abs(weighedPortionCarb(batch.carbPer100g, net)! - expected)).toBeLessThan(0.01);
  });

  it('T3 divides by the cooked weight, never the raw weight (15.46 g/100 g would be the bug)', () => {
    const batch = computeBatch(porridge, 2200, 'total');

    // Raw-weight divisor: 386.5 / 2500 × 100 = 15.46 (check-values §2.3, the answer to reject).
    expect(batch.carbPer100g).not.toBeCloseTo(15.46, 2);
    expect(batch.carbPer100g).toBeCloseTo((386.5 / 2200) * 100, 9);
    expect(batch.rawGrams).toBe(2500);
  });
});

describe('a realistic weighed week of overnight oats in five portions', () => {
  // Planned oats 250, milk 500, yogurt 250, apple 150; the scale read 252, 496, 247, 163.
  const lines = [line(oats, 252), line(wholeMilk, 496), line(greekYogurt, 247), line(apple, 163)];
  // Settled mix in the mixing bowl: gross 1612 g − bowl tare 480 g = 1132 g (a little stays on the spoon).
  const cooked = netGrams(1612, 480);
  // Portions: gross − container tare.
  const portionNets = [netGrams(438, 212), netGrams(441, 215), netGrams(436, 209), netGrams(440, 213), netGrams(437, 211)];

  // Hand calculation, written out:
  //   total carbohydrate = 252×0.677 + 496×0.048 + 247×0.036 + 163×0.1381
  //                      = 170.604 + 23.808 + 8.892 + 22.5103 = 225.8143 g
  //   fibre              = 252×0.101 + 163×0.024 = 25.452 + 3.912 = 29.364 g
  //   available          = 225.8143 − 29.364 = 196.4503 g
  //   raw weight         = 252 + 496 + 247 + 163 = 1158 g; yield factor = 1132 / 1158 = 0.97755
  //   available / 100 g  = 196.4503 / 1132 × 100 = 17.35427 g
  //   portion of 226 g       = 17.35427 × 2.26 = 39.2206 g; portion of 227 g = 39.3942 g
  it('gets the nets, yield factor and per-100 g the hand calculation gets', () => {
    const batch = computeBatch(lines, cooked, 'available');

    expect(cooked).toBe(1132);
    expect(portionNets).toEqual([226, 226, 227, 227, 226]);
    expect(batch.rawGrams).toBe(1158);
    expect(batch.yieldFactor).toBeCloseTo(0.97755, 5);
    expect(batch.carbTotal).toBeCloseTo(196.4503, 6);
    expect(batch.carbPer100g).toBeCloseTo(17.35427, 5);
    expect(gramsLeftToSplit(cooked, portionNets)).toBe(0);
  });

  it.each([
    { name: 'a 226 g portion', net: 226, available: 39.2206, total: 45.0831 },
    { name: 'a 227 g portion', net: 227, available: 39.3942, total: 45.2825 },
  ])('gives $name the hand-calculated carbohydrate in both bases', ({ net, available, total }) => {
    const avail = computeBatch(lines, cooked, 'available');
    const tot = computeBatch(lines, cooked, 'total');

    // Total basis by hand: 225.8143 / 1132 × net.
    expect(weighedPortionCarb(avail.carbPer100g, net)).toBeCloseTo(available, 3);
    expect(weighedPortionCarb(tot.carbPer100g, net)).toBeCloseTo(total, 3);
  });

  it('agrees with equal portions when the portions weigh the same', () => {
    const batch = computeBatch(lines, cooked, 'available');
    const equal = splitEqually(batch, 5);

    expect(equal[0].netGrams).toBeCloseTo(226.4, 9);
    expect(weighedPortionCarb(batch.carbPer100g, 226.4)).toBeCloseTo(equal[0].carbGrams!, 9);
    // 196.4503 / 5 = 39.29006 g.
    expect(equal[0].carbGrams).toBeCloseTo(39.29006, 5);
  });

  it.each([
    // T22 conversions (check-values §6): 10 g portions, 12 g units, 15 g exchanges.
    { name: '10 g portions', unit: 'portion10' as const, expected: 3.929006 },
    { name: '12 g units', unit: 'unit12' as const, expected: 3.274172 },
    { name: '15 g exchanges', unit: 'exchange15' as const, expected: 2.619337 },
  ])('shows an equal portion in $name', ({ unit, expected }) => {
    const equal = splitEqually(computeBatch(lines, cooked, 'available'), 5);

    expect(gramsToCarbUnit(equal[0].carbGrams!, unit)).toBeCloseTo(expected, 5);
  });
});

describe('splitBatch: both carbohydrate bases at once, equal and weighed', () => {
  // Expected values per portion, each from outside the code under test:
  //   T1 porridge (check-values §2.3/T1, FAO recipe method, Greenfield & Southgate 2003, on SR Legacy): 2200 g cooked,
  //     8 portions of 275 g → total 48.3125 g, available 42.000 g (±0.01 g).
  //   T4 portions (check-values §2.4/T4): 1150 g, 6 portions → total 41.09 g, available 36.20 g (±0.01 g).
  //   T2 and §2.3 weighed porridge portions: 250 g → total 43.92, available 38.18; 300 g → 52.70 / 45.82 (±0.01 g).
  //   Five oat portions: the hand calculation written out above (226 g → 39.2206 / 45.0831; 227 g → 39.3942 / 45.2825).
  const oatLines = [line(oats, 252), line(wholeMilk, 496), line(greekYogurt, 247), line(apple, 163)];
  it.each([
    { name: 'T1 porridge, 8 equal portions', lines: porridge, cooked: 2200, split: { mode: 'equal' as const, count: 8 }, expected: [{ net: 275, available: 42.0, total: 48.3125 }] },
    { name: 'T4 portions, 6 equal portions', lines: t4Lines, cooked: 1150, split: { mode: 'equal' as const, count: 6 }, expected: [{ net: 1150 / 6, available: 36.2, total: 41.09 }] },
    {
      name: 'T2 / §2.3 porridge, weighed 250 g and 300 g in containers',
      lines: porridge,
      cooked: 2200,
      split: { mode: 'weighed' as const, portions: [{ grossGrams: 400, tareGrams: 150 }, { grossGrams: 300, tareGrams: 0 }] },
      expected: [{ net: 250, available: 38.18, total: 43.92 }, { net: 300, available: 45.82, total: 52.7 }],
    },
    {
      name: 'five weighed oat portions (hand calculation)',
      lines: oatLines,
      cooked: 1132,
      split: { mode: 'weighed' as const, portions: [{ grossGrams: 438, tareGrams: 212 }, { grossGrams: 436, tareGrams: 209 }] },
      expected: [{ net: 226, available: 39.2206, total: 45.0831 }, { net: 227, available: 39.3942, total: 45.2825 }],
    },
  ])('$name', ({ lines, cooked, split, expected }) => {
    const shares = splitBatch(computeBatch(lines, cooked, 'available'), split);

    expect(shares).toHaveLength(split.mode === 'equal' ? split.count : expected.length);
    expected.forEach((e, i) => {
      expect(shares[i].netGrams).toBeCloseTo(e.net, 9);
      expect(Math.abs(shares[i].carbAvailable! - e.available)).toBeLessThan(0.01);
      expect(Math.abs(shares[i].carbTotal! - e.total)).toBeLessThan(0.01);
    });
  });

  it('keeps unknown carbohydrate unknown in every share', () => {
    const shares = splitBatch(computeBatch([line(emptyNutrients(), 100)], 100, 'available'), { mode: 'equal', count: 2 });

    expect(shares).toEqual([
      { netGrams: 50, carbAvailable: null, carbTotal: null },
      { netGrams: 50, carbAvailable: null, carbTotal: null },
    ]);
  });

  it.each([
    { name: 'zero portions', split: { mode: 'equal' as const, count: 0 } },
    { name: 'a tare not below its gross', split: { mode: 'weighed' as const, portions: [{ grossGrams: 200, tareGrams: 200 }] } },
  ])('throws a RangeError for $name', ({ split }) => {
    expect(() => splitBatch(computeBatch(porridge, 2200, 'total'), split)).toThrow(RangeError);
  });
});

describe('yield factor', () => {
  it.each([
    { name: 'below 1 when water boils off (porridge, 2200 / 2500)', lines: porridge, cooked: 2200, yf: 0.88, per100: (386.5 / 2200) * 100 },
    // Oats boiled in plenty of water and drained: 300 g dry oats weigh 750 g cooked → YF 2.5,
    // 300 × 0.677 = 203.1 g carbohydrate, 203.1 / 750 × 100 = 27.08 g/100 g (hand calculation).
    { name: 'above 1 when water is taken up (drained oats, 750 / 300)', lines: [line(oats, 300)], cooked: 750, yf: 2.5, per100: 27.08 },
  ])('is $name', ({ lines, cooked, yf, per100: expected }) => {
    const batch = computeBatch(lines, cooked, 'total');

    expect(batch.yieldFactor).toBeCloseTo(yf, 9);
    expect(batch.carbPer100g).toBeCloseTo(expected, 9);
  });
});

describe('omitted and unknown ingredients', () => {
  it('leaves an omitted line out of the raw weight and the totals', () => {
    const batch = computeBatch([line(oats, 500), line(raisins, 40, true)], 500, 'total');

    expect(batch.rawGrams).toBe(500);
    expect(batch.carbTotal).toBeCloseTo(338.5, 9);
  });

  it('marks carbohydrate incomplete when one ingredient has no value', () => {
    const batch = computeBatch([line(oats, 100), line(emptyNutrients(), 100)], 200, 'total');

    expect(batch.incomplete).toContain('carbTotal');
    expect(batch.carbTotal).toBeCloseTo(67.7, 9);
  });
});

describe('bad input', () => {
  it.each([
    { name: 'cooked weight 0', run: () => computeBatch(porridge, 0, 'total') },
    { name: 'negative cooked weight', run: () => computeBatch(porridge, -5, 'total') },
    { name: 'no ingredients', run: () => computeBatch([], 100, 'total') },
    { name: 'every ingredient omitted', run: () => computeBatch([line(oats, 100, true)], 100, 'total') },
    { name: 'tare equal to gross', run: () => netGrams(300, 300) },
    { name: 'tare above gross', run: () => netGrams(300, 301) },
    { name: 'negative tare', run: () => netGrams(300, -1) },
    { name: 'zero portions', run: () => splitEqually({ cookedGrams: 100, carbTotal: 10 }, 0) },
    { name: 'a fractional portion count', run: () => splitEqually({ cookedGrams: 100, carbTotal: 10 }, 2.5) },
  ])('throws a RangeError for $name', ({ run }) => {
    expect(run).toThrow(RangeError);
  });

  it.each([
    { name: 'within the 2 g tolerance', nets: [500, 501.5], exceeds: false },
    { name: 'over the tolerance', nets: [500, 502.5], exceeds: true },
    { name: 'under the batch weight', nets: [400, 400], exceeds: false },
  ])('flags weighed portions $name of a 1000 g batch correctly', ({ nets, exceeds }) => {
    expect(splitExceedsBatch(1000, nets)).toBe(exceeds);
  });

  it('reports the scale difference as actual minus planned', () => {
    expect(weighingDifference(250, 252)).toBe(2);
    expect(weighingDifference(500, 496)).toBe(-4);
  });
});
