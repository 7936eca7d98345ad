import fs from 'node:fs';
import path from 'node:path';
import { FoodMeasureModel, FoodModel } from '../../server/models';
import { runImport } from '../../server/services/imports.service';
import { useTestApp } from '../helpers/api';

const dataDir = process.env.CARBWRIGHT_SAMPLE_DATA ?? path.resolve(__dirname, '../../../shared/data');
const sr28Dir = path.join(dataDir, 'sr28-sample');
const fdcDir = path.join(dataDir, 'fdc-csv-sample');
const present = fs.existsSync(path.join(sr28Dir, 'FOOD_DES.txt')) && fs.existsSync(path.join(fdcDir, 'food.csv'));
if (!present) console.warn(`USDA sample tests skipped: ${sr28Dir} and ${fdcDir} not found (set CARBWRIGHT_SAMPLE_DATA).`);

const ctx = useTestApp();

const food = (source: 'usda_sr28' | 'usda_fdc', sourceCode: string) =>
  FoodModel.findOne({ where: { source, sourceCode }, include: [{ model: FoodMeasureModel, as: 'measures' }] });
const fdcByNdb = async (ndb: string) => FoodModel.findOne({ where: { source: 'usda_fdc', extra: { ndbNumber: ndb } } });

(present ? describe : describe.skip)('USDA samples (150 foods in the SR28 and FoodData Central layouts)', () => {
  beforeAll(async () => {
    await runImport(ctx.sequelize, 'sr28', sr28Dir);
    await runImport(ctx.sequelize, 'fdc', fdcDir);
  });

  it('imports all 150 foods from each layout with their household measures', async () => {
    expect(await FoodModel.count({ where: { source: 'usda_sr28' } })).toBe(150);
    expect(await FoodModel.count({ where: { source: 'usda_fdc' } })).toBe(150);
    // sr28-sample README: 499 household measures; fdc-csv-sample README: 500 portions
    const measures = async (source: string) =>
      FoodMeasureModel.count({ include: [{ model: FoodModel, as: 'food', where: { source } }] });
    expect(await measures('usda_sr28')).toBe(499);
    expect(await measures('usda_fdc')).toBe(500);
  });

  it('stores raw bananas with the published values, carbohydrate by difference as total and available derived', async () => {
    const sr = await food('usda_sr28', '09040');
    const fdc = await food('usda_fdc', '173944');

    // USDA SR28 (May 2016) NDB 09040 "Bananas, raw": 205 = 22.84 g, 208 = 89 kcal, 268 = 371 kJ, 291 = 2.6 g, 269 = 12.23 g
    for (const f of [sr!, fdc!]) {
      expect(f.name).toBe('Bananas, raw');
      expect(f.carbMeasured).toBe('total');
      expect(f.carbTotal).toBe(22.84);
      expect(f.fibre).toBe(2.6);
      expect(f.carbAvailable).toBeCloseTo(20.24, 9);
      expect(f.energyKcal).toBe(89);
      expect(f.energyKj).toBe(371);
      expect(f.sugars).toBe(12.23);
      expect(f.derived).toEqual(['carbAvailable']);
    }
    // SR28 WEIGHT.txt and FDC food_portion.csv (SR Legacy 2019-04-01): 1 medium banana = 118 g
    expect(sr!.measures!.find((m) => m.label.startsWith('1 medium'))!.grams).toBe(118);
    expect(fdc!.measures!.find((m) => m.label.startsWith('1 medium'))!.grams).toBe(118);
    expect(sr!.extra.scientificName).toBe('Musa acuminata Colla');
  });

  it('derives available carbohydrate for rolled oats as 67.70 − 10.1 = 57.60 g', async () => {
    const oats = await food('usda_sr28', '08120');

    // check-values.md §1.3: SR Legacy NDB 08120, 67.70 − 10.1 = 57.60 g/100 g
    expect(oats!.carbTotal).toBe(67.7);
    expect(oats!.carbAvailable).toBeCloseTo(57.6, 9);
  });

  it('accepts sugars above carbohydrate by difference (whole milk) and keeps a missing nutrient unknown', async () => {
    const milk = await food('usda_sr28', '01077');
    const coconutMilk = await food('usda_sr28', '12118');
    const greekYogurt = await food('usda_sr28', '01293');

    // datasets.md §4: USDA whole milk 5.05 g sugars, 4.80 g carbohydrate
    expect(milk!.sugars).toBe(5.05);
    expect(milk!.carbTotal).toBe(4.8);
    // sr28-sample README: 12118 has neither total sugars (269) nor fibre (291)
    expect(coconutMilk!.sugars).toBeNull();
    expect(coconutMilk!.fibre).toBeNull();
    expect(coconutMilk!.carbTotal).toBe(2.81);
    expect(coconutMilk!.carbAvailable).toBeNull();
    expect(greekYogurt!.measures).toEqual([]);
  });

  it('gives identical nutrient values for every food in the two layouts', async () => {
    const srFoods = await FoodModel.findAll({ where: { source: 'usda_sr28' } });
    const fdcFoods = await FoodModel.findAll({ where: { source: 'usda_fdc' } });
    const fdcByNdbNumber = new Map(fdcFoods.map((f) => [f.extra.ndbNumber, f]));

    expect(fdcByNdbNumber.size).toBe(150);
    for (const sr of srFoods) {
      const twin = fdcByNdbNumber.get(sr.sourceCode);
      expect(twin).toBeDefined();
      for (const key of ['energyKcal', 'energyKj', 'carbAvailable', 'carbTotal', 'fibre', 'sugars', 'protein', 'fat', 'water'] as const) {
        expect({ code: sr.sourceCode, key, value: twin![key] }).toEqual({ code: sr.sourceCode, key, value: sr[key] });
      }
      expect(twin!.foodGroup).toBe(sr.foodGroup);
    }
    expect((await fdcByNdb('20038'))!.carbTotal).toBe(66.27);
  });

  it('changes nothing on a re-import of either layout', async () => {
    const before = await FoodModel.findAll({ order: [['id', 'ASC']], raw: true });
    const measuresBefore = await FoodMeasureModel.count();

    const sr = await runImport(ctx.sequelize, 'sr28', sr28Dir);
    const fdc = await runImport(ctx.sequelize, 'fdc', fdcDir);

    expect(sr).toMatchObject({ rowsInserted: 0, rowsUpdated: 0, rowsUnchanged: 150 });
    expect(fdc).toMatchObject({ rowsInserted: 0, rowsUpdated: 0, rowsUnchanged: 150 });
    expect(await FoodModel.findAll({ order: [['id', 'ASC']], raw: true })).toEqual(before);
    expect(await FoodMeasureModel.count()).toBe(measuresBefore);
  });
});
