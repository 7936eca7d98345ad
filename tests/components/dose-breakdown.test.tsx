import { render, screen } from '@testing-library/react';
import { DoseBreakdownView } from '@/components/dose/dose-breakdown';
import { computeDose, type DoseSettings } from '@/shared/compute/dose';
import type { DoseSuggestion } from '@/shared/schemas/dose';
import { engineSettings } from '../helpers/dose-settings';

const T0 = Date.UTC(2026, 2, 1, 12, 0);
const settings: DoseSettings = engineSettings({ targetHighMmol: 7, maxDoseUnits: 15 });
const rest = { id: 1, name: 'Rest', timesOfDay: [{ startMinute: 0, endMinute: 1440, carbRatio: 10, correctionFactorMmol: 2.5 }] };

function suggestion(glucose: number, extra: Partial<Parameters<typeof computeDose>[2]> = {}): DoseSuggestion {
  const result = computeDose(settings, rest, {
    carbsGrams: 60,
    glucose: { value: glucose, unit: 'mmol_l', takenAt: T0 },
    mealAt: T0,
    mealMinuteOfDay: 780,
    ...extra,
  });
  return { ...result, glucoseUnit: 'mmol_l', carbBasis: 'available', carbUnit: 'g', mealAt: new Date(T0).toISOString(), glucoseTakenAt: new Date(T0).toISOString() };
}

describe('DoseBreakdownView', () => {
  it('shows every part of the sum: meal with the ratio named, correction, active insulin, total and rounding', () => {
    // T11 (check-values §12): 6.0 + 2.0 − 1.5 = 6.5 U.
    render(<DoseBreakdownView result={suggestion(11, { earlierDoses: [{ units: 1.5, takenAt: T0 }] })} />);

    expect(screen.getByLabelText('Suggested dose')).toHaveTextContent('6.5 units');
    expect(screen.getByText('60 g ÷ 10 g per unit (ratio for Rest, 00:00–24:00)')).toBeInTheDocument();
    expect(screen.getByText('(11.0 mmol/L − 6.0 mmol/L) ÷ 2.5 mmol/L per unit')).toBeInTheDocument();
    expect(screen.getByText('+ 2 units')).toBeInTheDocument();
    expect(screen.getByText('Insulin still active')).toBeInTheDocument();
    expect(screen.getByText('− 1.5 units')).toBeInTheDocument();
    expect(screen.getByText('Total before rounding')).toBeInTheDocument();
    expect(screen.getByText(/still working/)).toBeInTheDocument();
    expect(screen.getByText('Active insulin model: straight line over the action time (4 hours), from your settings.')).toBeInTheDocument();
  });

  it('says when the profile counts active insulin with the curve', () => {
    const r = computeDose({ ...settings, activeInsulinModel: 'curve' }, rest, { carbsGrams: 60, mealAt: T0, mealMinuteOfDay: 780 });
    render(<DoseBreakdownView result={{ ...r, glucoseUnit: 'mmol_l', carbBasis: 'available', carbUnit: 'g', mealAt: new Date(T0).toISOString(), glucoseTakenAt: null }} />);

    expect(screen.getByText('Active insulin model: curve with its peak at 75 minutes (4 hours), from your settings.')).toBeInTheDocument();
  });

  it('shows no dose and the treat-a-low steps when glucose is low', () => {
    render(<DoseBreakdownView result={suggestion(3.1)} />);

    expect(screen.queryByLabelText('Suggested dose')).toBeNull();
    expect(screen.getByText(/Low: 3.1 mmol\/L — no dose/)).toBeInTheDocument();
    expect(screen.getByText(/15–20 g of fast-acting carbohydrate/)).toBeInTheDocument();
  });

  it('says the correction was left out for a stale reading', () => {
    render(<DoseBreakdownView result={suggestion(12, { glucose: { value: 12, unit: 'mmol_l', takenAt: T0 - 20 * 60_000 } })} />);

    expect(screen.getByText('Left out: the reading is more than 15 minutes from the meal time.')).toBeInTheDocument();
    expect(screen.getByLabelText('Suggested dose')).toHaveTextContent('6 units');
  });

  it('puts the warnings above the number and writes no "u" and no trailing zero anywhere', () => {
    // T11 again: the active-insulin warning ("still working") must come before the suggested dose.
    const { container } = render(<DoseBreakdownView result={suggestion(11, { earlierDoses: [{ units: 1.5, takenAt: T0 }] })} />);

    const warning = screen.getByText(/still working/);
    const dose = screen.getByLabelText('Suggested dose');
    expect(warning.compareDocumentPosition(dose) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    const text = container.textContent ?? '';
    expect(text).not.toMatch(/\d\s?[uU]\b/);
    expect(text).not.toMatch(/\d\.\d*0 units?\b/);
  });
});
