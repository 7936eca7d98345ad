import {
  dailyTotals,
  glucoseBeforeMeals,
  ratioReview,
  REVIEW_MINIMUM_MEALS,
  timeInRange,
  type ReviewEntry,
  type ReviewTimeOfDay,
} from '../../shared/compute/logbook-review';

const REST = 1;
const TRAINING = 2;

let nextId = 1;
/** An entry on a UTC profile, so the local minute is the UTC minute: `at('2026-03-02', '07:50')`. */
function entry(kind: ReviewEntry['kind'], date: string, time: string, extra: Partial<ReviewEntry> = {}): ReviewEntry {
  const [h, m] = time.split(':').map(Number);
  const dayKindId = date === '2026-03-04' ? TRAINING : REST;
  return {
    id: nextId++,
    kind,
    at: Date.parse(`${date}T${time}:00Z`),
    localDate: date,
    localMinute: h * 60 + m,
    dayKindId,
    groupKey: null,
    glucoseMmol: null,
    carbG: null,
    units: null,
    ...extra,
  };
}
const reading = (date: string, time: string, mmol: number, groupKey: string | null = null) => entry('reading', date, time, { glucoseMmol: mmol, groupKey });
const meal = (date: string, time: string, carbG: number, groupKey: string | null = null) => entry('meal', date, time, { carbG, groupKey });
const rapid = (date: string, time: string, units: number, groupKey: string | null = null) => entry('rapid_dose', date, time, { units, groupKey });

/**
 * A small hand-made log. Rest days (2 and 3 March) have two times of day (00:00–11:00, 11:00–24:00); the training day
 * (4 March) has one. Each meal is annotated with what the review should make of it.
 */
const LOG: ReviewEntry[] = [
  // 2 March, Rest
  reading('2026-03-02', '07:50', 6.0),
  meal('2026-03-02', '08:00', 40), // m1: before 6.0 (07:50), after 8.0 (10:00, first in 10:00–12:00) → +2.0, morning
  rapid('2026-03-02', '08:00', 4), //    its own dose (same minute)
  reading('2026-03-02', '10:00', 8.0),
  meal('2026-03-02', '12:00', 60, 'g2'), // m2: before 5.0 saved with it, after 7.5 (14:30) → +2.5, afternoon
  reading('2026-03-02', '12:00', 5.0, 'g2'),
  rapid('2026-03-02', '12:00', 6, 'g2'),
  reading('2026-03-02', '14:30', 7.5),
  reading('2026-03-02', '17:30', 9.0),
  meal('2026-03-02', '18:00', 50), // m3: the 19:00 snack lies between 17:30 and 20:30 → skipped (something between)
  rapid('2026-03-02', '18:00', 5),
  meal('2026-03-02', '19:00', 15), // m4: nearest reading before is 90 min earlier → skipped (no reading before)
  reading('2026-03-02', '20:30', 10.5),
  // 3 March, Rest
  reading('2026-03-03', '06:55', 7.0),
  meal('2026-03-03', '07:00', 30), // m5: before 7.0, 08:30 is too early, after 6.5 (10:00) → −0.5, morning
  rapid('2026-03-03', '07:05', 3),
  reading('2026-03-03', '08:30', 9.0),
  reading('2026-03-03', '10:00', 6.5),
  reading('2026-03-03', '12:40', 5.5),
  meal('2026-03-03', '13:00', 45), // m6: next reading 17:30 is 4.5 h later → skipped (no reading after)
  reading('2026-03-03', '17:30', 6.2),
  reading('2026-03-03', '19:45', 6.0),
  meal('2026-03-03', '20:00', 20), // m7: a correction at 21:00 (60 min after: not its own) → skipped (something between)
  rapid('2026-03-03', '21:00', 1),
  reading('2026-03-03', '22:30', 7.0),
  entry('long_dose', '2026-03-03', '22:00', { units: 14 }),
  // 4 March, Training
  reading('2026-03-04', '16:50', 8.0),
  meal('2026-03-04', '17:00', 50), // m8: before 8.0, after 5.0 at exactly 2 h (19:00, bound included) → −3.0
  rapid('2026-03-04', '17:00', 3),
  reading('2026-03-04', '19:00', 5.0),
];

const TIMES: ReviewTimeOfDay[] = [
  { dayKindId: REST, dayKindName: 'Rest', startMinute: 0, endMinute: 660 },
  { dayKindId: REST, dayKindName: 'Rest', startMinute: 660, endMinute: 1440 },
  { dayKindId: TRAINING, dayKindName: 'Training', startMinute: 0, endMinute: 1440 },
];

