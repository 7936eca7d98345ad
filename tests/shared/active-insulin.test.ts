import fc from 'fast-check';
import { activeFraction, activeInsulin, peakMinutesFor, recentDoses, type ActiveInsulinModel } from '../../shared/compute/active-insulin';
import { profileSettingsInputSchema } from '../../shared/schemas/profile-settings';
import { TEST_DOSE_SETTINGS } from '../helpers/dose-settings';

const HOUR = 3_600_000;
const MIN = 60_000;
const T0 = Date.UTC(2026, 2, 1, 12, 0);
const MODELS: ActiveInsulinModel[] = ['linear', 'curve'];

/**
 * The curve, worked out independently of the product's closed form: activity a(t) = t·(1 − t/td)·e^(−t/τ)
 * (the model's definition), where τ puts the peak of a(t) at tp: a'(tp) = 0 gives (1 − 2tp/td) = tp(1 − tp/td)/τ,
 * so τ = tp(1 − tp/td) / (1 − 2tp/td). tp = 75 minutes (from memory, common practice), or 0.4 × td when that is
 * earlier. The active fraction is the activity still to come: ∫ₜ^td a ÷ ∫₀^td a, each integral by Simpson's rule
 * over 4000 intervals (error far below the 1e-6 the tests ask for).
 */
function curveBySimpson(minutes: number, actionMinutes: number): number {
  const tp = Math.min(75, 0.4 * actionMinutes);
  const tau = (tp * (1 - tp / actionMinutes)) / (1 - (2 * tp) / actionMinutes);
  const a = (t: number) => t * (1 - t / actionMinutes) * Math.exp(-t / tau);
  const simpson = (from: number, to: number, n = 4000) => {
    const h = (to - from) / n;
    let sum = a(from) + a(to);
    for (let i = 1; i < n; i++) sum += (i % 2 === 1 ? 4 : 2) * a(from + i * h);
    return (sum * h) / 3;
  };
  return simpson(minutes, actionMinutes) / simpson(0, actionMinutes);
}

describe('activeFraction at 1, 2 and 3 hours', () => {
  // Straight line: 1 − t/td, by hand (e.g. 4 h at 1 h: 1 − 60/240 = 3/4).
  it.each([
    { hours: 4, name: '3/4, 2/4, 1/4', at1: 3 / 4, at2: 2 / 4, at3: 1 / 4 },
    { hours: 5, name: '4/5, 3/5, 2/5', at1: 4 / 5, at2: 3 / 5, at3: 2 / 5 },
    { hours: 6, name: '5/6, 4/6, 3/6', at1: 5 / 6, at2: 4 / 6, at3: 3 / 6 },
  ])('straight line over $hours hours: $name', ({ hours, at1, at2, at3 }) => {
    expect(activeFraction(60, hours * 60, 'linear')).toBeCloseTo(at1, 12);
    expect(activeFraction(120, hours * 60, 'linear')).toBeCloseTo(at2, 12);
    expect(activeFraction(180, hours * 60, 'linear')).toBeCloseTo(at3, 12);
  });

  // Curve: the numbers are the Simpson integration above, rounded to 4 places (they check the integrator too).
  it.each([
    { hours: 4, at1: 0.7374, at2: 0.3417, at3: 0.0808 },
    { hours: 5, at1: 0.764, at2: 0.4106, at3: 0.1588 },
    { hours: 6, at1: 0.7793, at2: 0.4498, at3: 0.2082 },
  ])('curve over $hours hours (peak 75 min): $at1, $at2, $at3 by numerical integration', ({ hours, at1, at2, at3 }) => {
    const td = hours * 60;
    [
      [60, at1],
      [120, at2],
      [180, at3],
    ].forEach(([t, rounded]) => {
      expect(curveBySimpson(t, td)).toBeCloseTo(rounded, 4);
      expect(activeFraction(t, td, 'curve')).toBeCloseTo(curveBySimpson(t, td), 6);
    });
  });

  it('curve with a short action time (2.5 h) moves its peak to 0.4 × 150 = 60 minutes and still matches the integration', () => {
    expect(peakMinutesFor(150)).toBe(60);
    expect(peakMinutesFor(300)).toBe(75);
    expect(activeFraction(45, 150, 'curve')).toBeCloseTo(curveBySimpson(45, 150), 6);
    expect(activeFraction(90, 150, 'curve')).toBeCloseTo(curveBySimpson(90, 150), 6);
  });

  it('the default model, as the settings schema fills it in, counts 50 % active at 2 hours of a 4-hour action time (HSCNI, check-values §3.1)', () => {
    const { activeInsulinModel: _left, ...withoutModel } = TEST_DOSE_SETTINGS;
    const parsed = profileSettingsInputSchema.parse(withoutModel);

    expect(parsed.activeInsulinModel).toBe('linear');
    expect(activeFraction(120, 240, parsed.activeInsulinModel)).toBe(0.5);
  });

  it('the curve counts less than the straight line from about 55 minutes of a 4-hour action time (why it is not the default)', () => {
    expect(activeFraction(45, 240, 'curve')).toBeGreaterThan(activeFraction(45, 240, 'linear'));
    expect(activeFraction(60, 240, 'curve')).toBeLessThan(activeFraction(60, 240, 'linear'));
  });
});

