import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ImportFileError } from '../../server/importers/import-error';
import { DatasetImportModel, FoodMeasureModel, FoodModel } from '../../server/models';
import { runImport, type ImportKind } from '../../server/services/imports.service';
import { useTestApp } from '../helpers/api';

const FIXTURES = path.resolve(__dirname, '../fixtures/foods');

const ctx = useTestApp();

/** A private copy of a fixture folder, with `change` applied to it. */
function brokenCopy(folder: string, change: (dir: string) => void): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-import-'));
  for (const f of fs.readdirSync(path.join(FIXTURES, folder))) fs.copyFileSync(path.join(FIXTURES, folder, f), path.join(dir, f));
  change(dir);
  return dir;
}
const edit = (dir: string, file: string, fn: (text: string) => string, encoding: BufferEncoding = 'utf8') =>
  fs.writeFileSync(path.join(dir, file), fn(fs.readFileSync(path.join(dir, file), encoding)), encoding);

describe('importing the invented fixtures', () => {
  it('reads the FoodData Central layout: SR Legacy foods only, unused nutrients ignored, portions kept', async () => {
    const result = await runImport(ctx.sequelize, 'fdc', path.join(FIXTURES, 'fdc-mini'));

    expect(result).toMatchObject({ status: 'succeeded', rowsInserted: 2, rowsSkipped: 2 });
    expect(JSON.stringify(result.report)).toContain('branded_food');
    const fruit = await FoodModel.findOne({ where: { source: 'usda_fdc', sourceCode: '900001' }, include: [{ model: FoodMeasureModel, as: 'measures' }] });
    // Invented fixture values: carbohydrate by difference 12.5, fibre 2.0 → available 10.5
    expect(fruit).toMatchObject({ name: 'Testfruit, purée, raw', carbTotal: 12.5, fibre: 2, carbAvailable: 10.5, foodGroup: 'Fruits and Fruit Juices' });
    expect(fruit!.measures!.map((m) => [m.label, m.grams])).toEqual([['1 medium', 118], ['0.5 cup', 75]]);
    const grain = await FoodModel.findOne({ where: { source: 'usda_fdc', sourceCode: '900002' } });
    expect(grain).toMatchObject({ carbTotal: 70, fibre: null, carbAvailable: null, sugars: null });
  });

  it('reads the SR28 layout (Latin-1, CRLF) into the same values as the FoodData Central layout', async () => {
    await runImport(ctx.sequelize, 'sr28', path.join(FIXTURES, 'sr28-mini'));

    const sr = await FoodModel.findOne({ where: { source: 'usda_sr28', sourceCode: '99001' }, include: [{ model: FoodMeasureModel, as: 'measures' }] });
    const fdc = await FoodModel.findOne({ where: { source: 'usda_fdc', sourceCode: '900001' } });
    expect(sr!.name).toBe('Testfruit, purée, raw');
    expect(sr!.altNames).toEqual(['test berry']);
    for (const key of ['energyKcal', 'energyKj', 'carbAvailable', 'carbTotal', 'fibre', 'sugars', 'protein', 'fat', 'water'] as const) {
      expect([key, sr![key]]).toEqual([key, fdc![key]]);
    }
    expect(sr!.measures!.map((m) => [m.label, m.grams]).sort()).toEqual([['0.5 cup', 75], ['1 medium', 118]]);
  });
});

type BadCase = { name: string; kind: ImportKind; folder: string; change: (dir: string) => void; file: string; line: number | null; column: string | null };

