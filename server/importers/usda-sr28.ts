import { emptyNutrients } from '../../shared/compute/nutrients';
import { SkipLog, USDA_LICENCE, type FoodInput, type ParsedDataset, type ProgressFn } from './dataset';
import { ImportFileError } from './import-error';
import { parseAmount, readRows, requireFile, SR28_LAYOUT, type Row } from './read-rows';
import { finishUsdaFoods, formatAmount, SR_NUTRIENTS, USDA_CARB_NOTE } from './usda-nutrients';

const FIELDS = {
  'FD_GROUP.txt': ['FdGrp_Cd', 'FdGrp_Desc'],
  'FOOD_DES.txt': ['NDB_No', 'FdGrp_Cd', 'Long_Desc', 'Shrt_Desc', 'ComName', 'ManufacName', 'Survey', 'Ref_desc', 'Refuse', 'SciName', 'N_Factor', 'Pro_Factor', 'Fat_Factor', 'CHO_Factor'],
  'NUTR_DEF.txt': ['Nutr_No', 'Units', 'Tagname', 'NutrDesc', 'Num_Dec', 'SR_Order'],
  'NUT_DATA.txt': ['NDB_No', 'Nutr_No', 'Nutr_Val', 'Num_Data_Pts', 'Std_Error', 'Src_Cd', 'Deriv_Cd', 'Ref_NDB_No', 'Add_Nutr_Mark', 'Num_Studies', 'Min', 'Max', 'DF', 'Low_EB', 'Up_EB', 'Stat_cmt', 'AddMod_Date', 'CC'],
  'WEIGHT.txt': ['NDB_No', 'Seq', 'Amount', 'Msre_Desc', 'Gm_Wgt', 'Num_Data_Pts', 'Std_Dev'],
} as const;
type SrFile = keyof typeof FIELDS;

export const SR28_ATTRIBUTION =
  'U.S. Department of Agriculture, Agricultural Research Service, Nutrient Data Laboratory. USDA National Nutrient Database for Standard Reference, Release 28 (slightly revised), May 2016.';

/**
 * A manufacturer's product: SR28 names the maker in ManufacName (1,707 rows) and writes brand words in capitals in
 * the name ("Kefir, lowfat, plain, LIFEWAY"); "USDA Commodity" is a generic food, not a brand.
 */
