/**
 * Active insulin ("insulin on board") from earlier rapid-acting doses, by one of two models chosen per profile.
 *
 * linear (the default): the active fraction falls in a straight line from 1 at the dose to 0 at the action time.
 * With a 4-hour action time it counts 50 % active at 2 hours, the figure of the education source the project
 * cites (HSCNI "Blood glucose correction": "50 % of rapid-acting insulin is still active for 2 hours").
 *
 * curve: an exponential insulin-activity model with a finite action time td and a peak tp
 * (activity ∝ t·(1 − t/td)·e^(−t/τ), integrated and normalised so the active fraction is exactly 1 at 0 and 0
 * at td; τ follows from tp and td). It counts more than the line in the first hour and less after that
 * (README, dose section, has the table), so it is not the default.
 */

export const ACTIVE_INSULIN_MODELS = ['linear', 'curve'] as const;
export type ActiveInsulinModel = (typeof ACTIVE_INSULIN_MODELS)[number];

/** Peak activity of a rapid-acting analogue for the curve, minutes (about 1–1.5 h after injection — from memory, common practice). */
export const RAPID_PEAK_MINUTES = 75;

/** The curve needs the peak before half the action time; short action times move the peak earlier. */
export function peakMinutesFor(actionTimeMinutes: number): number {
  return Math.min(RAPID_PEAK_MINUTES, actionTimeMinutes * 0.4);
}

function curveFraction(t: number, td: number): number {
  const tp = peakMinutesFor(td);
  const tau = (tp * (1 - tp / td)) / (1 - (2 * tp) / td);
  const a = (2 * tau) / td;
  const s = 1 / (1 - a + (1 + a) * Math.exp(-td / tau));
  const value = 1 - s * (1 - a) * ((t * t / (tau * td * (1 - a)) - t / tau - 1) * Math.exp(-t / tau) + 1);
  return Math.min(1, Math.max(0, value));
}

/**
 * Fraction (0–1) of a dose still active `minutesSince` after it was taken, for an action time in
 * minutes, by the given model. 1 at or before 0 minutes, 0 at or after the action time.
 */
export function activeFraction(minutesSince: number, actionTimeMinutes: number, model: ActiveInsulinModel): number {
  if (!(actionTimeMinutes > 0)) return 0;
  if (minutesSince <= 0) return 1;
  if (minutesSince >= actionTimeMinutes) return 0;
  return model === 'curve' ? curveFraction(minutesSince, actionTimeMinutes) : 1 - minutesSince / actionTimeMinutes;
}

export type EarlierDose = { units: number; takenAt: number };

/**
 * Units still active at `at` (epoch ms) from earlier doses (units, takenAt epoch ms), for an action
 * time in hours, by the given model. Doses after `at` are ignored; doses add up.
 */
export function activeInsulin(doses: readonly EarlierDose[], at: number, actionTimeHours: number, model: ActiveInsulinModel): number {
  const td = actionTimeHours * 60;
  let sum = 0;
  for (const d of doses) {
    if (d.takenAt > at || !(d.units > 0)) continue;
    sum += d.units * activeFraction((at - d.takenAt) / 60_000, td, model);
  }
  return sum;
}

/** Doses taken within the action time before `at` (what the "insulin still working" warning lists). */
export function recentDoses<T extends EarlierDose>(doses: readonly T[], at: number, actionTimeHours: number): T[] {
  const td = actionTimeHours * 3_600_000;
  return doses.filter((d) => d.units > 0 && d.takenAt <= at && at - d.takenAt < td);
}
