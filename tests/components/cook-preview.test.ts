import { previewBatch, previewPortions, previewSplit, type CookLine } from '@/components/kitchen/cook-state';
import { emptyNutrients } from '@/shared/compute/nutrients';

// Rolled oats per 100 g, USDA SR Legacy 08120 via check-values §11: 67.7 g carbohydrate by difference, 10.1 g fibre,
// so 57.6 g available. 100 g of oats cooked up to 400 g (pot 1400 g gross, 1000 g tare).
const oats = { ...emptyNutrients(), carbTotal: 67.7, fibre: 10.1, carbAvailable: 57.6 };
const lines: CookLine[] = [{ foodId: 1, foodName: 'Oats, rolled', per100g: oats, plannedGrams: 100, reading: '100', omitted: false, swappedFrom: null }];
const pot = { containerId: '', gross: '1400', tare: '1000' };

describe('cook preview uses the shared split', () => {
  const available = previewBatch({ lines, pot }, 'available')!;

  it.each([
    // 57.6 g ÷ 4 = 14.4 g available; 67.7 g ÷ 4 = 16.925 g total; 400 g ÷ 4 = 100 g each.
    { name: 'equal in the available basis', basis: 'available' as const, expected: { netGrams: 100, carbGrams: 14.4 } },
    { name: 'equal in the total basis', basis: 'total' as const, expected: { netGrams: 100, carbGrams: 16.925 } },
  ])('$name', ({ basis, expected }) => {
    const share = previewSplit(previewBatch({ lines, pot }, basis)!, { mode: 'equal', count: 4 }, basis)![0];

    expect(share.netGrams).toBeCloseTo(expected.netGrams, 9);
    expect(share.carbGrams).toBeCloseTo(expected.carbGrams, 9);
  });

  it('refuses a count that is not a whole number', () => {
    expect(previewSplit(available, { mode: 'equal', count: 2.5 }, 'available')).toBeNull();
  });

  it('gives a weighed container its net grams × carbohydrate per 100 g cooked, and nothing for a tare above the gross', () => {
    // 350 g − 150 g = 200 g of a dish with 57.6 g available per 400 g → 28.8 g.
    const preview = previewPortions(
      [
        { containerId: '', gross: '350', tare: '150' },
        { containerId: '', gross: '100', tare: '150' },
      ],
      available,
      'available',
    );

    expect(preview.nets).toEqual([200, null]);
    expect(preview.carbs[0]).toBeCloseTo(28.8, 9);
    expect(preview.carbs[1]).toBeNull();
    expect(preview.left).toBe(200);
  });
});