const SR_LATIN1 = 'latin1' as const;
const badCases: BadCase[] = [
  {
    name: 'FDC food_nutrient.csv without its amount column',
    kind: 'fdc', folder: 'fdc-mini', file: 'food_nutrient.csv', line: 1, column: 'amount',
    change: (d) => edit(d, 'food_nutrient.csv', (t) => t.split('\n').map((l) => l.split(',').filter((_, i) => i !== 3).join(',')).join('\n')),
  },
  {
    name: 'FDC non-numeric amount',
    kind: 'fdc', folder: 'fdc-mini', file: 'food_nutrient.csv', line: 4, column: 'amount',
    change: (d) => edit(d, 'food_nutrient.csv', (t) => t.replace('"12.5"', '"12,5 g"')),
  },
  {
    name: 'FDC value for a nutrient id not in nutrient.csv',
    kind: 'fdc', folder: 'fdc-mini', file: 'food_nutrient.csv', line: 5, column: 'nutrient_id',
    change: (d) => edit(d, 'food_nutrient.csv', (t) => t.replace('"900001","1079"', '"900001","1999"')),
  },
  {
    name: 'FDC truncated food_portion.csv (cut inside a quoted field)',
    kind: 'fdc', folder: 'fdc-mini', file: 'food_portion.csv', line: 4, column: null,
    change: (d) => edit(d, 'food_portion.csv', (t) => t.slice(0, t.lastIndexOf('"cup"') + 3)),
  },
  {
    name: 'FDC truncated food_nutrient.csv (cut at a field boundary)',
    kind: 'fdc', folder: 'fdc-mini', file: 'food_nutrient.csv', line: 17, column: 'amount',
    change: (d) => edit(d, 'food_nutrient.csv', (t) => t.slice(0, t.lastIndexOf('"1005"') + 6)),
  },
  {
    name: 'FDC wrong file altogether (nutrient.csv saved as food.csv)',
    kind: 'fdc', folder: 'fdc-mini', file: 'food.csv', line: 1, column: 'fdc_id',
    change: (d) => fs.copyFileSync(path.join(d, 'nutrient.csv'), path.join(d, 'food.csv')),
  },
  {
    name: 'FDC folder without food_portion.csv',
    kind: 'fdc', folder: 'fdc-mini', file: 'food_portion.csv', line: null, column: null,
    change: (d) => fs.rmSync(path.join(d, 'food_portion.csv')),
  },
  {
    name: 'SR28 NUT_DATA.txt line with a missing field',
    kind: 'sr28', folder: 'sr28-mini', file: 'NUT_DATA.txt', line: 2, column: 'CC',
    change: (d) => edit(d, 'NUT_DATA.txt', (t) => t.replace('~99001~^~268~^209^', '~99001~^~268~^'), SR_LATIN1),
  },
  {
    name: 'SR28 non-numeric Nutr_Val',
    kind: 'sr28', folder: 'sr28-mini', file: 'NUT_DATA.txt', line: 3, column: 'Nutr_Val',
    change: (d) => edit(d, 'NUT_DATA.txt', (t) => t.replace('^12.50^', '^twelve^'), SR_LATIN1),
  },
  {
    name: 'SR28 value for a nutrient number not in NUTR_DEF.txt',
    kind: 'sr28', folder: 'sr28-mini', file: 'NUT_DATA.txt', line: 4, column: 'Nutr_No',
    change: (d) => edit(d, 'NUT_DATA.txt', (t) => t.replace('~99001~^~291~', '~99001~^~999~'), SR_LATIN1),
  },
  {
    name: 'SR28 truncated NUT_DATA.txt (cut inside a ~-quoted field)',
    kind: 'sr28', folder: 'sr28-mini', file: 'NUT_DATA.txt', line: 8, column: null,
    change: (d) => edit(d, 'NUT_DATA.txt', (t) => t.slice(0, t.indexOf('~99001~^~255~') + 10), SR_LATIN1),
  },
  {
    name: 'SR28 wrong file altogether (a FoodData Central CSV saved as FOOD_DES.txt)',
    kind: 'sr28', folder: 'sr28-mini', file: 'FOOD_DES.txt', line: 1, column: null,
    change: (d) => fs.copyFileSync(path.join(FIXTURES, 'fdc-mini', 'food.csv'), path.join(d, 'FOOD_DES.txt')),
  },
];

describe('bad import files', () => {
  it.each(badCases)('$name: names file, line and column and leaves the database as it was', async (c) => {
    const dir = brokenCopy(c.folder, (d) => {
      // A valid change elsewhere in the same import proves nothing is half-saved.
      if (c.kind === 'fdc' && c.file !== 'food.csv') edit(d, 'food.csv', (t) => t.replace('Testgrain, dry', 'Testgrain, renamed'));
      if (c.kind === 'sr28' && c.file !== 'FOOD_DES.txt') edit(d, 'FOOD_DES.txt', (t) => t.replace('Testgrain, dry', 'Testgrain, renamed'), SR_LATIN1);
      c.change(d);
    });
    const foodsBefore = await FoodModel.findAll({ order: [['id', 'ASC']], raw: true });
    const measuresBefore = await FoodMeasureModel.findAll({ order: [['id', 'ASC']], raw: true });

    const error = await runImport(ctx.sequelize, c.kind, dir).catch((e: unknown) => e);

    expect(error).toBeInstanceOf(ImportFileError);
    const e = error as ImportFileError;
    expect({ file: e.file, line: e.line }).toEqual({ file: c.file, line: c.line });
    if (c.column) expect(e.column).toBe(c.column);
    expect(e.message).toContain(c.file);
    expect(await FoodModel.findAll({ order: [['id', 'ASC']], raw: true })).toEqual(foodsBefore);
    expect(await FoodMeasureModel.findAll({ order: [['id', 'ASC']], raw: true })).toEqual(measuresBefore);
    const record = await DatasetImportModel.findOne({ order: [['id', 'DESC']] });
    expect(record).toMatchObject({ status: 'failed', error: e.message });
    fs.rmSync(dir, { recursive: true, force: true });
  });
});
