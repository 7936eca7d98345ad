import type { BenchModule } from './types';

/**
 * Log a meal: one transaction writing a typed meal, its reading and a two-part dose with the suggestion shown (four
 * rows and their local date, minute and day kind), as the breakfast flow saves it.
 */
export const scenarios: BenchModule['scenarios'] = async (ctx) => {
  const suggestion = { status: 'ok', caution: { version: 'bench' }, engineVersion: 'bench', breakdown: { doseUnits: 4.5 } };
  return [
    {
      kind: 'http',
      name: 'POST log-entries/meals (typed meal, reading, two-part dose)',
      method: 'POST',
      path: `/api/profiles/${ctx.member.profileId}/log-entries/meals`,
      body: { meal: { source: 'typed', carbsGrams: 45, note: 'Porridge' }, reading: { glucose: 7.4 }, doses: [{ units: 3 }, { units: 1.5 }], suggestion },
    },
  ];
};
