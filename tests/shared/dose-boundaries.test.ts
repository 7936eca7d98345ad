import { computeDose, type DayKindRatios, type DoseInput } from '../../shared/compute/dose';
import { exerciseReduction } from '../../shared/compute/exercise';
import { doseRequestSchema } from '../../shared/schemas/dose';
import { engineSettings } from '../helpers/dose-settings';

// Every threshold the engine uses, tested exactly at it, just below and just above. Settings are invented
// (tests/helpers/dose-settings.ts values): low 3.9 (IHSG 2017), ketone check from 15 (Riddell 2017), range 5–8.
const T0 = Date.UTC(2026, 2, 1, 12, 0);
const MIN = 60_000;
const SECOND = 1_000;

const settings = engineSettings;
const rest: DayKindRatios = { id: 1, name: 'Rest', timesOfDay: [{ startMinute: 0, endMinute: 1440, carbRatio: 10, correctionFactorMmol: 2 }] };
const input = (over: Partial<DoseInput> = {}): DoseInput => ({ carbsGrams: 60, mealAt: T0, mealMinuteOfDay: 720, ...over });
const glucose = (value: number, minutesBeforeMeal = 5) => ({ value, unit: 'mmol_l' as const, takenAt: T0 - minutesBeforeMeal * MIN });
function ok(r: ReturnType<typeof computeDose>) {
  if (r.status !== 'ok') throw new Error(`expected a dose, got ${r.status}`);
  return r;
}
const codes = (r: ReturnType<typeof computeDose>) => r.warnings.map((w) => w.code);

describe('the low threshold (no dose at or below 3.9 mmol/L)', () => {
  it.each([
    { name: 'just below (3.89): no dose, treat the low', value: 3.89, status: 'treat_low' },
    { name: 'at it (3.9): no dose, treat the low', value: 3.9, status: 'treat_low' },
    { name: 'just above (3.91): a dose', value: 3.91, status: 'ok' },
  ])('$name', ({ value, status }) => {
    expect(computeDose(settings(), rest, input({ glucose: glucose(value) })).status).toBe(status);
  });

  it('just below, with the profile’s own threshold of 4.4 and no day kind: still says to treat the low', () => {
    const r = computeDose(settings({ hypoThresholdMmol: 4.4 }), null, input({ glucose: glucose(4.3) }));

    expect(r.status).toBe('no_settings');
    expect(codes(r)).toEqual(['no_settings', 'treat_low']);
  });

  it('lists insulin still working beside the treat-the-low steps', () => {
    const r = computeDose(settings(), rest, input({ glucose: glucose(3.5), earlierDoses: [{ units: 2, takenAt: T0 - 30 * MIN }] }));

    expect(r.status === 'treat_low' && r.recentDoses).toEqual([{ units: 2, takenAt: T0 - 30 * MIN }]);
    expect(r.status === 'treat_low' && r.glucoseMmol).toBe(3.5);
  });
});

describe('the very-high threshold ("at or above" 15 mmol/L: check ketones)', () => {
  it.each([
    { name: 'just below (14.99): no ketone warning', value: 14.99, warned: false },
    { name: 'at it (15.0): ketone warning', value: 15, warned: true },
    { name: 'just above (15.01): ketone warning', value: 15.01, warned: true },
  ])('$name', ({ value, warned }) => {
    expect(codes(computeDose(settings(), rest, input({ glucose: glucose(value) }))).includes('ketone_check')).toBe(warned);
  });
});

describe('the age at which a reading is stale (more than 15 minutes from the meal)', () => {
  it.each([
    { name: 'just inside (14 min 59 s before): used', before: 15 * MIN - SECOND, reason: 'above_range' },
    { name: 'at it (exactly 15 min before): still used', before: 15 * MIN, reason: 'above_range' },
    { name: 'just past (15 min 1 s before): left out', before: 15 * MIN + SECOND, reason: 'stale_glucose' },
    { name: 'at it after the meal (15 min after): still used', before: -15 * MIN, reason: 'above_range' },
    { name: 'just past after the meal (15 min 1 s after): left out', before: -15 * MIN - SECOND, reason: 'stale_glucose' },
  ])('$name', ({ before, reason }) => {
    const r = ok(computeDose(settings(), rest, input({ glucose: { value: 10, unit: 'mmol_l', takenAt: T0 - before } })));

    expect(r.breakdown.correctionReason).toBe(reason);
    // (10 − 6) ÷ 2 = 2 units when used, 0 when left out.
    expect(r.breakdown.correctionUnits).toBe(reason === 'above_range' ? 2 : 0);
    expect(codes(r).includes('glucose_stale')).toBe(reason === 'stale_glucose');
  });
});

