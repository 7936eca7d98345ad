import type { CreationAttributes } from 'sequelize';
import { LogEntryModel } from '../models';
import type { BenchContext, BenchModule } from './types';

const DAY = 86_400_000;
const DAYS = 365;

/**
 * A year of logbook on the bench member (UTC profile): three meals a day, each with its reading before and its dose,
 * a long-acting dose, and a sensor reading every 15 minutes — about 38,000 entries.
 */
async function fillYear(ctx: BenchContext): Promise<{ from: string; to: string }> {
  const start = Date.UTC(2025, 0, 1);
  const rows: CreationAttributes<LogEntryModel>[] = [];
  const at = (t: number) => {
    const d = new Date(t);
    return { occurredAt: d, localDate: d.toISOString().slice(0, 10), localMinute: d.getUTCHours() * 60 + d.getUTCMinutes(), timeZone: 'UTC' };
  };
  const profileId = ctx.member.profileId;
  for (let day = 0; day < DAYS; day++) {
    const base = start + day * DAY;
    for (let q = 0; q < 96; q++) {
      rows.push({ profileId, kind: 'reading', ...at(base + q * 15 * 60_000), glucoseMmol: 5 + ((day * 7 + q * 3) % 80) / 10, readingSource: 'imported' });
    }
    for (const [minute, carb] of [[450, 45], [750, 70], [1110, 60]] as const) {
      rows.push({ profileId, kind: 'reading', ...at(base + (minute - 5) * 60_000), glucoseMmol: 6.2, readingSource: 'typed' });
      rows.push({ profileId, kind: 'meal', ...at(base + minute * 60_000), title: 'Bench meal', mealSource: 'typed', carbAvailableG: carb, carbTotalG: carb + 5 });
      rows.push({ profileId, kind: 'rapid_dose', ...at(base + minute * 60_000), units: carb / 10, suggestion: { breakdown: { doseUnits: carb / 10 } } });
    }
    rows.push({ profileId, kind: 'long_dose', ...at(base + 22 * 60 * 60_000), units: 14 });
  }
  for (let i = 0; i < rows.length; i += 5000) await LogEntryModel.bulkCreate(rows.slice(i, i + 5000));
  await ctx.sequelize.query('ANALYZE log_entries');
  return { from: '2025-12-01', to: '2025-12-31' };
}

/** The logbook's reading side on a year of entries: a history page, a filtered page, charts and review for a month. */
export const scenarios: BenchModule['scenarios'] = async (ctx) => {
  const { from, to } = await fillYear(ctx);
  const base = `/api/profiles/${ctx.member.profileId}/logbook`;
  return [
    { kind: 'http', name: 'GET logbook/history (newest 50, year of entries)', path: `${base}/history` },
    { kind: 'http', name: 'GET logbook/history (meals in a month, 50)', path: `${base}/history?kinds=meal&from=${from}&to=${to}` },
    { kind: 'http', name: 'GET logbook/charts (a month)', path: `${base}/charts?from=${from}&to=${to}` },
    { kind: 'http', name: 'GET logbook/review (a month)', path: `${base}/review?from=${from}&to=${to}` },
  ];
};
