import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Sequelize } from 'sequelize';
import { from as copyFrom } from 'pg-copy-streams';
import type { ParsedDataset } from '../importers/dataset';
import { COLUMNS, csvCell, hashOf, rowOf } from '../importers/write-foods';

/**
 * The importer's floor: a plain `COPY … FROM STDIN (CSV)` of exactly the rows the importer writes (foods with their
 * search columns, and their measures) into empty tables shaped like foods and food_measures, indexes included.
 * Returns the milliseconds of the two COPYs alone (building the CSV text is not counted).
 */
export async function copyFloorMs(sequelize: Sequelize, parsed: ParsedDataset): Promise<number> {
  const opts = { source: parsed.dataset, attribution: parsed.attribution, licence: parsed.licence, importId: null as unknown as number };
  const foodsCsv = parsed.foods.map((f) => {
    const row = rowOf(f, hashOf(f, parsed.attribution, parsed.licence), opts) as Record<string, unknown>;
    return `${COLUMNS.map(([c]) => csvCell(row[c])).join(',')},now,now\n`;
  });
  let id = 0;
  const measuresCsv = parsed.foods.flatMap((f, i) => f.measures.map((m, seq) => `${(id += 1)},${i + 1},${csvCell(m.label)},${m.grams},${seq}\n`));
  const client = (await sequelize.connectionManager.getConnection({ type: 'write' })) as unknown as import('pg').PoolClient;
  try {
    await client.query('DROP TABLE IF EXISTS bench_copy_foods, bench_copy_measures');
    await client.query('CREATE TABLE bench_copy_foods (LIKE foods INCLUDING ALL)');
    await client.query('CREATE TABLE bench_copy_measures (LIKE food_measures INCLUDING ALL)');
    const start = process.hrtime.bigint();
    await pipeline(Readable.from(foodsCsv), client.query(copyFrom(`COPY bench_copy_foods (${COLUMNS.map(([c]) => c).join(', ')}, created_at, updated_at) FROM STDIN (FORMAT csv)`)));
    await pipeline(Readable.from(measuresCsv), client.query(copyFrom('COPY bench_copy_measures (id, food_id, label, grams, seq) FROM STDIN (FORMAT csv)')));
    const ms = Number(process.hrtime.bigint() - start) / 1e6;
    await client.query('DROP TABLE bench_copy_foods, bench_copy_measures');
    return ms;
  } finally {
    sequelize.connectionManager.releaseConnection(client as never);
  }
}