describe('the target range (correction only above it)', () => {
  it.each([
    { name: 'at the top (8.0): no correction', value: 8, reason: 'in_range' },
    { name: 'just above the top (8.01): correction', value: 8.01, reason: 'above_range' },
    { name: 'at the bottom (5.0): no correction', value: 5, reason: 'in_range' },
    { name: 'just below the bottom (4.99): below the range', value: 4.99, reason: 'below_range_none' },
  ])('$name', ({ value, reason }) => {
    expect(ok(computeDose(settings(), rest, input({ glucose: glucose(value) }))).breakdown.correctionReason).toBe(reason);
  });
});

describe('the exercise limits (starting within 180 minutes, lasting at least 20)', () => {
  const moderate = (durationMinutes: number, startsInMinutes: number) => exerciseReduction({ intensity: 'moderate', durationMinutes, startsInMinutes });

  it.each([
    { name: 'start just inside (179 min): reduced', starts: 179, percent: 50 },
    { name: 'start at the limit (180 min): reduced', starts: 180, percent: 50 },
    { name: 'start just past (181 min): not reduced', starts: 181, percent: 0 },
  ])('$name', ({ starts, percent }) => {
    expect(moderate(30, starts).percent).toBe(percent);
    expect(ok(computeDose(settings(), rest, input({ exercise: { intensity: 'moderate', durationMinutes: 30, startsInMinutes: starts } }))).breakdown.exercisePercent).toBe(percent);
  });

  it.each([
    { name: 'duration just short (19 min): not reduced', duration: 19, percent: 0 },
    { name: 'duration at the limit (20 min): reduced', duration: 20, percent: 50 },
    { name: 'duration just over (21 min): reduced', duration: 21, percent: 50 },
  ])('$name', ({ duration, percent }) => {
    expect(moderate(duration, 60).percent).toBe(percent);
    expect(ok(computeDose(settings(), rest, input({ exercise: { intensity: 'moderate', durationMinutes: duration, startsInMinutes: 60 } }))).breakdown.exercisePercent).toBe(percent);
  });

  it.each([
    { name: '90 minutes (at the end of the table): no note about longer sessions', duration: 90, longer: false },
    { name: '91 minutes (just past): a note that longer sessions may need more', duration: 91, longer: true },
  ])('$name', ({ duration, longer }) => {
    expect(/Longer sessions/.test(moderate(duration, 0).note)).toBe(longer);
  });
});

describe('the end of the action time (4 hours; straight line)', () => {
  it.each([
    { name: 'a dose just inside (239 min old): 6 × 1/240 = 0.025 units active, warned', minutes: 239, active: 6 / 240, warned: true },
    { name: 'a dose exactly one action time old (240 min): nothing active, no warning', minutes: 240, active: 0, warned: false },
    { name: 'a dose just past (241 min): nothing active, no warning', minutes: 241, active: 0, warned: false },
  ])('$name', ({ minutes, active, warned }) => {
    const r = ok(computeDose(settings(), rest, input({ glucose: glucose(10), earlierDoses: [{ units: 6, takenAt: T0 - minutes * MIN }] })));

    expect(r.breakdown.activeInsulinUnits).toBeCloseTo(active, 12);
    expect(r.recentDoses).toHaveLength(warned ? 1 : 0);
    expect(codes(r).includes('recent_insulin')).toBe(warned);
  });
});

describe('the two-part dose limits (rest taken 15 to 480 minutes later, 10 to 90 % now)', () => {
  const request = (split: { nowPercent: number; laterMinutes: number }) =>
    doseRequestSchema.safeParse({ carbsGrams: 60, localTime: '12:30', split });

  it.each([
    { name: 'later just too soon (14 min): refused', later: 14, accepted: false },
    { name: 'later at the lower limit (15 min): accepted', later: 15, accepted: true },
    { name: 'later just inside the lower limit (16 min): accepted', later: 16, accepted: true },
    { name: 'later just inside the upper limit (479 min): accepted', later: 479, accepted: true },
    { name: 'later at the upper limit (480 min): accepted', later: 480, accepted: true },
    { name: 'later just too late (481 min): refused', later: 481, accepted: false },
  ])('$name', ({ later, accepted }) => {
    expect(request({ nowPercent: 60, laterMinutes: later }).success).toBe(accepted);
  });

  it.each([
    { name: 'now just under (9 %): refused', now: 9, accepted: false },
    { name: 'now at the lower limit (10 %): accepted', now: 10, accepted: true },
    { name: 'now at the upper limit (90 %): accepted', now: 90, accepted: true },
    { name: 'now just over (91 %): refused', now: 91, accepted: false },
  ])('$name', ({ now, accepted }) => {
    expect(request({ nowPercent: now, laterMinutes: 120 }).success).toBe(accepted);
  });
});

