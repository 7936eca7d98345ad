import fc from 'fast-check';
import { computeDose, roundToIncrement, type DayKindRatios, type DoseInput, type DoseSettings } from '../../shared/compute/dose';
import { DEFAULT_EXERCISE_REDUCTIONS, EXERCISE_INTENSITIES } from '../../shared/compute/exercise';

const T0 = Date.UTC(2026, 2, 1, 12, 0);
/** mg/dL per mmol/L: the molar mass of glucose, 18.0156 g/mol (check-values T19), written here, not imported. */
const MGDL_PER_MMOL = 18.0156;

const settingsArb: fc.Arbitrary<DoseSettings> = fc
  .record({
    penIncrement: fc.constantFrom(0.5, 1),
    rounding: fc.constantFrom('down' as const, 'nearest' as const),
    // Decimal maximums such as 7.3: the cap must still hold (it is rounded down to the pen step).
    maxDoseUnits: fc.double({ min: 1, max: 60, noNaN: true }),
    actionTimeHours: fc.double({ min: 2, max: 8, noNaN: true }),
    activeInsulinModel: fc.constantFrom('linear' as const, 'curve' as const),
    targetLowMmol: fc.double({ min: 4.5, max: 6, noNaN: true }),
    rangeWidth: fc.double({ min: 0.5, max: 4, noNaN: true }),
    hypoThresholdMmol: fc.double({ min: 3, max: 4.4, noNaN: true }),
    allowNegativeCorrection: fc.boolean(),
    iobConvention: fc.constantFrom('correction_only' as const, 'total' as const),
  })
  .map(({ rangeWidth, ...s }) => ({
    ...s,
    targetHighMmol: s.targetLowMmol + rangeWidth,
    correctionTargetMmol: s.targetLowMmol + rangeWidth / 2,
    veryHighMmol: 15,
    exerciseReductions: DEFAULT_EXERCISE_REDUCTIONS,
  }));

const dayKindArb: fc.Arbitrary<DayKindRatios> = fc
  .record({ carbRatio: fc.double({ min: 1, max: 150, noNaN: true }), cf: fc.double({ min: 0.2, max: 20, noNaN: true }) })
  .map(({ carbRatio, cf }) => ({ id: 1, name: 'Any', timesOfDay: [{ startMinute: 0, endMinute: 1440, carbRatio, correctionFactorMmol: cf }] }));

const inputArb: fc.Arbitrary<DoseInput> = fc.record({
  carbsGrams: fc.double({ min: 0, max: 500, noNaN: true }),
  // Glucose in either unit: a mmol/L value, or the same range in mg/dL.
  glucose: fc.option(
    fc
      .record({ mmol: fc.double({ min: 1, max: 33, noNaN: true }), inMgdl: fc.boolean(), takenAt: fc.integer({ min: T0 - 40 * 60_000, max: T0 }) })
      .map(({ mmol, inMgdl, takenAt }) => ({ value: inMgdl ? mmol * MGDL_PER_MMOL : mmol, unit: inMgdl ? ('mg_dl' as const) : ('mmol_l' as const), takenAt })),
    { nil: null },
  ),
  mealAt: fc.constant(T0),
  mealMinuteOfDay: fc.integer({ min: 0, max: 1439 }),
  earlierDoses: fc.array(fc.record({ units: fc.double({ min: 0.5, max: 20, noNaN: true }), takenAt: fc.integer({ min: T0 - 9 * 3_600_000, max: T0 }) }), { maxLength: 4 }),
  exercise: fc.option(
    fc.record({ intensity: fc.constantFrom(...EXERCISE_INTENSITIES), durationMinutes: fc.integer({ min: 1, max: 240 }), startsInMinutes: fc.integer({ min: 0, max: 300 }) }),
    { nil: null },
  ),
});

const doseOf = (r: ReturnType<typeof computeDose>) => (r.status === 'ok' ? r.breakdown.doseUnits : 0);

