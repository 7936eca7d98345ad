import { Op } from 'sequelize';
import { parseSr28 } from '../../server/importers/usda-sr28';
import { FoodMeasureModel, FoodModel } from '../../server/models';
import { SHIPPED_SR28_DIR } from '../../server/services/imports.service';
import { NUTRIENT_KEYS } from '../../shared/compute/nutrients';
import { openTestDatabase, restoreShippedFoods } from '../helpers/db';
import type { Sequelize } from 'sequelize';

// Counts from the README of the shipped files (data/usda-sr28/README.md, from the USDA SR28 ASCII release):
// 8,789 foods, 67,852 nutrient values, 15,438 household measures; 1,707 rows name a manufacturer.
let sequelize: Sequelize;
beforeAll(async () => {
  sequelize = await openTestDatabase();
  await restoreShippedFoods(sequelize);
});
afterAll(async () => {
  await sequelize.close();
});

const sr = async (code: string) => (await FoodModel.findOne({ where: { source: 'usda_sr28', sourceCode: code }, include: [{ model: FoodMeasureModel, as: 'measures' }] }))!;

describe('USDA SR28, every food (the files the product ships)', () => {
  it('reads every food, value and measure of the gzipped files, the last FOOD_DES line (no line ending) included', async () => {
    const parsed = await parseSr28(SHIPPED_SR28_DIR);

    expect(parsed.foods).toHaveLength(8789);
    expect(parsed.skipped.total).toBe(0);
    let values = 0;
    for (const f of parsed.foods) for (const k of NUTRIENT_KEYS) if (f.nutrients[k] != null && !f.derived.includes(k)) values += 1;
    expect(values).toBe(67852);
    expect(parsed.foods.reduce((n, f) => n + f.measures.length, 0)).toBe(15438);
    // The last line of FOOD_DES.txt (no CRLF after it): 93600 "Turtle, green, raw".
    expect(parsed.foods.at(-1)).toMatchObject({ sourceCode: '93600', name: 'Turtle, green, raw' });
    expect(parsed.foods.filter((f) => f.extra.manufacturer).length).toBe(1707);
  }, 60_000);

  it('is in the database beside IFCT 2017, each food with its source table and code', async () => {
    expect(await FoodModel.count({ where: { source: 'usda_sr28' } })).toBe(8789);
    expect(await FoodModel.count({ where: { source: 'ifct2017' } })).toBe(542);
    const srIds = (await FoodModel.findAll({ where: { source: 'usda_sr28' }, attributes: ['id'] })).map((f) => f.id);
    expect(await FoodMeasureModel.count({ where: { foodId: { [Op.in]: srIds } } })).toBe(15438);
  });

  it.each([
    // USDA SR28 NUT_DATA, nutrient 205 (carbohydrate by difference, fibre included), per 100 g.
    { code: '08120', name: 'Cereals, oats, regular and quick, not fortified, dry', carbTotal: 67.7 },
    { code: '09040', name: 'Bananas, raw', carbTotal: 22.84 },
  ])('keeps $code $name at $carbTotal g carbohydrate by difference per 100 g (USDA SR28)', async ({ code, name, carbTotal }) => {
    const food = await sr(code);
    expect(food.name).toBe(name);
    expect(food.carbTotal).toBeCloseTo(carbTotal, 9);
    expect(food.attribution).toMatch(/Standard Reference, Release 28/);
  });

  it('gives 01293 Greek yogurt, whole milk no household measure (USDA SR28 WEIGHT.txt has none)', async () => {
    const yogurt = await sr('01293');
    expect(yogurt.name).toBe('Yogurt, Greek, plain, whole milk');
    expect(yogurt.measures).toEqual([]);
  });

  it('keeps 20038 oats without a total sugars value as unknown, not 0 (USDA SR28 has no 269 row for it)', async () => {
    const oats = await sr('20038');
    expect(oats.name).toBe('Oats');
    expect(oats.sugars).toBeNull();
  });

  it('marks the manufacturer rows as branded and leaves generic foods unmarked', async () => {
    // USDA SR28 FOOD_DES: 01193 names Kraft Foods, Inc. as ManufacName; 09040 bananas has none.
    expect((await sr('01193')).extra).toMatchObject({ branded: true, manufacturer: 'Kraft Foods, Inc.' });
    expect((await sr('09040')).extra.branded).toBeUndefined();
  });

  it('has 594 foods with carbohydrate but no fibre value, whose available carbohydrate stays unknown', async () => {
    // Issue 11 and the shipped files: 594 SR28 foods have a 205 row and no 291 row.
    const rows = await FoodModel.findAll({ where: { source: 'usda_sr28', carbTotal: { [Op.ne]: null }, fibre: null } });
    expect(rows).toHaveLength(594);
    expect(rows.every((f) => f.carbAvailable === null)).toBe(true);
  });
});
