import fs from 'node:fs';
import path from 'node:path';
import { emptyNutrients, type NutrientKey } from '../../shared/compute/nutrients';
import { SkipLog, USDA_LICENCE, type FoodInput, type ParsedDataset, type ProgressFn } from './dataset';
import { ImportFileError } from './import-error';
import { FDC_LAYOUT, headerIndex, parseAmount, readRows, requireFile, type Row } from './read-rows';
import { finishUsdaFoods, formatAmount, SR_NUTRIENTS, USDA_CARB_NOTE } from './usda-nutrients';

export const FDC_ATTRIBUTION = 'U.S. Department of Agriculture, Agricultural Research Service. FoodData Central (fdc.nal.usda.gov).';

const IMPORTED_TYPES = new Set(['sr_legacy_food', 'foundation_food']);

type Cells = { get: (column: string) => string; line: number };

/** Reads a FoodData Central CSV by column name; the header must have the required columns. */
async function* fdcRows(folder: string, name: string, required: string[], optional: string[] = []): AsyncGenerator<Cells> {
  const file = requireFile(folder, name);
  let index: Record<string, number> | null = null;
  let width = 0;
  for await (const row of readRows(file, FDC_LAYOUT)) {
    if (!index) {
      index = headerIndex(name, row, required, optional);
      width = row.fields.length;
      continue;
    }
    if (row.fields.length < width) {
      const idx = index;
      const missing = Object.keys(idx).find((c) => idx[c] >= row.fields.length) ?? `#${row.fields.length + 1}`;
      throw new ImportFileError(name, row.line, missing, `expected ${width} fields, found ${row.fields.length} — the line is cut short.`);
    }
    const idx = index;
    yield { line: row.line, get: (c: string) => (idx[c] == null ? '' : (row as Row).fields[idx[c]]) };
  }
  if (!index) throw new ImportFileError(name, 1, null, 'the file is empty (no header line).');
}

