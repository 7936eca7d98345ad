import { render, screen, within } from '@testing-library/react';
import { glucoseChangeText } from '@/components/logbook/log-format';
import { ReviewTable } from '@/components/logbook/review-table';
import { RATIO_REVIEW_CAUTION, type LogReview } from '@/shared/schemas/logbook-read';

/** A review as the API answers it: two times of day of a Rest day, one with enough meals and one with too few. */
const REVIEW: LogReview = {
  from: '2026-03-01',
  to: '2026-03-14',
  glucoseUnit: 'mmol_l',
  carbBasis: 'available',
  minimumMeals: 5,
  caution: RATIO_REVIEW_CAUTION,
  mealsInPeriod: 9,
  mealsUsed: 7,
  skipped: { noReadingBefore: 1, noReadingAfter: 1, somethingBetween: 0 },
  dayKinds: [],
  groups: [
    { dayKindId: 1, dayKindName: 'Rest', startMinute: 0, endMinute: 660, meals: 6, averageChangeMmol: 2.25, averageCarbG: 42, averageUnits: 4.5, tooFew: false },
    { dayKindId: 1, dayKindName: 'Rest', startMinute: 660, endMinute: 1440, meals: 1, averageChangeMmol: -1.04, averageCarbG: 60, averageUnits: 6, tooFew: true },
  ],
};

describe('ReviewTable (phone width: one block per time of day)', () => {
  it('shows each time of day with its meals, average change and dose in words, and marks too few meals', () => {
    render(<ReviewTable review={REVIEW} carbUnit="g" />);
    const items = screen.getAllByRole('listitem');

    expect(within(items[0]).getByText('Rest · 00:00–11:00')).toBeInTheDocument();
    expect(within(items[0]).getByText('Average change: +2.3 mmol/L')).toBeInTheDocument(); // 2.25 shown to 0.1 mmol/L
    expect(within(items[0]).getByText('Average dose: 4.5 units')).toBeInTheDocument();
    expect(within(items[0]).queryByText(/too few/)).toBeNull();
    expect(within(items[1]).getByText('Meals: 1 · too few (under 5)')).toBeInTheDocument();
    expect(within(items[1]).getByText('Average change: −1.0 mmol/L')).toBeInTheDocument();
    // The review states evidence only: nothing proposes a ratio.
    expect(screen.queryByText(/new ratio|change (the|your) ratio to/i)).toBeNull();
  });
});

describe('glucoseChangeText', () => {
  it.each([
    { name: 'a rise in mmol/L', mmol: 1.5, unit: 'mmol_l' as const, expected: '+1.5 mmol/L' },
    { name: 'a fall in mmol/L', mmol: -0.5, unit: 'mmol_l' as const, expected: '−0.5 mmol/L' },
    // 1 mmol/L × 18.0156 = 18.0 → 18 mg/dL (check-values, glucose conversion)
    { name: 'a rise shown in mg/dL', mmol: 1, unit: 'mg_dl' as const, expected: '+18 mg/dL' },
    { name: 'no change', mmol: 0.01, unit: 'mmol_l' as const, expected: '±0.0 mmol/L' },
    { name: 'nothing to show', mmol: null, unit: 'mmol_l' as const, expected: '—' },
  ])('$name', ({ mmol, unit, expected }) => {
    expect(glucoseChangeText(mmol, unit)).toBe(expected);
  });
});
