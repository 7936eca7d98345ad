import { computeDose } from '../../shared/compute/dose';
import { DEFAULT_EXERCISE_REDUCTIONS } from '../../shared/compute/exercise';
import type { BenchContext, BenchModule } from './types';

async function call(ctx: BenchContext, method: string, path: string, body: unknown) {
  const res = await fetch(`${ctx.baseUrl}${path}`, {
    method,
    headers: { 'content-type': 'application/json', authorization: `Bearer ${ctx.member.token}` },
    body: JSON.stringify(body),
  });
  if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`);
}

/** Dose suggestions over HTTP (settings + day kind loaded each time) and the pure engine alone. */
export const scenarios: BenchModule['scenarios'] = async (ctx) => {
  const base = `/api/profiles/${ctx.member.profileId}`;
  await call(ctx, 'PUT', `${base}/settings`, {
    glucoseUnit: 'mmol_l', carbBasis: 'available', carbUnit: 'g', penIncrement: 0.5, rounding: 'down', maxDoseUnits: 15,
    actionTimeHours: 4, targetLow: 5, targetHigh: 8, correctionTarget: 6, hypoThreshold: 3.9, veryHigh: 15,
    allowNegativeCorrection: false, iobConvention: 'correction_only', exerciseReductions: DEFAULT_EXERCISE_REDUCTIONS,
  });
  await call(ctx, 'POST', `${base}/day-kinds`, {
    name: 'Rest', isDefault: true, longActingUnits: null, glucoseUnit: 'mmol_l',
    timesOfDay: [
      { from: '00:00', to: '11:00', carbRatio: 8, correctionFactor: 2 },
      { from: '11:00', to: '24:00', carbRatio: 10, correctionFactor: 2.5 },
    ],
  });
  const earlier = new Date(Date.now() - 90 * 60_000).toISOString();
  return [
    {
      kind: 'http',
      name: 'POST dose-suggestions (glucose, earlier dose, exercise)',
      method: 'POST',
      path: `${base}/dose-suggestions`,
      body: { carbsGrams: 62, glucose: 9.4, localTime: '12:30', earlierDoses: [{ units: 3, takenAt: earlier }], exercise: { intensity: 'moderate', durationMinutes: 45, startsInMinutes: 60 } },
    },
    { kind: 'http', name: 'GET day-kinds', path: `${base}/day-kinds` },
    {
      kind: 'task',
      name: 'computeDose (pure engine, 100k calls)',
      run: async () => {
        const settings = {
          penIncrement: 0.5, rounding: 'down' as const, maxDoseUnits: 15, actionTimeHours: 4, activeInsulinModel: 'linear' as const, targetLowMmol: 5, targetHighMmol: 8,
          correctionTargetMmol: 6, hypoThresholdMmol: 3.9, veryHighMmol: 15, allowNegativeCorrection: false,
          iobConvention: 'correction_only' as const, exerciseReductions: DEFAULT_EXERCISE_REDUCTIONS,
        };
        const kind = { id: 1, name: 'Rest', timesOfDay: [{ startMinute: 0, endMinute: 1440, carbRatio: 10, correctionFactorMmol: 2 }] };
        const t = Date.now();
        const start = process.hrtime.bigint();
        for (let i = 0; i < 100_000; i++) {
          computeDose(settings, kind, { carbsGrams: i % 120, glucose: { value: 9, unit: 'mmol_l', takenAt: t }, mealAt: t, mealMinuteOfDay: 750, earlierDoses: [{ units: 2, takenAt: t - 3_600_000 }] });
        }
        const ms = Number(process.hrtime.bigint() - start) / 1e6;
        return { figure: ((ms * 1000) / 100_000).toFixed(2), unit: 'µs per suggestion' };
      },
    },
  ];
};