/** Parses a FoodData Central CSV download (SR Legacy or Foundation) into foods; nothing is written. */
export async function parseFdc(folder: string, onProgress?: ProgressFn): Promise<ParsedDataset> {
  const skipped = new SkipLog();
  let rowsRead = 0;

  const nutrientKeys = new Map<string, NutrientKey | null>();
  for await (const r of fdcRows(folder, 'nutrient.csv', ['id', 'name', 'unit_name', 'nutrient_nbr'])) {
    const nbr = String(Number(r.get('nutrient_nbr')) || r.get('nutrient_nbr')).trim();
    const known = SR_NUTRIENTS[nbr];
    if (known && r.get('unit_name').trim().toLowerCase() !== known.unit) {
      throw new ImportFileError('nutrient.csv', r.line, 'unit_name', `nutrient ${nbr} should be in ${known.unit}, found "${r.get('unit_name')}".`);
    }
    nutrientKeys.set(r.get('id').trim(), known ? known.key : null);
  }

  const categories = new Map<string, string>();
  for await (const r of fdcRows(folder, 'food_category.csv', ['id', 'description'])) categories.set(r.get('id').trim(), r.get('description').trim());
  const units = new Map<string, string>();
  for await (const r of fdcRows(folder, 'measure_unit.csv', ['id', 'name'])) units.set(r.get('id').trim(), r.get('name').trim());

  const ndb = new Map<string, string>();
  if (fs.existsSync(path.join(folder, 'sr_legacy_food.csv'))) {
    for await (const r of fdcRows(folder, 'sr_legacy_food.csv', ['fdc_id', 'NDB_number'])) ndb.set(r.get('fdc_id').trim(), r.get('NDB_number').trim());
  }

  const foods = new Map<string, FoodInput>();
  let published = '';
  for await (const r of fdcRows(folder, 'food.csv', ['fdc_id', 'data_type', 'description', 'food_category_id'], ['publication_date'])) {
    rowsRead += 1;
    const id = r.get('fdc_id').trim();
    if (!/^\d+$/.test(id)) throw new ImportFileError('food.csv', r.line, 'fdc_id', `"${id.slice(0, 40)}" is not an fdc_id.`);
    const type = r.get('data_type').trim();
    if (!IMPORTED_TYPES.has(type)) {
      skipped.add(`data type "${type}" is not imported (only SR Legacy and Foundation foods)`, `food.csv line ${r.line}`);
      continue;
    }
    if (r.get('publication_date') > published) published = r.get('publication_date');
    const ndbNumber = ndb.get(id);
    foods.set(id, {
      sourceCode: id,
      name: r.get('description').trim(),
      foodGroup: categories.get(r.get('food_category_id').trim()) ?? null,
      altNames: [],
      nutrients: emptyNutrients(),
      carbMeasured: 'total',
      derived: [],
      carbNote: USDA_CARB_NOTE,
      extra: ndbNumber ? { ndbNumber: ndbNumber.padStart(5, '0') } : {},
      measures: [],
    });
  }
  onProgress?.('food.csv read', rowsRead);

  for await (const r of fdcRows(folder, 'food_nutrient.csv', ['fdc_id', 'nutrient_id', 'amount'])) {
    rowsRead += 1;
    const nutrientId = r.get('nutrient_id').trim();
    if (!nutrientKeys.has(nutrientId)) {
      throw new ImportFileError('food_nutrient.csv', r.line, 'nutrient_id', `nutrient ${nutrientId} is not in nutrient.csv.`);
    }
    const amount = parseAmount(r.get('amount'), 'food_nutrient.csv', r.line, 'amount');
    const key = nutrientKeys.get(nutrientId);
    if (!key) continue;
    const food = foods.get(r.get('fdc_id').trim());
    if (!food) skipped.add('value for a food not imported from food.csv', `food_nutrient.csv line ${r.line}`);
    else if (amount == null) skipped.add('empty amount (kept as unknown)', `food_nutrient.csv line ${r.line}`);
    else food.nutrients[key] = amount;
    if (rowsRead % 50_000 === 0) onProgress?.('food_nutrient.csv', rowsRead);
  }

  const portions: { key: string; seq: number; label: string; grams: number }[] = [];
  for await (const r of fdcRows(folder, 'food_portion.csv', ['fdc_id', 'seq_num', 'amount', 'measure_unit_id', 'modifier', 'gram_weight'], ['portion_description'])) {
    rowsRead += 1;
    const id = r.get('fdc_id').trim();
    const amount = parseAmount(r.get('amount'), 'food_portion.csv', r.line, 'amount');
    const grams = parseAmount(r.get('gram_weight'), 'food_portion.csv', r.line, 'gram_weight');
    const seq = parseAmount(r.get('seq_num'), 'food_portion.csv', r.line, 'seq_num') ?? 0;
    const unitId = r.get('measure_unit_id').trim();
    const unit = unitId === '9999' ? '' : (units.get(unitId) ?? '');
    const what = [unit, r.get('modifier').trim()].filter(Boolean).join(' ') || r.get('portion_description').trim();
    if (!foods.has(id)) skipped.add('portion for a food not imported from food.csv', `food_portion.csv line ${r.line}`);
    else if (grams == null || grams <= 0 || !what) skipped.add('portion without a weight or a description', `food_portion.csv line ${r.line}`);
    else portions.push({ key: id, seq, label: amount != null ? `${formatAmount(amount)} ${what}` : what, grams });
  }
  finishUsdaFoods(foods, portions);
  onProgress?.('files read', rowsRead);
  return {
    dataset: 'usda_fdc',
    version: published ? `FoodData Central, published ${published}` : 'FoodData Central',
    attribution: FDC_ATTRIBUTION,
    licence: USDA_LICENCE,
    foods: [...foods.values()],
    rowsRead,
    skipped,
  };
}
