import { computeDose, findTimeOfDay, roundToIncrement, TREAT_LOW_GUIDANCE, type DayKindRatios, type DoseInput, type TimeOfDay } from '../../shared/compute/dose';
import { engineSettings } from '../helpers/dose-settings';

// Dose-engine edges that mutation testing (npm run mutate, 2 December 2026) found untested. Settings are the invented
// ones of tests/helpers/dose-settings.ts: range 5–8, correction to 6, factor 2 mmol/L per unit, ratio 10 g per unit.
const T0 = Date.UTC(2026, 2, 1, 12, 0);
const MIN = 60_000;
const input = (over: Partial<DoseInput> = {}): DoseInput => ({ carbsGrams: 60, mealAt: T0, mealMinuteOfDay: 720, ...over });
const rest: DayKindRatios = { id: 1, name: 'Rest', timesOfDay: [{ startMinute: 0, endMinute: 1440, carbRatio: 10, correctionFactorMmol: 2 }] };

describe('findTimeOfDay with times of day not in time order', () => {
  const timeOfDay = (startMinute: number, endMinute: number, carbRatio: number): TimeOfDay => ({ startMinute, endMinute, carbRatio, correctionFactorMmol: 2 });

  it.each([
    { name: 'minute 100 is in the morning time of day even when the afternoon one is listed first', timesOfDay: [timeOfDay(660, 1440, 12), timeOfDay(0, 660, 8)], minute: 100, ratio: 8 },
    { name: 'minute 100 is before a time of day that starts at 600: none', timesOfDay: [timeOfDay(600, 1440, 12)], minute: 100, ratio: undefined },
  ])('$name', ({ timesOfDay, minute, ratio }) => {
    expect(findTimeOfDay(timesOfDay, minute)?.carbRatio).toBe(ratio);
  });
});

describe('roundToIncrement of something that is not a number', () => {
  it('gives 0 units, never NaN', () => {
    expect(roundToIncrement(Number.NaN, 0.5, 'down')).toBe(0);
    expect(roundToIncrement(Number.NaN, 0.5, 'nearest')).toBe(0);
  });
});

describe('the treat-the-low warning, word for word', () => {
  it('is in danger tone without settings and says the whole guidance', () => {
    const r = computeDose(null, null, input({ glucose: { value: 3.0, unit: 'mmol_l', takenAt: T0 } }));
    const low = r.warnings.find((w) => w.code === 'treat_low');

    expect(low?.tone).toBe('danger');
    expect(low?.message).toBe(TREAT_LOW_GUIDANCE);
    expect(TREAT_LOW_GUIDANCE).toMatch(/^Treat the low first: take 15–20 g of fast-acting carbohydrate/);
    expect(TREAT_LOW_GUIDANCE).toMatch(/then eat your meal and check again before any insulin \(ADA Standards of Care, hypoglycaemia treatment\)\.$/);
  });
});

describe('the negative correction, named', () => {
  it('says below_range_negative: 4.5 mmol/L against 6 with 2 mmol/L per unit → (4.5 − 6) ÷ 2 = −0.75 units', () => {
    const r = computeDose(engineSettings({ allowNegativeCorrection: true }), rest, input({ glucose: { value: 4.5, unit: 'mmol_l', takenAt: T0 - 5 * MIN } }));

    if (r.status !== 'ok') throw new Error(`expected a dose, got ${r.status}`);
    expect(r.breakdown.correctionReason).toBe('below_range_negative');
    expect(r.breakdown.correctionUnits).toBeCloseTo(-0.75, 12);
  });
});
