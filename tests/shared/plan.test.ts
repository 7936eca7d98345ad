import { toLocalTime } from '../../shared/compute/local-time';
import type { DayKindRatios } from '../../shared/compute/dose';
import {
  dayKindFor,
  dayTotals,
  mealCarbGrams,
  nextPlannedMeal,
  planWarnings,
  plannedMealDose,
  portionsUse,
  safeUntil,
  weekDates,
  weekTotals,
  type WarnMeal,
} from '../../shared/compute/plan';

// Ratios from check-values T15 (user-set example: rest-day ICR 10 g/unit, training-day ICR 15 g/unit), one time of day
// for the morning and an invented evening one so the clock time matters.
const REST: DayKindRatios = {
  id: 1,
  name: 'Rest',
  timesOfDay: [
    { startMinute: 0, endMinute: 660, carbRatio: 10, correctionFactorMmol: 2 },
    { startMinute: 660, endMinute: 1440, carbRatio: 12, correctionFactorMmol: 2.5 },
  ],
};
const TRAINING: DayKindRatios = { id: 2, name: 'Training', timesOfDay: [{ startMinute: 0, endMinute: 1440, carbRatio: 15, correctionFactorMmol: 3 }] };
const GAP: DayKindRatios = { id: 3, name: 'Gap', timesOfDay: [{ startMinute: 600, endMinute: 1440, carbRatio: 10, correctionFactorMmol: 2 }] };
const HALF_DOWN = { penIncrement: 0.5, rounding: 'down' as const, maxDoseUnits: 30 };
const ONE_NEAREST = { penIncrement: 1, rounding: 'nearest' as const, maxDoseUnits: 30 };

// Overnight-oats jars, check-values §2.4 worked example B: 217.227 g available carbohydrate over six jars
// = 36.2045 g available per jar.
const JAR = 217.227 / 6;

describe('the week of overnight oats: five breakfasts on two kinds of day', () => {
  // Monday first; the weekly pattern makes Tuesday and Thursday training days, every other day a rest day.
  const week = weekDates('2026-03-11', 1);
  const pattern = new Map([[2, TRAINING.id], [4, TRAINING.id]]);
  const kinds = new Map([[REST.id, REST], [TRAINING.id, TRAINING]]);
  const breakfasts = week.slice(0, 5).map((date) => {
    const kind = kinds.get(dayKindFor(date, new Map(), pattern, REST.id).dayKindId!)!;
    const carb = mealCarbGrams({ kind: 'portion', carbGrams: JAR });
    return { date, kind: kind.name, carb, half: plannedMealDose(carb, kind, 7 * 60 + 30, HALF_DOWN), one: plannedMealDose(carb, kind, 7 * 60 + 30, ONE_NEAREST) };
  });

  // Worked by hand: rest 36.2045 ÷ 10 = 3.62045 → 3.5 (0.5 down) / 4 (1, nearest);
  // training 36.2045 ÷ 15 = 2.41363 → 2.0 (0.5 down) / 2 (1, nearest).
  it.each([
    { date: '2026-03-09', kind: 'Rest', exact: 3.62045, half: 3.5, one: 4 },
    { date: '2026-03-10', kind: 'Training', exact: 2.413633, half: 2, one: 2 },
    { date: '2026-03-11', kind: 'Rest', exact: 3.62045, half: 3.5, one: 4 },
    { date: '2026-03-12', kind: 'Training', exact: 2.413633, half: 2, one: 2 },
    { date: '2026-03-13', kind: 'Rest', exact: 3.62045, half: 3.5, one: 4 },
  ])('$date ($kind): carbohydrate is the jar’s, the dose carbohydrate ÷ that day’s ratio', ({ date, kind, exact, half, one }) => {
    const b = breakfasts.find((x) => x.date === date)!;
    expect(b.kind).toBe(kind);
    expect(b.carb).toBeCloseTo(36.2045, 4);
    expect(b.half).toMatchObject({ status: 'ok', units: half });
    expect(b.one).toMatchObject({ status: 'ok', units: one });
    expect(b.half.status === 'ok' && b.half.exactUnits).toBeCloseTo(exact, 5);
  });

  it('the week sums five jars and the planned rapid-acting units; long-acting per kind of day', () => {
    // Invented long-acting doses: rest 14 units, training 12 units. 5 rest days × 14 + 2 training days × 12 = 94 units.
    const days = week.map((date) => {
      const b = breakfasts.find((x) => x.date === date);
      const kind = kinds.get(dayKindFor(date, new Map(), pattern, REST.id).dayKindId!)!;
      const meals = b ? [{ carbGrams: b.carb, doseUnits: b.half.status === 'ok' ? b.half.units : null }] : [];
      return dayTotals(meals, kind === REST ? 14 : 12);
    });
    const total = weekTotals(days);
    // 5 × 36.2045 = 181.0225 g (= 217.227 × 5 ÷ 6); 3.5 + 2 + 3.5 + 2 + 3.5 = 14.5 units.
    expect(total.carbGrams).toBeCloseTo(181.0225, 4);
    expect(total.rapidUnits).toBe(14.5);
    expect(total.longActingUnits).toBe(94);
    expect(total.carbIncomplete).toBe(false);
  });
});