export function isBranded(name: string, manufacturer: string): boolean {
  return manufacturer !== '' || /\b(?!USDA\b)[A-Z][A-Z'&]{2,}\b/.test(name);
}

/** Reads one SR28 file, checking every line has the published number of fields (so a wrong or cut file is named). */
async function* srRows(folder: string, name: SrFile): AsyncGenerator<Row & { get: (field: string) => string }> {
  const file = requireFile(folder, name);
  const fields: readonly string[] = FIELDS[name];
  for await (const row of readRows(file, SR28_LAYOUT)) {
    if (row.fields.length !== fields.length) {
      const column = row.fields.length < fields.length ? fields[row.fields.length] : `#${fields.length + 1}`;
      throw new ImportFileError(
        name,
        row.line,
        column,
        `expected ${fields.length} ^-separated fields, found ${row.fields.length} — the line is cut short or this is not the SR28 ${name}.`,
      );
    }
    yield { ...row, get: (field: string) => row.fields[fields.indexOf(field)] };
  }
}

/** Parses the SR28 ASCII files in a folder into foods (nothing is written). Values are per 100 g edible portion. */
export async function parseSr28(folder: string, onProgress?: ProgressFn): Promise<ParsedDataset> {
  const skipped = new SkipLog();
  let rowsRead = 0;
  const groups = new Map<string, string>();
  for await (const r of srRows(folder, 'FD_GROUP.txt')) groups.set(r.get('FdGrp_Cd'), r.get('FdGrp_Desc'));

  const nutrientUnits = new Map<string, string>();
  for await (const r of srRows(folder, 'NUTR_DEF.txt')) {
    const no = r.get('Nutr_No').trim();
    const known = SR_NUTRIENTS[no];
    if (known && r.get('Units').trim().toLowerCase() !== known.unit) {
      throw new ImportFileError('NUTR_DEF.txt', r.line, 'Units', `nutrient ${no} should be in ${known.unit}, found "${r.get('Units')}".`);
    }
    nutrientUnits.set(no, r.get('Units'));
  }

  const foods = new Map<string, FoodInput>();
  for await (const r of srRows(folder, 'FOOD_DES.txt')) {
    rowsRead += 1;
    const code = r.get('NDB_No').trim();
    if (!/^\d{4,5}$/.test(code)) throw new ImportFileError('FOOD_DES.txt', r.line, 'NDB_No', `"${code}" is not an NDB number.`);
    const group = groups.get(r.get('FdGrp_Cd'));
    if (group == null) skipped.add('food group code not in FD_GROUP.txt (group left empty)', `FOOD_DES.txt line ${r.line}`);
    const common = r.get('ComName').split(',').map((s) => s.trim()).filter(Boolean);
    const name = r.get('Long_Desc').trim();
    const manufacturer = r.get('ManufacName').trim();
    foods.set(code, {
      sourceCode: code,
      name,
      foodGroup: group ?? null,
      altNames: common,
      nutrients: emptyNutrients(),
      carbMeasured: 'total',
      derived: [],
      carbNote: USDA_CARB_NOTE,
      extra: {
        ndbNumber: code,
        ...(r.get('SciName').trim() ? { scientificName: r.get('SciName').trim() } : {}),
        ...(manufacturer ? { manufacturer } : {}),
        ...(isBranded(name, manufacturer) ? { branded: true } : {}),
      },
      measures: [],
    });
  }
  onProgress?.('FOOD_DES.txt read', rowsRead);

  for await (const r of srRows(folder, 'NUT_DATA.txt')) {
    rowsRead += 1;
    const no = r.get('Nutr_No').trim();
    if (!nutrientUnits.has(no)) throw new ImportFileError('NUT_DATA.txt', r.line, 'Nutr_No', `nutrient ${no} is not defined in NUTR_DEF.txt.`);
    const value = parseAmount(r.get('Nutr_Val'), 'NUT_DATA.txt', r.line, 'Nutr_Val');
    const food = foods.get(r.get('NDB_No').trim());
    const known = SR_NUTRIENTS[no];
    if (!known) continue;
    if (!food) skipped.add('value for a food not in FOOD_DES.txt', `NUT_DATA.txt line ${r.line}`);
    else if (value == null) skipped.add('empty Nutr_Val (kept as unknown)', `NUT_DATA.txt line ${r.line}`);
    else food.nutrients[known.key] = value;
    if (rowsRead % 50_000 === 0) onProgress?.('NUT_DATA.txt', rowsRead);
  }

  const measures: { key: string; seq: number; label: string; grams: number }[] = [];
  for await (const r of srRows(folder, 'WEIGHT.txt')) {
    rowsRead += 1;
    const code = r.get('NDB_No').trim();
    const amount = parseAmount(r.get('Amount'), 'WEIGHT.txt', r.line, 'Amount');
    const grams = parseAmount(r.get('Gm_Wgt'), 'WEIGHT.txt', r.line, 'Gm_Wgt');
    const seq = parseAmount(r.get('Seq'), 'WEIGHT.txt', r.line, 'Seq') ?? 0;
    if (!foods.has(code)) skipped.add('household measure for a food not in FOOD_DES.txt', `WEIGHT.txt line ${r.line}`);
    else if (grams == null || grams <= 0 || amount == null || amount <= 0) skipped.add('household measure without a positive amount and weight', `WEIGHT.txt line ${r.line}`);
    else measures.push({ key: code, seq, label: `${formatAmount(amount)} ${r.get('Msre_Desc').trim()}`, grams });
  }
  finishUsdaFoods(foods, measures);
  onProgress?.('files read', rowsRead);
  return { dataset: 'usda_sr28', version: 'SR28 (May 2016)', attribution: SR28_ATTRIBUTION, licence: USDA_LICENCE, foods: [...foods.values()], rowsRead, skipped };
}
