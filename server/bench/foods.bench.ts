import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { parse } from 'csv-parse/sync';
import { parseFdc } from '../importers/usda-fdc';
import { FoodModel } from '../models';
import { ensureDefaultDatasets, runImport } from '../services/imports.service';
import { copyFloorMs } from './copy-floor';
import type { BenchModule, HttpScenario } from './types';

const TARGET_FOODS = 10_000;
const VARIETY = ['garden', 'market', 'organic', 'local', 'heritage', 'valley', 'hill', 'coastal', 'northern', 'southern', 'winter', 'summer'];

const quote = (rows: string[][]) => rows.map((r) => r.map((c) => `"${c.replace(/"/g, '""')}"`).join(',')).join('\n') + '\n';

/** The FDC sample (or, without it, the invented fixture) repeated with varied names up to 10,000 foods, in a temp folder. */
function buildLargeFdcFolder(): { dir: string; seed: string } {
  const shared = process.env.CARBWRIGHT_SAMPLE_DATA ?? path.resolve(__dirname, '../../../shared/data');
  const sample = path.join(shared, 'fdc-csv-sample');
  const seed = fs.existsSync(path.join(sample, 'food.csv')) ? sample : path.resolve(__dirname, '../../tests/fixtures/foods/fdc-mini');
  const read = (f: string) => parse(fs.readFileSync(path.join(seed, f)), { relax_column_count: true }) as string[][];
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-bench-fdc-'));
  for (const f of ['nutrient.csv', 'measure_unit.csv', 'food_category.csv']) fs.copyFileSync(path.join(seed, f), path.join(dir, f));
  const [foodHead, ...foods] = read('food.csv');
  const [nutHead, ...nutrients] = read('food_nutrient.csv');
  const [portionHead, ...portions] = read('food_portion.csv');
  const legacy = foods.filter((f) => f[1] === 'sr_legacy_food');
  const reps = Math.ceil(TARGET_FOODS / legacy.length);
  const outFoods = [foodHead];
  const outNut = [nutHead];
  const outPortions = [portionHead];
  let nid = 1;
  for (let r = 0; r < reps; r++) {
    for (const f of legacy) {
      if (outFoods.length > TARGET_FOODS) break;
      const id = String(5_000_000 + r * 10_000 + Number(f[0]) % 10_000);
      outFoods.push([id, f[1], `${f[2]}, ${VARIETY[r % VARIETY.length]} lot ${r}`, f[3], f[4] ?? '']);
      for (const n of nutrients.filter((x) => x[1] === f[0])) outNut.push([String(nid++), id, ...n.slice(2)]);
      for (const p of portions.filter((x) => x[1] === f[0])) outPortions.push([String(nid++), id, ...p.slice(2)]);
    }
  }
  fs.writeFileSync(path.join(dir, 'food.csv'), quote(outFoods));
  fs.writeFileSync(path.join(dir, 'food_nutrient.csv'), quote(outNut));
  fs.writeFileSync(path.join(dir, 'food_portion.csv'), quote(outPortions));
  return { dir, seed };
}

/**
 * Food search latency on the shipped tables (IFCT 2017 + USDA SR28, about 9,300 foods) and on a generated
 * 10,000-food table; the default tables' first import and the restart check; FDC import throughput.
 */
export const scenarios: BenchModule['scenarios'] = async (ctx) => {
  const firstStart = Date.now();
  await ensureDefaultDatasets(ctx.sequelize);
  const firstMs = Date.now() - firstStart;
  const { dir, seed } = buildLargeFdcFolder();
  const first = await runImport(ctx.sequelize, 'fdc', dir);
  const shipped = await FoodModel.count({ where: { source: ['ifct2017', 'usda_sr28'] } });
  const searches = (label: string, source: string | null, queries: string[][]): HttpScenario[] =>
    queries.map(([q, kind]) => ({
      kind: 'http',
      target: 'search',
      name: `GET /api/foods ${kind} "${q}" (${label})`,
      path: `/api/foods?q=${encodeURIComponent(q)}${source ? `&source=${source}` : ''}&limit=20`,
    }));
  const rate = (rows: number, ms: number) => Math.round((rows / ms) * 1000).toLocaleString('en');
  const list = [
    ...searches(`shipped tables, ${shipped.toLocaleString('en')} foods`, null, [
      ['oats', 'word'],
      ['greek yogurt', 'two words'],
      ['bananna', 'typo'],
      ['porridge', 'synonym'],
      ['ric', 'prefix'],
    ]),
    ...searches(`generated table, ${first.rowsInserted.toLocaleString('en')} foods`, 'usda_fdc', [
      ['banana', 'word'],
      ['bananna', 'typo'],
      ['ric', 'prefix'],
    ]),
  ];
  // One request each first, so the first figure is not a cold cache and plan.
  for (const sc of list) await fetch(`${ctx.baseUrl}${sc.path}`, { headers: { authorization: `Bearer ${ctx.member.token}` } });
  return [
    ...list,
    { kind: 'http', name: 'GET /api/foods/:id (one food with measures)', path: `/api/foods/1` },
    {
      kind: 'task',
      name: 'default tables, first import (IFCT 2017 + USDA SR28, reading and writing)',
      run: async () => ({ figure: (firstMs / 1000).toFixed(1), unit: 's' }),
    },
    {
      kind: 'task',
      name: 'default tables, restart check (nothing to import)',
      run: async () => {
        const start = Date.now();
        await ensureDefaultDatasets(ctx.sequelize);
        return { figure: String(Date.now() - start), unit: 'ms' };
      },
    },
    {
      kind: 'task',
      name: `FDC import, first load (${first.rowsInserted} foods, ${first.rowsRead} rows read, seed ${path.basename(seed)})`,
      run: async () => ({ figure: rate(first.rowsRead, first.durationMs ?? 1), unit: 'rows/s' }),
    },
    {
      kind: 'task',
      name: 'FDC import, re-import of the same files (nothing changes)',
      run: async () => {
        const again = await runImport(ctx.sequelize, 'fdc', dir);
        return { figure: rate(again.rowsRead, again.durationMs ?? 1), unit: 'rows/s' };
      },
    },
    {
      kind: 'task',
      name: 'floor: FDC files read and checked only, no database',
      run: async () => {
        const start = Date.now();
        const parsed = await parseFdc(dir);
        return { figure: rate(parsed.rowsRead, Date.now() - start), unit: 'rows/s' };
      },
    },
    {
      kind: 'task',
      name: `FDC import, first load, against its floor: a plain COPY of the same ${first.rowsInserted} food rows and their measures`,
      run: async () => {
        const parsed = await parseFdc(dir);
        fs.rmSync(dir, { recursive: true, force: true });
        const copyMs = await copyFloorMs(ctx.sequelize, parsed);
        const ratio = (first.durationMs ?? 0) / copyMs;
        return { figure: `${ratio.toFixed(1)}× (import ${first.durationMs} ms, COPY ${Math.round(copyMs)} ms)`, unit: '', target: '≤ 3×', met: ratio <= 3 };
      },
    },
  ];
};