describe('plannedMealDose', () => {
  it.each([
    // check-values T15: 42 g, rest ICR 10 → 4.2 → 4.0; training ICR 15 → 2.8 → 2.5 (0.5-unit round-down).
    { name: 'T15 rest day', carb: 42, kind: REST, minute: 480, settings: HALF_DOWN, expected: { status: 'ok', units: 4, carbRatio: 10 } },
    { name: 'T15 training day', carb: 42, kind: TRAINING, minute: 480, settings: HALF_DOWN, expected: { status: 'ok', units: 2.5, carbRatio: 15 } },
    // The same rest day after 11:00 uses the evening time of day: 42 ÷ 12 = 3.5 exactly.
    { name: 'clock time picks the time of day', carb: 42, kind: REST, minute: 720, settings: HALF_DOWN, expected: { status: 'ok', units: 3.5, carbRatio: 12 } },
    // 420 g ÷ 10 = 42 units, capped at the invented 30-unit largest single dose.
    { name: 'capped at the largest single dose', carb: 420, kind: REST, minute: 480, settings: HALF_DOWN, expected: { status: 'ok', units: 30, capped: true } },
    { name: 'no time of day holds 07:00', carb: 42, kind: GAP, minute: 420, settings: HALF_DOWN, expected: { status: 'no_ratio' } },
    { name: 'no day kind', carb: 42, kind: null, minute: 420, settings: HALF_DOWN, expected: { status: 'no_ratio' } },
    { name: 'no settings', carb: 42, kind: REST, minute: 420, settings: null, expected: { status: 'no_settings' } },
    { name: 'unknown carbohydrate', carb: null, kind: REST, minute: 420, settings: HALF_DOWN, expected: { status: 'unknown_carb' } },
  ])('$name', ({ carb, kind, minute, settings, expected }) => {
    expect(plannedMealDose(carb, kind, minute, settings)).toMatchObject(expected);
  });
});

describe('mealCarbGrams', () => {
  it.each([
    { name: 'a portion keeps its own value', amount: { kind: 'portion' as const, carbGrams: 36.2 }, expected: 36.2 },
    // check-values §2.4: 18.889 g available per 100 g × 150 g ÷ 100 = 28.3335 g.
    { name: 'grams of a recipe or food', amount: { kind: 'grams' as const, carbPer100g: 18.889, grams: 150 }, expected: 28.3335 },
    { name: 'portions of a recipe', amount: { kind: 'portions' as const, carbPerPortion: 36.2, portions: 1.5 }, expected: 54.3 },
    { name: 'a plain amount', amount: { kind: 'plain' as const, carbGrams: 30 }, expected: 30 },
    { name: 'unknown stays unknown', amount: { kind: 'grams' as const, carbPer100g: null, grams: 100 }, expected: null },
  ])('$name', ({ amount, expected }) => {
    const got = mealCarbGrams(amount);
    if (expected == null) expect(got).toBeNull();
    else expect(got).toBeCloseTo(expected, 6);
  });
});

