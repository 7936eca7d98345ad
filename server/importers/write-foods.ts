import { createHash } from 'node:crypto';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { FoodSource } from '../models/food.model';
import { searchKeys } from '../search/search-text';
import type { FoodInput } from './dataset';

// Rows per statement: large enough that a full table takes a handful of round trips, small enough for one JSON text.
const CHUNK = 5000;

export type WriteCounts = { inserted: number; updated: number; unchanged: number };

// The search columns are in the hash, so a change of the search rules rewrites them on the next import.
/** The content hash of one food row: identical input gives an identical hash, so a re-import skips it. */
export function hashOf(input: FoodInput, attribution: string, licence: string): string {
  const keys = searchKeys(input.name, input.altNames, { branded: Boolean(input.extra.branded) });
  return createHash('sha1').update(JSON.stringify([input, attribution, licence, keys])).digest('hex');
}

const NUTRIENT_COLUMNS = ['energy_kcal', 'energy_kj', 'carb_available', 'carb_total', 'fibre', 'sugars', 'protein', 'fat', 'water'];
/** The foods columns an import writes, with their PostgreSQL types. */
export const COLUMNS: [string, string][] = [
  ['source', 'text'], ['source_code', 'text'], ['name', 'text'], ['food_group', 'text'], ['alt_names', 'text[]'],
  ...NUTRIENT_COLUMNS.map((c): [string, string] => [c, 'float8']),
  ['carb_measured', 'text'], ['carb_note', 'text'], ['derived', 'text[]'], ['attribution', 'text'], ['licence', 'text'],
  ['import_id', 'int'], ['extra', 'jsonb'], ['content_hash', 'text'], ['name_key', 'text'], ['search_text', 'text'], ['rank_penalty', 'int'],
];
const ENUMS: Record<string, string> = { source: 'enum_foods_source', carb_measured: 'enum_foods_carb_measured' };
const select = COLUMNS.map(([c]) => (ENUMS[c] ? `r.${c}::${ENUMS[c]}` : `r.${c}`)).join(', ');
const updates = COLUMNS.filter(([c]) => c !== 'source' && c !== 'source_code').map(([c]) => `${c} = EXCLUDED.${c}`).join(', ');

/** One food as a row of the foods table (snake_case keys), search columns included. */
export function rowOf(input: FoodInput, hash: string, opts: { source: FoodSource; attribution: string; licence: string; importId: number }) {
  const n = input.nutrients;
  const keys = searchKeys(input.name, input.altNames, { branded: Boolean(input.extra.branded) });
  return {
    source: opts.source, source_code: input.sourceCode, name: input.name, food_group: input.foodGroup, alt_names: input.altNames,
    energy_kcal: n.energyKcal, energy_kj: n.energyKj, carb_available: n.carbAvailable, carb_total: n.carbTotal, fibre: n.fibre,
    sugars: n.sugars, protein: n.protein, fat: n.fat, water: n.water, carb_measured: input.carbMeasured, carb_note: input.carbNote,
    derived: input.derived, attribution: opts.attribution, licence: opts.licence, import_id: opts.importId, extra: input.extra,
    content_hash: hash, name_key: keys.nameKey, search_text: keys.searchText, rank_penalty: keys.rankPenalty,
  };
}

/**
 * Upserts foods of one source inside the caller's transaction: new codes are inserted, changed ones updated
 * (their measures replaced), identical ones left alone, so a re-import changes nothing. Each chunk is one
 * set-based statement (rows passed as one JSON parameter), so a full table is written in a few round trips.
 */
export async function writeFoods(
  sequelize: Sequelize,
  t: Transaction,
  opts: { source: FoodSource; attribution: string; licence: string; importId: number; foods: FoodInput[] },
  onProgress?: (written: number) => void,
): Promise<WriteCounts> {
  const existing = await sequelize.query<{ id: number; source_code: string; content_hash: string | null }>(
    'SELECT id, source_code, content_hash FROM foods WHERE source = :source',
    { replacements: { source: opts.source }, type: QueryTypes.SELECT, transaction: t },
  );
  const byCode = new Map(existing.map((r) => [r.source_code, r]));
  const counts: WriteCounts = { inserted: 0, updated: 0, unchanged: 0 };
  const pending: { input: FoodInput; hash: string }[] = [];
  for (const input of opts.foods) {
    const hash = hashOf(input, opts.attribution, opts.licence);
    const old = byCode.get(input.sourceCode);
    if (old && old.content_hash === hash) counts.unchanged += 1;
    else {
      if (old) counts.updated += 1;
      else counts.inserted += 1;
      pending.push({ input, hash });
    }
  }
  let written = 0;
  for (let i = 0; i < pending.length; i += CHUNK) {
    const chunk = pending.slice(i, i + CHUNK);
    const rows = JSON.stringify(chunk.map(({ input, hash }) => rowOf(input, hash, opts)));
    const saved = await sequelize.query<{ id: number; source_code: string }>(
      `INSERT INTO foods (${COLUMNS.map(([c]) => c).join(', ')}, created_at, updated_at)
       SELECT ${select}, now(), now()
         FROM jsonb_to_recordset(CAST(:rows AS jsonb)) AS r(${COLUMNS.map(([c, type]) => `${c} ${type}`).join(', ')})
       ON CONFLICT (source, source_code) DO UPDATE SET ${updates}, updated_at = now()
       RETURNING id, source_code`,
      { replacements: { rows }, type: QueryTypes.SELECT, transaction: t },
    );
    const idOf = new Map(saved.map((s) => [s.source_code, Number(s.id)]));
    const ids = [...idOf.values()];
    await sequelize.query('DELETE FROM food_measures WHERE food_id = ANY(CAST(:ids AS int[]))', { replacements: { ids: `{${ids.join(',')}}` }, transaction: t });
    const measures = chunk.flatMap(({ input }) => input.measures.map((m, seq) => ({ food_id: idOf.get(input.sourceCode), label: m.label, grams: m.grams, seq })));
    if (measures.length) {
      await sequelize.query(
        `INSERT INTO food_measures (food_id, label, grams, seq)
         SELECT food_id, label, grams, seq FROM jsonb_to_recordset(CAST(:rows AS jsonb)) AS m(food_id int, label text, grams float8, seq int)`,
        { replacements: { rows: JSON.stringify(measures) }, transaction: t },
      );
    }
    written += chunk.length;
    onProgress?.(written);
  }
  return counts;
}