describe('activeFraction at the ends of the action time', () => {
  it.each(MODELS)('%s: all of a dose at 0 minutes and before (a dose time after the moment asked about)', (model) => {
    expect(activeFraction(0, 240, model)).toBe(1);
    expect(activeFraction(-5, 240, model)).toBe(1);
  });

  it('straight line: 1 minute before the end of a 4-hour action time 1/240 is left, at the end nothing, 1 minute after nothing', () => {
    expect(activeFraction(239, 240, 'linear')).toBeCloseTo(1 / 240, 12);
    expect(activeFraction(240, 240, 'linear')).toBe(0);
    expect(activeFraction(241, 240, 'linear')).toBe(0);
  });

  it('curve: just before the end a little is left, at the end exactly nothing, just after nothing', () => {
    expect(activeFraction(230, 240, 'curve')).toBeGreaterThan(0);
    expect(activeFraction(230, 240, 'curve')).toBeCloseTo(curveBySimpson(230, 240), 6);
    expect(activeFraction(240, 240, 'curve')).toBe(0);
    expect(activeFraction(241, 240, 'curve')).toBe(0);
  });

  it.each(MODELS)('%s: no action time (0 or not a number) counts nothing', (model) => {
    expect(activeFraction(0, 0, model)).toBe(0);
    expect(activeFraction(30, Number.NaN, model)).toBe(0);
  });

  it.each(MODELS)('%s: falls monotonically and stays strictly between 0 and 1 inside the action time', (model) => {
    fc.assert(
      fc.property(fc.integer({ min: 120, max: 480 }), fc.double({ min: 0.01, max: 0.99, noNaN: true }), fc.double({ min: 0.01, max: 0.99, noNaN: true }), (td, a, b) => {
        const [early, late] = a <= b ? [a * td, b * td] : [b * td, a * td];
        expect(activeFraction(early, td, model)).toBeGreaterThanOrEqual(activeFraction(late, td, model) - 1e-12);
        expect(activeFraction(early, td, model)).toBeGreaterThan(0);
        expect(activeFraction(early, td, model)).toBeLessThan(1);
      }),
    );
  });
});

describe('activeInsulin', () => {
  it('adds two stacked doses: 4 units 1 h ago and 2 units 2 h ago on a 4-hour straight line = 4 × 3/4 + 2 × 1/2 = 4 units', () => {
    const doses = [
      { units: 4, takenAt: T0 - HOUR },
      { units: 2, takenAt: T0 - 2 * HOUR },
    ];

    expect(activeInsulin(doses, T0, 4, 'linear')).toBeCloseTo(4, 12);
    expect(activeInsulin(doses, T0, 4, 'curve')).toBeCloseTo(4 * curveBySimpson(60, 240) + 2 * curveBySimpson(120, 240), 6);
  });

  it('counts a dose taken right now in full, and ignores doses after the moment asked about and doses of 0 or fewer units', () => {
    expect(activeInsulin([{ units: 3, takenAt: T0 }], T0, 4, 'linear')).toBe(3);
    expect(activeInsulin([{ units: 3, takenAt: T0 + MIN }], T0, 4, 'linear')).toBe(0);
    expect(activeInsulin([{ units: -3, takenAt: T0 - 30 * MIN }, { units: 0, takenAt: T0 }], T0, 4, 'linear')).toBe(0);
  });

  it('uses the action time in hours: 2 units 90 minutes ago over 3 hours (180 min) → 2 × (1 − 90/180) = 1 unit', () => {
    expect(activeInsulin([{ units: 2, takenAt: T0 - 90 * MIN }], T0, 3, 'linear')).toBeCloseTo(1, 12);
  });
});

describe('recentDoses', () => {
  const dose = (minutesAgo: number, units = 1) => ({ units, takenAt: T0 - minutesAgo * MIN });

  it.each([
    { name: 'just inside the action time (239 min of 240): listed', doses: [dose(239)], listed: 1 },
    { name: 'exactly one action time old (240 min): not listed', doses: [dose(240)], listed: 0 },
    { name: 'just past the action time (241 min): not listed', doses: [dose(241)], listed: 0 },
    { name: 'taken exactly now: listed', doses: [dose(0)], listed: 1 },
    { name: 'after the moment asked about: not listed', doses: [dose(-1)], listed: 0 },
    { name: 'a dose of 0 units: not listed', doses: [dose(30, 0)], listed: 0 },
  ])('$name', ({ doses, listed }) => {
    expect(recentDoses(doses, T0, 4)).toHaveLength(listed);
  });
});