describe('computeDose properties', () => {
  it('never gives a negative dose', () => {
    fc.assert(fc.property(settingsArb, dayKindArb, inputArb, (s, k, i) => expect(doseOf(computeDose(s, k, i))).toBeGreaterThanOrEqual(0)));
  });

  it('never gives more than the maximum dose (decimal maximums too), and the dose is on the pen step', () => {
    fc.assert(
      fc.property(settingsArb, dayKindArb, inputArb, (s, k, i) => {
        const dose = doseOf(computeDose(s, k, i));
        // 1e-6: the pen-step rounding forgives float noise of 1e-9 steps (a maximum of 59.9999999995 caps at 60).
        expect(dose).toBeLessThanOrEqual(s.maxDoseUnits + 1e-6);
        expect(Number.isInteger(Math.round((dose / s.penIncrement) * 1e9) / 1e9)).toBe(true);
      }),
    );
  });

  it('divides decimal carbohydrate as entered: meal units = grams ÷ ratio', () => {
    fc.assert(
      fc.property(settingsArb, dayKindArb, inputArb, (s, k, i) => {
        const r = computeDose(s, k, i);
        if (r.status !== 'ok') return;
        expect(r.breakdown.mealUnits).toBeCloseTo(i.carbsGrams / k.timesOfDay[0].carbRatio, 9);
      }),
    );
  });

  it('splits a dose so the part now is on the pen step and at most dose × percent, and both parts add up to the dose', () => {
    fc.assert(
      fc.property(settingsArb, dayKindArb, inputArb, fc.integer({ min: 10, max: 90 }), (s, k, i, nowPercent) => {
        const r = computeDose(s, k, { ...i, split: { nowPercent, laterMinutes: 120 } });
        if (r.status !== 'ok' || !r.split) return;
        const { nowUnits, laterUnits } = r.split;
        expect(Number.isInteger(Math.round((nowUnits / s.penIncrement) * 1e9) / 1e9)).toBe(true);
        expect(nowUnits).toBeLessThanOrEqual((r.breakdown.doseUnits * nowPercent) / 100 + 1e-9);
        expect((r.breakdown.doseUnits * nowPercent) / 100 - nowUnits).toBeLessThan(s.penIncrement);
        expect(nowUnits + laterUnits).toBeLessThanOrEqual(r.breakdown.roundedUnits + 1e-9);
        expect(nowUnits + laterUnits).toBeCloseTo(r.breakdown.doseUnits, 9);
      }),
    );
  });

  it('never gives less insulin for more carbohydrate', () => {
    fc.assert(
      fc.property(settingsArb, dayKindArb, inputArb, fc.double({ min: 0, max: 200, noNaN: true }), (s, k, i, extra) => {
        const less = doseOf(computeDose(s, k, i));
        const more = doseOf(computeDose(s, k, { ...i, carbsGrams: i.carbsGrams + extra }));
        expect(more).toBeGreaterThanOrEqual(less);
      }),
    );
  });

  it('always gives no dose for glucose at or below the hypoglycaemia threshold', () => {
    fc.assert(
      fc.property(settingsArb, dayKindArb, inputArb, fc.double({ min: 0, max: 1, noNaN: true }), (s, k, i, f) => {
        const value = 1 + f * (s.hypoThresholdMmol - 1);
        const r = computeDose(s, k, { ...i, glucose: { value, unit: 'mmol_l', takenAt: T0 } });
        expect(r.status).toBe('treat_low');
        expect(doseOf(r)).toBe(0);
      }),
    );
  });

  it('never rounds up when rounding down, and stays on the pen step', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 100, noNaN: true }), fc.constantFrom(0.5, 1), (units, inc) => {
        const r = roundToIncrement(units, inc, 'down');
        expect(r).toBeLessThanOrEqual(units + 1e-6);
        expect(units - r).toBeLessThan(inc + 1e-6);
        expect(Number.isInteger(r / inc)).toBe(true);
      }),
    );
  });

  it('gives the same dose for the same glucose in mmol/L and in mg/dL', () => {
    fc.assert(
      fc.property(settingsArb, dayKindArb, inputArb, fc.double({ min: 2, max: 30, noNaN: true }), (s, k, i, mmol) => {
        const inMmol = computeDose(s, k, { ...i, glucose: { value: mmol, unit: 'mmol_l', takenAt: T0 } });
        const inMgdl = computeDose(s, k, { ...i, glucose: { value: mmol * MGDL_PER_MMOL, unit: 'mg_dl', takenAt: T0 } });
        expect(inMgdl.status).toBe(inMmol.status);
        expect(doseOf(inMgdl)).toBe(doseOf(inMmol));
      }),
    );
  });
});
