import { fireEvent, render, screen } from '@testing-library/react';
import { UnitsSafetyForm } from '@/components/settings/units-safety-form';
import { DEFAULT_EXERCISE_REDUCTIONS } from '@/shared/compute/exercise';

const exercise = Object.fromEntries(
  Object.entries(DEFAULT_EXERCISE_REDUCTIONS).map(([k, v]) => [k, { min30: String(v.min30), min60: String(v.min60) }]),
) as never;

describe('UnitsSafetyForm glucose unit choice', () => {
  it.each([
    // 1 mmol/L = 18.0156 mg/dL (DEVELOPERS.md conventions): 5 → 90.08 → 90, 8 → 144.12 → 144.
    { from: 'mmol_l' as const, to: 'mg/dL', low: '5', high: '8', expected: ['90', '144'] },
    { from: 'mg_dl' as const, to: 'mmol/L', low: '90', high: '144', expected: ['5', '8'] },
  ])('converts the typed targets from $from when $to is chosen', ({ from, to, low, high, expected }) => {
    render(
      <UnitsSafetyForm
        submitting={false}
        onSubmit={jest.fn()}
        defaultValues={{
          glucoseUnit: from,
          carbBasis: 'available',
          carbUnit: 'g',
          penIncrement: 0.5,
          rounding: 'down',
          maxDoseUnits: '10',
          actionTimeHours: '4',
          targetLow: low,
          targetHigh: high,
          correctionTarget: '',
          hypoThreshold: '',
          veryHigh: '',
          allowNegativeCorrection: false,
          iobConvention: 'correction_only',
          exerciseReductions: exercise,
        }}
      />,
    );

    fireEvent.click(screen.getByRole('radio', { name: to }));

    expect(screen.getByRole('radio', { name: to })).toHaveAttribute('aria-checked', 'true');
    expect(screen.getByLabelText('Target range from', { selector: 'input' })).toHaveValue(expected[0]);
    expect(screen.getByLabelText('Target range to', { selector: 'input' })).toHaveValue(expected[1]);
  });
});
