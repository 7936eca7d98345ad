import { render, screen } from '@testing-library/react';
import { useForm } from 'react-hook-form';
import { CookedWeightStep } from '@/components/kitchen/cooked-weight-step';
import type { CookForm } from '@/components/kitchen/cook-batch-screen';
import { previewBatch, previewSplit, type CookFormValues, type CookLine } from '@/components/kitchen/cook-state';
import { emptyNutrients, type Nutrients } from '@/shared/compute/nutrients';
import type { CarbBasis } from '@/shared/schemas/units';

// Overnight oats (check-values §2.4): rolled oats 08120 per 100 g 67.7 g by difference, 10.1 g fibre → 57.6 g available;
// the yogurt is a pack food whose panel gives 3.6 g carbohydrate (available, as EU panels do) and no fibre, so its
// total carbohydrate is unknown. Uncooked: 240 g + 240 g = 480 g in a pot of 1000 g tare.
const oats: Nutrients = { ...emptyNutrients(), carbTotal: 67.7, fibre: 10.1, carbAvailable: 57.6 };
const yogurt: Nutrients = { ...emptyNutrients(), carbAvailable: 3.6 };
const line = (foodId: number, foodName: string, per100g: Nutrients): CookLine => ({ foodId, foodName, per100g, plannedGrams: 240, reading: '240', omitted: false, swappedFrom: null });
const lines = [line(1, 'Oats, rolled', oats), line(2, 'Greek yogurt (pack)', yogurt)];
const pot = { containerId: '', gross: '1480', tare: '1000' };

function Step({ basis }: { basis: CarbBasis }) {
  const form = useForm<CookFormValues>({ defaultValues: { lines, pot, portions: [] } }) as unknown as CookForm;
  return <CookedWeightStep form={form} pots={[]} batch={previewBatch({ lines, pot }, basis)} basis={basis} unit="g" onBack={() => {}} onDone={() => {}} />;
}

describe('the unknown-carbohydrate warning follows the counted basis only', () => {
  it('stays away when every value in the counted basis (available) is known, though the yogurt has no fibre value', () => {
    render(<Step basis="available" />);

    expect(screen.queryByText(/Carbohydrate unknown/)).toBeNull();
    expect(screen.queryByText(/too low/)).toBeNull();
    // 240 × 0.576 + 240 × 0.036 = 138.24 + 8.64 = 146.88 g in 480 g → 30.6 g per 100 g.
    expect(screen.getByText('147 g')).toBeInTheDocument();
    expect(screen.getByText('31 g')).toBeInTheDocument();
  });

  it('shows the warning and "unknown" (never a low number) when the counted basis (total) has an unknown value', () => {
    render(<Step basis="total" />);

    expect(screen.getByText(/Carbohydrate unknown/)).toBeInTheDocument();
    expect(screen.getAllByText('unknown')).toHaveLength(2);
    // The partial total (oats only, 162.48 g) must not appear.
    expect(screen.queryByText('162 g')).toBeNull();
  });

  it.each([
    { basis: 'available' as const, carbGrams: 146.88 / 4 },
    { basis: 'total' as const, carbGrams: null },
  ])('gives the portions of the preview the same rule ($basis)', ({ basis, carbGrams }) => {
    const share = previewSplit(previewBatch({ lines, pot }, basis)!, { mode: 'equal', count: 4 }, basis)![0];

    if (carbGrams == null) expect(share.carbGrams).toBeNull();
    else expect(share.carbGrams).toBeCloseTo(carbGrams, 9);
  });
});
