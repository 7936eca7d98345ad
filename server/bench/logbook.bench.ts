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
  const period = { from: '2025-12-01', to: '2025-12-31' };
  if (process.env.BENCH_EXPLAIN) await explain(ctx, period);
  return period;
}

/** BENCH_EXPLAIN=1 prints the plans of the history and period queries on this volume (README, logbook). */
async function explain(ctx: BenchContext, { from, to }: { from: string; to: string }) {
  const live = `profile_id = ${ctx.member.profileId} AND deleted_at IS NULL`;
  const queries = {
    'history page': `SELECT id FROM log_entries WHERE ${live} ORDER BY occurred_at DESC, id DESC LIMIT 51`,
    'meals in a month': `SELECT id FROM log_entries WHERE ${live} AND kind IN ('meal') AND local_date BETWEEN '${from}' AND '${to}' ORDER BY occurred_at DESC, id DESC LIMIT 51`,
    'period (charts, review)': `SELECT id FROM log_entries WHERE ${live} AND local_date BETWEEN '${from}' AND '${to}' ORDER BY occurred_at, id`,
  };
  for (const [name, sql] of Object.entries(queries)) {
    const [plan] = await ctx.sequelize.query(`EXPLAIN (ANALYZE, BUFFERS) ${sql}`);
    console.log(`-- ${name}\n${(plan as { 'QUERY PLAN': string }[]).map((r) => r['QUERY PLAN']).join('\n')}`);
  }
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
