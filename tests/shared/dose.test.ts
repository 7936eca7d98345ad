import { computeDose, fatProteinUnits, findTimeOfDay, roundToIncrement, type DayKindRatios, type DoseInput } from '../../shared/compute/dose';
import { carbUnitToGrams, glucoseToMmol, gramsToCarbUnit, mgdlToMmol, mmolToMgdl } from '../../shared/compute/units';
import { engineSettings } from '../helpers/dose-settings';

const T0 = Date.UTC(2026, 2, 1, 12, 0);
const MIN = 60_000;

const settings = engineSettings;
function dayKind(carbRatio: number, correctionFactorMmol: number, name = 'Rest'): DayKindRatios {
  return { id: 1, name, timesOfDay: [{ startMinute: 0, endMinute: 1440, carbRatio, correctionFactorMmol }] };
}
function input(over: Partial<DoseInput> = {}): DoseInput {
  return { carbsGrams: 60, mealAt: T0, mealMinuteOfDay: 720, ...over };
}
function ok(r: ReturnType<typeof computeDose>) {
  if (r.status !== 'ok') throw new Error(`expected a dose, got ${r.status}`);
  return r;
}
const fresh = (value: number, unit: 'mmol_l' | 'mg_dl' = 'mmol_l') => ({ value, unit, takenAt: T0 - 5 * MIN });