describe('weekDates and dayKindFor', () => {
  it.each([
    // 2026-03-11 is a Wednesday (calendar).
    { name: 'Monday start', date: '2026-03-11', start: 1, first: '2026-03-09', last: '2026-03-15' },
    { name: 'Sunday start', date: '2026-03-11', start: 7, first: '2026-03-08', last: '2026-03-14' },
    { name: 'the start day itself', date: '2026-03-09', start: 1, first: '2026-03-09', last: '2026-03-15' },
    { name: 'across a year end', date: '2026-12-31', start: 1, first: '2026-12-28', last: '2027-01-03' },
  ])('$name', ({ date, start, first, last }) => {
    const dates = weekDates(date, start);
    expect(dates).toHaveLength(7);
    expect([dates[0], dates[6]]).toEqual([first, last]);
  });

  it.each([
    { name: 'a date set wins', set: [['2026-03-10', 9]], expected: { dayKindId: 9, from: 'date' } },
    { name: 'else the weekly pattern', set: [], expected: { dayKindId: 2, from: 'pattern' } },
  ])('$name', ({ set, expected }) => {
    expect(dayKindFor('2026-03-10', new Map(set as [string, number][]), new Map([[2, 2]]), 1)).toEqual(expected);
  });

  it('else the default, or nothing', () => {
    expect(dayKindFor('2026-03-11', new Map(), new Map([[2, 2]]), 1)).toEqual({ dayKindId: 1, from: 'default' });
    expect(dayKindFor('2026-03-11', new Map(), new Map(), null)).toEqual({ dayKindId: null, from: null });
  });
});

describe('safeUntil', () => {
  it.each([
    { name: 'a fridge portion: its use-by', keeping: { kind: 'batch' as const, storage: 'fridge' as const, useBy: '2026-03-12', region: 'uk' as const, containsRice: false }, thaw: null, expected: { until: '2026-03-12', needsThaw: false } },
    { name: 'a frozen portion without a thaw day', keeping: { kind: 'batch' as const, storage: 'freezer' as const, useBy: '2026-06-10', region: 'uk' as const, containsRice: false }, thaw: null, expected: { until: null, needsThaw: true } },
    // UK FSA leftovers: 2 days in the fridge (check-values §9), counted from the thaw day.
    { name: 'a frozen portion: fridge rule from the thaw day', keeping: { kind: 'batch' as const, storage: 'freezer' as const, useBy: '2026-06-10', region: 'uk' as const, containsRice: false }, thaw: '2026-03-12', expected: { until: '2026-03-14', needsThaw: false } },
    // USDA FSIS 3–4 days, taken as 3 (check-values §9).
    { name: 'a planned cook: fridge rule from the cook day', keeping: { kind: 'planned_cook' as const, cookOn: '2026-03-08', region: 'us' as const }, thaw: null, expected: { until: '2026-03-11', needsThaw: false } },
    { name: 'a planned cook without a date', keeping: { kind: 'planned_cook' as const, cookOn: null, region: 'uk' as const }, thaw: null, expected: { until: null, needsThaw: false } },
  ])('$name', ({ keeping, thaw, expected }) => {
    expect(safeUntil(keeping, thaw)).toEqual(expected);
  });
});

