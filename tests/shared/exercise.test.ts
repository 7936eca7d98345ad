import { DEFAULT_EXERCISE_REDUCTIONS, exerciseReduction } from '../../shared/compute/exercise';

describe('exerciseReduction', () => {
  // Rabasa-Lhoret et al., Diabetes Care 2001;24(4):625–630 [C], via the Diabetes Spectrum table [C];
  // check-values §4.1 and cases T16–T18.
  it.each([
    { name: 'light, 30 min → 25 % (Diabetes Spectrum table)', intensity: 'light', durationMinutes: 30, percent: 25 },
    { name: 'light, 60 min → 50 % (T17, Rabasa-Lhoret 2001)', intensity: 'light', durationMinutes: 60, percent: 50 },
    { name: 'moderate, 30 min → 50 % (Rabasa-Lhoret 2001)', intensity: 'moderate', durationMinutes: 30, percent: 50 },
    { name: 'moderate, 60 min → 75 % (T16, Rabasa-Lhoret 2001)', intensity: 'moderate', durationMinutes: 60, percent: 75 },
    { name: 'hard, 30 min → 75 % (Rabasa-Lhoret 2001)', intensity: 'hard', durationMinutes: 30, percent: 75 },
  ] as const)('$name', ({ intensity, durationMinutes, percent }) => {
    const r = exerciseReduction({ intensity, durationMinutes, startsInMinutes: 90 });

    expect(r.percent).toBe(percent);
  });

  it('makes no automatic reduction for hard exercise of 60 minutes ("not established", Riddell 2017, from memory; T18)', () => {
    const r = exerciseReduction({ intensity: 'hard', durationMinutes: 60, startsInMinutes: 60 });

    expect(r).toMatchObject({ percent: 0, basis: 'not_established' });
  });

  it.each([
    { name: 'starting more than 3 hours after the meal', durationMinutes: 60, startsInMinutes: 181, basis: 'too_late' },
    { name: 'shorter than 20 minutes', durationMinutes: 19, startsInMinutes: 30, basis: 'too_short' },
  ])('makes no reduction for exercise $name', ({ durationMinutes, startsInMinutes, basis }) => {
    expect(exerciseReduction({ intensity: 'moderate', durationMinutes, startsInMinutes })).toMatchObject({ percent: 0, basis });
  });

  it('uses the 30-minute column up to 45 minutes and the 60-minute column beyond', () => {
    expect(exerciseReduction({ intensity: 'moderate', durationMinutes: 45, startsInMinutes: 0 }).basis).toBe('min30');
    expect(exerciseReduction({ intensity: 'moderate', durationMinutes: 46, startsInMinutes: 0 }).basis).toBe('min60');
  });

  it('uses the profile’s own table when it was edited', () => {
    const table = { ...DEFAULT_EXERCISE_REDUCTIONS, moderate: { min30: 30, min60: 40 } };

    expect(exerciseReduction({ intensity: 'moderate', durationMinutes: 60, startsInMinutes: 0 }, table).percent).toBe(40);
  });
});

describe('exerciseReduction notes (shown on the dose screen)', () => {
  it.each([
    { name: 'too late', exercise: { durationMinutes: 60, startsInMinutes: 200 }, note: 'Exercise starting more than 3 hours after the meal does not change the meal dose in the table.' },
    { name: 'too short', exercise: { durationMinutes: 10, startsInMinutes: 0 }, note: 'Exercise under 20 minutes is shorter than the table covers; no reduction made.' },
    { name: 'about 30 minutes', exercise: { durationMinutes: 30, startsInMinutes: 0 }, note: 'moderate exercise for about 30 minutes, starting within 3 hours.' },
    { name: 'about 60 minutes', exercise: { durationMinutes: 60, startsInMinutes: 0 }, note: 'moderate exercise for about 60 minutes, starting within 3 hours.' },
  ])('$name', ({ exercise, note }) => {
    expect(exerciseReduction({ intensity: 'moderate', ...exercise }).note).toBe(note);
  });

  it('says when nothing is established, and that longer sessions may need more', () => {
    expect(exerciseReduction({ intensity: 'hard', durationMinutes: 60, startsInMinutes: 0 }).note).toBe(
      'No reduction is established for this intensity and length; none made. Ask your diabetes team.',
    );
    expect(exerciseReduction({ intensity: 'light', durationMinutes: 120, startsInMinutes: 0 }).note).toBe(
      'light exercise for about 60 minutes, starting within 3 hours. Longer sessions than the table covers may need more; ask your diabetes team.',
    );
  });
});