describe('computeDose worked examples (check-values §12)', () => {
  it.each([
    // T8: education formula [C2].
    { name: 'T8 meal dose: 60 g at 10 g/U → 6.0 U', carbs: 60, icr: 10, dose: 6, meal: 6 },
    // T9: Building Competency in Diabetes Education [C] — round down to the pen step.
    { name: 'T9 45 g at 12 g/U = 3.75 U → 3.5 U rounded down', carbs: 45, icr: 12, dose: 3.5, meal: 3.75 },
    // T15: day-kind ratios are user inputs; formula [C2].
    { name: 'T15 42 g on a rest day at 10 g/U → 4.2 → 4.0 U', carbs: 42, icr: 10, dose: 4, meal: 4.2 },
    { name: 'T15 42 g on a training day at 15 g/U → 2.8 → 2.5 U', carbs: 42, icr: 15, dose: 2.5, meal: 2.8 },
  ])('$name', ({ carbs, icr, dose, meal }) => {
    const r = ok(computeDose(settings(), dayKind(icr, 2), input({ carbsGrams: carbs, glucose: fresh(6) })));

    expect(r.breakdown.mealUnits).toBeCloseTo(meal, 9);
    expect(r.breakdown.doseUnits).toBe(dose);
  });

  it('T9 rounds 3.75 U to 4.0 U when the profile rounds to the nearest step', () => {
    const r = ok(computeDose(settings({ rounding: 'nearest' }), dayKind(12, 2), input({ carbsGrams: 45, glucose: fresh(6) })));

    expect(r.breakdown.doseUnits).toBe(4);
  });

  it('T10 correction only: glucose 14, target 8, factor 2 mmol/L per unit → 3 U (HSCNI "Blood glucose correction" [C])', () => {
    const s = settings({ targetLowMmol: 5, targetHighMmol: 8, correctionTargetMmol: 8 });

    const r = ok(computeDose(s, dayKind(10, 2), input({ carbsGrams: 0, glucose: fresh(14) })));

    expect(r.breakdown.correctionUnits).toBeCloseTo(3, 9);
    expect(r.breakdown.doseUnits).toBe(3);
  });

  it('T11 meal 6.0 + correction 2.0 − active insulin 1.5 = 6.5 U (formulas [C2]; IOB logic common practice)', () => {
    const s = settings({ targetHighMmol: 7, correctionTargetMmol: 6 });
    // A dose taken right now is still fully active, which gives exactly 1.5 U of active insulin.
    const earlierDoses = [{ units: 1.5, takenAt: T0 }];

    const r = ok(computeDose(s, dayKind(10, 2.5), input({ glucose: fresh(11), earlierDoses })));

    expect(r.breakdown).toMatchObject({ mealUnits: 6, activeInsulinUnits: 1.5, activeInsulinSubtracted: 1.5, doseUnits: 6.5 });
    expect(r.breakdown.correctionUnits).toBeCloseTo(2, 9);
  });

  it('T12 with active insulin above the correction: 6.0 U when it lowers the correction only (convention A)', () => {
    const earlierDoses = [{ units: 1.5, takenAt: T0 }];
    const s = settings({ targetLowMmol: 4, targetHighMmol: 6.5, correctionTargetMmol: 6 });

    const r = ok(computeDose(s, dayKind(10, 2.5), input({ glucose: fresh(7), earlierDoses })));

    expect(r.breakdown.correctionUnits).toBeCloseTo(0.4, 9);
    expect(r.breakdown.activeInsulinSubtracted).toBeCloseTo(0.4, 9);
    expect(r.breakdown.doseUnits).toBe(6);
  });

  it('T12 with active insulin above the correction: 4.9 → 4.5 U when it lowers the whole dose (convention B)', () => {
    const earlierDoses = [{ units: 1.5, takenAt: T0 }];
    const s = settings({ targetLowMmol: 4, targetHighMmol: 6.5, correctionTargetMmol: 6, iobConvention: 'total' });

    const r = ok(computeDose(s, dayKind(10, 2.5), input({ glucose: fresh(7), earlierDoses })));

    expect(r.breakdown.totalBeforeRounding).toBeCloseTo(4.9, 9);
    expect(r.breakdown.doseUnits).toBe(4.5);
  });

  it('T13 mg/dL: 70 g at 5 g/U + (220 − 120) ÷ 20 mg/dL per unit = 19 U (educator slide deck [C2])', () => {
    const s = settings({
      penIncrement: 1,
      targetLowMmol: mgdlToMmol(80),
      targetHighMmol: mgdlToMmol(140),
      correctionTargetMmol: mgdlToMmol(120),
    });

    const r = ok(computeDose(s, dayKind(5, mgdlToMmol(20)), input({ carbsGrams: 70, glucose: fresh(220, 'mg_dl') })));

    expect(r.breakdown.mealUnits).toBe(14);
    expect(r.breakdown.correctionUnits).toBeCloseTo(5, 9);
    expect(r.breakdown.doseUnits).toBe(19);
  });

  it('T16 moderate exercise for 60 minutes takes 75 % off an 8 U meal dose → 2.0 U (Rabasa-Lhoret 2001 [C])', () => {
    const r = ok(
      computeDose(settings(), dayKind(10, 2), input({ carbsGrams: 80, glucose: fresh(6), exercise: { intensity: 'moderate', durationMinutes: 60, startsInMinutes: 90 } })),
    );

    expect(r.breakdown).toMatchObject({ mealUnits: 8, exercisePercent: 75, exerciseUnits: 6, doseUnits: 2 });
  });

  it('T17 light exercise for 60 minutes takes 50 % off a 6 U meal dose → 3.0 U (Rabasa-Lhoret 2001 [C])', () => {
    const r = ok(
      computeDose(settings(), dayKind(10, 2), input({ glucose: fresh(6), exercise: { intensity: 'light', durationMinutes: 60, startsInMinutes: 60 } })),
    );

    expect(r.breakdown.doseUnits).toBe(3);
  });

  it('takes the exercise reduction from the meal part only, not from the correction', () => {
    const r = ok(
      computeDose(settings(), dayKind(10, 2), input({ glucose: fresh(10), exercise: { intensity: 'moderate', durationMinutes: 30, startsInMinutes: 30 } })),
    );

    expect(r.breakdown.mealAfterExerciseUnits).toBe(3);
    expect(r.breakdown.correctionUnits).toBe(2);
    expect(r.breakdown.doseUnits).toBe(5);
  });
});

