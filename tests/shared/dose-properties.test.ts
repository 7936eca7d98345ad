import fc from 'fast-check';
import { computeDose, roundToIncrement, type DayKindRatios, type DoseInput, type DoseSettings } from '../../shared/compute/dose';
import { DEFAULT_EXERCISE_REDUCTIONS, EXERCISE_INTENSITIES } from '../../shared/compute/exercise';
import { mmolToMgdl } from '../../shared/compute/units';

const T0 = Date.UTC(2026, 2, 1, 12, 0);

const settingsArb: fc.Arbitrary<DoseSettings> = fc
  .record({
    penIncrement: fc.constantFrom(0.5, 1),
    rounding: fc.constantFrom('down' as const, 'nearest' as const),
    maxDoseUnits: fc.integer({ min: 1, max: 60 }),
    actionTimeHours: fc.double({ min: 2, max: 8, noNaN: true }),
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
  .map(({ carbRatio, cf }) => ({ id: 1, name: 'Any', blocks: [{ startMinute: 0, endMinute: 1440, carbRatio, correctionFactorMmol: cf }] }));

const inputArb: fc.Arbitrary<DoseInput> = fc.record({
  carbsGrams: fc.double({ min: 0, max: 500, noNaN: true }),
  glucose: fc.option(
    fc.record({ value: fc.double({ min: 1, max: 33, noNaN: true }), unit: fc.constant('mmol_l' as const), takenAt: fc.integer({ min: T0 - 40 * 60_000, max: T0 }) }),
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

  it('never gives more than the maximum dose', () => {
    fc.assert(fc.property(settingsArb, dayKindArb, inputArb, (s, k, i) => expect(doseOf(computeDose(s, k, i))).toBeLessThanOrEqual(s.maxDoseUnits)));
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
        const inMgdl = computeDose(s, k, { ...i, glucose: { value: mmolToMgdl(mmol), unit: 'mg_dl', takenAt: T0 } });
        expect(inMgdl.status).toBe(inMmol.status);
        expect(doseOf(inMgdl)).toBe(doseOf(inMmol));
      }),
    );
  });
});
