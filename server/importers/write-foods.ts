import { createHash } from 'node:crypto';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { PoolClient } from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { FoodSource } from '../models/food.model';
import { searchKeys } from '../search/search-text';
import type { FoodInput } from './dataset';
import { diffImport, type ImportDiff, type StoredFood } from './import-diff';

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
type StoredRow = { id: number; source_code: string; name: string; content_hash: string | null } & Record<string, number | null>;
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

/** One value as a cell of PostgreSQL's CSV COPY format: empty for null, arrays as array literals, objects as JSON. */
export const csvCell = (v: unknown): string => {
  if (v === null || v === undefined) return '';
  if (Array.isArray(v)) return csvCell(`{${v.map((x) => `"${String(x).replace(/["\\]/g, (c) => `\\${c}`)}"`).join(',')}}`);
  const text = typeof v === 'object' ? JSON.stringify(v) : String(v);
  return `"${text.replace(/"/g, '""')}"`;
};

/** Streams CSV lines into `COPY <target> FROM STDIN (FORMAT csv)` on the given client (a few hundred lines a chunk). */
export async function copyLines(client: PoolClient, target: string, lines: string[]): Promise<void> {
  const chunks = (function* () {
    for (let i = 0; i < lines.length; i += 500) yield lines.slice(i, i + 500).join('');
  })();
  await pipeline(Readable.from(chunks), client.query(copyFrom(`COPY ${target} FROM STDIN (FORMAT csv)`)));
}

type WriteOptions = { source: FoodSource; attribution: string; licence: string; importId: number; foods: FoodInput[] };

/** What writing these foods would change (see diffImport), read inside the caller's transaction; writes nothing. */
export async function planFoods(sequelize: Sequelize, t: Transaction, opts: WriteOptions) {
  // One import of a source at a time: a second one waits here, then sees the first one's rows (new foods are
  // written with COPY, which would stop on a code the other import has just added).
  await sequelize.query(`SELECT pg_advisory_xact_lock(hashtext('foods import ' || :source))`, { replacements: { source: opts.source }, transaction: t });
  const existing = await sequelize.query<StoredRow>(
    `SELECT id, source_code, name, content_hash, ${NUTRIENT_COLUMNS.join(', ')} FROM foods WHERE source = :source`,
    { replacements: { source: opts.source }, type: QueryTypes.SELECT, transaction: t },
  );
  const stored = new Map<string, StoredFood>(
    existing.map((r) => [
      r.source_code,
      {
        code: r.source_code, name: r.name, hash: r.content_hash,
        nutrients: {
          energyKcal: r.energy_kcal, energyKj: r.energy_kj, carbAvailable: r.carb_available, carbTotal: r.carb_total,
          fibre: r.fibre, sugars: r.sugars, protein: r.protein, fat: r.fat, water: r.water,
        },
      },
    ]),
  );
  const hashed = opts.foods.map((input) => ({ input, hash: hashOf(input, opts.attribution, opts.licence) }));
  const diff: ImportDiff = diffImport(stored, hashed);
  const pending = hashed
    .filter(({ input, hash }) => stored.get(input.sourceCode)?.hash !== hash)
    .map((p) => ({ ...p, isNew: !stored.has(p.input.sourceCode) }));
  const counts: WriteCounts = { inserted: diff.added.count, updated: diff.changed.count, unchanged: diff.unchanged };
  return { diff, counts, pending };
}

/**
 * Writes foods of one source inside the caller's transaction: new codes are inserted, changed ones updated
 * (their measures replaced), identical ones left alone, so a re-import changes nothing. New foods (all of them on a
 * first load) go in with COPY, their ids taken from the sequence first so their measures can follow by COPY too;
 * changed ones are upserted a chunk per set-based statement (rows passed as one JSON parameter).
 * Pass the plan when the caller has already made one in this transaction.
 */
export async function writeFoods(
  sequelize: Sequelize,
  t: Transaction,
  opts: WriteOptions,
  onProgress?: (written: number) => void,
  plan?: Awaited<ReturnType<typeof planFoods>>,
): Promise<WriteCounts> {
  const { counts, pending } = plan ?? (await planFoods(sequelize, t, opts));
  let written = 0;
  const fresh = pending.filter((p) => p.isNew);
  if (fresh.length) {
    await copyNewFoods(sequelize, t, opts, fresh);
    written += fresh.length;
    onProgress?.(written);
  }
  const changed = pending.filter((p) => !p.isNew);
  for (let i = 0; i < changed.length; i += CHUNK) {
    const chunk = changed.slice(i, i + CHUNK);
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

/** COPYs foods the table does not hold yet (the plan checked, under the import lock) and their measures. */
async function copyNewFoods(sequelize: Sequelize, t: Transaction, opts: WriteOptions, fresh: { input: FoodInput; hash: string }[]): Promise<void> {
  const ids = await sequelize.query<{ id: string }>(`SELECT nextval(pg_get_serial_sequence('foods', 'id')) AS id FROM generate_series(1, :n)`, {
    replacements: { n: fresh.length },
    type: QueryTypes.SELECT,
    transaction: t,
  });
  const foodLines: string[] = [];
  const measureLines: string[] = [];
  fresh.forEach(({ input, hash }, i) => {
    const id = ids[i].id;
    const row = rowOf(input, hash, opts) as Record<string, unknown>;
    foodLines.push(`${id},${COLUMNS.map(([c]) => csvCell(row[c])).join(',')},now,now\n`);
    input.measures.forEach((m, seq) => measureLines.push(`${id},${csvCell(m.label)},${m.grams},${seq}\n`));
  });
  // The transaction's own connection: COPY is not a statement Sequelize can send.
  const client = (t as unknown as { connection: PoolClient }).connection;
  await copyLines(client, `foods (id, ${COLUMNS.map(([c]) => c).join(', ')}, created_at, updated_at)`, foodLines);
  if (measureLines.length) await copyLines(client, 'food_measures (food_id, label, grams, seq)', measureLines);
}