describe('computeDose rules and warnings', () => {
  it('suggests nothing without settings or without a day kind', () => {
    expect(computeDose(null, dayKind(10, 2), input()).status).toBe('no_settings');
    expect(computeDose(settings(), null, input()).status).toBe('no_settings');
  });

  it('still says to treat a low without settings, at the IHSG 2017 alert value of 3.9 mmol/L', () => {
    const low = computeDose(null, null, input({ glucose: { value: 3.9, unit: 'mmol_l', takenAt: T0 } }));
    const fine = computeDose(null, null, input({ glucose: { value: 4.0, unit: 'mmol_l', takenAt: T0 } }));

    expect(low.status).toBe('no_settings');
    expect(low.warnings.map((w) => w.code)).toEqual(['no_settings', 'treat_low']);
    expect(fine.warnings.map((w) => w.code)).toEqual(['no_settings']);
  });

  it.each([
    { name: '3.9 mmol/L (at the IHSG 2017 alert value)', value: 3.9, unit: 'mmol_l' },
    { name: '70 mg/dL (3.886 mmol/L, check-values §5)', value: 70, unit: 'mg_dl' },
    { name: '2.5 mmol/L', value: 2.5, unit: 'mmol_l' },
  ] as const)('gives no dose and says to treat the low first at $name', ({ value, unit }) => {
    const r = computeDose(settings(), dayKind(10, 2), input({ glucose: { value, unit, takenAt: T0 } }));

    expect(r.status).toBe('treat_low');
    expect(r.warnings[0].message).toMatch(/15–20 g of fast-acting carbohydrate/);
  });

  it('leaves the correction out and says so when the glucose reading is older than 15 minutes', () => {
    const r = ok(computeDose(settings(), dayKind(10, 2), input({ glucose: { value: 14, unit: 'mmol_l', takenAt: T0 - 16 * MIN } })));

    expect(r.breakdown.correctionReason).toBe('stale_glucose');
    expect(r.breakdown.correctionUnits).toBe(0);
    expect(r.warnings.map((w) => w.code)).toContain('glucose_stale');
  });

  it('leaves the correction out and says so when there is no glucose reading', () => {
    const r = ok(computeDose(settings(), dayKind(10, 2), input()));

    expect(r.breakdown.correctionReason).toBe('no_glucose');
    expect(r.warnings.map((w) => w.code)).toContain('glucose_missing');
  });

  it('gives no correction within the target range', () => {
    const r = ok(computeDose(settings(), dayKind(10, 2), input({ glucose: fresh(7.9) })));

    expect(r.breakdown).toMatchObject({ correctionReason: 'in_range', correctionUnits: 0, doseUnits: 6 });
  });

  it('gives a negative correction below the range only when the profile allows it', () => {
    const off = ok(computeDose(settings(), dayKind(10, 2), input({ glucose: fresh(4.5) })));
    const on = ok(computeDose(settings({ allowNegativeCorrection: true }), dayKind(10, 2), input({ glucose: fresh(4.5) })));

    expect(off.breakdown).toMatchObject({ correctionReason: 'below_range_none', doseUnits: 6 });
    expect(on.breakdown.correctionUnits).toBeCloseTo(-0.75, 9);
    expect(on.breakdown.doseUnits).toBe(5);
  });

  it('warns to check ketones above the very-high threshold, in danger tone (at it and just below: dose-boundaries.test.ts)', () => {
    const r = ok(computeDose(settings(), dayKind(10, 2), input({ glucose: fresh(16) })));

    expect(r.warnings.find((w) => w.code === 'ketone_check')).toMatchObject({ tone: 'danger', message: expect.stringMatching(/check ketones/) });
  });

  it('takes half of a 4-unit dose from 2 hours ago off the correction: 6 + 2 − 2 = 6.0 U (HSCNI, check-values §3.1: 50 % active at 2 h)', () => {
    // Straight line over 4 h: 4 × (1 − 120/240) = 2.0 units still active; correction (10 − 6) ÷ 2 = 2.0.
    const earlierDoses = [{ units: 4, takenAt: T0 - 120 * MIN }];

    const r = ok(computeDose(settings(), dayKind(10, 2), input({ glucose: fresh(10), earlierDoses })));

    expect(r.breakdown).toMatchObject({ activeInsulinModel: 'linear', actionTimeHours: 4, activeInsulinUnits: 2, activeInsulinSubtracted: 2, doseUnits: 6 });
    expect(r.warnings.find((w) => w.code === 'recent_insulin')).toMatchObject({ tone: 'caution', message: expect.stringContaining('last 4 hours is still working: about 2.0 units active') });
  });

  it('counts less of the same dose with the curve: 4 × 0.3417 = 1.37 U active, so 6 + 2 − 1.37 = 6.63 → 6.5 U', () => {
    // 0.3417: the curve at 2 h of 4 h by numerical integration (active-insulin.test.ts).
    const earlierDoses = [{ units: 4, takenAt: T0 - 120 * MIN }];

    const r = ok(computeDose(settings({ activeInsulinModel: 'curve' }), dayKind(10, 2), input({ glucose: fresh(10), earlierDoses })));

    expect(r.breakdown.activeInsulinUnits).toBeCloseTo(4 * 0.3417, 3);
    expect(r.breakdown.doseUnits).toBe(6.5);
  });

  it('divides the carbohydrate as entered, not rounded to whole grams: 29.6 g ÷ 10 = 2.96 → 2.5 U (30 g would give 3.0)', () => {
    const r = ok(computeDose(settings(), dayKind(10, 2), input({ carbsGrams: 29.6, glucose: fresh(6) })));

    expect(r.breakdown.mealUnits).toBeCloseTo(2.96, 12);
    expect(r.breakdown.doseUnits).toBe(2.5);
  });

  it('splits 5 U at 65 % into 3.0 now and 2.0 later (5 × 0.65 = 3.25, rounded down to the 0.5 step)', () => {
    const r = ok(computeDose(settings({ rounding: 'nearest' }), dayKind(10, 2), input({ carbsGrams: 50, glucose: fresh(6), split: { nowPercent: 65, laterMinutes: 120 } })));

    expect(r.breakdown.doseUnits).toBe(5);
    expect(r.split).toEqual({ nowUnits: 3, laterUnits: 2, laterMinutes: 120, nowPercent: 65 });
  });

  it('makes no split of a zero dose', () => {
    const r = ok(computeDose(settings(), dayKind(10, 2), input({ carbsGrams: 0, glucose: fresh(6), split: { nowPercent: 50, laterMinutes: 60 } })));

    expect(r.split).toBeNull();
  });

  it('names every warning in its tone with words that say what to do', () => {
    const missing = computeDose(settings(), dayKind(10, 2), input());
    const stale = computeDose(settings(), dayKind(10, 2), input({ glucose: { value: 9, unit: 'mmol_l', takenAt: T0 - 30 * MIN } }));
    const negative = computeDose(settings({ allowNegativeCorrection: true }), dayKind(10, 2), input({ glucose: fresh(4.5) }));
    const none = computeDose(null, null, input());
    const exercise = computeDose(settings(), dayKind(10, 2), input({ glucose: fresh(6), exercise: { intensity: 'light', durationMinutes: 30, startsInMinutes: 10 } }));
    const low = computeDose(settings(), dayKind(10, 2), input({ glucose: fresh(3) }));
    const all = [missing, stale, negative, none, exercise, low].flatMap((r) => r.warnings);

    expect(all.map(({ code, tone }) => [code, tone])).toEqual([
      ['glucose_missing', 'caution'],
      ['glucose_stale', 'caution'],
      ['negative_correction', 'info'],
      ['no_settings', 'caution'],
      ['exercise_note', 'info'],
      ['treat_low', 'danger'],
    ]);
    expect(all[0].message).toMatch(/^No glucose reading: the correction is left out\. Check your glucose/);
    expect(all[1].message).toMatch(/^The glucose reading is more than 15 minutes from the meal time/);
    expect(all[2].message).toMatch(/below your target range, so the dose is lowered/);
    expect(all[3].message).toMatch(/^No dose can be suggested until the ratios/);
    expect(all[4].message).toMatch(/^light exercise for about 30 minutes/);
    expect(all[5].message).toMatch(/^No insulin now\. Treat the low first/);
  });

  it('caps the dose at the maximum with a warning', () => {
    const r = ok(computeDose(settings({ maxDoseUnits: 10 }), dayKind(5, 2), input({ carbsGrams: 100, glucose: fresh(6) })));

    expect(r.breakdown).toMatchObject({ roundedUnits: 20, capped: true, doseUnits: 10 });
    expect(r.warnings.map((w) => w.code)).toContain('capped');
  });

  it('shows insulin taken within the action time', () => {
    const r = ok(computeDose(settings(), dayKind(10, 2), input({ glucose: fresh(6), earlierDoses: [{ units: 4, takenAt: T0 - 90 * MIN }] })));

    expect(r.recentDoses).toHaveLength(1);
    expect(r.warnings.map((w) => w.code)).toContain('recent_insulin');
    expect(r.breakdown.activeInsulinUnits).toBeGreaterThan(0);
    expect(r.breakdown.doseUnits).toBe(6);
  });

  it('splits 60 % now and the rest later, both on pen steps, and shows the fat-protein figure', () => {
    const r = ok(
      computeDose(settings(), dayKind(10, 2), input({ carbsGrams: 75, glucose: fresh(6), split: { nowPercent: 60, laterMinutes: 90 }, fatGrams: 20, proteinGrams: 30 })),
    );

    expect(r.breakdown.doseUnits).toBe(7.5);
    expect(r.split).toEqual({ nowUnits: 4.5, laterUnits: 3, laterMinutes: 90, nowPercent: 60 });
    expect(r.fatProteinUnits).toBe(3);
  });

  it('picks the time of day holding the meal time and names it', () => {
    const kind: DayKindRatios = {
      id: 7,
      name: 'Long ride',
      timesOfDay: [
        { startMinute: 0, endMinute: 660, carbRatio: 8, correctionFactorMmol: 2 },
        { startMinute: 660, endMinute: 1440, carbRatio: 12, correctionFactorMmol: 3 },
      ],
    };

    const breakfast = ok(computeDose(settings(), kind, input({ mealMinuteOfDay: 659 })));
    const lunch = ok(computeDose(settings(), kind, input({ mealMinuteOfDay: 660 })));

    expect(breakfast.breakdown.carbRatio).toBe(8);
    expect(lunch.breakdown.carbRatio).toBe(12);
    expect(lunch.dayKind).toEqual({ id: 7, name: 'Long ride' });
    expect(lunch.timeOfDay).toEqual({ startMinute: 660, endMinute: 1440 });
    expect(findTimeOfDay(kind.timesOfDay, 1439)?.carbRatio).toBe(12);
    expect(findTimeOfDay(kind.timesOfDay, 659.9)?.carbRatio).toBe(8);
    expect(findTimeOfDay(kind.timesOfDay, 1440)?.carbRatio).toBe(8);
    expect(findTimeOfDay(kind.timesOfDay, -1)?.carbRatio).toBe(12);
  });

  it('suggests nothing when no time of day covers the meal time', () => {
    const partial: DayKindRatios = { id: 2, name: 'Half', timesOfDay: [{ startMinute: 0, endMinute: 600, carbRatio: 10, correctionFactorMmol: 2 }] };

    expect(computeDose(settings(), partial, input({ mealMinuteOfDay: 700 })).status).toBe('no_settings');
  });
});