describe('planWarnings: each warning by its own case', () => {
  const fridge = { kind: 'batch' as const, storage: 'fridge' as const, useBy: '2026-03-12', region: 'uk' as const, containsRice: false };
  const meal = (over: Partial<WarnMeal>): WarnMeal => ({
    id: 1, date: '2026-03-10', title: 'Breakfast', logged: false, doseStatus: 'ok', thawOn: null, portion: null, plannedCook: null, ...over,
  });
  it.each([
    { name: 'nothing wrong', meals: [meal({ portion: { id: 5, batchId: 7, keeping: fridge } })], holders: [{ batchId: 7, plannedCookId: null, title: 'Oats', holds: 5 }], cooks: [], expected: [] },
    { name: 'past its use-by date', meals: [meal({ date: '2026-03-13', portion: { id: 5, batchId: 7, keeping: fridge } })], holders: [], cooks: [], expected: ['past_use_by'] },
    { name: 'frozen without a thaw day', meals: [meal({ portion: { id: 5, batchId: 7, keeping: { ...fridge, storage: 'freezer' as const } } })], holders: [], cooks: [], expected: ['needs_thaw'] },
    {
      name: 'more portions placed than the batch holds',
      meals: [1, 2, 3].map((id) => meal({ id, portion: { id: 10 + id, batchId: 7, keeping: fridge } })),
      holders: [{ batchId: 7, plannedCookId: null, title: 'Oats', holds: 2 }],
      cooks: [],
      expected: ['over_placed'],
    },
    { name: 'no ratio for the meal’s time', meals: [meal({ doseStatus: 'no_ratio' })], holders: [], cooks: [], expected: ['no_ratio'] },
    { name: 'a planned cook with no date', meals: [], holders: [], cooks: [{ id: 4, title: 'Dal', cookOn: null }], expected: ['cook_no_date'] },
    { name: 'a planned cook’s portion before the cook', meals: [meal({ plannedCook: { id: 4, cookOn: '2026-03-11' } })], holders: [], cooks: [], expected: ['before_cook'] },
    { name: 'a logged meal warns no more', meals: [meal({ logged: true, doseStatus: 'no_ratio' })], holders: [], cooks: [], expected: [] },
  ])('$name', ({ meals, holders, cooks, expected }) => {
    expect(planWarnings(meals, holders, cooks).map((w) => w.code)).toEqual(expected);
  });

  it('counts portions used and left per batch (logged meals no longer hold one)', () => {
    const meals = [meal({ id: 1, portion: { id: 1, batchId: 7, keeping: fridge } }), meal({ id: 2, logged: true, portion: { id: 2, batchId: 7, keeping: fridge } })];
    expect(portionsUse([{ batchId: 7, plannedCookId: null, title: 'Oats', holds: 4 }], meals)[0]).toMatchObject({ placed: 1, left: 3 });
  });
});

describe('nextPlannedMeal and the local clock it reads', () => {
  it('offers the first meal not logged from today on', () => {
    const meals = [
      { id: 1, date: '2026-03-09', minute: 450, logged: false },
      { id: 2, date: '2026-03-10', minute: 780, logged: false },
      { id: 3, date: '2026-03-10', minute: 450, logged: true },
      { id: 4, date: '2026-03-11', minute: 450, logged: false },
    ];
    expect(nextPlannedMeal(meals, '2026-03-10')?.id).toBe(2);
    expect(nextPlannedMeal([], '2026-03-10')).toBeNull();
  });

  it.each([
    // 2026-03-10T23:30Z is 00:30 the next day in Berlin (UTC+1 in March before the switch) and 19:30 in New York (UTC−4 after 8 March).
    { zone: 'Europe/Berlin', expected: { localDate: '2026-03-11', localMinute: 30 } },
    { zone: 'America/New_York', expected: { localDate: '2026-03-10', localMinute: 19 * 60 + 30 } },
    { zone: 'UTC', expected: { localDate: '2026-03-10', localMinute: 23 * 60 + 30 } },
  ])('local clock in $zone', ({ zone, expected }) => {
    expect(toLocalTime(Date.parse('2026-03-10T23:30:00Z'), zone)).toEqual(expected);
  });
});
