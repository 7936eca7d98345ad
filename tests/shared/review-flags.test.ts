import { REVIEW_FLAG_CHANGE_MMOL, reviewFlags, type ReviewGroup } from '../../shared/compute/logbook-review';

const group = (over: Partial<ReviewGroup>): ReviewGroup => ({
  dayKindId: 1,
  dayKindName: 'Rest',
  startMinute: 0,
  endMinute: 660,
  meals: 5,
  averageChangeMmol: 0,
  averageCarbG: 40,
  averageUnits: 4,
  tooFew: false,
  ...over,
});

// The limit is "back within about ±2 mmol/L of the pre-meal value" (check-values §13.4, common practice); T30 (before
// 6.2, after 10.4 → +4.2) is outside it and counts as "rose".
const cases: { name: string; group: Partial<ReviewGroup>; expected: 'rose' | 'fell' | null }[] = [
  { name: 'T30: +4.2 mmol/L over enough meals rose', group: { averageChangeMmol: 10.4 - 6.2 }, expected: 'rose' },
  { name: 'a fall of 2.5 mmol/L fell', group: { averageChangeMmol: -2.5 }, expected: 'fell' },
  { name: 'exactly +2.0 is within', group: { averageChangeMmol: 2 }, expected: null },
  { name: 'exactly −2.0 is within', group: { averageChangeMmol: -2 }, expected: null },
  { name: '+2.1 is outside', group: { averageChangeMmol: 2.1 }, expected: 'rose' },
  { name: 'a large rise over too few meals is not flagged', group: { averageChangeMmol: 6, meals: 4, tooFew: true }, expected: null },
  { name: 'a time of day with no usable meal is not flagged', group: { averageChangeMmol: null, meals: 0, tooFew: true }, expected: null },
];

describe('reviewFlags', () => {
  it('uses ±2 mmol/L (check-values §13.4)', () => {
    expect(REVIEW_FLAG_CHANGE_MMOL).toBe(2);
  });

  it.each(cases)('$name', ({ group: over, expected }) => {
    const flags = reviewFlags({ groups: [group(over)] });

    expect(flags.map((f) => f.direction)).toEqual(expected ? [expected] : []);
  });

  it('keeps the group it came from, its meals and its average', () => {
    const flags = reviewFlags({ groups: [group({ dayKindId: 7, dayKindName: 'Training', startMinute: 660, endMinute: 1440, meals: 6, averageChangeMmol: -3 }), group({})] });

    expect(flags).toEqual([{ dayKindId: 7, dayKindName: 'Training', startMinute: 660, endMinute: 1440, direction: 'fell', meals: 6, averageChangeMmol: -3 }]);
  });

  it('takes another team\'s limit', () => {
    expect(reviewFlags({ groups: [group({ averageChangeMmol: 2.5 })] }, 3)).toEqual([]);
  });
});