describe('roundToIncrement', () => {
  it.each([
    { name: '3.75 down to 0.5 → 3.5', units: 3.75, inc: 0.5, rule: 'down', out: 3.5 },
    { name: '3.75 nearest 0.5 → 4', units: 3.75, inc: 0.5, rule: 'nearest', out: 4 },
    { name: '4.99 down to 1 → 4', units: 4.99, inc: 1, rule: 'down', out: 4 },
    { name: 'float noise 4.999999999999 down to 1 → 5', units: 4.999999999999, inc: 1, rule: 'down', out: 5 },
    { name: 'negative → 0', units: -2, inc: 0.5, rule: 'down', out: 0 },
  ] as const)('$name', ({ units, inc, rule, out }) => {
    expect(roundToIncrement(units, inc, rule)).toBe(out);
  });
});

describe('units used by the dose engine', () => {
  // T19: factor 18.0156 from the molar mass of glucose [D].
  it.each([
    { name: '126 mg/dL → 6.994 mmol/L', value: mgdlToMmol(126), expected: 6.994 },
    { name: '3.9 mmol/L → 70.26 mg/dL', value: mmolToMgdl(3.9), expected: 70.26 },
    { name: '10.0 mmol/L → 180.16 mg/dL', value: mmolToMgdl(10), expected: 180.16 },
    { name: 'glucoseToMmol(180, mg/dL) → 9.991', value: glucoseToMmol(180, 'mg_dl'), expected: 9.991 },
  ])('T19 $name', ({ value, expected }) => {
    expect(Math.abs(value - expected)).toBeLessThan(0.01);
  });

  // T22: carbohydrate units, check-values §6.
  it.each([
    { unit: 'portion10', amount: 4.8 },
    { unit: 'unit12', amount: 4 },
    { unit: 'exchange15', amount: 3.2 },
  ] as const)('T22 48 g is $amount in $unit and back', ({ unit, amount }) => {
    expect(gramsToCarbUnit(48, unit)).toBeCloseTo(amount, 9);
    expect(carbUnitToGrams(amount, unit)).toBeCloseTo(48, 9);
  });

  // T14 / §3.2: the 500, 1800 and 100 rules, as a check of the engine's arithmetic only (ratios are never suggested).
  // mg/dL per mmol/L = 18.0156 (T19, molar mass of glucose), written here rather than imported.
  it('T14 ratios from a total daily dose of 50 U give the same 8 U in mmol/L and through the mg/dL path', () => {
    const icr = 500 / 50;
    const isfMgdl = 1800 / 50;
    const isfMmol = 100 / 50;
    expect([icr, isfMgdl, isfMmol]).toEqual([10, 36, 2]);
    // 60 g ÷ 10 = 6 U; (10 − 6) ÷ 2 = 2 U in mmol/L; (180.156 − 108.0936) ÷ 36.0312 = 2 U in mg/dL → 8 U either way.
    const s = settings({ penIncrement: 1, correctionTargetMmol: 6 });

    const inMmol = ok(computeDose(s, dayKind(icr, isfMmol), input({ glucose: fresh(10) })));
    const inMgdl = ok(computeDose(s, dayKind(icr, isfMmol), input({ glucose: fresh(10 * 18.0156, 'mg_dl') })));

    expect(inMmol.breakdown.doseUnits).toBe(8);
    expect(inMgdl.breakdown.glucoseMmol).toBeCloseTo(10, 9);
    expect(inMgdl.breakdown.doseUnits).toBe(8);
  });

  it('mg/dL profile: correction factor 36 mg/dL per unit, 180 mg/dL against a target of 108 → 2.0 U', () => {
    // By hand: (180 − 108) ÷ 36 = 72 ÷ 36 = 2.0 U. Stored in mmol/L with 18.0156 mg/dL per mmol/L (T19):
    // target 108 ÷ 18.0156 = 5.995, factor 36 ÷ 18.0156 = 1.998, reading 180 ÷ 18.0156 = 9.991 → (9.991 − 5.995) ÷ 1.998 = 2.0.
    const mg = (v: number) => v / 18.0156;
    const s = settings({ targetLowMmol: mg(90), targetHighMmol: mg(140), correctionTargetMmol: mg(108) });

    const r = ok(computeDose(s, dayKind(10, mg(36)), input({ carbsGrams: 0, glucose: fresh(180, 'mg_dl') })));

    expect(r.breakdown.correctionUnits).toBeCloseTo(2, 9);
    expect(r.breakdown.doseUnits).toBe(2);
  });

  it('T23 fat-protein units: 20 g fat + 30 g protein = 3.0 FPU (Pańkowska 2009)', () => {
    expect(fatProteinUnits(20, 30)).toBe(3);
    expect(fatProteinUnits(28, 16)).toBeCloseTo(3.16, 9);
    expect(fatProteinUnits(null, null)).toBeNull();
    expect(fatProteinUnits(20, null)).toBeCloseTo(1.8, 12);
    expect(fatProteinUnits(undefined, 30)).toBeCloseTo(1.2, 12);
  });
});
