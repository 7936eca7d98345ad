import fc from 'fast-check';
import { activeFraction, activeInsulin, peakMinutesFor, recentDoses } from '../../shared/compute/active-insulin';

const HOUR = 3_600_000;
const T0 = Date.UTC(2026, 2, 1, 12, 0);

describe('activeFraction', () => {
  it.each([2, 3, 4, 5, 8])('is the whole dose at 0 and nothing at an action time of %i hours', (hours) => {
    expect(activeFraction(0, hours * 60)).toBe(1);
    expect(activeFraction(hours * 60, hours * 60)).toBe(0);
    expect(activeFraction(hours * 60 + 30, hours * 60)).toBe(0);
  });

  it('falls monotonically between 0 and the action time', () => {
    fc.assert(
      fc.property(fc.integer({ min: 120, max: 480 }), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (td, a, b) => {
        const [early, late] = a <= b ? [a * td, b * td] : [b * td, a * td];
        expect(activeFraction(early, td)).toBeGreaterThanOrEqual(activeFraction(late, td) - 1e-12);
      }),
    );
  });

  it('stays within 0 and 1 and is strictly between them inside the action time', () => {
    fc.assert(
      fc.property(fc.integer({ min: 120, max: 480 }), fc.double({ min: 0.01, max: 0.99, noNaN: true }), (td, f) => {
        const v = activeFraction(f * td, td);
        expect(v).toBeGreaterThan(0);
        expect(v).toBeLessThan(1);
      }),
    );
  });

  it('keeps more than a straight line would early on (it does not under-count a fresh dose)', () => {
    expect(activeFraction(30, 240)).toBeGreaterThan(1 - 30 / 240);
  });

  it('moves the peak earlier for short action times so the curve stays valid', () => {
    expect(peakMinutesFor(300)).toBe(75);
    expect(peakMinutesFor(120)).toBe(48);
  });
});

describe('activeInsulin', () => {
  it('adds two stacked doses', () => {
    const a = { units: 4, takenAt: T0 - HOUR };
    const b = { units: 2, takenAt: T0 - 2 * HOUR };

    const both = activeInsulin([a, b], T0, 4);

    expect(both).toBeCloseTo(activeInsulin([a], T0, 4) + activeInsulin([b], T0, 4), 12);
    expect(both).toBeCloseTo(4 * activeFraction(60, 240) + 2 * activeFraction(120, 240), 12);
  });

  it('counts a dose taken right now in full and ignores doses after the moment asked about', () => {
    expect(activeInsulin([{ units: 3, takenAt: T0 }], T0, 4)).toBe(3);
    expect(activeInsulin([{ units: 3, takenAt: T0 + 60_000 }], T0, 4)).toBe(0);
  });

  it('lists only doses within the action time as recent', () => {
    const doses = [
      { units: 1, takenAt: T0 - 3 * HOUR },
      { units: 2, takenAt: T0 - 5 * HOUR },
    ];

    expect(recentDoses(doses, T0, 4)).toEqual([doses[0]]);
  });
});