describe('timeInRange', () => {
  // Battelino et al., Diabetes Care 2019 (international consensus on time in range): target 3.9–10.0 mmol/L,
  // below < 3.9, above > 10.0 (check-values.md). Counts below are by hand.
  const cases = [
    {
      name: 'ten readings: 3.8 and 2.9 below, 10.1 and 12.0 above, the bounds 3.9 and 10.0 inside → 20 / 60 / 20 %',
      readings: [3.8, 3.9, 5.0, 10.0, 10.1, 12.0, 7.0, 6.0, 2.9, 8.0],
      expected: { readings: 10, belowPercent: 20, inPercent: 60, abovePercent: 20 },
    },
    {
      name: 'four readings, one below → 25 / 75 / 0 %',
      readings: [3.0, 4.0, 6.0, 9.9],
      expected: { readings: 4, belowPercent: 25, inPercent: 75, abovePercent: 0 },
    },
    { name: 'no readings → no percentages', readings: [], expected: { readings: 0, belowPercent: null, inPercent: null, abovePercent: null } },
  ];
  it.each(cases)('$name', ({ readings, expected }) => {
    expect(timeInRange(readings, 3.9, 10.0)).toEqual(expected);
  });

  it('uses the profile range it is given (5.0–8.0: 3.9 and 10.0 both fall outside)', () => {
    // 3.9 below, 5.0 and 8.0 inside (bounds), 10.0 above → 25 / 50 / 25 %, by hand
    expect(timeInRange([3.9, 5.0, 8.0, 10.0], 5, 8)).toEqual({ readings: 4, belowPercent: 25, inPercent: 50, abovePercent: 25 });
  });
});

describe('ratioReview on the hand-made log', () => {
  const review = ratioReview(LOG, TIMES, 2);
  const group = (dayKindId: number, startMinute: number) => review.groups.find((g) => g.dayKindId === dayKindId && g.startMinute === startMinute);

  it('counts the meals used and why the others were left out (by hand: m1, m2, m5, m8 used)', () => {
    expect(review.mealsInPeriod).toBe(8);
    expect(review.mealsUsed).toBe(4);
    expect(review.skipped).toEqual({ noReadingBefore: 1, noReadingAfter: 1, somethingBetween: 2 });
  });

  const cases = [
    // m1 +2.0 and m5 −0.5 → (2.0 − 0.5) / 2 = +0.75; carbohydrate (40 + 30) / 2 = 35 g; own doses (4 + 3) / 2 = 3.5 units
    { name: 'Rest 00:00–11:00: two meals, +0.75 mmol/L', dayKindId: REST, start: 0, meals: 2, change: 0.75, carb: 35, units: 3.5, tooFew: false },
    // m2 alone: 7.5 − 5.0 = +2.5; 60 g; 6 units
    { name: 'Rest 11:00–24:00: one meal, too few', dayKindId: REST, start: 660, meals: 1, change: 2.5, carb: 60, units: 6, tooFew: true },
    // m8 alone: 5.0 − 8.0 = −3.0; 50 g; 3 units
    { name: 'Training all day: one meal, too few', dayKindId: TRAINING, start: 0, meals: 1, change: -3, carb: 50, units: 3, tooFew: true },
  ];
  it.each(cases)('$name', ({ dayKindId, start, meals, change, carb, units, tooFew }) => {
    const g = group(dayKindId, start);
    expect(g).toMatchObject({ meals, tooFew });
    expect(g!.averageChangeMmol).toBeCloseTo(change, 10);
    expect(g!.averageCarbG).toBeCloseTo(carb, 10);
    expect(g!.averageUnits).toBeCloseTo(units, 10);
  });

  it('flags every figure as too few under the default minimum of five meals', () => {
    const strict = ratioReview(LOG, TIMES);
    expect(REVIEW_MINIMUM_MEALS).toBe(5);
    expect(strict.groups.map((g) => g.tooFew)).toEqual([true, true, true]);
  });

  it('lists a time of day with no usable meal, with no average', () => {
    const review2 = ratioReview(LOG.filter((e) => e.localDate !== '2026-03-04'), TIMES, 2);
    expect(review2.groups.find((g) => g.dayKindId === TRAINING)).toMatchObject({ meals: 0, averageChangeMmol: null, tooFew: true });
  });
});

describe('dailyTotals', () => {
  it('adds carbohydrate and insulin per local date and lists empty dates', () => {
    expect(dailyTotals(LOG, '2026-03-02', '2026-03-05')).toEqual([
      // 40 + 60 + 50 + 15 = 165 g; 4 + 6 + 5 = 15 units
      { date: '2026-03-02', carbG: 165, rapidUnits: 15, longUnits: 0, meals: 4 },
      // 30 + 45 + 20 = 95 g; 3 + 1 = 4 units; 14 long-acting units
      { date: '2026-03-03', carbG: 95, rapidUnits: 4, longUnits: 14, meals: 3 },
      { date: '2026-03-04', carbG: 50, rapidUnits: 3, longUnits: 0, meals: 1 },
      { date: '2026-03-05', carbG: 0, rapidUnits: 0, longUnits: 0, meals: 0 },
    ]);
  });
});

describe('glucoseBeforeMeals', () => {
  it('averages the reading before each meal per day kind', () => {
    const rows = glucoseBeforeMeals(LOG, new Map([[REST, 'Rest'], [TRAINING, 'Training']]));
    // Rest: m1 6.0, m2 5.0, m3 9.0, m5 7.0, m6 5.5, m7 6.0 (m4 has none) → 38.5 / 6 = 6.41666…
    const rest = rows.find((r) => r.dayKindId === REST)!;
    expect(rest).toMatchObject({ dayKindName: 'Rest', readings: 6, lowestMmol: 5.0, highestMmol: 9.0 });
    expect(rest.averageMmol).toBeCloseTo(38.5 / 6, 10);
    expect(rows.find((r) => r.dayKindId === TRAINING)).toEqual({ dayKindId: TRAINING, dayKindName: 'Training', readings: 1, averageMmol: 8, lowestMmol: 8, highestMmol: 8 });
  });
});