describe('the cap (largest single dose, rounded down to the pen step)', () => {
  // 10 g per unit: carbohydrate ÷ 10 is the rounded sum when it lands on a half unit.
  it.each([
    { name: 'sum just below the cap of 10 (9.5): not capped', carbs: 95, max: 10, dose: 9.5, capped: false },
    { name: 'sum at the cap of 10 (10.0): not capped', carbs: 100, max: 10, dose: 10, capped: false },
    { name: 'sum just above the cap of 10 (10.5): capped at 10', carbs: 105, max: 10, dose: 10, capped: true },
    { name: 'decimal cap 7.3: a sum of 7.0 is at the stepped cap, not capped', carbs: 70, max: 7.3, dose: 7, capped: false },
    { name: 'decimal cap 7.3: a sum of 7.5 is above it, capped at 7.0 (the pen step below 7.3)', carbs: 75, max: 7.3, dose: 7, capped: true },
    { name: 'decimal cap 7.8: a sum of 9.0 is capped at 7.5, never 8.0', carbs: 90, max: 7.8, dose: 7.5, capped: true },
  ])('$name', ({ carbs, max, dose, capped }) => {
    const r = ok(computeDose(settings({ maxDoseUnits: max }), rest, input({ carbsGrams: carbs })));

    expect(r.breakdown.doseUnits).toBe(dose);
    expect(r.breakdown.capped).toBe(capped);
    expect(codes(r).includes('capped')).toBe(capped);
  });

  it('says the sum and the cap in the warning', () => {
    const r = ok(computeDose(settings({ maxDoseUnits: 7.3 }), rest, input({ carbsGrams: 75 })));

    expect(r.warnings.find((w) => w.code === 'capped')).toMatchObject({ tone: 'danger', message: expect.stringContaining('(7.5 units)') });
    expect(r.warnings.find((w) => w.code === 'capped')?.message).toContain('capped at 7 units');
  });
});

describe('floors at 0 (active insulin never turns into extra insulin)', () => {
  it('below the range with negative correction allowed, an earlier dose takes nothing more off: 6 − 0.75 = 5.25 → 5.0 units', () => {
    // (4.5 − 6) ÷ 2 = −0.75; only a positive correction is lowered by active insulin (convention A).
    const r = ok(computeDose(settings({ allowNegativeCorrection: true }), rest, input({ glucose: glucose(4.5), earlierDoses: [{ units: 2, takenAt: T0 - 60 * MIN }] })));

    expect(r.breakdown.activeInsulinUnits).toBeCloseTo(1.5, 12);
    expect(r.breakdown.activeInsulinSubtracted).toBe(0);
    expect(r.breakdown.totalBeforeRounding).toBeCloseTo(5.25, 12);
    expect(r.breakdown.doseUnits).toBe(5);
  });

  it('a negative correction larger than the meal part gives a total of 0, not below', () => {
    const r = ok(computeDose(settings({ allowNegativeCorrection: true }), rest, input({ carbsGrams: 5, glucose: glucose(4.5) })));

    // 5 ÷ 10 = 0.5; 0.5 − 0.75 = −0.25 → 0.
    expect(r.breakdown.totalBeforeRounding).toBe(0);
    expect(r.breakdown.doseUnits).toBe(0);
  });

  it('with active insulin taken off the whole dose, more active insulin than the dose gives a total of 0', () => {
    const r = ok(computeDose(settings({ iobConvention: 'total' }), rest, input({ glucose: glucose(6), earlierDoses: [{ units: 10, takenAt: T0 }] })));

    // 6 − 10 = −4 → 0.
    expect(r.breakdown.activeInsulinSubtracted).toBe(10);
    expect(r.breakdown.totalBeforeRounding).toBe(0);
  });

  it('with no earlier doses nothing is active and nothing is listed', () => {
    const r = ok(computeDose(settings(), rest, input({ glucose: glucose(10) })));

    expect(r.breakdown.activeInsulinUnits).toBe(0);
    expect(r.recentDoses).toEqual([]);
  });
});
